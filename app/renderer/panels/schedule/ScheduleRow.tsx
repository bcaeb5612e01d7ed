// One schedule row: the link's inputs (several editable in place) and its results.
// Memoised and subscribed to its own link and result, so an edit re-renders only the rows it changes.

import { memo, type ReactNode } from 'react';
import { deviceMark, type CircuitResult, type Device, type Link, type Status } from '../../../../engine/index.js';
import { selectLink, selectNode, selectResult, useEditor } from '../../store/index.js';
import { editLink } from '../actions.js';
import { FixMenu } from '../fixes/FixButtons.js';
import { NumberField, TextField } from '../fields/fields.js';
import { ROLE_SHORT, ROLE_LONG, STATUS_LOOK, failingChecks, num, ohms, ohmsValue, percentValue, shownVerdict } from '../format.js';
import type { ColumnKey } from './columns.js';

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

/** A check's status in a narrow cell: symbol and word (and colour), the full word in the tooltip. */
function CheckCell({ status, check, why }: { status: Status; check: string; why?: string }) {
  const look = STATUS_LOOK[status];
  return (
    <span className={`lwp-status lwp-status-compact ${look.className}`} data-cell-status={check} data-status-badge={status}
      title={why ? `${check}: ${look.word} (${why})` : `${check}: ${look.word}`}>
      <span aria-hidden="true" className="lwp-status-symbol">{look.symbol}</span> {look.word}
    </span>
  );
}

const kA = (v: number | null | undefined) => (v === null || v === undefined || !Number.isFinite(v) ? '—' : num(v / 1000, 2));

interface CellContext {
  id: string;
  link: Link;
  r: CircuitResult | undefined;
  fromName: string | undefined;
  toName: string | undefined;
  sizesId: string;
  set(field: string): (v: unknown) => ReturnType<typeof editLink>;
}

/** The cell of one column: its class and content. */
function cell(key: ColumnKey, c: CellContext): { className?: string; content: ReactNode; title?: string; hook?: string } {
  const { id, link, r, set } = c;
  const known = r?.method === 'known-source';
  switch (key) {
    case 'id':
      // The id is renamed in the details panel only: renaming in a schedule is too easy to do by accident.
      return { className: 'lwp-cell-id', content: id, title: `${id} (rename it in the details panel)`, hook: 'id' };
    case 'name':
      return {
        className: 'lwp-cell-name',
        content: (
          <span className="lwf-with-fix">
            <TextField compact attr="data-cell" field="name" label={`Name of ${id}`} value={link.name} title={link.name}
              placeholder="no name" onCommit={set('name')} />
            <FixMenu linkId={id} />
          </span>
        ),
      };
    case 'from':
      return { className: 'lwp-cell-node', content: link.from, title: c.fromName ? `${link.from} — ${c.fromName}` : link.from };
    case 'to':
      return { className: 'lwp-cell-node', content: link.to, title: c.toName ? `${link.to} — ${c.toName}` : link.to };
    case 'role':
      return { className: 'lwp-cell-role', content: r ? ROLE_SHORT[r.role] : '—', title: r ? ROLE_LONG[r.role] : undefined };
    case 'cable':
      return {
        content: (
          <span className="lwp-cell-cable">
            <NumberField compact attr="data-cell" field="cable.active" label={`Active size of ${id}`} unit="mm²" above={0}
              list={c.sizesId} value={link.cable.active} onCommit={set('cable.active')} />
            <span className="lwp-slash" aria-hidden="true">/</span>
            <NumberField compact attr="data-cell" field="cable.earth" label={`Earth size of ${id}`} unit="mm²" above={0}
              list={c.sizesId} value={link.cable.earth} onCommit={set('cable.earth')} />
            <span className="lwp-material" title={MATERIAL_WORD[link.cable.material] ?? link.cable.material}>{link.cable.material}</span>
          </span>
        ),
      };
    case 'length':
      return {
        className: 'lwp-cell-length',
        content: <NumberField compact attr="data-cell" field="cable.length" label={`Length of ${id}`} unit="m" min={0}
          value={link.cable.length} onCommit={set('cable.length')} />,
      };
    case 'device':
      return {
        content: link.device ? (
          <span className="lwp-cell-device">
            <span className="lwp-mark" title={deviceMark(link.device)}>{deviceKind(link.device)}</span>
            <NumberField compact attr="data-cell" field="device.rating" label={`Device rating of ${id}`} unit="A" above={0}
              value={link.device.rating} onCommit={set('device.rating')} />
          </span>
        ) : (
          <span className="lwp-muted" title={r?.protectedBy && r.protectedBy !== id ? `Protected by the device on ${r.protectedBy}` : 'No protective device: unprotected'}>
            {r?.protectedBy && r.protectedBy !== id ? `via ${r.protectedBy}` : 'none'}
          </span>
        ),
      };
    case 'rcd':
      return { className: 'lwp-num', content: link.rcd ? num(link.rcd.sensitivity * 1000, 1) : '—' };
    case 'loop':
      return {
        className: 'lwp-num',
        content: known || !r ? ohmsValue(r?.zs) : (
          <>
            {ohmsValue(r.own)}
            {/* An unchecked link has no upstream part to show: a bare dash, not "— ↑—". */}
            {r.upstream !== null && <span className="lwp-sub" title={`upstream loop ${ohms(r.upstream)}`}> ↑{ohmsValue(r.upstream)}</span>}
          </>
        ),
      };
    case 'limit':
      return { className: 'lwp-num', content: ohmsValue(r?.limit) };
    case 'ia':
      return { className: 'lwp-num', content: num(r?.tripCurrent, 1) };
    case 'treq':
      return { className: 'lwp-num', content: num(r?.requiredTime, 2) };
    case 'maxLength':
      return { className: 'lwp-num', content: r?.maxLength != null && Number.isFinite(r.maxLength) ? r.maxLength.toFixed(1) : '—' };
    case 'ratio':
      return { className: 'lwp-num lwp-cell-ratio lwp-sticky-ratio', content: percentValue(r?.ratio) };
    case 'status':
      return { className: 'lwp-sticky-status', content: r ? <CheckCell status={r.status} check="loop impedance" /> : '—' };
    case 'phases':
      return { className: 'lwp-num', content: r ? String(r.phases) : '—', title: link.phases === undefined ? 'derived from the network' : 'stated' };
    case 'ib':
      return {
        className: 'lwp-cell-amps',
        content: <NumberField compact attr="data-cell" field="designCurrent" label={`Design current override of ${id}`} unit="A" above={0}
          optional value={link.designCurrent} placeholder={r?.designCurrent != null ? num(r.designCurrent, 1) : '—'}
          title={link.designCurrent !== undefined ? `Ib stated: ${link.designCurrent} A (clear it to take the loads below)`
            : r?.designCurrent != null ? `Ib from the loads below: ${num(r.designCurrent, 2)} A; type a value to override it` : 'No load below; type a design current to state one'}
          onCommit={set('designCurrent')} />,
      };
    case 'pf':
      return { className: 'lwp-num', content: num(r?.powerFactor, 2) };
    case 'vdOwn':
      return { className: 'lwp-num', content: num(r?.voltageDrop, 2) };
    case 'vdTotal':
      return { className: 'lwp-num lwp-cell-strong', content: num(r?.voltageDropTotal, 2) };
    case 'vdLimit':
      return { className: 'lwp-num', content: num(r?.voltageDropLimit, 1) };
    case 'vStatus':
      return { content: r ? <CheckCell status={r.voltageStatus} check="voltage drop" /> : '—' };
    case 'iz':
      return {
        className: 'lwp-cell-amps',
        content: <NumberField compact attr="data-cell" field="cable.capacity" label={`Capacity Iz of ${id}`} unit="A" above={0}
          optional value={link.cable.capacity} placeholder={r?.capacity != null ? num(r.capacity, 1) : '—'}
          title={link.cable.capacity !== undefined ? `Iz stated: ${link.cable.capacity} A (clear it to use the table)`
            : r?.capacity != null ? `Iz from the table: ${num(r.capacity, 1)} A; type a value to state your own` : 'Iz unknown: type the cable\u2019s rating as installed'}
          onCommit={set('cable.capacity')} />,
      };
    case 'izStatus':
      return { content: r ? <CheckCell status={r.capacityStatus} check="capacity Ib ≤ In ≤ Iz" /> : '—' };
    case 'rating':
      return {
        className: 'lwp-cell-amps',
        content: link.device ? (
          <NumberField compact attr="data-cell" field="device.rating" label={`Device rating of ${id}`} unit="A" above={0}
            value={link.device.rating} onCommit={set('device.rating')} />
        ) : (
          <span className="lwp-muted" title={r?.protectedBy && r.protectedBy !== id ? `Protected by the device on ${r.protectedBy}` : 'No protective device'}>
            {r?.protectedBy && r.protectedBy !== id ? `via ${r.protectedBy}` : 'none'}
          </span>
        ),
      };
    case 'breaking':
      return { className: 'lwp-num', content: link.device?.breaking !== undefined ? num(link.device.breaking, 1) : '—' };
    case 'fault':
      return { className: 'lwp-num', content: kA(r?.faultLevel) };
    case 'bStatus':
      return { content: r ? <CheckCell status={r.breakingStatus} check="breaking capacity" /> : '—' };
    case 'earthMin':
      return { className: 'lwp-num', content: num(r?.earthMinArea, 2) };
    case 'wStatus':
      return { content: r ? <CheckCell status={r.withstandStatus} check="earth withstand" /> : '—' };
    case 'testLimit':
      return { className: 'lwp-num', content: ohmsValue(r?.testLimit) };
    case 'measured':
      return {
        className: 'lwp-num',
        content: r?.measured ? (
          <>
            {ohmsValue(r.measured.zs)}
            <span className="lwp-sub" title={`corrected ${ohms(r.measured.corrected)}`}> →{ohmsValue(r.measured.corrected)}</span>
          </>
        ) : '—',
      };
    case 'mStatus':
      return { content: r?.measured ? <CheckCell status={r.measured.status} check="measured reading" /> : <span className="lwp-muted">no reading</span> };
    case 'verdict': {
      const v = shownVerdict(r);
      const failing = r ? failingChecks(r) : [];
      return {
        className: 'lwp-sticky-verdict',
        content: r ? <span data-verdict-cell={v}><CheckCell status={v} check="verdict" why={failing.length ? `fails: ${failing.join(', ')}` : undefined} /></span> : '—',
      };
    }
  }
}

export const ScheduleRow = memo(function ScheduleRow({ id, selected, sizesId, columns, offsets }: {
  id: string; selected: boolean; sizesId: string; columns: readonly ColumnKey[]; offsets: Partial<Record<ColumnKey, number>>;
}) {
  const link = useEditor(selectLink(id));
  const r = useEditor(selectResult(id));
  // Indexed by id in the store's selectors, so this stays cheap on a large job.
  const fromName = useEditor(selectNode(link?.from ?? ''))?.name;
  const toName = useEditor(selectNode(link?.to ?? ''))?.name;
  if (!link) return null;
  const set = (field: string) => (v: unknown) => editLink(id, field, v);
  const ctx: CellContext = { id, link, r, fromName, toName, sizesId, set };
  return (
    <tr
      data-schedule-row={id}
      data-verdict={r?.verdict ?? 'unchecked'}
      className={selected ? 'lwp-row lwp-row-selected' : 'lwp-row'}
      aria-selected={selected}
      tabIndex={0}
      style={{ height: ROW_HEIGHT }}
      onClick={(e) => selectRow(id, e.target)}
      onKeyDown={(e) => {
        if (e.key === 'Enter' && e.target === e.currentTarget) selectRow(id, null);
      }}
    >
      {columns.map((key) => {
        const c = cell(key, ctx);
        const right = offsets[key];
        return (
          <td key={key} data-col={key} className={c.className} title={c.title} {...(c.hook ? { 'data-cell': c.hook } : {})}
            style={right !== undefined ? { right } : undefined}>
            {c.content}
          </td>
        );
      })}
    </tr>
  );
});
