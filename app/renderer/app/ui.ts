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
  showProblems(title: string, lines: string[]): void;
  set(patch: Partial<Omit<UiState, 'set' | 'showProblems'>>): void;
}

export const useUi = create<UiState>()((set) => ({
  problems: null,
  aboutOpen: false,
  findOpen: false,
  contextMenu: null,
  recovery: null,
  rightTab: 'details',
  showProblems: (title, lines) => set({ problems: { title, lines } }),
  set: (patch) => set(patch),
}));
