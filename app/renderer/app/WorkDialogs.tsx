// Two small dialogs for working from the keyboard: add N final subcircuits to a board in one
// step, and connect the selected part to another one picked by name.
import { useMemo, useState } from 'react';
import type { PointUse } from '../../../engine/index.js';
import { useEditor } from '../store/editor.js';
import { selectSearchable } from '../store/selectors.js';
import { addCircuitsEdit, MAX_CIRCUITS } from '../commands/adding.js';
import { connectParts } from '../commands/wiring.js';
import { feedReason } from '../sheet/connect.js';
import { Dialog } from './Dialog.js';
import { useUi } from './ui.js';

const USES: ReadonlyArray<{ value: PointUse; label: string }> = [
  { value: 'socket-outlets', label: 'socket-outlets' },
  { value: 'lighting', label: 'lighting' },
  { value: 'fixed-equipment', label: 'fixed equipment' },
  { value: 'motor', label: 'motor' },
  { value: 'other', label: 'other' },
];

/** Adds `count` circuits of `use` to `board` as one undo step; the outcome for the status bar. */
export function addCircuits(board: string, count: number, use: PointUse): { ok: true } | { ok: false; reason: string } {
  const s = useEditor.getState();
  const made = addCircuitsEdit(s.job, board, count, use);
  if ('error' in made) return { ok: false, reason: made.error };
  const outcome = s.apply(made.edit, `add ${count} circuit${count === 1 ? '' : 's'} to ${board}`);
  if (!outcome.ok) return outcome;
  s.select({ nodes: [], links: made.links });
  s.requestFocus([board, ...made.nodes]);
  s.setMessage({ kind: 'info', text: `Added ${count} ${use} circuit${count === 1 ? '' : 's'} to ${board}: ${made.links.join(', ')}` });
  return { ok: true };
}

export function AddCircuitsDialog() {
  const board = useUi((s) => s.addCircuits);
  if (!board) return null;
  return <AddCircuitsBody board={board} />;
}

function AddCircuitsBody({ board }: { board: string }) {
  const [count, setCount] = useState('6');
  const [use, setUse] = useState<PointUse>('socket-outlets');
  const [error, setError] = useState<string | null>(null);
  const name = useEditor((s) => s.job.nodes.find((n) => n.id === board)?.name);
  const close = () => useUi.getState().set({ addCircuits: null });
  const submit = () => {
    const n = Number(count.trim());
    if (count.trim() === '' || !Number.isInteger(n) || n < 1 || n > MAX_CIRCUITS) {
      setError(`Number of circuits: a whole number from 1 to ${MAX_CIRCUITS}, got "${count}"`);
      return;
    }
    const out = addCircuits(board, n, use);
    if (out.ok) close();
    else setError(out.reason);
  };
  return (
    <Dialog title={`Add circuits to ${board}${name ? ` (${name})` : ''}`} onClose={close}>
      <form className="lw-form" data-add-circuits onSubmit={(e) => { e.preventDefault(); submit(); }}>
        <label>Number of final subcircuits
          <input type="text" inputMode="numeric" value={count} data-add-count aria-invalid={error ? true : undefined}
            onChange={(e) => { setCount(e.target.value); setError(null); }} />
        </label>
        <label>Use of each point
          <select value={use} data-add-use onChange={(e) => setUse(e.target.value as PointUse)}>
            {USES.map((u) => <option key={u.value} value={u.value}>{u.label}</option>)}
          </select>
        </label>
        <p className="lw-hint">Each gets its own cable and device with the usual defaults for its use; edit them in the schedule.</p>
        {error && <p className="lw-form-error" role="alert" data-add-error>✗ {error}</p>}
        <div className="lw-form-buttons">
          <button type="submit" data-add-ok>Add</button>
          <button type="button" onClick={close}>Cancel</button>
        </div>
      </form>
    </Dialog>
  );
}

export function ConnectDialog() {
  const from = useUi((s) => s.connectFrom);
  if (!from) return null;
  return <ConnectBody from={from} />;
}

function ConnectBody({ from }: { from: string }) {
  const [query, setQuery] = useState('');
  const [error, setError] = useState<string | null>(null);
  const searchable = useEditor(selectSearchable);
  const job = useEditor((s) => s.job);
  const close = () => useUi.getState().set({ connectFrom: null });
  const q = query.trim().toLowerCase();
  const hits = useMemo(
    () => searchable.nodes
      .filter((n) => n.id !== from && n.kind !== 'supply')
      .filter((n) => q === '' || n.id.toLowerCase().includes(q) || (n.name ?? '').toLowerCase().includes(q))
      .slice(0, 40),
    [searchable, from, q],
  );
  const choose = (to: string) => {
    const why = feedReason(job, from, to);
    if (why) {
      setError(`${from} cannot feed ${to}: ${why}`);
      return;
    }
    if (connectParts(from, to).ok) close();
  };
  return (
    <Dialog title={`Connect ${from} to…`} onClose={close}>
      <input type="search" className="lw-find-input" placeholder="Name or id of the part it feeds" aria-label={`Part that ${from} feeds, by name or id`}
        data-connect-query value={query} onChange={(e) => { setQuery(e.target.value); setError(null); }}
        onKeyDown={(e) => { if (e.key === 'Enter' && hits[0]) choose(hits[0].id); }} />
      {error && <p className="lw-form-error" role="alert" data-connect-error>✗ {error}</p>}
      <ul className="lw-find-hits" aria-label="Parts">
        {hits.map((n) => {
          const fed = job.links.find((l) => l.to === n.id);
          return (
            <li key={n.id}>
              <button type="button" data-connect-hit={n.id} onClick={() => choose(n.id)}>
                {n.id} · {n.kind}{n.name ? ` · ${n.name}` : ''}{fed ? ` (fed from ${fed.from})` : ' (not fed)'}
              </button>
            </li>
          );
        })}
        {hits.length === 0 && <li className="lw-muted">Nothing matches “{query}”.</li>}
      </ul>
    </Dialog>
  );
}
