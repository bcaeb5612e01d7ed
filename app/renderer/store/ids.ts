// Ids for new elements: the prefix and the next free number (S1, B1, P1, L1 ...).
// Ids are unique across nodes and links, so both are searched.
import type { Job } from '../../../engine/index.js';

export function allIds(job: Job): Set<string> {
  const ids = new Set<string>();
  for (const n of job.nodes) ids.add(n.id);
  for (const l of job.links) ids.add(l.id);
  return ids;
}

/** The next id with this prefix: one past the highest number already used with it, never taken. */
export function nextId(job: Job, prefix: string, taken: Set<string> = allIds(job)): string {
  let highest = 0;
  const pattern = new RegExp(`^${prefix.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')}(\\d+)$`);
  for (const id of taken) {
    const m = pattern.exec(id);
    if (m) highest = Math.max(highest, Number(m[1]));
  }
  let n = highest + 1;
  while (taken.has(`${prefix}${n}`)) n += 1;
  return `${prefix}${n}`;
}

/** The usual prefix for a kind of node. */
export function prefixFor(kind: 'supply' | 'board' | 'point' | 'link'): string {
  return kind === 'supply' ? 'S' : kind === 'board' ? 'B' : kind === 'point' ? 'P' : 'L';
}
