// The one command registry. The toolbar, the sheet's context menu, the keyboard and (desktop)
// the native menu all look commands up here by id.
import { faultPath, type NodeKind } from '../../../engine/index.js';
import { autoArrange } from '../sheet/arrange.js';
import { collectSubtree, pasteEdit, type Clip } from './clipboard.js';
import type { Command, CommandContext } from './types.js';
import { addPartEdit, feederFor } from './adding.js';
import { WORK_COMMANDS } from './work.js';
import { importReadings } from '../io/readings-import.js';
import { printTestSheets } from '../io/print.js';
import { useTestingView } from '../panels/testing/view.js';

export type { Command, CommandContext } from './types.js';

let clip: Clip | null = null;
let pasteCount = 0;

/** In a text field the text commands act on the field, as the platform would. */
function textCommand(ctx: CommandContext, name: 'undo' | 'redo' | 'copy' | 'cut' | 'paste' | 'selectAll' | 'delete'): boolean {
  if (!ctx.typing()) return false;
  document.execCommand(name);
  return true;
}

const any = () => true;
const hasSelection = (s: { selection: { nodes: string[]; links: string[] } }) =>
  s.selection.nodes.length + s.selection.links.length > 0;

function addPart(kind: NodeKind): Command['run'] {
  return (ctx) => {
    const store = ctx.store.getState();
    // At the cursor (or the middle of the view), moved to the nearest spot no node covers; with a
    // board selected, below it and already fed from it (adding.ts).
    const feeder = feederFor(store.job, store.selection, kind);
    const added = addPartEdit(store.job, kind, ctx.sheet?.cursor() ?? { x: 0, y: 0 }, feeder);
    if (!store.apply(added.edit, feeder ? `add ${kind} to ${feeder.id}` : `add ${kind}`).ok) return;
    store.select({ nodes: added.nodes, links: [] });
    if (feeder) {
      store.setMessage({ kind: 'info', text: `Added ${added.nodes[0]} fed from ${feeder.id} by ${added.links[0]}` });
      ctx.sheet?.centre([feeder.id, ...added.nodes]);
    }
  };
}

function plural(n: number, word: string): string {
  return `${n} ${word}${n === 1 ? '' : 's'}`;
}

function copySelection(ctx: CommandContext): number {
  const s = ctx.store.getState();
  clip = collectSubtree(s.job, s.selection);
  pasteCount = 0;
  const links = clip.links.length + (clip.feeds?.length ?? 0);
  const n = clip.nodes.length + links;
  s.setMessage({ kind: 'info', text: `Copied ${plural(clip.nodes.length, 'node')} and ${plural(links, 'link')}` });
  return n;
}

export const COMMANDS: Command[] = [
  { id: 'file.new', label: 'New Job', shortcut: 'Mod+N', group: 'file', toolbar: 'New', enabled: any, run: (ctx) => ctx.newJob() },
  { id: 'file.open', label: 'Open…', shortcut: 'Mod+O', group: 'file', toolbar: 'Open', enabled: any, run: (ctx) => ctx.open() },
  { id: 'file.save', label: 'Save', shortcut: 'Mod+S', group: 'file', toolbar: 'Save', separatorBefore: true, enabled: any, run: (ctx) => ctx.save(false) },
  { id: 'file.saveAs', label: 'Save As…', shortcut: 'Mod+Shift+S', group: 'file', enabled: any, run: (ctx) => ctx.save(true) },
  {
    id: 'file.exportPdf', label: 'Export PDF…', shortcut: 'Mod+E', group: 'file', separatorBefore: true, desktopOnly: true,
    enabled: (_s, env) => env.desktop, run: (ctx) => ctx.exportPdf(),
  },
  { id: 'file.print', label: 'Print…', shortcut: 'Mod+P', group: 'file', toolbar: 'Print', enabled: any, run: (ctx) => ctx.print() },
  {
    id: 'file.printTestSheets', label: 'Print Test Sheets…', shortcut: null, group: 'file', toolbar: 'Test sheets',
    enabled: any, run: () => printTestSheets(),
  },
  {
    id: 'readings.import', label: 'Import Readings (CSV)…', shortcut: null, group: 'file', toolbar: 'Import readings',
    separatorBefore: true, enabled: any, run: () => importReadings(),
  },

  {
    id: 'edit.undo', label: 'Undo', shortcut: 'Mod+Z', group: 'edit', toolbar: 'Undo', enabled: (s) => s.canUndo,
    run: (ctx) => void (textCommand(ctx, 'undo') || ctx.store.getState().undo()),
  },
  {
    id: 'edit.redo', label: 'Redo', shortcut: 'Mod+Shift+Z', alternates: ['Mod+Y'], group: 'edit', toolbar: 'Redo',
    enabled: (s) => s.canRedo, run: (ctx) => void (textCommand(ctx, 'redo') || ctx.store.getState().redo()),
  },
  {
    id: 'edit.copy', label: 'Copy', shortcut: 'Mod+C', group: 'edit', separatorBefore: true, contextMenu: true, enabled: hasSelection,
    run: (ctx) => void (textCommand(ctx, 'copy') || copySelection(ctx)),
  },
  {
    id: 'edit.cut', label: 'Cut', shortcut: 'Mod+X', group: 'edit', contextMenu: true, enabled: hasSelection,
    run: (ctx) => {
      if (textCommand(ctx, 'cut')) return;
      copySelection(ctx);
      const s = ctx.store.getState();
      s.apply({ op: 'remove', ids: [...s.selection.nodes, ...s.selection.links] }, 'cut');
    },
  },
  {
    id: 'edit.paste', label: 'Paste', shortcut: 'Mod+V', group: 'edit', contextMenu: true, enabled: () => clip !== null,
    run: (ctx) => {
      if (textCommand(ctx, 'paste') || !clip) return;
      pasteCount += 1;
      const s = ctx.store.getState();
      // With one board selected (not itself copied) pasted points hang from it; else from their own board.
      const target = s.selection.nodes.length === 1 && s.selection.links.length === 0 && !clip.nodes.some((n) => n.id === s.selection.nodes[0])
        ? s.job.nodes.find((n) => n.id === s.selection.nodes[0] && n.kind === 'board')?.id ?? null : null;
      const { edit, ids } = pasteEdit(s.job, clip, { x: 40 * pasteCount, y: 40 * pasteCount }, target);
      const outcome = s.apply(edit, 'paste');
      if (!outcome.ok) return;
      const after = ctx.store.getState();
      after.select(ids);
      const n = ids.nodes.length + ids.links.length;
      after.setMessage({ kind: 'info', text: `Pasted ${n} element${n === 1 ? '' : 's'} (${plural(ids.nodes.length, 'node')}, ${plural(ids.links.length, 'link')})` });
    },
  },
  {
    id: 'edit.delete', label: 'Delete', shortcut: 'Delete', alternates: ['Backspace'], group: 'edit', contextMenu: true,
    enabled: hasSelection,
    run: (ctx) => {
      if (textCommand(ctx, 'delete')) return;
      const s = ctx.store.getState();
      const ids = [...s.selection.nodes, ...s.selection.links];
      if (ids.length > 0) s.apply({ op: 'remove', ids }, ids.length === 1 ? `delete ${ids[0]}` : `delete ${ids.length} items`);
    },
  },
  {
    id: 'edit.selectAll', label: 'Select All', shortcut: 'Mod+A', group: 'edit', separatorBefore: true, enabled: any,
    run: (ctx) => {
      if (textCommand(ctx, 'selectAll')) return;
      const s = ctx.store.getState();
      s.select({ nodes: s.job.nodes.map((n) => n.id), links: s.job.links.map((l) => l.id) });
    },
  },
  { id: 'edit.find', label: 'Find…', shortcut: 'Mod+F', group: 'edit', toolbar: 'Find', enabled: any, run: (ctx) => ctx.openFind() },

  {
    id: 'insert.supply', label: 'Add Supply', shortcut: 'Alt+S', group: 'arrange', separatorBefore: true, contextMenu: true,
    enabled: any, run: addPart('supply'),
  },
  { id: 'insert.board', label: 'Add Board', shortcut: 'Alt+B', group: 'arrange', contextMenu: true, enabled: any, run: addPart('board') },
  { id: 'insert.point', label: 'Add Point', shortcut: 'Alt+P', group: 'arrange', contextMenu: true, enabled: any, run: addPart('point') },
  {
    id: 'arrange.auto', label: 'Auto-arrange', shortcut: 'Mod+Shift+L', group: 'arrange', toolbar: 'Arrange', separatorBefore: true,
    enabled: (s) => s.job.nodes.length > 0,
    run: async (ctx) => {
      const s = ctx.store.getState();
      const moves = await autoArrange(s.job);
      if (moves.length > 0) ctx.store.getState().apply({ op: 'move', moves }, 'auto-arrange');
      requestAnimationFrame(() => ctx.sheet?.fit());
    },
  },

  {
    id: 'view.fit', label: 'Zoom to Fit', shortcut: 'Shift+1', group: 'view', toolbar: 'Fit', contextMenu: true,
    enabled: any, run: (ctx) => ctx.sheet?.fit(),
  },
  {
    id: 'view.traceWorst', label: 'Trace Worst Loop', shortcut: 'Alt+W', group: 'view', toolbar: 'Worst loop',
    separatorBefore: true, enabled: (s) => s.results.worst !== null,
    run: (ctx) => {
      const s = ctx.store.getState();
      const worst = s.results.worst;
      if (!worst) {
        s.setMessage({ kind: 'info', text: 'No circuit is checked yet, so there is no worst loop to trace' });
        return;
      }
      s.setHighlight(worst.path, worst.link);
      s.select({ nodes: [], links: [worst.link] });
      ctx.sheet?.centre(worst.path);
      s.setMessage({ kind: 'info', text: `Worst loop: ${worst.link}, ${Math.round(worst.ratio * 100)} % of its limit` });
    },
  },
  {
    id: 'view.traceSelected', label: 'Trace Selected Loop', shortcut: 'Alt+T', group: 'view', contextMenu: true,
    enabled: (s) => s.selection.links.length === 1,
    run: (ctx) => {
      const s = ctx.store.getState();
      const id = s.selection.links[0];
      if (!id) return;
      const found = faultPath(s.job, id);
      const path = found?.reachesSupply ? found.ids : null;
      if (!path) {
        s.setMessage({ kind: 'error', text: `${id} is not fed from a supply, so it has no fault loop to trace` });
        return;
      }
      s.setHighlight(path, id);
    },
  },
  {
    id: 'view.clearTrace', label: 'Clear Trace', shortcut: 'Escape', group: 'view',
    enabled: (s) => s.highlightPath !== null || s.breakdownLink !== null || hasSelection(s),
    run: (ctx) => {
      const s = ctx.store.getState();
      if (s.highlightPath || s.breakdownLink) s.setHighlight(null, null);
      else s.select({ nodes: [], links: [] });
    },
  },
  {
    id: 'view.testing', label: 'Testing View (readings on site)', shortcut: null, group: 'view', separatorBefore: true, enabled: any,
    run: () => {
      const v = useTestingView.getState();
      v.setView(v.view === 'testing' ? 'design' : 'testing');
    },
  },
  ...WORK_COMMANDS,
  { id: 'help.about', label: 'About Loopwright', shortcut: 'F1', group: 'help', enabled: any, run: (ctx) => ctx.openAbout() },
];

const byId = new Map(COMMANDS.map((c) => [c.id, c]));

export function getCommand(id: string): Command | undefined {
  return byId.get(id);
}
