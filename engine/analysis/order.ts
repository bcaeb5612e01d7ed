// The installation ordered once: every node and link numbered, each node's feeding link and
// parent, and one pre-order of the trees (parents before children). Every later pass works on
// arrays by index over this order; nothing here recurses, so no file can exhaust the stack.
//
// Trees start at the supplies (in file order); nodes that no supply reaches are ordered after
// them from their own topmost node, so their loads still roll up. A node inside a cycle (only in
// a job the validator would refuse) is left out of the order.

import type { Job, JobNode, Link, NodeKind, SupplyNode } from '../model/types.js';
import type { LinkRole } from './results.js';
import { IdTable, type IdLookup } from '../model/id-table.js';

/** A link's role from the kinds of its two ends (undefined for an end that is not in the job):
 *  into a point it is a final subcircuit, out of a supply the consumer mains, else a submain. */
export function roleOfEnds(fromKind: NodeKind | undefined, toKind: NodeKind | undefined): LinkRole {
  if (toKind === 'point') return 'final-subcircuit';
  if (fromKind === 'supply') return 'consumer-mains';
  return 'submain';
}

/** What the loader worked out about a job's ids, by the nodes list it was worked out for. */
interface SharedIds {
  ids: IdLookup;
  links: readonly Link[];
  /** The ids and ends as they were, to see that the lists were not edited since. */
  nodeIds: string[];
  fromIds: string[];
  toIds: string[];
  linkFrom: Int32Array;
  linkTo: Int32Array;
}
const shared = new WeakMap<readonly JobNode[], SharedIds>();

/**
 * Offer the loader's index of ids (each node id → its index, ≥ 0; link ids → negative numbers)
 * and each link's ends as node indices, for `nodes` and `links`, so that ordering the same job
 * does not index its ids again. They are used only while they still match: the same lists, of
 * the same lengths, with every node's id and every link's ends as they were (so an edited list,
 * even one edited in place, is indexed afresh).
 */
export function shareIds(nodes: readonly JobNode[], links: readonly Link[], ids: IdLookup, linkFrom: Int32Array, linkTo: Int32Array): void {
  const nodeIds = new Array<string>(nodes.length);
  for (let i = 0; i < nodes.length; i++) nodeIds[i] = nodes[i]!.id;
  const fromIds = new Array<string>(links.length);
  const toIds = new Array<string>(links.length);
  for (let i = 0; i < links.length; i++) {
    fromIds[i] = links[i]!.from;
    toIds[i] = links[i]!.to;
  }
  shared.set(nodes, { ids, links, nodeIds, fromIds, toIds, linkFrom, linkTo });
}

function sharedFor(nodes: readonly JobNode[], links: readonly Link[]): SharedIds | null {
  const entry = shared.get(nodes);
  if (entry === undefined || entry.links !== links || entry.nodeIds.length !== nodes.length || entry.fromIds.length !== links.length) return null;
  const { nodeIds, fromIds, toIds } = entry;
  for (let i = 0; i < nodes.length; i++) if (nodes[i]!.id !== nodeIds[i]) return null;
  for (let i = 0; i < links.length; i++) {
    const link = links[i]!;
    if (link.from !== fromIds[i] || link.to !== toIds[i]) return null;
  }
  return entry;
}

export class TreeOrder {
  readonly nodes: readonly JobNode[];
  readonly links: readonly Link[];
  /** Each node id's index (ids of links may map to negative numbers: not nodes). */
  readonly nodeIndex: IdLookup;
  /** Node index of each link's origin and far end (−1 when missing). */
  readonly linkFrom: Int32Array;
  readonly linkTo: Int32Array;
  /** The link feeding each node (−1 for none). */
  readonly feederOf: Int32Array;
  /** Node indices, parents before children. */
  readonly pre: Int32Array;
  /** The supply node index at the top of each node's tree; −1 when no supply reaches it. */
  readonly supplyOf: Int32Array;
  /** Links leaving each node, as a compressed list: childLinks[childStart[n] .. childStart[n+1]). */
  readonly childStart: Int32Array;
  readonly childLinks: Int32Array;
  /** Each link's role. */
  readonly roles: LinkRole[];
  /** The supply nodes, in file order. */
  readonly supplies: Int32Array;
  /** Each node's place in `pre` (−1 when outside it) and the size of its subtree there. */
  readonly prePosition: Int32Array;
  readonly subtreeSize: Int32Array;

  /**
   * `ids`, when given, is where each id is (graph-rules.ts): a node's index (≥ 0), or a negative
   * number for a link's id; the loader passes it so the ids are not indexed twice.
   */
  constructor(job: Job, ids?: IdLookup) {
    const nodes = job.nodes;
    const links = job.links;
    this.nodes = nodes;
    this.links = links;
    const nn = nodes.length;
    const nl = links.length;
    const known = ids === undefined ? sharedFor(nodes, links) : null;
    if (ids) this.nodeIndex = ids;
    else if (known) this.nodeIndex = known.ids;
    else {
      const index = new IdTable(nn);
      for (let i = 0; i < nn; i++) {
        const id = nodes[i]!.id;
        if (!index.has(id)) index.set(id, i);
      }
      this.nodeIndex = index;
    }
    this.linkFrom = new Int32Array(nl);
    this.linkTo = new Int32Array(nl);
    this.feederOf = new Int32Array(nn).fill(-1);
    const outCount = new Int32Array(nn + 1);
    for (let l = 0; l < nl; l++) {
      let from: number;
      let to: number;
      if (known) {
        from = known.linkFrom[l]!;
        to = known.linkTo[l]!;
      } else {
        const fromCode = this.nodeIndex.get(links[l]!.from);
        const toCode = this.nodeIndex.get(links[l]!.to);
        from = fromCode !== undefined && fromCode >= 0 ? fromCode : -1;
        to = toCode !== undefined && toCode >= 0 ? toCode : -1;
      }
      this.linkFrom[l] = from;
      this.linkTo[l] = to;
      if (to >= 0 && from >= 0 && to !== from && this.feederOf[to] === -1 && nodes[to]!.kind !== 'supply') this.feederOf[to] = l;
      if (from >= 0) outCount[from + 1]! += 1;
    }
    this.childStart = new Int32Array(nn + 1);
    for (let n = 0; n < nn; n++) this.childStart[n + 1] = this.childStart[n]! + outCount[n + 1]!;
    this.childLinks = new Int32Array(this.childStart[nn]!);
    const fill = this.childStart.slice(0, nn);
    for (let l = 0; l < nl; l++) {
      const from = this.linkFrom[l]!;
      if (from >= 0 && this.feederOf[this.linkTo[l]!] === l) this.childLinks[fill[from]!++] = l;
    }

    // Pre-order from the supplies, then from every other node that nothing feeds.
    this.supplyOf = new Int32Array(nn).fill(-1);
    const pre = new Int32Array(nn);
    let count = 0;
    const placed = new Uint8Array(nn);
    const stack: number[] = [];
    const walkFrom = (root: number, supply: number): void => {
      stack.push(root);
      while (stack.length) {
        const n = stack.pop()!;
        if (placed[n]) continue;
        placed[n] = 1;
        pre[count++] = n;
        this.supplyOf[n] = supply;
        const end = this.childStart[n + 1]!;
        // Pushed in reverse so children come out in file order.
        for (let k = end - 1; k >= this.childStart[n]!; k--) {
          const child = this.linkTo[this.childLinks[k]!]!;
          if (!placed[child]) stack.push(child);
        }
      }
    };
    const supplies: number[] = [];
    for (let n = 0; n < nn; n++) if (nodes[n]!.kind === 'supply') supplies.push(n);
    this.supplies = Int32Array.from(supplies);
    for (const n of supplies) walkFrom(n, n);
    for (let n = 0; n < nn; n++) if (!placed[n] && this.feederOf[n] === -1) walkFrom(n, -1);
    this.pre = pre.slice(0, count);
    this.prePosition = new Int32Array(nn).fill(-1);
    this.subtreeSize = new Int32Array(nn);
    for (let k = 0; k < count; k++) this.prePosition[this.pre[k]!] = k;
    for (let k = count - 1; k >= 0; k--) {
      const n = this.pre[k]!;
      this.subtreeSize[n]! += 1;
      const f = this.feederOf[n]!;
      const parent = f >= 0 ? this.linkFrom[f]! : -1;
      if (parent >= 0 && this.prePosition[parent]! >= 0 && this.prePosition[parent]! < k) this.subtreeSize[parent]! += this.subtreeSize[n]!;
    }

    this.roles = links.map((_, l) => {
      const to = this.linkTo[l]!;
      const from = this.linkFrom[l]!;
      return roleOfEnds(from >= 0 ? nodes[from]!.kind : undefined, to >= 0 ? nodes[to]!.kind : undefined);
    });
  }

  /** The same order over another job of exactly the same shape (same ids, ends and feeders). */
  withJob(job: Job): TreeOrder {
    const copy = Object.create(TreeOrder.prototype) as TreeOrder;
    Object.assign(copy, this, { nodes: job.nodes, links: job.links });
    return copy;
  }

  /** The nodes of the subtree under node n (n first), as a range of `pre`. */
  subtree(n: number): { start: number; end: number } {
    const start = this.prePosition[n]!;
    return start < 0 ? { start: 0, end: 0 } : { start, end: start + this.subtreeSize[n]! };
  }

  /** The node feeding node n through its feeder (−1 at the top). */
  parentOf(n: number): number {
    const l = this.feederOf[n]!;
    return l >= 0 ? this.linkFrom[l]! : -1;
  }

  supplyNode(n: number): SupplyNode | null {
    const s = n >= 0 ? this.supplyOf[n]! : -1;
    return s >= 0 ? (this.nodes[s] as SupplyNode) : null;
  }

  /** Node and link ids alternately from the supply to the far end of link l; null when unreached. */
  pathIds(l: number): string[] | null {
    const to = this.linkTo[l]!;
    if (to < 0 || this.supplyOf[to]! < 0) return null;
    const ids: string[] = [];
    let n = to;
    let guard = this.nodes.length + 1;
    while (guard-- > 0) {
      ids.push(this.nodes[n]!.id);
      const f = this.feederOf[n]!;
      if (f < 0) break;
      ids.push(this.links[f]!.id);
      n = this.linkFrom[f]!;
    }
    return ids.reverse();
  }
}
