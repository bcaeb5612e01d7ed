// One schedule row: the link's inputs (several editable in place) and its results.
// Memoised and subscribed to its own link and result, so an edit re-renders only the rows it changes.

import { memo } from 'react';
import { deviceMark, type Device } from '../../../../engine/index.js';
import { selectLink, selectNode, selectResult, useEditor } from '../../store/index.js';
import { editLink } from '../actions.js';
import { StatusBadge } from '../details/CircuitResults.js';
import { FixMenu } from '../fixes/FixButtons.js';
import { NumberField, TextField } from '../fields/fields.js';
import { ROLE_SHORT, ROLE_LONG, num, ohms, ohmsValue, percentValue } from '../format.js';

export const ROW_HEIGHT = 34;

const MATERIAL_WORD: Record<string, string> = { Cu: 'copper', Al: 'aluminium' };

/** The device without its rating (the rating is the cell's input beside it); a label is kept whole. */
function deviceKind(device: Device): string {
  if (device.label) return device.label;
  switch (device.type) {
    case 'mcb':
      return `MCB ${device.curve}`;
    case 'adjustable':
      return 'adj.';
    case 'curve':
      return 'curve';
    case 'fixed':
      return 'fixed';
  }
}

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
  // Indexed by id in the store's selectors, so this stays cheap on a large job.
  const fromName = useEditor(selectNode(link?.from ?? ''))?.name;
  const toName = useEditor(selectNode(link?.to ?? ''))?.name;
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
      {/* The id is renamed in the details panel only: renaming in a schedule is too easy to do by accident. */}
      <td className="lwp-cell-id" data-cell="id" title={`${id} (rename it in the details panel)`}>{id}</td>
      <td className="lwp-cell-name">
        <TextField compact attr="data-cell" field="name" label={`Name of ${id}`} value={link.name} title={link.name}
          placeholder="no name" onCommit={set('name')} />
      </td>
      <td className="lwp-cell-node" title={fromName ? `${link.from} — ${fromName}` : link.from}>{link.from}</td>
      <td className="lwp-cell-node" title={toName ? `${link.to} — ${toName}` : link.to}>{link.to}</td>
      <td className="lwp-cell-role" title={r ? ROLE_LONG[r.role] : undefined}>{r ? ROLE_SHORT[r.role] : '—'}</td>
      <td>
        <span className="lwp-cell-cable">
          <NumberField compact attr="data-cell" field="cable.active" label={`Active size of ${id}`} unit="mm²" above={0}
            list={sizesId} value={link.cable.active} onCommit={set('cable.active')} />
          <span className="lwp-slash" aria-hidden="true">/</span>
          <NumberField compact attr="data-cell" field="cable.earth" label={`Earth size of ${id}`} unit="mm²" above={0}
            list={sizesId} value={link.cable.earth} onCommit={set('cable.earth')} />
          <span className="lwp-material" title={MATERIAL_WORD[link.cable.material] ?? link.cable.material}>{link.cable.material}</span>
        </span>
      </td>
      <td className="lwp-cell-length">
        <NumberField compact attr="data-cell" field="cable.length" label={`Length of ${id}`} unit="m" min={0}
          value={link.cable.length} onCommit={set('cable.length')} />
      </td>
      <td>
        {link.device ? (
          <span className="lwp-cell-device">
            <span className="lwp-mark" title={deviceMark(link.device)}>{deviceKind(link.device)}</span>
            <NumberField compact attr="data-cell" field="device.rating" label={`Device rating of ${id}`} unit="A" above={0}
              value={link.device.rating} onCommit={set('device.rating')} />
          </span>
        ) : (
          <span className="lwp-muted" title={r?.protectedBy && r.protectedBy !== id ? `Protected by the device on ${r.protectedBy}` : 'No protective device: unprotected'}>
            {r?.protectedBy && r.protectedBy !== id ? `via ${r.protectedBy}` : 'none'}
          </span>
        )}
      </td>
      <td className="lwp-num">{link.rcd ? num(link.rcd.sensitivity * 1000, 1) : '—'}</td>
      <td className="lwp-num">
        {known || !r ? ohmsValue(r?.zs) : (
          <>
            {ohmsValue(r.own)}
            {/* An unchecked link has no upstream part to show: a bare dash, not "— ↑—". */}
            {r.upstream !== null && <span className="lwp-sub" title={`upstream loop ${ohms(r.upstream)}`}> ↑{ohmsValue(r.upstream)}</span>}
          </>
        )}
      </td>
      <td className="lwp-num">{ohmsValue(r?.limit)}</td>
      <td className="lwp-num">{num(r?.tripCurrent, 1)}</td>
      <td className="lwp-num">{num(r?.requiredTime, 2)}</td>
      <td className="lwp-num">{r?.maxLength != null && Number.isFinite(r.maxLength) ? r.maxLength.toFixed(1) : "—"}<FixMenu linkId={id} /></td>
      <td className="lwp-num lwp-cell-ratio lwp-sticky-ratio">{percentValue(r?.ratio)}</td>
      <td className="lwp-sticky-status">{r ? <StatusBadge status={r.status} /> : '—'}</td>
    </tr>
  );
});
