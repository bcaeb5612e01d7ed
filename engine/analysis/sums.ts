// The loop sums down the ordered trees: each link's impedance, Σ of the drawn links from the
// supply to every node (Ze excluded), Ze at each supply, and each link's protecting link.
// One pass over the pre-order; every value is read back by index.
//
// The protecting link of a link is itself when it carries a device; for a link leaving a point,
// the protecting link of the link feeding that point (the nearest device above, up to the board
// or supply the circuit started from); otherwise none (−1).

import type { Job } from '../model/types.js';
import type { ResolvedRules } from './basis.js';
import type { Complex } from './complex.js';
import { linkImpedance, linkImpedanceInto } from './impedance.js';
import { TreeOrder } from './order.js';
import { sourceImpedance } from './source.js';

export class Sums {
  readonly order: TreeOrder;
  /** Loop impedance of each link. */
  readonly linkRe: Float64Array;
  readonly linkIm: Float64Array;
  /** Σ drawn links supply → node. */
  readonly nodeRe: Float64Array;
  readonly nodeIm: Float64Array;
  readonly protect: Int32Array;
  /** Ze by supply node index (null when unknown; undefined for other nodes). */
  private readonly zeBySupply: Array<Complex | null> = [];

  constructor(
    job: Job,
    readonly rules: ResolvedRules,
    order?: TreeOrder,
  ) {
    this.order = order ?? new TreeOrder(job);
    const { links, nodes, pre, feederOf, linkFrom } = this.order;
    this.linkRe = new Float64Array(links.length);
    this.linkIm = new Float64Array(links.length);
    for (let l = 0; l < links.length; l++) linkImpedanceInto(links[l]!.cable, rules, this.linkRe, this.linkIm, l);
    this.nodeRe = new Float64Array(nodes.length);
    this.nodeIm = new Float64Array(nodes.length);
    this.protect = new Int32Array(links.length).fill(-1);
    const protectOf = (l: number): number => {
      if (links[l]!.device) return l;
      const from = linkFrom[l]!;
      if (from < 0 || nodes[from]!.kind !== 'point') return -1;
      const up = feederOf[from]!;
      return up >= 0 && up !== l ? this.protect[up]! : -1;
    };
    for (let at = 0; at < pre.length; at++) {
      const n = pre[at]!;
      const f = feederOf[n]!;
      if (f < 0) continue;
      const p = linkFrom[f]!;
      this.nodeRe[n] = this.nodeRe[p]! + this.linkRe[f]!;
      this.nodeIm[n] = this.nodeIm[p]! + this.linkIm[f]!;
      this.protect[f] = protectOf(f);
    }
    // Links that feed nothing in the order (only in a job the validator refuses).
    links.forEach((_, l) => {
      const to = this.order.linkTo[l]!;
      if (to < 0 || feederOf[to] !== l) this.protect[l] = links[l]!.device ? l : -1;
    });
    for (let at = 0; at < pre.length; at++) {
      const n = pre[at]!;
      const node = nodes[n]!;
      if (node.kind === 'supply') this.zeBySupply[n] = sourceImpedance(node.source, rules.voltage.value);
    }
  }

  /**
   * These sums over `job`, a job of the same shape in which only link l's cable changed: its
   * impedance and the sums of its subtree are redone in place. The tables are shared with this
   * Sums (versions.ts: the caller has saved the entries written here, link l and the nodes of its
   * subtree, and owns the tables from now on).
   */
  withLinkChanged(job: Job, l: number): Sums {
    const copy = Object.create(Sums.prototype) as Sums;
    const order = this.order.withJob(job);
    const { linkRe, linkIm, nodeRe, nodeIm } = this;
    const z = linkImpedance(job.links[l]!.cable, this.rules);
    linkRe[l] = z.re;
    linkIm[l] = z.im;
    const to = order.linkTo[l]!;
    if (to >= 0 && order.feederOf[to] === l) {
      // Summed again from each parent (in pre-order), as the first pass does: the same numbers as
      // a fresh analysis, also where an extreme value made a sum Infinity (a difference would be NaN).
      const { start, end } = order.subtree(to);
      for (let k = start; k < end; k++) {
        const n = order.pre[k]!;
        const f = order.feederOf[n]!;
        const p = order.linkFrom[f]!;
        nodeRe[n] = nodeRe[p]! + linkRe[f]!;
        nodeIm[n] = nodeIm[p]! + linkIm[f]!;
      }
    }
    Object.assign(copy, this, { order });
    return copy;
  }

  /** Σ drawn links from the supply to node n. */
  drawn(n: number): Complex {
    return { re: this.nodeRe[n]!, im: this.nodeIm[n]! };
  }

  /** Whether a supply reaches link l (it feeds its far end within a tree from a supply). */
  reached(l: number): boolean {
    const to = this.order.linkTo[l]!;
    return to >= 0 && this.order.feederOf[to] === l && this.order.supplyOf[to]! >= 0;
  }

  /** Ze of the supply above node n, or null when unknown or unreached. */
  zeOf(n: number): Complex | null {
    const s = this.order.supplyOf[n]!;
    return s >= 0 ? this.zeBySupply[s] ?? null : null;
  }
}
