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

/** A new node of the given kind, centred on `centre` (sheet coordinates); see freeCentre for a clear spot. */
export function newPart(job: Job, kind: NodeKind, centre: { x: number; y: number }): JobNode {
  const id = nextId(job, prefixFor(kind));
  const size = NODE_SIZE[kind];
  const at = { x: Math.round(centre.x - size.width / 2), y: Math.round(centre.y - size.height / 2) };
  if (kind === 'supply') return { id, kind, name: 'Point of supply', at, source: { type: 'unknown' } };
  if (kind === 'board') return { id, kind, name: `Board ${id}`, at };
  return { id, kind, name: `Point ${id}`, use: 'socket-outlets', at };
}

/** Clear space kept between a new part and the nodes around it (px): room for a link label above. */
export const PART_GAP = { x: 24, y: 72 };

function overlaps(job: Job, kind: NodeKind, at: { x: number; y: number }): boolean {
  const size = NODE_SIZE[kind];
  return job.nodes.some((n) => {
    const o = n.at ?? { x: 0, y: 0 };
    const other = NODE_SIZE[n.kind];
    return at.x < o.x + other.width + PART_GAP.x && o.x < at.x + size.width + PART_GAP.x
      && at.y < o.y + other.height + PART_GAP.y && o.y < at.y + size.height + PART_GAP.y;
  });
}

/**
 * The centre nearest `centre` where a new part of this kind overlaps no node: tried on a grid of
 * part-sized steps, nearest first, right and below counted nearer than left and above (so parts added
 * one after another at the same spot line up instead of stacking).
 */
export function freeCentre(job: Job, kind: NodeKind, centre: { x: number; y: number }, reach = 12): { x: number; y: number } {
  const size = NODE_SIZE[kind];
  // Steps of the largest part, so a neighbouring cell clears a node of any kind.
  const kinds = Object.values(NODE_SIZE);
  const step = { x: Math.max(...kinds.map((k) => k.width)) + PART_GAP.x, y: Math.max(...kinds.map((k) => k.height)) + PART_GAP.y };
  const topLeft = (c: { x: number; y: number }) => ({ x: Math.round(c.x - size.width / 2), y: Math.round(c.y - size.height / 2) });
  const tries: Array<{ col: number; row: number; d: number }> = [];
  for (let row = -reach; row <= reach; row++) {
    for (let col = -reach; col <= reach; col++) {
      // Left and above count as farther, so a clear spot right or below is taken first.
      tries.push({ col, row, d: Math.hypot(col * step.x * (col < 0 ? 2 : 1), row * step.y * (row < 0 ? 2 : 1)) });
    }
  }
  tries.sort((a, b) => a.d - b.d || b.col - a.col || b.row - a.row);
  for (const t of tries) {
    const c = { x: centre.x + t.col * step.x, y: centre.y + t.row * step.y };
    if (!overlaps(job, kind, topLeft(c))) return c;
  }
  return centre;
}
