// Which schedule view is shown (the design schedule or the testing view), the defaults a new
// reading takes (the temperature, date and instrument of the day), and what was typed on a row
// before its reading Zs (kept until the Zs is entered; not part of the job).
import { create } from 'zustand';
import type { LinkReading } from '../../../../engine/index.js';

export type ScheduleView = 'design' | 'testing';
export type ReadingExtras = Omit<LinkReading, 'zs'>;

export interface TestingViewState {
  view: ScheduleView;
  /** Given to every new reading (a row that had none), unless the row says otherwise. */
  session: ReadingExtras;
  /** Per link: temperature, date or instrument typed before the row's Zs. */
  drafts: Record<string, ReadingExtras>;
  setView(view: ScheduleView): void;
  setSession(patch: ReadingExtras): void;
  setDraft(link: string, extras: ReadingExtras | undefined): void;
}

function withoutUndefined<T extends object>(o: T): T {
  return Object.fromEntries(Object.entries(o).filter(([, v]) => v !== undefined)) as T;
}

export const useTestingView = create<TestingViewState>()((set) => ({
  view: 'design',
  session: {},
  drafts: {},
  setView: (view) => set({ view }),
  setSession: (patch) => set((s) => ({ session: withoutUndefined({ ...s.session, ...patch }) })),
  setDraft: (link, extras) =>
    set((s) => {
      const drafts = { ...s.drafts };
      const clean = extras ? withoutUndefined(extras) : undefined;
      if (!clean || Object.keys(clean).length === 0) delete drafts[link];
      else drafts[link] = clean;
      return { drafts };
    }),
}));
