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

/** A node as the user knows it: its id and, when it has one, its name (`board DB2 "Workshop"`). */
export function nodeWords(job: Job, id: string): string {
  const n = job.nodes.find((x) => x.id === id);
  if (!n) return id;
  return n.name && n.name !== id ? `${n.kind} ${id} "${n.name}"` : `${n.kind} ${id}`;
}

/**
 * Why `from` may not feed `to`, in the drawing's terms, or null when it may: the same node, a
 * supply as the far end, a second feeder, or a loop. `except`: a link being re-pointed (its own
 * feed of `to` does not count as a second one).
 */
export function feedReason(job: Job, from: string, to: string, except?: string): string | null {
  if (!job.nodes.some((n) => n.id === from)) return `there is no node ${from}`;
  if (!job.nodes.some((n) => n.id === to)) return `there is no node ${to}`;
  if (from === to) return `a link cannot run from ${from} back to itself`;
  if (job.nodes.find((n) => n.id === to)?.kind === 'supply') {
    return `${nodeWords(job, to)} is where the network starts; a supply is fed by no link`;
  }
  const other = job.links.find((l) => l.to === to && l.id !== except);
  if (other) {
    return `${nodeWords(job, to)} is already fed by link ${other.id} from ${other.from}; every part has one feeding cable (to move it to another board, change that link's "From" in the details panel)`;
  }
  const others = except ? { ...job, links: job.links.filter((l) => l.id !== except) } : job;
  return cycleReason(others, from, to);
}

/** The id prefix of a new link by what it joins: M (from a supply), SM (between boards), C (to a point). */
export function linkPrefix(job: Job, from: string, to: string): string {
  const a = job.nodes.find((n) => n.id === from);
  const b = job.nodes.find((n) => n.id === to);
  if (b?.kind === 'point') return 'C';
  if (a?.kind === 'supply') return 'M';
  return 'SM';
}
