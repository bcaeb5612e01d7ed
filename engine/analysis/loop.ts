// Loop sums along the tree: Σ links from the supply to a node, memoised per node, and the
// parts of a circuit's loop the check needs.

import type { Link } from '../model/types.js';
import { add, sub, ZERO, type Complex } from './complex.js';
import type { ResolvedRules } from './basis.js';
import { linkImpedance } from './impedance.js';
import type { Network } from './network.js';
import { sourceImpedance } from './source.js';

export class LoopSums {
  private readonly toNode = new Map<string, Complex>();
  private readonly ownZ = new Map<string, Complex>();

  constructor(
    readonly net: Network,
    readonly rules: ResolvedRules,
  ) {}

  /** The impedance of one link. */
  link(link: Link): Complex {
    let z = this.ownZ.get(link.id);
    if (!z) {
      z = linkImpedance(link.cable, this.rules);
      this.ownZ.set(link.id, z);
    }
    return z;
  }

  /** Σ of the drawn links from the supply to `nodeId` (Ze excluded); null when unreached. */
  toNodeSum(nodeId: string): Complex | null {
    // Climb the feeders to a node already summed (or the supply), then add back down.
    const climb: Link[] = [];
    const seen = new Set<string>();
    let current = nodeId;
    let base = this.toNode.get(current);
    while (!base) {
      const node = this.net.nodeById.get(current);
      if (!node || seen.has(current)) return null;
      seen.add(current);
      if (node.kind === 'supply') {
        base = ZERO;
        this.toNode.set(current, base);
        break;
      }
      const feed = this.net.feeder.get(current);
      if (!feed) return null;
      climb.push(feed);
      current = feed.from;
      base = this.toNode.get(current);
    }
    let acc = base;
    for (let i = climb.length - 1; i >= 0; i--) {
      const l = climb[i]!;
      acc = add(acc, this.link(l));
      this.toNode.set(l.to, acc);
    }
    return acc;
  }

  /** Ze of the supply that feeds `nodeId`: null when unknown or unreached. */
  ze(nodeId: string): Complex | null {
    const supply = this.net.supplyOf(nodeId);
    return supply ? sourceImpedance(supply.source, this.rules.voltage.value) : null;
  }
}

/** The loop figures for one link, given its protecting link's origin. */
export interface LoopParts {
  /** Σ supply → far end (Ze excluded). */
  drawn: Complex;
  /** Σ supply → the protecting link's origin (Ze excluded). */
  upstream: Complex;
  /** Σ protecting link's origin → far end. */
  own: Complex;
  /** Σ supply → this link's origin (Ze excluded). */
  beforeLink: Complex;
}

export function loopParts(sums: LoopSums, link: Link, origin: string | null): LoopParts | null {
  const drawn = sums.toNodeSum(link.to);
  const beforeLink = sums.toNodeSum(link.from);
  if (!drawn || !beforeLink) return null;
  const upstream = origin ? sums.toNodeSum(origin) ?? ZERO : ZERO;
  return { drawn, upstream, own: sub(drawn, upstream), beforeLink };
}

