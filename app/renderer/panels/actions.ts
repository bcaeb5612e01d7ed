// What the panels ask of the store: field edits as store edits, the fault path of a link,
// and showing a loop breakdown.

import type { Job } from '../../../engine/index.js';
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

/**
 * Node and link ids alternately from the supply to the far end of a link
 * (the shape of `worst.path` in the results document). Stops safely on a broken chain.
 */
export function pathToLink(job: Job, linkId: string): string[] {
  const feeder = new Map(job.links.map((l) => [l.to, l]));
  const link = job.links.find((l) => l.id === linkId);
  if (!link) return [];
  const path: string[] = [link.to, link.id];
  let at = link.from;
  const seen = new Set<string>([link.to]);
  while (!seen.has(at)) {
    seen.add(at);
    path.push(at);
    const up = feeder.get(at);
    if (!up) break;
    path.push(up.id);
    at = up.from;
  }
  return path.reverse();
}

/** Highlights the fault path of a link and opens its loop breakdown. */
export function showBreakdown(linkId: string): void {
  const s = useEditor.getState();
  s.setHighlight(pathToLink(s.job, linkId), linkId);
}

export function closeBreakdown(): void {
  useEditor.getState().setHighlight(null, null);
}
