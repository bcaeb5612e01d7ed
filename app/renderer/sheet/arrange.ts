// Auto-arrange: elkjs layered layout, top-down from each supply. Layers are spaced so that
// the link labels (placed just above each far node) have room.
import ELK from 'elkjs/lib/elk.bundled.js';
import type { ElkNode } from 'elkjs/lib/elk-api.js';
import type { Job } from '../../../engine/index.js';
import { LABEL_HEIGHT, LABEL_WIDTH } from './geometry.js';
import { NODE_SIZE } from './parts.js';

let elk: InstanceType<typeof ELK> | null = null;

export async function autoArrange(job: Job): Promise<Array<{ id: string; at: { x: number; y: number } }>> {
  elk ??= new ELK();
  const graph: ElkNode = {
    id: 'root',
    layoutOptions: {
      'elk.algorithm': 'layered',
      'elk.direction': 'DOWN',
      'elk.layered.spacing.nodeNodeBetweenLayers': String(LABEL_HEIGHT + 56),
      'elk.spacing.nodeNode': String(LABEL_WIDTH - NODE_SIZE.point.width + 28),
      'elk.spacing.componentComponent': '80',
      'elk.layered.nodePlacement.strategy': 'NETWORK_SIMPLEX',
      'elk.layered.crossingMinimization.semiInteractive': 'true',
      'elk.edgeRouting': 'ORTHOGONAL',
    },
    // Nodes as wide as their label so neighbours' labels never meet.
    children: job.nodes.map((n) => {
      const size = NODE_SIZE[n.kind];
      return {
        id: n.id,
        width: Math.max(size.width, LABEL_WIDTH),
        height: size.height,
        // Keeps the current left-to-right order where it can.
        layoutOptions: { 'elk.position': `(${n.at?.x ?? 0}, ${n.at?.y ?? 0})` },
      };
    }),
    edges: job.links.map((l) => ({ id: l.id, sources: [l.from], targets: [l.to] })),
  };
  const laid = await elk.layout(graph);
  const slots = new Map((laid.children ?? []).map((c) => [c.id, { x: c.x ?? 0, y: c.y ?? 0, w: c.width ?? LABEL_WIDTH, h: c.height ?? 0 }]));
  centreParents(job, slots);
  return job.nodes.flatMap((node) => {
    const c = slots.get(node.id);
    if (!c) return [];
    const size = NODE_SIZE[node.kind];
    return [{ id: node.id, at: { x: Math.round(c.x + (c.w - size.width) / 2), y: Math.round(c.y) } }];
  });
}

/**
 * Positions for the nodes that have none (a job written by another tool): the whole job laid
 * out when no node has a position; otherwise only the missing ones, laid out among themselves
 * and set to the right of what the user drew, which is never moved.
 */
export async function positionsForMissing(job: Job): Promise<Array<{ id: string; at: { x: number; y: number } }>> {
  const missing = new Set(job.nodes.filter((n) => n.at === undefined).map((n) => n.id));
  if (missing.size === 0) return [];
  const arranged = await autoArrange(job);
  if (missing.size === job.nodes.length) return arranged;
  const placed = job.nodes.filter((n) => n.at !== undefined);
  const right = Math.max(...placed.map((n) => n.at!.x + NODE_SIZE[n.kind].width));
  const top = Math.min(...placed.map((n) => n.at!.y));
  const mine = arranged.filter((m) => missing.has(m.id));
  const left = Math.min(...mine.map((m) => m.at.x));
  const high = Math.min(...mine.map((m) => m.at.y));
  return mine.map((m) => ({ id: m.id, at: { x: m.at.x - left + right + LABEL_WIDTH, y: m.at.y - high + top } }));
}

/**
 * Tidies the layered result the way single-line diagrams are drawn: each board sits centred over
 * the circuits it feeds, where that leaves room beside its neighbours in the same row.
 */
function centreParents(job: Job, slots: Map<string, { x: number; y: number; w: number; h: number }>): void {
  const children = new Map<string, string[]>();
  for (const l of job.links) {
    const list = children.get(l.from);
    if (list !== undefined) list.push(l.to);
    else children.set(l.from, [l.to]);
  }
  const order = [...slots.keys()].sort((a, b) => slots.get(b)!.y - slots.get(a)!.y);
  const gap = 24;
  for (const id of order) {
    const kids = (children.get(id) ?? []).map((k) => slots.get(k)).filter((k) => k !== undefined);
    if (kids.length === 0) continue;
    const me = slots.get(id)!;
    const left = Math.min(...kids.map((k) => k.x + k.w / 2));
    const right = Math.max(...kids.map((k) => k.x + k.w / 2));
    const x = (left + right) / 2 - me.w / 2;
    const clash = [...slots.entries()].some(
      ([other, o]) =>
        other !== id && o.y < me.y + me.h + LABEL_HEIGHT && me.y < o.y + o.h + LABEL_HEIGHT && x < o.x + o.w + gap && o.x < x + me.w + gap,
    );
    if (!clash) me.x = x;
  }
}
