// Questions about the drawing answered from the ordered tree (order.ts): a link's role, and the
// fault path of a link from the top of its tree down to its far end.

import type { Job } from '../model/types.js';
import { roleOfEnds, TreeOrder } from './order.js';
import type { LinkRole } from './results.js';

export function linkRole(job: Job, linkId: string): LinkRole {
  const link = job.links.find((l) => l.id === linkId);
  if (!link) throw new Error(`no link ${linkId} in this job`);
  const kindOf = (id: string) => job.nodes.find((n) => n.id === id)?.kind;
  return roleOfEnds(kindOf(link.from), kindOf(link.to));
}

/**
 * The fault path of a link: node and link ids alternately, from the top of its tree down to its
 * far end, and whether that top is a supply (false for a link no supply reaches, whose path then
 * starts at the highest node above it). Null when there is no such link.
 */
export function faultPath(job: Job, linkId: string): { ids: string[]; reachesSupply: boolean } | null {
  const index = job.links.findIndex((l) => l.id === linkId);
  if (index < 0) return null;
  const order = new TreeOrder(job);
  const link = job.links[index]!;
  const ids: string[] = [link.to, link.id];
  const seen = new Set<string>([link.to]);
  let at = order.linkFrom[index]!;
  while (at >= 0 && !seen.has(order.nodes[at]!.id)) {
    const node = order.nodes[at]!;
    seen.add(node.id);
    ids.push(node.id);
    const up = order.feederOf[at]!;
    if (up < 0) break;
    ids.push(order.links[up]!.id);
    at = order.linkFrom[up]!;
  }
  if (at < 0) ids.push(link.from);
  ids.reverse();
  return { ids, reachesSupply: job.nodes.find((n) => n.id === ids[0])?.kind === 'supply' };
}
