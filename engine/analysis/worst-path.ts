// The worst fault path: among the checked links, the one with the highest ratio (the first in
// file order on a tie) ends it; the path runs from its supply to its far end.

import type { TreeOrder } from './order.js';
import type { CircuitResult, WorstPath } from './results.js';

export function worstPath(order: TreeOrder, circuits: readonly CircuitResult[]): WorstPath | null {
  let index = -1;
  let ratio = -Infinity;
  for (let i = 0; i < circuits.length; i++) {
    const c = circuits[i]!;
    if (c.status === 'unchecked' || c.ratio === null) continue;
    if (index < 0 || c.ratio > ratio) {
      index = i;
      ratio = c.ratio;
    }
  }
  if (index < 0) return null;
  const link = order.links[index]!;
  return { link: link.id, ratio, path: order.pathIds(index) ?? [link.from, link.id, link.to] };
}
