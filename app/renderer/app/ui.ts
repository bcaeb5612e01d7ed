// Interface state that is neither the job nor the editing session: dialogs and menus.
import { create } from 'zustand';
import type { Autosaved } from '../io/autosave.js';
import type { Job } from '../../../engine/index.js';

export interface UiState {
  problems: { title: string; lines: string[] } | null;
  aboutOpen: boolean;
  findOpen: boolean;
  contextMenu: { x: number; y: number } | null;
  recovery: (Autosaved & { job: Job }) | null;
  rightTab: 'details' | 'job';
  /** The board whose Add Circuits dialog is open. */
  addCircuits: string | null;
  /** The part whose Connect To dialog is open (it will feed the part chosen there). */
  connectFrom: string | null;
  /** Widths and heights the user dragged to (px); null = the default layout. Kept in the browser. */
  layout: Layout;
  setLayout(patch: Partial<Layout>): void;
  showProblems(title: string, lines: string[]): void;
  set(patch: Partial<Omit<UiState, 'set' | 'showProblems' | 'setLayout'>>): void;
}

export interface Layout {
  rightWidth: number | null;
  bottomHeight: number | null;
  /** Where the loop breakdown sits: over the sheet (default) or docked beside the schedule. */
  breakdownDock?: 'sheet' | 'schedule';
  /** The parts column folded to a strip. */
  paletteCollapsed?: boolean;
  /** The details column folded to a strip. */
  rightCollapsed?: boolean;
  /** The sheet's overview map shown (default) or hidden. */
  minimap?: boolean;
}

const LAYOUT_KEY = 'loopwright.layout';

function readLayout(): Layout {
  const none: Layout = { rightWidth: null, bottomHeight: null };
  try {
    const v = JSON.parse(globalThis.localStorage?.getItem(LAYOUT_KEY) ?? 'null') as Partial<Layout> | null;
    const ok = (n: unknown) => (typeof n === 'number' && Number.isFinite(n) && n > 0 ? n : null);
    if (!v || typeof v !== 'object') return none;
    return {
      rightWidth: ok(v.rightWidth),
      bottomHeight: ok(v.bottomHeight),
      ...(v.breakdownDock === 'schedule' || v.breakdownDock === 'sheet' ? { breakdownDock: v.breakdownDock } : {}),
      ...(v.paletteCollapsed === true ? { paletteCollapsed: true } : {}),
      ...(v.rightCollapsed === true ? { rightCollapsed: true } : {}),
      ...(v.minimap === false ? { minimap: false } : {}),
    };
  } catch {
    return none;
  }
}

export const useUi = create<UiState>()((set) => ({
  problems: null,
  aboutOpen: false,
  findOpen: false,
  contextMenu: null,
  recovery: null,
  rightTab: 'details',
  addCircuits: null,
  connectFrom: null,
  layout: readLayout(),
  setLayout: (patch) =>
    set((s) => {
      const layout = { ...s.layout, ...patch };
      try {
        globalThis.localStorage?.setItem(LAYOUT_KEY, JSON.stringify(layout));
      } catch {
        // Storage full or blocked: the layout still applies for this session.
      }
      return { layout };
    }),
  showProblems: (title, lines) => set({ problems: { title, lines } }),
  set: (patch) => set(patch),
}));
