// One schedule row: the link's inputs (several editable in place) and its results.
// Memoised and subscribed to its own link and result, so an edit re-renders only the rows it changes.

import { memo } from 'react';
import { deviceMark } from '../../../../engine/index.js';
import { selectLink, selectResult, useEditor } from '../../store/index.js';
import { editLink } from '../actions.js';
import { StatusBadge } from '../details/CircuitResults.js';
import { NumberField, TextField } from '../fields/fields.js';
import { ROLE_SHORT, ROLE_WORD, num, ohms, percent } from '../format.js';

export const ROW_HEIGHT = 34;

/**
 * Selects the row's link and asks the sheet to centre it. A click into a cell of the row that is
 * already selected (to edit it) keeps the view where it is.
 */
function selectRow(id: string, target: EventTarget | null) {
  const s = useEditor.getState();
  const already = s.selection.nodes.length === 0 && s.selection.links.length === 1 && s.selection.links[0] === id;
  const inControl = target instanceof Element && target.closest('input, select, textarea, button') !== null;
  if (already && inControl) return;
  s.select({ nodes: [], links: [id] });
  s.requestFocus([id]);
}

export const ScheduleRow = memo(function ScheduleRow({ id, selected, sizesId }: { id: string; selected: boolean; sizesId: string }) {
  const link = useEditor(selectLink(id));
  const r = useEditor(selectResult(id));
  if (!link) return null;
  const set = (field: string) => (v: unknown) => editLink(id, field, v);
  const known = r?.method === 'known-source';
  return (
    <tr
      data-schedule-row={id}
      className={selected ? 'lwp-row lwp-row-selected' : 'lwp-row'}
      aria-selected={selected}
      tabIndex={0}
      style={{ height: ROW_HEIGHT }}
      onClick={(e) => selectRow(id, e.target)}
      onKeyDown={(e) => {
        if (e.key === 'Enter' && e.target === e.currentTarget) selectRow(id, null);
      }}
    >
      <td className="lwp-cell-id">
        <TextField compact attr="data-cell" field="id" label={`Id of ${id}`} value={id} emptyAs="empty"
          onCommit={(v) => editLink(id, 'id', v ?? '', `rename ${id}`)} />
      </td>
      <td className="lwp-cell-name">
        <TextField compact attr="data-cell" field="name" label={`Name of ${id}`} value={link.name} onCommit={set('name')} />
      </td>
      <td>{link.from}</td>
      <td>{link.to}</td>
      <td className="lwp-cell-role" title={r ? ROLE_WORD[r.role] : undefined}>{r ? ROLE_SHORT[r.role] : '—'}</td>
      <td className="lwp-cell-cable">
        <NumberField compact attr="data-cell" field="cable.active" label={`Active size of ${id}`} unit="mm²" above={0}
          list={sizesId} value={link.cable.active} onCommit={set('cable.active')} />
        <span className="lwp-slash">/</span>
        <NumberField compact attr="data-cell" field="cable.earth" label={`Earth size of ${id}`} unit="mm²" above={0}
          list={sizesId} value={link.cable.earth} onCommit={set('cable.earth')} />
        <span className="lwp-material">{link.cable.material}</span>
      </td>
      <td className="lwp-cell-length">
        <NumberField compact attr="data-cell" field="cable.length" label={`Length of ${id}`} unit="m" min={0}
          value={link.cable.length} onCommit={set('cable.length')} />
      </td>
      <td className="lwp-cell-device">
        {link.device ? (
          <>
            <span className="lwp-mark">{deviceMark(link.device)}</span>
            <NumberField compact attr="data-cell" field="device.rating" label={`Device rating of ${id}`} unit="A" above={0}
              value={link.device.rating} onCommit={set('device.rating')} />
          </>
        ) : (
          <span className="lwp-muted">{r?.protectedBy && r.protectedBy !== id ? `via ${r.protectedBy}` : 'none'}</span>
        )}
      </td>
      <td>{link.rcd ? `${num(link.rcd.sensitivity * 1000, 1)} mA` : '—'}</td>
      <td className="lwp-num">
        {known || !r ? ohms(r?.zs) : (
          <>
            {ohms(r.own)}
            <span className="lwp-sub" title="upstream loop"> ↑{ohms(r.upstream)}</span>
          </>
        )}
      </td>
      <td className="lwp-num">{ohms(r?.limit)}</td>
      <td className="lwp-num">{num(r?.tripCurrent, 1)}</td>
      <td className="lwp-num">{num(r?.requiredTime, 2)}</td>
      <td className="lwp-num">{num(r?.maxLength, 1)}</td>
      <td className="lwp-num lwp-cell-ratio lwp-sticky-ratio">{percent(r?.ratio)}</td>
      <td className="lwp-sticky-status">{r ? <StatusBadge status={r.status} /> : '—'}</td>
    </tr>
  );
});
