// Which circuit the loop breakdown shows. While it is open it follows the selection: selecting
// exactly one link (on the sheet, in the schedule or through Find) moves the breakdown and the
// highlighted fault path to that link. Pinned, it stays on its link whatever is selected.
// Selecting nodes, several links or nothing leaves it where it is.

import { useEffect } from 'react';
import { create } from 'zustand';
import { useEditor } from '../../store/index.js';
import { showBreakdown } from '../actions.js';

export interface BreakdownView {
  /** Stays on its link when another one is selected. */
  pinned: boolean;
  /** Folded to its title bar, so the sheet under it is free. */
  collapsed: boolean;
  set(patch: Partial<Omit<BreakdownView, 'set'>>): void;
}

export const useBreakdownView = create<BreakdownView>()((set) => ({
  pinned: false,
  collapsed: false,
  set: (patch) => set(patch),
}));

/** The link the breakdown should move to for this selection, or null to stay. */
export function followTarget(selection: { nodes: string[]; links: string[] }, shown: string | null, pinned: boolean): string | null {
  if (shown === null || pinned) return null;
  if (selection.nodes.length !== 0 || selection.links.length !== 1) return null;
  const id = selection.links[0]!;
  return id === shown ? null : id;
}

/** Installs the follow rule once (App). The store itself closes a breakdown whose link is gone. */
export function useBreakdownFollowsSelection(): void {
  useEffect(() => {
    const unsubscribe = useEditor.subscribe((s, prev) => {
      if (s.breakdownLink === null) {
        if (prev.breakdownLink !== null) useBreakdownView.getState().set({ pinned: false, collapsed: false });
        return;
      }
      // Only a change of selection moves it (opening it on a link, as Worst loop does, does not).
      if (s.selection === prev.selection) return;
      const target = followTarget(s.selection, s.breakdownLink, useBreakdownView.getState().pinned);
      if (target !== null) showBreakdown(target);
    });
    return unsubscribe;
  }, []);
}
