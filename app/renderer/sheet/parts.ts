// The parts a designer places, their drawn sizes and their starting values.
import type { Job, JobNode, NodeKind } from '../../../engine/index.js';
import { nextId, prefixFor } from '../store/ids.js';

/** Drawn size of each kind of node (px); fixed, so labels can be placed without measuring. */
export const NODE_SIZE: Record<NodeKind, { width: number; height: number }> = {
  supply: { width: 168, height: 56 },
  board: { width: 176, height: 56 },
  point: { width: 160, height: 52 },
};

export const PART_LABEL: Record<NodeKind, string> = {
  supply: 'Supply',
  board: 'Board',
  point: 'Point',
};

export const PART_HINT: Record<NodeKind, string> = {
  supply: 'Point of supply: where the network begins',
  board: 'Switchboard or distribution board',
  point: 'Far end of a final subcircuit (outlet, luminaire, equipment)',
};

/** A new node of the given kind, centred on `centre` (sheet coordinates). */
export function newPart(job: Job, kind: NodeKind, centre: { x: number; y: number }): JobNode {
  const id = nextId(job, prefixFor(kind));
  const size = NODE_SIZE[kind];
  const at = { x: Math.round(centre.x - size.width / 2), y: Math.round(centre.y - size.height / 2) };
  if (kind === 'supply') return { id, kind, name: 'Point of supply', at, source: { type: 'unknown' } };
  if (kind === 'board') return { id, kind, name: `Board ${id}`, at };
  return { id, kind, name: `Point ${id}`, use: 'socket-outlets', at };
}
