// Copy and paste of a selection with its subtree: copying a board copies the links and nodes
// below it. Pasted elements get fresh ids and are offset so they do not sit on the originals.
import type { Job, JobNode, Link } from '../../../engine/index.js';
import { allIds, nextId, prefixFor } from '../store/ids.js';
import type { Edit } from '../store/edits.js';

export interface Clip {
  nodes: JobNode[];
  links: Link[];
  /** The feeding cable (with its device) of each copied point whose feeder is not copied. */
  feeds?: Link[];
}

/** The selected nodes with everything below them, the selected links with what they feed. */
export function collectSubtree(job: Job, sel: { nodes: string[]; links: string[] }): Clip {
  const children = new Map<string, Link[]>();
  for (const l of job.links) {
    const list = children.get(l.from);
    if (list !== undefined) list.push(l);
    else children.set(l.from, [l]);
  }
  const nodeIds = new Set<string>();
  const linkIds = new Set<string>(sel.links);
  const stack = [...sel.nodes, ...job.links.filter((l) => linkIds.has(l.id)).map((l) => l.to)];
  while (stack.length > 0) {
    const id = stack.pop()!;
    if (nodeIds.has(id)) continue;
    nodeIds.add(id);
    for (const l of children.get(id) ?? []) {
      linkIds.add(l.id);
      stack.push(l.to);
    }
  }
  const nodes = job.nodes.filter((n) => nodeIds.has(n.id));
  // A point goes with its feeding cable and device: pasted, it hangs from the same board again.
  const points = new Set(nodes.filter((n) => n.kind === 'point').map((n) => n.id));
  const feeds = job.links.filter((l) => points.has(l.to) && !nodeIds.has(l.from) && !linkIds.has(l.id));
  return {
    nodes,
    // A link whose feeding node is not copied is kept only if its far end is (it is dropped on paste).
    links: job.links.filter((l) => linkIds.has(l.id)),
    ...(feeds.length > 0 ? { feeds } : {}),
  };
}

function stem(id: string, fallback: string): string {
  const s = id.replace(/\d+$/, '');
  return s === '' ? fallback : s;
}

/**
 * The edit that pastes a clip into the job: ids renamed (same letters, next free number), links
 * re-pointed, positions offset. A copied link whose feeding node is not in the clip is left out.
 */
export function pasteEdit(
  job: Job, clip: Clip, offset: { x: number; y: number }, attachTo: string | null = null,
): { edit: Edit; ids: { nodes: string[]; links: string[] } } {
  const taken = allIds(job);
  const rename = new Map<string, string>();
  for (const n of clip.nodes) {
    const id = nextId(job, stem(n.id, prefixFor(n.kind)), taken);
    taken.add(id);
    rename.set(n.id, id);
  }
  const edits: Edit[] = [];
  const nodes: string[] = [];
  const links: string[] = [];
  for (const n of clip.nodes) {
    const at = n.at ?? { x: 0, y: 0 };
    const node = { ...n, id: rename.get(n.id)!, at: { x: at.x + offset.x, y: at.y + offset.y } } as JobNode;
    edits.push({ op: 'add-node', node });
    nodes.push(node.id);
  }
  for (const l of clip.links) {
    const from = rename.get(l.from);
    const to = rename.get(l.to);
    if (!from || !to) continue;
    const id = nextId(job, stem(l.id, 'L'), taken);
    taken.add(id);
    edits.push({ op: 'add-link', link: { ...l, id, from, to } });
    links.push(id);
  }
  // A copied point's feeding cable: from the board selected for the paste, else its own board if still there.
  for (const l of clip.feeds ?? []) {
    const to = rename.get(l.to);
    const from = attachTo ?? l.from;
    if (!to || !job.nodes.some((n) => n.id === from)) continue;
    const id = nextId(job, stem(l.id, 'C'), taken);
    taken.add(id);
    edits.push({ op: 'add-link', link: { ...l, id, from, to } });
    links.push(id);
  }
  return { edit: { op: 'batch', edits }, ids: { nodes, links } };
}
