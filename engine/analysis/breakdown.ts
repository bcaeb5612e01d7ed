// The loop of one circuit broken down by segment: the source (Ze, when known), then every link
// from the supply to the circuit's far end, each with its ohms and its share of the limit.

import type { Job } from '../model/types.js';
import { magnitude, sum, type Complex } from './complex.js';
import { resolveRules } from './basis.js';
import { checkLink } from './check.js';
import { LoopSums } from './loop.js';
import { Network } from './network.js';
import type { Method, Status } from './results.js';

export interface Segment {
  kind: 'source' | 'link';
  id: string;
  label: string;
  r: number;
  x: number;
  /** |R + jX| of this segment alone (Ω). */
  z: number;
  /** z / limit, or null when there is no limit. */
  share: number | null;
  /** True for the source and links before the protecting device (the upstream part). */
  upstream: boolean;
}

export interface Breakdown {
  link: string;
  method: Method;
  limit: number | null;
  /** |complex sum of all segments| (Ω): Zs when the source is known. */
  total: number;
  own: number | null;
  upstream: number | null;
  ratio: number | null;
  status: Status;
  segments: Segment[];
}

export function loopBreakdown(job: Job, linkId: string): Breakdown | null {
  const rules = resolveRules(job.rules);
  const net = new Network(job);
  const link = net.linkById.get(linkId);
  if (!link) return null;
  const links = net.linksTo(link.to);
  if (!links || links.length === 0) return null;
  const sums = new LoopSums(net, rules);
  const result = checkLink(sums, link);
  if (!result.method) return null;
  const protecting = net.protectingLink(link);
  const protectIndex = protecting ? links.findIndex((l) => l.id === protecting.id) : links.length;
  const limit = result.limit;
  const share = (z: number): number | null => (limit ? z / limit : null);
  const segments: Segment[] = [];
  const parts: Complex[] = [];
  const ze = sums.ze(link.to);
  if (ze) {
    const supply = net.supplyOf(link.to)!;
    parts.push(ze);
    const z = magnitude(ze);
    segments.push({ kind: 'source', id: supply.id, label: `Ze at ${supply.name ?? supply.id}`, r: ze.re, x: ze.im, z, share: share(z), upstream: true });
  }
  links.forEach((l, i) => {
    const zl = sums.link(l);
    parts.push(zl);
    const z = magnitude(zl);
    const label = `${l.id}${l.name ? ` ${l.name}` : ''} (${net.role(l).replace('-', ' ')})`;
    segments.push({ kind: 'link', id: l.id, label, r: zl.re, x: zl.im, z, share: share(z), upstream: i < protectIndex });
  });
  return {
    link: linkId,
    method: result.method,
    limit,
    total: magnitude(sum(parts)),
    own: result.own,
    upstream: result.upstream,
    ratio: result.ratio,
    status: result.status,
    segments,
  };
}
