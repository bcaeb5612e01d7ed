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

const nodeCache = new WeakMap<JobNode, { selected: boolean; unfed: boolean; label: string; node: Node }>();
const edgeCache = new WeakMap<Link, { selected: boolean; label: string; edge: Edge }>();

/** Accessible names by id: a map of its own over the names of the decor it came from. */
export interface LabelLookup {
  get(id: string): string | undefined;
}

/** What a node or link is read out as, and whether a node is fed: worked out once per edit. */
export interface Decor {
  /** Nodes no link feeds (a point or board drawn but not connected). */
  unfed: ReadonlySet<string>;
  /** Accessible names by id (id, name and status), for the nodes and links. */
  label: LabelLookup;
  /** Set when this decor is `base` with only these ids read out anew (a status changed). */
  changedFrom?: { base: Decor; ids: ReadonlySet<string> };
}

const NO_DECOR: Decor = { unfed: new Set(), label: new Map() };

/** Names of its own over a base's; after a few layers they are merged into one map again. */
class LayeredLabels implements LabelLookup {
  readonly depth: number;
  constructor(
    private readonly own: ReadonlyMap<string, string>,
    private readonly base: LabelLookup,
  ) {
    this.depth = base instanceof LayeredLabels ? base.depth + 1 : 1;
  }

  get(id: string): string | undefined {
    return this.own.get(id) ?? this.base.get(id);
  }
}

/** Merges a stack of layers into one map (the base a layer sits on is a plain map). */
function flatten(labels: LabelLookup, ids: Iterable<string>): Map<string, string> {
  const out = new Map<string, string>();
  for (const id of ids) {
    const v = labels.get(id);
    if (v !== undefined) out.set(id, v);
  }
  return out;
}

const MAX_LAYERS = 8;

function handles(kind: JobNode['kind']): NodeHandle[] {
  const { width, height } = NODE_SIZE[kind];
  const out: NodeHandle = { id: null, type: 'source', position: Position.Bottom, x: width / 2 - HANDLE / 2, y: height - HANDLE / 2, width: HANDLE, height: HANDLE };
  // A supply is where the network starts: no input dot.
  if (kind === 'supply') return [out];
  return [{ id: null, type: 'target', position: Position.Top, x: width / 2 - HANDLE / 2, y: -HANDLE / 2, width: HANDLE, height: HANDLE }, out];
}

export function toFlowNode(n: JobNode, selected: boolean, decor: Decor = NO_DECOR): Node {
  const unfed = decor.unfed.has(n.id);
  const label = decor.label.get(n.id) ?? `${n.kind} ${n.id}${n.name ? ` ${n.name}` : ''}`;
  const hit = nodeCache.get(n);
  if (hit && hit.selected === selected && hit.unfed === unfed && hit.label === label) return hit.node;
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
    ariaLabel: label,
    ...(unfed ? { className: 'lw-unfed' } : {}),
  };
  nodeCache.set(n, { selected, unfed, label, node });
  return node;
}

/**
 * The id of the element that reads out a link's status (LinkEdge draws it): the status is its
 * description, not part of the edge's label, so a new status leaves the edge object as it was
 * and React Flow does not index every edge again after an edit. No whitespace (an id list).
 */
export function statusDescriptionId(linkId: string): string {
  return `lw-status-${encodeURIComponent(linkId)}`;
}

export function toFlowEdge(l: Link, selected: boolean, decor: Decor = NO_DECOR): Edge {
  const label = decor.label.get(l.id) ?? `link ${l.id}${l.name ? ` ${l.name}` : ''}, ${l.from} to ${l.to}`;
  const hit = edgeCache.get(l);
  if (hit && hit.selected === selected && hit.label === label) return hit.edge;
  const edge: Edge = {
    id: l.id, source: l.from, target: l.to, type: 'link', data: EMPTY, selected, ariaLabel: label,
    domAttributes: { 'aria-describedby': statusDescriptionId(l.id) },
  };
  edgeCache.set(l, { selected, label, edge });
  return edge;
}

/** Two edges that draw and read the same (a cable edit: the link is a new record, its edge is not). */
export function sameEdge(a: Edge, b: Edge): boolean {
  return a.id === b.id && a.source === b.source && a.target === b.target && a.type === b.type && a.selected === b.selected && a.ariaLabel === b.ariaLabel;
}

/** Builds a flow array from records and the selected ids, reusing what did not change. */
export type FlowList<R, F> = (records: readonly R[], selected: readonly string[], decor?: Decor) => F[];

export function flowList<R extends { id: string }, F>(
  make: (record: R, selected: boolean, decor: Decor) => F,
  same: ((a: F, b: F) => boolean) | null = null,
): FlowList<R, F> {
  let lastRecords: readonly R[] | null = null;
  let lastSelected: readonly string[] = [];
  let lastDecor: Decor = NO_DECOR;
  let selectedSet = new Set<string>();
  let out: F[] = [];
  return (records, selected, decor = NO_DECOR) => {
    if (records === lastRecords && selected === lastSelected && decor === lastDecor) return out;
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
    // New decoration (an edit changed results or feeds): every entry is asked, the unchanged come
    // back from the cache; when it differs from the last one in a few ids only, just those.
    const redecorate = decor !== lastDecor;
    const only = redecorate && decor.changedFrom?.base === lastDecor ? decor.changedFrom.ids : null;
    lastDecor = decor;
    const previous = lastRecords;
    lastRecords = records;
    if (!previous || previous.length !== records.length) {
      out = records.map((r) => make(r, selectedSet.has(r.id), decor));
      return out;
    }
    let changed: F[] | null = null;
    for (let i = 0; i < records.length; i++) {
      const r = records[i]!;
      if ((!redecorate || (only !== null && !only.has(r.id))) && r === previous[i] && !flipped?.has(r.id)) continue;
      const f = make(r, selectedSet.has(r.id), decor);
      if (f === out[i] || (same !== null && same(f, out[i]!))) continue;
      changed ??= out.slice();
      changed[i] = f;
    }
    if (changed) out = changed;
    return out;
  };
}

export const STATUS_READ: Record<string, string> = { pass: '✓ pass', fail: '✗ FAIL', rcd: '⚠ RCD-reliant', unchecked: '○ unchecked' };
const KIND_WORD: Record<JobNode['kind'], string> = { supply: 'Supply', board: 'Board', point: 'Point' };

type Searchable = { nodes: readonly JobNode[]; links: readonly Link[] };
type ResultsById = Readonly<Record<string, { status: string } | undefined>>;

function statusWords(resultById: ResultsById, linkId: string): string {
  return STATUS_READ[resultById[linkId]?.status ?? 'unchecked'] ?? '○ unchecked';
}

function fedLabel(n: JobNode, feedId: string, resultById: ResultsById): string {
  const name = n.name ? ` "${n.name}"` : '';
  return `${KIND_WORD[n.kind]} ${n.id}${name}, fed by ${feedId}: ${statusWords(resultById, feedId)}`;
}

/** A full decor, and what a later one needs to redo only the nodes whose feeder's status moved. */
interface Built {
  decor: Decor;
  /** Each fed node that is not a supply, by the id of the link feeding it. */
  fed: Map<string, JobNode>;
}

function buildDecor(job: Searchable, resultById: ResultsById): Built {
  const feeder = new Map<string, Link>();
  for (const l of job.links) if (!feeder.has(l.to)) feeder.set(l.to, l);
  const fanOut = new Map<string, number>();
  for (const l of job.links) fanOut.set(l.from, (fanOut.get(l.from) ?? 0) + 1);
  const unfed = new Set<string>();
  const label = new Map<string, string>();
  const fed = new Map<string, JobNode>();
  for (const n of job.nodes) {
    const name = n.name ? ` "${n.name}"` : '';
    if (n.kind === 'supply') {
      const k = fanOut.get(n.id) ?? 0;
      label.set(n.id, `Supply ${n.id}${name}, feeds ${k} link${k === 1 ? '' : 's'}`);
      continue;
    }
    const feed = feeder.get(n.id);
    if (!feed) {
      unfed.add(n.id);
      label.set(n.id, `${KIND_WORD[n.kind]} ${n.id}${name}: ⚠ not fed, nothing connects to it`);
      continue;
    }
    if (!label.has(n.id)) fed.set(feed.id, n);
    label.set(n.id, fedLabel(n, feed.id, resultById));
  }
  for (const l of job.links) {
    // The status is the link's description (statusDescriptionId), drawn by the link itself.
    const name = l.name ? ` "${l.name}"` : '';
    label.set(l.id, `Link ${l.id}${name}, ${l.from} to ${l.to}`);
  }
  return { decor: { unfed, label }, fed };
}

/**
 * Which nodes nothing feeds, and what every node and link is read out as: its id and name, and
 * for a node the status of the link feeding it (a link's own status is its description).
 */
export function sheetDecor(job: Searchable, resultById: ResultsById): Decor {
  return buildDecor(job, resultById).decor;
}

/**
 * sheetDecor for the sheet, kept across edits: while the ids, names and ends stay the same
 * object (selectSearchable), a new set of results redoes only the nodes whose feeding link's
 * status changed, and hands back the last decor itself when none did. Every other name stays
 * the very same string, so nothing the size of the job is rebuilt or compared on an edit.
 */
export function decorKeeper(): (job: Searchable, resultById: ResultsById) => Decor {
  let last: { job: Searchable; resultById: ResultsById; built: Built; decor: Decor } | null = null;
  return (job, resultById) => {
    if (last && last.job === job) {
      if (last.resultById === resultById) return last.decor;
      const own = new Map<string, string>();
      for (const [linkId, node] of last.built.fed) {
        if (last.resultById[linkId]?.status === resultById[linkId]?.status) continue;
        own.set(node.id, fedLabel(node, linkId, resultById));
      }
      if (own.size === 0) {
        last = { ...last, resultById };
        return last.decor;
      }
      const base = last.decor;
      const layered = new LayeredLabels(own, base.label);
      const label = layered.depth > MAX_LAYERS ? flatten(layered, allIds(job)) : layered;
      const decor: Decor = { unfed: base.unfed, label, changedFrom: { base, ids: new Set(own.keys()) } };
      last = { job, resultById, built: last.built, decor };
      return decor;
    }
    const built = buildDecor(job, resultById);
    last = { job, resultById, built, decor: built.decor };
    return built.decor;
  };
}

function* allIds(job: Searchable): Iterable<string> {
  for (const n of job.nodes) yield n.id;
  for (const l of job.links) yield l.id;
}
