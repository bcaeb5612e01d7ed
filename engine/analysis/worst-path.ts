// The worst fault path: among the checked links, the one with the highest ratio (the first in
// file order on a tie) ends it; the path runs from its supply to its far end.

import type { TreeOrder } from './order.js';
import type { WorstPath } from './results.js';

/** From each link's ratio in a table (NaN where the link is unchecked or has no ratio). */
export function worstPathOf(order: TreeOrder, ratios: Float64Array): WorstPath | null {
  let index = -1;
  let ratio = -Infinity;
  for (let i = 0; i < ratios.length; i++) {
    const r = ratios[i]!;
    if (r > ratio || (index < 0 && r === r)) {
      index = i;
      ratio = r;
    }
  }
  if (index < 0) return null;
  const link = order.links[index]!;
  return { link: link.id, ratio, path: order.pathIds(index) ?? [link.from, link.id, link.to] };
}
