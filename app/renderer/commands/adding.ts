// Adding parts already connected: a part added with a board selected hangs from that board, and
// N final subcircuits can be added to a board in one step, each with the role defaults.
import { defaultLinkFor, type Job, type JobNode, type NodeKind, type PointUse } from '../../../engine/index.js';
import { allIds, nextId, prefixFor } from '../store/ids.js';
import type { Edit } from '../store/edits.js';
import { freeCentre, newPart, NODE_SIZE } from '../sheet/parts.js';
import { linkPrefix } from '../sheet/connect.js';

/** How far below its feeding board a new part goes (room for the link label between). */
export const DROP_BELOW = 170;

/** The one selected part that a new part of `kind` would hang from, or null. */
export function feederFor(job: Job, selection: { nodes: string[]; links: string[] }, kind: NodeKind): JobNode | null {
  if (kind === 'supply' || selection.nodes.length !== 1 || selection.links.length > 0) return null;
  const n = job.nodes.find((x) => x.id === selection.nodes[0]);
  if (!n) return null;
  if (n.kind === 'board') return n;
  if (n.kind === 'supply' && kind === 'board') return n;
  return null;
}

function below(feeder: JobNode): { x: number; y: number } {
  const at = feeder.at ?? { x: 0, y: 0 };
  const size = NODE_SIZE[feeder.kind];
  return { x: at.x + size.width / 2, y: at.y + size.height + DROP_BELOW };
}

export interface Added {
  edit: Edit;
  nodes: string[];
  links: string[];
}

/** A new part, and when `feeder` is given its link from it with the role defaults, as one edit. */
export function addPartEdit(job: Job, kind: NodeKind, centre: { x: number; y: number }, feeder: JobNode | null): Added {
  const spot = freeCentre(job, kind, feeder ? below(feeder) : centre);
  const node = newPart(job, kind, spot);
  if (!feeder) return { edit: { op: 'add-node', node }, nodes: [node.id], links: [] };
  const withNode = { ...job, nodes: [...job.nodes, node] };
  const id = nextId(withNode, linkPrefix(withNode, feeder.id, node.id));
  const link = defaultLinkFor(withNode, feeder.id, node.id, id);
  return { edit: { op: 'batch', edits: [{ op: 'add-node', node }, { op: 'add-link', link }] }, nodes: [node.id], links: [id] };
}

export const USE_NAMES: Record<PointUse, string> = {
  'socket-outlets': 'Sockets',
  lighting: 'Lights',
  'fixed-equipment': 'Equipment',
  motor: 'Motor',
  other: 'Circuit',
};

/** Most final subcircuits added in one step. */
export const MAX_CIRCUITS = 60;

/**
 * `count` points of one use, each fed from `boardId` by its own link with the role defaults
 * (engine defaultLinkFor), placed in clear spots below the board, as one edit.
 */
export function addCircuitsEdit(job: Job, boardId: string, count: number, use: PointUse): Added | { error: string } {
  const board = job.nodes.find((n) => n.id === boardId);
  if (!board || board.kind !== 'board') return { error: `${boardId} is not a board of this job` };
  if (!Number.isInteger(count) || count < 1 || count > MAX_CIRCUITS) return { error: `Number of circuits must be a whole number from 1 to ${MAX_CIRCUITS}, got ${count}` };
  let work = job;
  const taken = allIds(job);
  const edits: Edit[] = [];
  const nodes: string[] = [];
  const links: string[] = [];
  const start = below(board);
  for (let i = 0; i < count; i++) {
    const spot = freeCentre(work, 'point', start, 20);
    const id = nextId(work, prefixFor('point'), taken);
    taken.add(id);
    const size = NODE_SIZE.point;
    const node: JobNode = {
      id, kind: 'point', name: `${USE_NAMES[use]} ${id}`, use,
      at: { x: Math.round(spot.x - size.width / 2), y: Math.round(spot.y - size.height / 2) },
    };
    work = { ...work, nodes: [...work.nodes, node] };
    const linkId = nextId(work, 'C', taken);
    taken.add(linkId);
    const link = defaultLinkFor(work, boardId, id, linkId);
    work = { ...work, links: [...work.links, link] };
    edits.push({ op: 'add-node', node }, { op: 'add-link', link });
    nodes.push(id);
    links.push(linkId);
  }
  return { edit: { op: 'batch', edits }, nodes, links };
}
