// Edits as data: each edit turns one job into the next, sharing every untouched record
// (so components that select an unchanged node or link do not re-render).
import type { Job, JobNode, Link, JobDetails, Rules } from '../../../engine/index.js';

export type Edit =
  | { op: 'add-node'; node: JobNode }
  | { op: 'add-link'; link: Link }
  | { op: 'remove'; ids: string[] } // nodes and/or links; a removed node takes its links with it
  | { op: 'update-node'; id: string; patch: Record<string, unknown> } // shallow merge; undefined deletes a key
  | { op: 'update-link'; id: string; patch: Record<string, unknown> } // shallow merge (cable/device/rcd replaced whole)
  | { op: 'move'; moves: Array<{ id: string; at: { x: number; y: number } }> }
  | { op: 'set-details'; patch: Partial<JobDetails> }
  | { op: 'set-rules'; rules: Rules }
  | { op: 'batch'; edits: Edit[] };

export type ApplyOutcome = { ok: true } | { ok: false; reason: string; field?: string };

/** An edit that cannot even be attempted (names a missing element, say). */
export class EditError extends Error {
  constructor(message: string, readonly field?: string) {
    super(message);
  }
}

function merge<T extends object>(record: T, patch: Record<string, unknown>): T {
  const next: Record<string, unknown> = { ...(record as Record<string, unknown>) };
  for (const [key, value] of Object.entries(patch)) {
    if (value === undefined) delete next[key];
    else next[key] = value;
  }
  return next as T;
}

function renameRefs(links: Link[], from: string, to: string): Link[] {
  return links.map((l) =>
    l.from === from || l.to === from
      ? { ...l, from: l.from === from ? to : l.from, to: l.to === from ? to : l.to }
      : l,
  );
}

function checkNewId(job: Job, id: unknown): void {
  if (typeof id !== 'string' || id.trim() === '') throw new EditError('an id must be a non-empty text', 'id');
  if (job.nodes.some((n) => n.id === id) || job.links.some((l) => l.id === id)) {
    throw new EditError(`the id ${id} is already used by another node or link`, 'id');
  }
}

/** The job after one edit. Throws EditError when the edit names something that is not there. */
export function applyEdit(job: Job, edit: Edit): Job {
  switch (edit.op) {
    case 'add-node':
      checkNewId(job, edit.node.id);
      return { ...job, nodes: [...job.nodes, edit.node] };
    case 'add-link':
      checkNewId(job, edit.link.id);
      return { ...job, links: [...job.links, edit.link] };
    case 'remove': {
      const ids = new Set(edit.ids);
      const nodes = job.nodes.filter((n) => !ids.has(n.id));
      const gone = new Set(job.nodes.filter((n) => ids.has(n.id)).map((n) => n.id));
      const links = job.links.filter((l) => !ids.has(l.id) && !gone.has(l.from) && !gone.has(l.to));
      if (nodes.length === job.nodes.length && links.length === job.links.length) return job;
      return { ...job, nodes, links };
    }
    case 'update-node': {
      const index = job.nodes.findIndex((n) => n.id === edit.id);
      if (index < 0) throw new EditError(`there is no node ${edit.id}`);
      const node = merge(job.nodes[index]!, edit.patch);
      const nodes = job.nodes.slice();
      nodes[index] = node;
      let links = job.links;
      if (node.id !== edit.id) {
        checkNewId({ ...job, nodes: job.nodes.filter((n) => n.id !== edit.id) }, node.id);
        links = renameRefs(links, edit.id, node.id);
      }
      return { ...job, nodes, links };
    }
    case 'update-link': {
      const index = job.links.findIndex((l) => l.id === edit.id);
      if (index < 0) throw new EditError(`there is no link ${edit.id}`);
      const link = merge(job.links[index]!, edit.patch);
      if (link.id !== edit.id) checkNewId({ ...job, links: job.links.filter((l) => l.id !== edit.id) }, link.id);
      const links = job.links.slice();
      links[index] = link;
      return { ...job, links };
    }
    case 'move': {
      const at = new Map(edit.moves.map((m) => [m.id, m.at]));
      let changed = false;
      const nodes = job.nodes.map((n) => {
        const p = at.get(n.id);
        if (!p || (n.at && n.at.x === p.x && n.at.y === p.y)) return n;
        changed = true;
        return { ...n, at: { x: p.x, y: p.y } };
      });
      return changed ? { ...job, nodes } : job;
    }
    case 'set-details':
      return { ...job, job: merge(job.job, edit.patch as Record<string, unknown>) };
    case 'set-rules':
      return { ...job, rules: edit.rules };
    case 'batch':
      return edit.edits.reduce(applyEdit, job);
  }
}

/** Ids of the elements an edit touches (to prefer their problems when it is refused). */
export function touchedIds(edit: Edit): string[] {
  switch (edit.op) {
    case 'add-node':
      return [edit.node.id];
    case 'add-link':
      return [edit.link.id, edit.link.to, edit.link.from];
    case 'remove':
      return edit.ids;
    case 'update-node':
    case 'update-link':
      return [edit.id, ...(typeof edit.patch.id === 'string' ? [edit.patch.id] : [])];
    case 'move':
      return edit.moves.map((m) => m.id);
    case 'batch':
      return edit.edits.flatMap(touchedIds);
    default:
      return [];
  }
}

/** True when the edit can only change drawing positions (results stay the same). */
export function onlyMoves(edit: Edit): boolean {
  return edit.op === 'move' || (edit.op === 'batch' && edit.edits.every(onlyMoves));
}
