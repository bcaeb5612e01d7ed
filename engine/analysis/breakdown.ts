// The loop of one circuit broken down by segment: the source (Ze, when known), then every link
// from the supply to the circuit's far end, each with its ohms and its share of the limit.

import type { Job } from '../model/types.js';
import { magnitude, sum, type Complex } from './complex.js';
import { resolveRules } from './basis.js';
import { blankResult, checkLoop } from './check.js';
import { Sums } from './sums.js';
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
  const sums = new Sums(job, rules);
  const order = sums.order;
  const index = job.links.findIndex((l) => l.id === linkId);
  if (index < 0 || !sums.reached(index)) return null;
  const result = blankResult(job.links[index]!, order.roles[index]!);
  checkLoop(sums, index, result);
  if (!result.method) return null;
  // The links from the supply down to this link's far end.
  const path: number[] = [];
  for (let n = order.linkTo[index]!, f = order.feederOf[n]!; f >= 0; n = order.linkFrom[f]!, f = order.feederOf[n]!) path.push(f);
  path.reverse();
  const protecting = sums.protect[index]!;
  const protectIndex = protecting >= 0 ? path.indexOf(protecting) : path.length;
  const limit = result.limit;
  const share = (z: number): number | null => (limit ? z / limit : null);
  const segments: Segment[] = [];
  const parts: Complex[] = [];
  const ze = sums.zeOf(order.linkTo[index]!);
  if (ze) {
    const supply = order.supplyNode(order.linkTo[index]!)!;
    parts.push(ze);
    const z = magnitude(ze);
    segments.push({ kind: 'source', id: supply.id, label: `Ze at ${supply.name ?? supply.id}`, r: ze.re, x: ze.im, z, share: share(z), upstream: true });
  }
  path.forEach((li, i) => {
    const l = job.links[li]!;
    const zl = { re: sums.linkRe[li]!, im: sums.linkIm[li]! };
    parts.push(zl);
    const z = magnitude(zl);
    const label = `${l.id}${l.name ? ` ${l.name}` : ''} (${order.roles[li]!.replace('-', ' ')})`;
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
