// The worst fault path: among the checked links, the one with the highest ratio (the first in
// file order on a tie) ends it; the path runs from its supply to its far end.

import type { Link } from '../model/types.js';
import type { Network } from './network.js';
import type { CircuitResult, WorstPath } from './results.js';

export function worstPath(net: Network, links: readonly Link[], circuits: readonly CircuitResult[]): WorstPath | null {
  let worst: { index: number; ratio: number } | null = null;
  circuits.forEach((c, index) => {
    if (c.status === 'unchecked' || c.ratio === null) return;
    if (!worst || c.ratio > worst.ratio) worst = { index, ratio: c.ratio };
  });
  if (!worst) return null;
  const { index, ratio } = worst as { index: number; ratio: number };
  const link = links[index]!;
  return { link: link.id, ratio, path: net.pathIds(link) ?? [link.from, link.id, link.to] };
}
