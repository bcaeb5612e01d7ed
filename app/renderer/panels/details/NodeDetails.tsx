// Every field of one node: supply source, board diversity, point use and load.

import type { JobNode, PointUse, Source, SupplyNode } from '../../../../engine/index.js';
import { useEditor } from '../../store/index.js';
import { editNode } from '../actions.js';
import { CheckField, NumberField, Readout, SelectField, TextField } from '../fields/fields.js';
import { amps, ohms } from '../format.js';
import { selectSupplyResult } from '../../sheet/nodes.js';

const KIND_WORD = { supply: 'Supply', board: 'Board', point: 'Point' } as const;

const SOURCE_OPTIONS: ReadonlyArray<{ value: Source['type']; label: string }> = [
  { value: 'unknown', label: 'unknown (80 % share method)' },
  { value: 'impedance', label: 'impedance Ze (r, x)' },
  { value: 'fault-current', label: 'prospective fault current' },
];

const USE_OPTIONS: ReadonlyArray<{ value: PointUse; label: string }> = [
  { value: 'socket-outlets', label: 'socket-outlets' },
  { value: 'lighting', label: 'lighting' },
  { value: 'fixed-equipment', label: 'fixed equipment' },
  { value: 'motor', label: 'motor' },
  { value: 'other', label: 'other' },
];

const PHASE_OPTIONS: ReadonlyArray<{ value: '' | '1' | '3'; label: string }> = [
  { value: '', label: 'single phase (default)' },
  { value: '1', label: 'single phase' },
  { value: '3', label: 'three phase' },
];

/** A source of another type; its values start from what the old source implies where it can. */
export function sourceOfType(type: Source['type'], old: Source): Source {
  if (type === old.type) return old;
  switch (type) {
    case 'unknown':
      return { type: 'unknown' };
    case 'impedance':
      return { type: 'impedance', r: 0.1, x: 0.05 };
    case 'fault-current':
      return { type: 'fault-current', current: 5000, xr: 1 };
  }
}

function SourceFields({ id, source }: { id: string; source: Source }) {
  const set = (field: string) => (v: unknown) => editNode(id, field, v);
  return (
    <fieldset className="lwp-group" data-group="source">
      <legend>Source</legend>
      <SelectField field="source.type" label="Source impedance" value={source.type} options={SOURCE_OPTIONS}
        onCommit={(t) => editNode(id, 'source', sourceOfType(t, source), `change the source of ${id}`)} />
      {source.type === 'impedance' ? (
        <>
          <NumberField field="source.r" label="Ze resistance r" unit="Ω" value={source.r} min={0}
            hint="the distributor's or a measured figure" onCommit={set('source.r')} />
          <NumberField field="source.x" label="Ze reactance x" unit="Ω" value={source.x} min={0} onCommit={set('source.x')} />
        </>
      ) : null}
      {source.type === 'fault-current' ? (
        <>
          <NumberField field="source.current" label="Prospective earth-fault current" unit="A" value={source.current}
            above={0} hint="at the point of supply, from the distributor" onCommit={set('source.current')} />
          <NumberField field="source.xr" label="X/R ratio" value={source.xr} min={0} optional placeholder="1"
            onCommit={set('source.xr')} />
        </>
      ) : null}
      {source.type === 'unknown' ? (
        <p className="lwp-hint">Circuits are checked by the 80 % share method; upstream links are tested against the rest.</p>
      ) : null}
    </fieldset>
  );
}

const SUPPLY_PHASES: ReadonlyArray<{ value: '' | '1' | '3'; label: string }> = [
  { value: '', label: 'from the points it reaches' },
  { value: '1', label: 'single phase' },
  { value: '3', label: 'three phase' },
];

const phaseValue = (p: number | undefined): '' | '1' | '3' => (p === 1 ? '1' : p === 3 ? '3' : '');

/** Phases, the distributor's maximum fault current, and a measured Ze of a supply. */
function SupplyDesignFields({ node }: { node: SupplyNode }) {
  const id = node.id;
  const mf = node.maxFault;
  const m = node.measured;
  const needMaxFault = { ok: false, reason: 'Enter the maximum fault current first' } as const;
  const needZe = { ok: false, reason: 'Enter the measured Ze first' } as const;
  return (
    <>
      <fieldset className="lwp-group" data-group="supply-design">
        <legend>Phases and maximum fault</legend>
        <SelectField field="phases" label="Phases" value={phaseValue(node.phases)} options={SUPPLY_PHASES}
          onCommit={(p) => editNode(id, 'phases', p === '' ? undefined : Number(p))} />
        <NumberField field="maxFault.current" label="Maximum prospective fault current" unit="A" value={mf?.current} above={0}
          optional placeholder="from Ze, or unknown" hint="the distributor's stated maximum at the point of supply"
          onCommit={(v) =>
            v === undefined
              ? editNode(id, 'maxFault', undefined, `remove the maximum fault current of ${id}`)
              : editNode(id, 'maxFault', { ...(mf ?? {}), current: v }, `set the maximum fault current of ${id}`)
          } />
        <NumberField field="maxFault.xr" label="X/R at maximum fault" value={mf?.xr} min={0} optional placeholder="1"
          disabled={!mf} onCommit={(v) => (mf ? editNode(id, 'maxFault.xr', v) : needMaxFault)} />
      </fieldset>
      <fieldset className="lwp-group" data-group="supply-measured">
        <legend>Measured on site</legend>
        <NumberField field="measured.ze" label="Measured Ze" unit="Ω" value={m?.ze} above={0} optional placeholder="no reading"
          hint={m ? 'clear it to remove the reading' : 'used in the correction of the circuits’ readings'}
          onCommit={(v) =>
            v === undefined
              ? editNode(id, 'measured', undefined, `remove the measured Ze of ${id}`)
              : editNode(id, 'measured', { ...(m ?? {}), ze: v }, m ? `edit the measured Ze of ${id}` : `add a measured Ze to ${id}`)
          } />
        <TextField field="measured.date" label="Date" value={m?.date} placeholder="e.g. 2026-12-01" disabled={!m}
          onCommit={(v) => (m ? editNode(id, 'measured.date', v) : needZe)} />
        <TextField field="measured.instrument" label="Instrument" value={m?.instrument} disabled={!m}
          onCommit={(v) => (m ? editNode(id, 'measured.instrument', v) : needZe)} />
      </fieldset>
    </>
  );
}

/** The supply's results: fault level at its terminals and the source headroom. */
function SupplyResults({ node }: { node: SupplyNode }) {
  const r = useEditor(selectSupplyResult(node.id));
  const unknown = node.source.type === 'unknown';
  return (
    <section className="lwp-results" aria-label={`Results for ${node.id}`} data-supply-results={node.id}>
      <h4>Results</h4>
      {!r ? <p>No result yet for {node.id}.</p> : (
        <table className="lwp-results-table">
          <tbody>
            <tr data-result="phases"><th scope="row">Phases</th><td>{r.phases === 3 ? 'three phase' : 'single phase'}</td></tr>
            <tr data-result="faultLevel"><th scope="row">Maximum fault current at the terminals</th><td>{amps(r.faultLevel)}</td></tr>
            <tr data-result="maxZe">
              <th scope="row">{unknown ? 'Largest Ze the design allows' : 'Ze may rise to'}</th>
              <td>{r.maxZe === null ? '—' : ohms(r.maxZe)}</td>
            </tr>
            <tr data-result="minFaultCurrent">
              <th scope="row">{unknown ? 'Ask the distributor for at least' : 'Smallest earth-fault current allowed'}</th>
              <td>{r.minFaultCurrent === null ? '—' : amps(r.minFaultCurrent)}</td>
            </tr>
            <tr data-result="setBy"><th scope="row">Set by circuit</th><td>{r.setBy ?? '—'}</td></tr>
          </tbody>
        </table>
      )}
      {r && r.maxZe !== null ? (
        <p className="lwp-hint" data-headroom-note="">
          {unknown
            ? `The source is not known: ask the distributor for a prospective fault current of at least ${r.minFaultCurrent !== null ? amps(r.minFaultCurrent) : '—'} (Ze at most ${ohms(r.maxZe)}); the design passes for any source at least this strong${r.setBy ? `, ${r.setBy} being the circuit that sets it` : ''}.`
            : `Every checked circuit still passes while Ze stays at or below ${ohms(r.maxZe)}${r.setBy ? ` (${r.setBy} sets it)` : ''}.`}
        </p>
      ) : null}
    </section>
  );
}

export function NodeDetails({ node }: { node: JobNode }) {
  const id = node.id;
  const set = (field: string) => (v: unknown) => editNode(id, field, v);
  return (
    <div className="lwp-details-body" data-details-node={id}>
      <div className="lwp-details-inputs">
        <h3 className="lwp-details-title">{KIND_WORD[node.kind]} {id}{node.name ? ` — ${node.name}` : ''}</h3>
        <fieldset className="lwp-group" data-group="identity">
          <legend>{KIND_WORD[node.kind]}</legend>
          <TextField field="id" label="Id" value={id} emptyAs="empty" onCommit={(v) => editNode(id, 'id', v ?? '', `rename ${id}`)} />
          <Readout label="Kind">{node.kind}</Readout>
          <TextField field="name" label="Name" value={node.name} onCommit={set('name')} />
          <TextField field="notes" label="Notes" value={node.notes} multiline onCommit={set('notes')} />
          <NumberField field="at.x" label="Position x" value={node.at?.x} onCommit={(v) => editNode(id, 'at', { x: v ?? 0, y: node.at?.y ?? 0 })} />
          <NumberField field="at.y" label="Position y" value={node.at?.y} onCommit={(v) => editNode(id, 'at', { x: node.at?.x ?? 0, y: v ?? 0 })} />
        </fieldset>
        {node.kind === 'supply' ? <SourceFields id={id} source={node.source} /> : null}
        {node.kind === 'supply' ? <SupplyDesignFields node={node} /> : null}
        {node.kind === 'board' ? (
          <fieldset className="lwp-group" data-group="board">
            <legend>Load</legend>
            <NumberField field="diversity" label="Diversity" value={node.diversity} above={0} max={1} optional
              placeholder="1" hint="above 0, at most 1: applied to the sum of the loads this board feeds" onCommit={set('diversity')} />
          </fieldset>
        ) : null}
        {node.kind === 'point' ? (
          <fieldset className="lwp-group" data-group="point">
            <legend>Use and load</legend>
            <SelectField field="use" label="Use" value={node.use} options={USE_OPTIONS} onCommit={set('use')} />
            <CheckField field="handHeld" label="Hand-held Class I or portable equipment" value={node.handHeld === true}
              onCommit={(on) => editNode(id, 'handHeld', on ? true : undefined)} />
            <NumberField field="current" label="Load current" unit="A" value={node.current} min={0} optional
              placeholder="no load" hint="the line current of the equipment" onCommit={set('current')} />
            <SelectField field="phases" label="Phases" value={node.phases === undefined ? '' : (String(node.phases) as '1' | '3')}
              options={PHASE_OPTIONS} onCommit={(p) => editNode(id, 'phases', p === '' ? undefined : Number(p))} />
            <NumberField field="powerFactor" label="Power factor cos φ" value={node.powerFactor} above={0} max={1} optional
              placeholder="0.8" onCommit={set('powerFactor')} />
          </fieldset>
        ) : null}
      </div>
      {node.kind === 'supply' ? <SupplyResults node={node} /> : null}
    </div>
  );
}
