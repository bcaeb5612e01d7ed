// Phases of every supply and link (method-depth.md §1).
//
// A supply: its stated `phases`, else 3 when any point it reaches has `phases: 3`, else 1.
// A link: its stated `phases`; else 1 under a single-phase supply; under a three-phase supply 3
// for consumer mains and submains, and for a final-subcircuit link 3 when the point at its far
// end or any point below it has `phases: 3`, else 1. A link no supply reaches: stated, else 1.

import type { Phases, PointNode, SupplyNode } from '../model/types.js';
import type { TreeOrder } from './order.js';

export interface PhaseTable {
  /** Phases of each supply, by node index (0 for other nodes). */
  supply: Uint8Array;
  /** Phases of each link. */
  link: Uint8Array;
  /** 1 where some link from the supply down to the node has 1 phase. */
  singleAbove: Uint8Array;
}

export function phaseTable(order: TreeOrder): PhaseTable {
  const { nodes, links, pre, feederOf, linkFrom, linkTo, supplyOf, roles } = order;
  const threeBelow = new Uint8Array(nodes.length);
  for (let k = pre.length - 1; k >= 0; k--) {
    const n = pre[k]!;
    const node = nodes[n]!;
    if (node.kind === 'point' && (node as PointNode).phases === 3) threeBelow[n] = 1;
    const parent = order.parentOf(n);
    if (threeBelow[n] && parent >= 0) threeBelow[parent] = 1;
  }
  const supply = new Uint8Array(nodes.length);
  nodes.forEach((node, n) => {
    if (node.kind === 'supply') supply[n] = (node as SupplyNode).phases ?? (threeBelow[n] ? 3 : 1);
  });
  const link = new Uint8Array(links.length);
  links.forEach((l, i) => {
    if (l.phases !== undefined) {
      link[i] = l.phases;
      return;
    }
    const to = linkTo[i]!;
    const s = to >= 0 && feederOf[to] === i ? supplyOf[to]! : -1;
    if (s < 0 || supply[s] === 1) link[i] = 1;
    else if (roles[i] !== 'final-subcircuit') link[i] = 3;
    else link[i] = threeBelow[to] ? 3 : 1;
  });
  const singleAbove = new Uint8Array(nodes.length);
  for (let at = 0; at < pre.length; at++) {
    const n = pre[at]!;
    const f = feederOf[n]!;
    if (f >= 0) singleAbove[n] = singleAbove[linkFrom[f]!]! || link[f] === 1 ? 1 : 0;
  }
  return { supply, link, singleAbove };
}

export function asPhases(value: number): Phases {
  return value === 3 ? 3 : 1;
}
