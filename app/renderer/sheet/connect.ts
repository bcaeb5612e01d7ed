// Why a link drawn on the sheet would break the radial rule, said in the terms of the drawing
// (which node already feeds which), before the whole-job validation names some other link.
import type { Job } from '../../../engine/index.js';

/**
 * When `to` already feeds `from` (directly or further up), a link from `from` to `to` would close
 * a loop: the reason, naming the links it would loop through. Null otherwise.
 */
export function cycleReason(job: Job, from: string, to: string): string | null {
  // A link into a supply is refused for that plainer reason (the engine's own message).
  if (job.nodes.find((n) => n.id === to)?.kind === 'supply') return null;
  const feeder = new Map<string, { id: string; from: string }>();
  for (const l of job.links) if (!feeder.has(l.to)) feeder.set(l.to, { id: l.id, from: l.from });
  const chain: string[] = [];
  const seen = new Set<string>();
  let at = from;
  while (at !== to) {
    const up = feeder.get(at);
    if (!up || seen.has(at)) return null;
    seen.add(at);
    chain.unshift(up.id);
    at = up.from;
  }
  if (chain.length === 0) return null; // from === to: the caller says a link cannot loop on itself
  const through = chain.length === 1 ? `link ${chain[0]}` : `links ${chain.join(', ')}`;
  return `"${to}" already feeds "${from}" (through ${through}), so this link would close a loop; the network must be radial (a tree from each supply)`;
}
