// The job as React Flow nodes and edges, one cached object per record (and selection state),
// so React Flow sees the same object for everything an edit did not touch.
import { Position, type Edge, type Node, type NodeHandle } from '@xyflow/react';
import type { JobNode, Link } from '../../../engine/index.js';
import { NODE_SIZE } from './parts.js';

const EMPTY: Record<string, unknown> = {};
const HANDLE = 8;

const nodeCache = new WeakMap<JobNode, { selected: boolean; node: Node }>();
const edgeCache = new WeakMap<Link, { selected: boolean; edge: Edge }>();

function handles(kind: JobNode['kind']): NodeHandle[] {
  const { width, height } = NODE_SIZE[kind];
  return [
    { id: null, type: 'target', position: Position.Top, x: width / 2 - HANDLE / 2, y: -HANDLE / 2, width: HANDLE, height: HANDLE },
    { id: null, type: 'source', position: Position.Bottom, x: width / 2 - HANDLE / 2, y: height - HANDLE / 2, width: HANDLE, height: HANDLE },
  ];
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
