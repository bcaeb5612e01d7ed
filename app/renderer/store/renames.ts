// Following renamed elements from one state of the job to the next. Renaming a node or a link
// (update-node / update-link with a new id) keeps the element in its place in the job's list,
// so an id that is gone, while the list kept its length and that place now holds a record the
// same in all but an id the old job did not have, was renamed to it. Undo and redo of a rename
// are followed the same way; a removed element (or one replaced by another) is not.
import type { Job } from '../../../engine/index.js';

type Ided = { id: string };

/** The two records agree in everything but their id (a rename changes nothing else). */
function sameButId(a: Ided, b: Ided): boolean {
  return JSON.stringify({ ...a, id: '' }) === JSON.stringify({ ...b, id: '' });
}

/** Follows ids from `prev` to `next`: each id as it is now, or null when it is gone. */
export function idFollower(prev: Job, next: Job): (id: string) => string | null {
  let present: Set<string> | null = null;
  let before: Set<string> | null = null;
  const ids = (job: Job) => new Set<string>([...job.nodes.map((n) => n.id), ...job.links.map((l) => l.id)]);
  const renamedIn = (old: Ided[], now: Ided[], id: string): string | null => {
    if (old === now || old.length !== now.length) return null;
    const index = old.findIndex((item) => item.id === id);
    if (index < 0) return null;
    const candidate = now[index]!;
    before ??= ids(prev);
    return !before.has(candidate.id) && sameButId(old[index]!, candidate) ? candidate.id : null;
  };
  return (id) => {
    present ??= ids(next);
    if (present.has(id)) return id;
    if (prev === next) return null;
    return renamedIn(prev.links, next.links, id) ?? renamedIn(prev.nodes, next.nodes, id);
  };
}
