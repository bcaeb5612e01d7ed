// The job as React Flow nodes and edges, one cached object per record (and selection state),
// so React Flow sees the same object for everything an edit did not touch. A flow list keeps the
// array it gave last time and replaces only the entries whose record or selection changed (a drag
// frame: the moved nodes), handing back the very same array when nothing it draws changed.
// Results and the traced path are not in these objects: each node and link component subscribes
// to its own (nodes.tsx, LinkEdge.tsx), so a new result re-renders only its own label.
import { Position, type Edge, type Node, type NodeHandle } from '@xyflow/react';
import type { JobNode, Link } from '../../../engine/index.js';
import { NODE_SIZE } from './parts.js';

const EMPTY: Record<string, unknown> = {};
const HANDLE = 8;

const nodeCache = new WeakMap<JobNode, { selected: boolean; node: Node }>();
const edgeCache = new WeakMap<Link, { selected: boolean; edge: Edge }>();

function handles(kind: JobNode['kind']): NodeHandle[] {
  const { width, height } = NODE_SIZE[kind];
  const out: NodeHandle = { id: null, type: 'source', position: Position.Bottom, x: width / 2 - HANDLE / 2, y: height - HANDLE / 2, width: HANDLE, height: HANDLE };
  // A supply is where the network starts: no input dot.
  if (kind === 'supply') return [out];
  return [{ id: null, type: 'target', position: Position.Top, x: width / 2 - HANDLE / 2, y: -HANDLE / 2, width: HANDLE, height: HANDLE }, out];
}

export function toFlowNode(n: JobNode, selected: boolean): Node {
  const hit = nodeCache.get(n);
  if (hit && hit.selected === selected) return hit.node;
  const size = NODE_SIZE[n.kind];
  const node: Node = {
    id: n.id,
    type: n.kind,
    position: n.at ?? { x: 0, y: 0 },
    data: EMPTY,
    selected,
    width: size.width,
    height: size.height,
    measured: { ...size },
    handles: handles(n.kind),
  };
  nodeCache.set(n, { selected, node });
  return node;
}

export function toFlowEdge(l: Link, selected: boolean): Edge {
  const hit = edgeCache.get(l);
  if (hit && hit.selected === selected) return hit.edge;
  const edge: Edge = { id: l.id, source: l.from, target: l.to, type: 'link', data: EMPTY, selected };
  edgeCache.set(l, { selected, edge });
  return edge;
}

/** Builds a flow array from records and the selected ids, reusing what did not change. */
export type FlowList<R, F> = (records: readonly R[], selected: readonly string[]) => F[];

export function flowList<R extends { id: string }, F>(make: (record: R, selected: boolean) => F): FlowList<R, F> {
  let lastRecords: readonly R[] | null = null;
  let lastSelected: readonly string[] = [];
  let selectedSet = new Set<string>();
  let out: F[] = [];
  return (records, selected) => {
    if (records === lastRecords && selected === lastSelected) return out;
    // Ids whose selection state flipped (most changes flip none, a click a few).
    let flipped: Set<string> | null = null;
    if (selected !== lastSelected) {
      const next = new Set(selected);
      flipped = new Set();
      for (const id of next) if (!selectedSet.has(id)) flipped.add(id);
      for (const id of selectedSet) if (!next.has(id)) flipped.add(id);
      selectedSet = next;
      lastSelected = selected;
    }
    const previous = lastRecords;
    lastRecords = records;
    if (!previous || previous.length !== records.length) {
      out = records.map((r) => make(r, selectedSet.has(r.id)));
      return out;
    }
    let changed: F[] | null = null;
    for (let i = 0; i < records.length; i++) {
      const r = records[i]!;
      if (r === previous[i] && !flipped?.has(r.id)) continue;
      const f = make(r, selectedSet.has(r.id));
      if (f === out[i]) continue;
      changed ??= out.slice();
      changed[i] = f;
    }
    if (changed) out = changed;
    return out;
  };
}
