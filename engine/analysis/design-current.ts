// Design current Ib and power factor of every link, gathered up the tree (method-depth.md §2).
//
// For a link L from A to N, with N's diversity d(N) (1 unless N is a board):
//   Ib(L) = L.designCurrent when stated, else d(N) · Σ share(x) over the items x at N:
//   N's own load (a point with current > 0) and every link leaving N.
//   Under a 1-phase L every item counts whole. Under a 3-phase L a 1-phase load or link counts
//   a third (the balanced-phase assumption: single-phase loads spread evenly over the phases),
//   a 3-phase one whole.
// Power factor: L's stated one; else the share-weighted mean over the items; else 0.8 for a
// stated design current with nothing below (IEC 60364-5-52 Annex G, from memory).

import type { BoardNode, PointNode } from '../model/types.js';
import type { TreeOrder } from './order.js';
import type { PhaseTable } from './phases.js';

export const DEFAULT_POWER_FACTOR = 0.8;

export interface LoadTable {
  /** Ib per link, A (NaN where null). */
  ib: Float64Array;
  /** cos φ per link (NaN where null). */
  pf: Float64Array;
}

export function loadTable(order: TreeOrder, phases: PhaseTable): LoadTable {
  const { nodes, links, pre, feederOf, childStart, childLinks, linkTo } = order;
  const ib = new Float64Array(links.length).fill(NaN);
  const pf = new Float64Array(links.length).fill(NaN);
  const computeLink = (l: number): void => {
    const link = links[l]!;
    const n = linkTo[l]!;
    const threePhase = phases.link[l] === 3;
    let sum = 0;
    let pfSum = 0;
    let items = 0;
    if (n >= 0) {
      const node = nodes[n]!;
      if (node.kind === 'point') {
        const p = node as PointNode;
        if (p.current !== undefined && p.current > 0) {
          const share = threePhase && (p.phases ?? 1) === 1 ? p.current / 3 : p.current;
          sum += share;
          pfSum += share * (p.powerFactor ?? DEFAULT_POWER_FACTOR);
          items++;
        }
      }
      for (let k = childStart[n]!; k < childStart[n + 1]!; k++) {
        const c = childLinks[k]!;
        const childIb = ib[c]!;
        if (Number.isNaN(childIb)) continue;
        const share = threePhase && phases.link[c] === 1 ? childIb / 3 : childIb;
        sum += share;
        pfSum += share * pf[c]!;
        items++;
      }
    }
    const meanPf = items > 0 && sum > 0 ? pfSum / sum : NaN;
    if (link.designCurrent !== undefined) {
      ib[l] = link.designCurrent;
      pf[l] = link.powerFactor ?? (Number.isNaN(meanPf) ? DEFAULT_POWER_FACTOR : meanPf);
      return;
    }
    if (items === 0) return;
    const node = nodes[n]!;
    const d = node.kind === 'board' ? (node as BoardNode).diversity ?? 1 : 1;
    ib[l] = d * sum;
    pf[l] = link.powerFactor ?? meanPf;
  };
  for (let k = pre.length - 1; k >= 0; k--) {
    const f = feederOf[pre[k]!]!;
    if (f >= 0) computeLink(f);
  }
  // Links outside the trees (only in a job the validator refuses) take their own statement.
  links.forEach((link, l) => {
    const to = linkTo[l]!;
    if ((to < 0 || feederOf[to] !== l) && link.designCurrent !== undefined) {
      ib[l] = link.designCurrent;
      pf[l] = link.powerFactor ?? DEFAULT_POWER_FACTOR;
    }
  });
  return { ib, pf };
}
