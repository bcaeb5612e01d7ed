// Selectors at module level, stable per id, so components subscribe to exactly their record.
import type { CircuitResult, JobNode, Link } from '../../../engine/index.js';
import type { EditorState } from './editor.js';

type Selector<T> = (s: EditorState) => T;

function cached<T>(cache: Map<string, Selector<T>>, id: string, make: () => Selector<T>): Selector<T> {
  let sel = cache.get(id);
  if (!sel) {
    sel = make();
    cache.set(id, sel);
  }
  return sel;
}

// Index by id, brought up to date only when the array itself changes (once per edit, not per
// component): a list of the same length and ids (a drag frame, a cable edit) has only its new
// records put in, anything else (an element added, removed or renamed) is indexed afresh.
function indexer<T extends { id: string }>(pick: (s: EditorState) => T[]) {
  let source: T[] | null = null;
  let index = new Map<string, T>();
  return (s: EditorState): Map<string, T> => {
    const list = pick(s);
    if (list === source) return index;
    const before = source;
    source = list;
    if (before && before.length === list.length) {
      let same = true;
      for (let i = 0; i < list.length && same; i++) {
        const item = list[i]!;
        const was = before[i]!;
        if (item === was) continue;
        if (item.id === was.id) index.set(item.id, item);
        else same = false;
      }
      if (same) return index;
    }
    index = new Map(list.map((item) => [item.id, item]));
    return index;
  };
}

const nodeIndex = indexer((s) => s.job.nodes);
const linkIndex = indexer((s) => s.job.links);

// The link feeding each node (the first one, as the engine's network takes it).
let feederSource: Link[] | null = null;
let feeders = new Map<string, Link>();
function feederIndex(s: EditorState): Map<string, Link> {
  if (s.job.links !== feederSource) {
    feederSource = s.job.links;
    feeders = new Map();
    for (const l of s.job.links) if (!feeders.has(l.to)) feeders.set(l.to, l);
  }
  return feeders;
}

const nodeSelectors = new Map<string, Selector<JobNode | undefined>>();
const linkSelectors = new Map<string, Selector<Link | undefined>>();
const resultSelectors = new Map<string, Selector<CircuitResult | undefined>>();

export function selectNode(id: string): Selector<JobNode | undefined> {
  return cached(nodeSelectors, id, () => (s) => nodeIndex(s).get(id));
}

export function selectLink(id: string): Selector<Link | undefined> {
  return cached(linkSelectors, id, () => (s) => linkIndex(s).get(id));
}

export function selectResult(id: string): Selector<CircuitResult | undefined> {
  return cached(resultSelectors, id, () => (s) => s.resultById[id]);
}

/**
 * Everything one link's loop depends on: the job's rules and the records of the nodes and links
 * on its path, from its far end up to the top of its tree. Use with useShallow: the array is new
 * on every call, its items are the store's own records, so it compares equal until one of them
 * changes (an edit or a move elsewhere in the job leaves it alone).
 */
export function selectLoopInputs(linkId: string): Selector<unknown[]> {
  return (s) => {
    const link = linkIndex(s).get(linkId);
    if (!link) return [];
    const nodes = nodeIndex(s);
    const feeder = feederIndex(s);
    const out: unknown[] = [s.job.rules, link, nodes.get(link.to)];
    const seen = new Set<string>([link.to]);
    let at = link.from;
    while (!seen.has(at)) {
      seen.add(at);
      out.push(nodes.get(at));
      const up = feeder.get(at);
      if (!up) break;
      out.push(up);
      at = up.from;
    }
    return out;
  };
}

// An id list that keeps its identity while the ids (and their order) stay the same.
function idList<T extends { id: string }>(pick: (s: EditorState) => T[]): Selector<string[]> {
  let source: T[] | null = null;
  let ids: string[] = [];
  return (s) => {
    const list = pick(s);
    if (list === source) return ids;
    source = list;
    const same = list.length === ids.length && list.every((item, i) => item.id === ids[i]);
    if (!same) ids = list.map((item) => item.id);
    return ids;
  };
}

export const selectNodeIds: Selector<string[]> = idList((s) => s.job.nodes);
export const selectLinkIds: Selector<string[]> = idList((s) => s.job.links);

export const selectSelection = (s: EditorState) => s.selection;
export const selectResults = (s: EditorState) => s.results;
export const selectHighlight = (s: EditorState) => s.highlightPath;
export const selectMessage = (s: EditorState) => s.message;
export const selectDirty = (s: EditorState) => s.dirty;

/** Whether an id is selected (node or link). */
export function isSelected(s: EditorState, id: string): boolean {
  return s.selection.nodes.includes(id) || s.selection.links.includes(id);
}

/** What Find searches: every node's id, kind and name, every link's id, ends and name. */
export interface Searchable {
  nodes: readonly JobNode[];
  links: readonly Link[];
}

const sameNodeText = (a: JobNode, b: JobNode) => a === b || (a.id === b.id && a.kind === b.kind && a.name === b.name);
const sameLinkText = (a: Link, b: Link) => a === b || (a.id === b.id && a.from === b.from && a.to === b.to && a.name === b.name);

function sameText<T>(a: readonly T[], b: readonly T[], same: (x: T, y: T) => boolean): boolean {
  if (a === b) return true;
  if (a.length !== b.length) return false;
  for (let i = 0; i < a.length; i++) if (!same(a[i]!, b[i]!)) return false;
  return true;
}

let searchable: Searchable | null = null;
/** The lists last compared with `searchable` (newer than its own when only cables or places changed). */
let compared: Searchable | null = null;
/**
 * The job's nodes and links as Find sees them: the same object until an id, kind, name or end
 * changes (or something is added or removed), so a move or an edit of a cable leaves it alone.
 * Each pair of lists is compared once: every later store update with the same lists returns at once.
 */
export const selectSearchable: Selector<Searchable> = (s) => {
  const { nodes, links } = s.job;
  if (searchable && compared && compared.nodes === nodes && compared.links === links) return searchable;
  if (!searchable || !sameText(searchable.nodes, nodes, sameNodeText) || !sameText(searchable.links, links, sameLinkText)) {
    searchable = { nodes, links };
  }
  compared = { nodes, links };
  return searchable;
};
