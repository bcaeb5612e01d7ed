// The "From" of a link as a choice of feeding part, so a circuit moves to another board without
// being redrawn. A choice that would loop is refused beside the field, with the reason.
import { useMemo } from 'react';
import type { JobNode, Link } from '../../../engine/index.js';
import { useEditor } from '../store/editor.js';
import { moveFeed } from '../commands/wiring.js';
import { SelectField, TextField } from '../panels/fields/fields.js';

const ORDER = { supply: 0, board: 1, point: 2 } as const;
/** One collator for every comparison (localeCompare with options builds one per call). */
const IDS = new Intl.Collator(undefined, { numeric: true });

/** Every part that could be chosen to feed `to`: supplies, boards, then points, each with its name. */
export function feedOptions(nodes: ReadonlyArray<{ id: string; kind: 'supply' | 'board' | 'point'; name?: string }>, to: string) {
  return nodes
    .filter((n) => n.id !== to)
    .slice()
    .sort((a, b) => ORDER[a.kind] - ORDER[b.kind] || IDS.compare(a.id, b.id))
    .map((n) => ({ value: n.id, label: `${n.id}${n.name ? ` — ${n.name}` : ''} (${n.kind})` }));
}

/** Past this many parts to choose from, the feed is typed (with suggestions) instead of chosen from a list box. */
export const FEED_SELECT_LIMIT = 300;
/** The id of the one list of parts offered while typing a feed (FeedList). */
export const FEEDS_LIST_ID = 'lw-feed-parts';

/**
 * The parts offered while a feed is typed on a large job: one list for the whole page, drawn
 * again only when a part is added, removed or renamed (not each time a link is shown).
 */
export function FeedList() {
  const parts = useEditor(selectParts);
  const options = useMemo(() => {
    if (parts.length <= FEED_SELECT_LIMIT) return null;
    return feedOptions(partNodes(parts), '');
  }, [parts]);
  if (options === null) return null;
  return (
    <datalist id={FEEDS_LIST_ID} data-feed-list>
      {options.map((o) => <option key={o.value} value={o.value} label={o.label} />)}
    </datalist>
  );
}

/** The parts back from their texts (selectParts). */
function partNodes(parts: readonly string[]): Array<{ id: string; kind: 'supply' | 'board' | 'point'; name?: string }> {
  return parts.map((p) => {
    const [kind, id, name] = p.split('\u0000') as ['supply' | 'board' | 'point', string, string];
    return { id, kind, ...(name ? { name } : {}) };
  });
}

/**
 * The parts' kinds, ids and names, as one text each; the same array while the nodes list is the
 * same, and while an edit (a drag) left every part's kind, id and name as they were. Only the
 * records that are new since the last call are read (a drag frame: the moved nodes), so no store
 * update builds or compares a text for every part.
 */
let partsOf: readonly JobNode[] | null = null;
let partsKept: readonly string[] = [];
const partText = (n: JobNode): string => `${n.kind}\u0000${n.id}\u0000${n.name ?? ''}`;
export function selectParts(s: { job: { nodes: readonly JobNode[] } }): readonly string[] {
  const nodes = s.job.nodes;
  if (nodes === partsOf) return partsKept;
  const before = partsOf;
  partsOf = nodes;
  if (!before || before.length !== nodes.length) {
    const next = nodes.map(partText);
    if (next.length !== partsKept.length || next.some((p, i) => p !== partsKept[i])) partsKept = next;
    return partsKept;
  }
  let next: string[] | null = null;
  for (let i = 0; i < nodes.length; i++) {
    const n = nodes[i]!;
    if (n === before[i]) continue;
    const p = partText(n);
    if (p === partsKept[i]) continue;
    next ??= partsKept.slice();
    next[i] = p;
  }
  if (next) partsKept = next;
  return partsKept;
}

export function FeedPicker({ link }: { link: Link }) {
  // Ids, kinds and names only: a drag or a cable edit does not re-render the list.
  const parts = useEditor(selectParts);
  const toName = useEditor((s) => s.job.nodes.find((n) => n.id === link.to)?.name);
  // Worked out again only when a part is added, removed or renamed, or another link is shown
  // (thousands of options: not re-sorted, nor re-rendered, on every edit of this link's cable).
  // The same test as FeedList's: past the limit, the one shared list of parts is offered.
  const typed = parts.length > FEED_SELECT_LIMIT;
  const nodes = useMemo(() => (typed ? [] : partNodes(parts)), [parts, typed]);
  const options = useMemo(() => {
    if (typed) return [];
    const list = feedOptions(nodes, link.to);
    if (!nodes.some((n) => n.id === link.from)) list.unshift({ value: link.from, label: `${link.from} (not in the job)` });
    return list;
  }, [nodes, link.to, link.from, typed]);
  const id = link.id;
  const from = link.from;
  const field = useMemo(() => (typed ? (
    // Thousands of parts: the id is typed, with the parts offered as it is (the shared FeedList).
    // A list box of thousands of options costs a long layout each time a link is shown.
    <TextField field="from" label="From (fed by)" value={from} list={FEEDS_LIST_ID}
      hint="Type or pick the id of another board or point to move this circuit; nothing is redrawn."
      onCommit={(to) => (to === undefined ? { ok: false, reason: 'give the id of the board or point that feeds it' } : moveFeed(id, to.trim()))} />
  ) : (
    <SelectField field="from" label="From (fed by)" value={from} options={options}
      hint="Choose another board or point to move this circuit; nothing is redrawn."
      onCommit={(to) => moveFeed(id, to)} />
  )), [from, options, id, typed]);
  return (
    <>
      {field}
      <div className="lwp-field lwp-readout">
        <span className="lwp-label">To</span>
        <span className="lwp-readout-value" data-field-to>{link.to}{toName ? ` (${toName})` : ''}</span>
      </div>
    </>
  );
}
