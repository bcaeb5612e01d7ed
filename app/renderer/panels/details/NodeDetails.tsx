// Every field of one node: supply source, board diversity, point use and load.

import type { JobNode, PointUse, Source } from '../../../../engine/index.js';
import { editNode } from '../actions.js';
import { CheckField, NumberField, Readout, SelectField, TextField } from '../fields/fields.js';

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
  { value: '', label: 'not given' },
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
        {node.kind === 'board' ? (
          <fieldset className="lwp-group" data-group="board">
            <legend>Load</legend>
            <NumberField field="diversity" label="Diversity" value={node.diversity} min={0} max={1} optional
              placeholder="not given" hint="0 to 1" onCommit={set('diversity')} />
          </fieldset>
        ) : null}
        {node.kind === 'point' ? (
          <fieldset className="lwp-group" data-group="point">
            <legend>Use and load</legend>
            <SelectField field="use" label="Use" value={node.use} options={USE_OPTIONS} onCommit={set('use')} />
            <CheckField field="handHeld" label="Hand-held Class I or portable equipment" value={node.handHeld === true}
              onCommit={(on) => editNode(id, 'handHeld', on ? true : undefined)} />
            <NumberField field="current" label="Design current" unit="A" value={node.current} min={0} optional
              onCommit={set('current')} />
            <SelectField field="phases" label="Phases" value={node.phases === undefined ? '' : (String(node.phases) as '1' | '3')}
              options={PHASE_OPTIONS} onCommit={(p) => editNode(id, 'phases', p === '' ? undefined : Number(p))} />
            <NumberField field="powerFactor" label="Power factor" value={node.powerFactor} min={0} max={1} optional
              onCommit={set('powerFactor')} />
          </fieldset>
        ) : null}
      </div>
    </div>
  );
}
