// The "From" of a link as a choice of feeding part, so a circuit moves to another board without
// being redrawn. A choice that would loop is refused beside the field, with the reason.
import { useShallow } from 'zustand/react/shallow';
import type { Link } from '../../../engine/index.js';
import { useEditor } from '../store/editor.js';
import { moveFeed } from '../commands/wiring.js';
import { SelectField } from '../panels/fields/fields.js';

const ORDER = { supply: 0, board: 1, point: 2 } as const;

/** Every part that could be chosen to feed `to`: supplies, boards, then points, each with its name. */
export function feedOptions(nodes: ReadonlyArray<{ id: string; kind: 'supply' | 'board' | 'point'; name?: string }>, to: string) {
  return nodes
    .filter((n) => n.id !== to)
    .slice()
    .sort((a, b) => ORDER[a.kind] - ORDER[b.kind] || a.id.localeCompare(b.id, undefined, { numeric: true }))
    .map((n) => ({ value: n.id, label: `${n.id}${n.name ? ` — ${n.name}` : ''} (${n.kind})` }));
}

export function FeedPicker({ link }: { link: Link }) {
  // Ids, kinds and names only: a drag or a cable edit does not re-render the list.
  const parts = useEditor(useShallow((s) => s.job.nodes.map((n) => `${n.kind}\u0000${n.id}\u0000${n.name ?? ''}`)));
  const toName = useEditor((s) => s.job.nodes.find((n) => n.id === link.to)?.name);
  const nodes = parts.map((p) => {
    const [kind, id, name] = p.split('\u0000') as ['supply' | 'board' | 'point', string, string];
    return { id, kind, ...(name ? { name } : {}) };
  });
  const options = feedOptions(nodes, link.to);
  if (!nodes.some((n) => n.id === link.from)) options.unshift({ value: link.from, label: `${link.from} (not in the job)` });
  return (
    <>
      <SelectField field="from" label="From (fed by)" value={link.from} options={options}
        hint="Choose another board or point to move this circuit; nothing is redrawn."
        onCommit={(from) => moveFeed(link.id, from)} />
      <div className="lwp-field lwp-readout">
        <span className="lwp-label">To</span>
        <span className="lwp-readout-value" data-field-to>{link.to}{toName ? ` (${toName})` : ''}</span>
      </div>
    </>
  );
}
