// What the panels ask of the store: field edits as store edits, the fault path of a link,
// and showing a loop breakdown.

import { faultPath } from '../../../engine/index.js';
import { useEditor } from '../store/index.js';
import type { Outcome } from './fields/fields.js';
import { patchFor } from './patch.js';

/** Sets one dotted field of a link (e.g. `cable.length`); the store validates it with the engine. */
export function editLink(id: string, field: string, value: unknown, label = `edit ${id} ${field}`): Outcome {
  const s = useEditor.getState();
  const link = s.job.links.find((l) => l.id === id);
  if (!link) return { ok: false, reason: `There is no link ${id} any more` };
  const wasSelected = s.selection.links.includes(id);
  const outcome = s.apply({ op: 'update-link', id, patch: patchFor(link, field, value) }, label);
  if (outcome.ok && wasSelected && field === 'id' && typeof value === 'string') keepSelected(value, 'links');
  return outcome;
}

/** Sets one dotted field of a node (e.g. `source.r`). */
export function editNode(id: string, field: string, value: unknown, label = `edit ${id} ${field}`): Outcome {
  const s = useEditor.getState();
  const node = s.job.nodes.find((n) => n.id === id);
  if (!node) return { ok: false, reason: `There is no node ${id} any more` };
  const wasSelected = s.selection.nodes.includes(id);
  const outcome = s.apply({ op: 'update-node', id, patch: patchFor(node, field, value) }, label);
  if (outcome.ok && wasSelected && field === 'id' && typeof value === 'string') keepSelected(value, 'nodes');
  return outcome;
}

/** Keeps a renamed element selected (the selection holds ids, and the old one is gone). */
function keepSelected(to: string, kind: 'nodes' | 'links') {
  const s = useEditor.getState();
  const sel = s.selection[kind].includes(to) ? s.selection[kind] : [...s.selection[kind], to];
  s.select(kind === 'nodes' ? { nodes: sel } : { links: sel });
}

/** Highlights the fault path of a link and opens its loop breakdown. */
export function showBreakdown(linkId: string): void {
  const s = useEditor.getState();
  // The whole drawn path, even when no supply reaches it (the breakdown then says so).
  s.setHighlight(faultPath(s.job, linkId)?.ids ?? [], linkId);
}

export function closeBreakdown(): void {
  useEditor.getState().setHighlight(null, null);
}
