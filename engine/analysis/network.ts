// The network as radial trees: who feeds whom, each link's role, its protecting link, and the
// path from its supply. A link's role is derived, never stored:
//   arriving at a point            → final subcircuit (or a further leg of one)
//   otherwise leaving a supply     → consumer mains
//   otherwise (arriving at a board) → submain

import type { Job, JobNode, Link, SupplyNode } from '../model/types.js';
import type { LinkRole } from './results.js';

export class Network {
  readonly nodeById = new Map<string, JobNode>();
  readonly linkById = new Map<string, Link>();
  /** The link feeding each node. */
  readonly feeder = new Map<string, Link>();
  private readonly upstreamCache = new Map<string, Link[] | null>();

  constructor(readonly job: Job) {
    for (const n of job.nodes) this.nodeById.set(n.id, n);
    for (const l of job.links) {
      this.linkById.set(l.id, l);
      if (!this.feeder.has(l.to)) this.feeder.set(l.to, l);
    }
  }

  role(link: Link): LinkRole {
    const to = this.nodeById.get(link.to);
    if (to?.kind === 'point') return 'final-subcircuit';
    if (this.nodeById.get(link.from)?.kind === 'supply') return 'consumer-mains';
    return 'submain';
  }

  /**
   * The links from the supply down to node `nodeId` (supply first), or null when no supply
   * reaches it. Memoised per node.
   */
  linksTo(nodeId: string): Link[] | null {
    const cached = this.upstreamCache.get(nodeId);
    if (cached !== undefined) return cached;
    const node = this.nodeById.get(nodeId);
    let result: Link[] | null;
    if (!node) result = null;
    else if (node.kind === 'supply') result = [];
    else {
      const feed = this.feeder.get(nodeId);
      this.upstreamCache.set(nodeId, null); // guards against a cycle in an unvalidated job
      const above = feed ? this.linksTo(feed.from) : null;
      result = feed && above ? [...above, feed] : null;
    }
    this.upstreamCache.set(nodeId, result);
    return result;
  }

  /** The supply at the top of the tree that holds node `nodeId`, if any. */
  supplyOf(nodeId: string): SupplyNode | null {
    const path = this.linksTo(nodeId);
    if (!path) return null;
    const top = path.length ? path[0]!.from : nodeId;
    const node = this.nodeById.get(top);
    return node?.kind === 'supply' ? node : null;
  }

  /**
   * The link whose device protects `link`: itself when it carries a device; for a link leaving a
   * point, the nearest link above with a device, up to the board or supply the circuit started
   * from; null when the link is unprotected.
   */
  protectingLink(link: Link): Link | null {
    let current: Link | undefined = link;
    const seen = new Set<string>();
    while (current && !seen.has(current.id)) {
      seen.add(current.id);
      if (current.device) return current;
      const origin = this.nodeById.get(current.from);
      if (origin?.kind !== 'point') return null;
      current = this.feeder.get(origin.id);
    }
    return null;
  }

  /** Node and link ids alternately, from the supply to the far end of `link`. */
  pathIds(link: Link): string[] | null {
    const links = this.linksTo(link.to);
    if (!links || links.length === 0) return null;
    const ids = [links[0]!.from];
    for (const l of links) ids.push(l.id, l.to);
    return ids;
  }
}

export function linkRole(job: Job, linkId: string): LinkRole {
  const net = new Network(job);
  const link = net.linkById.get(linkId);
  if (!link) throw new Error(`no link ${linkId} in this job`);
  return net.role(link);
}

/**
 * The fault path of a link: node and link ids alternately, from the top of its tree down to its
 * far end, and whether that top is a supply (false for a link no supply reaches, whose path then
 * starts at the highest node above it). Null when there is no such link.
 */
export function faultPath(job: Job, linkId: string): { ids: string[]; reachesSupply: boolean } | null {
  const net = new Network(job);
  const link = net.linkById.get(linkId);
  if (!link) return null;
  const ids: string[] = [link.to, link.id];
  const seen = new Set<string>([link.to]);
  let at = link.from;
  while (!seen.has(at)) {
    seen.add(at);
    ids.push(at);
    const up = net.feeder.get(at);
    if (!up) break;
    ids.push(up.id);
    at = up.from;
  }
  ids.reverse();
  return { ids, reachesSupply: net.nodeById.get(ids[0]!)?.kind === 'supply' };
}
