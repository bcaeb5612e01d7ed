// A link's fields of format version 2: phases and load, the cable's capacity, insulation and
// earth, the voltage-drop limit, and the measured reading; each with the value the engine
// computed from it beside the input. Every edit is one undoable step through the store.

import type { CircuitResult, Insulation, Link } from '../../../../engine/index.js';
import { editLink } from '../actions.js';
import { NumberField, Readout, SelectField, TextField } from '../fields/fields.js';
import { STATUS_LOOK, amps, dropPercent, ohms, percent, powerFactor } from '../format.js';

export const PHASE_CHOICES: ReadonlyArray<{ value: '' | '1' | '3'; label: string }> = [
  { value: '', label: 'from the network' },
  { value: '1', label: 'single phase' },
  { value: '3', label: 'three phase' },
];

const INSULATIONS: ReadonlyArray<{ value: Insulation; label: string }> = [
  { value: 'pvc', label: 'PVC (70 °C)' },
  { value: 'xlpe', label: 'XLPE (90 °C)' },
];

const EARTH_PLACES: ReadonlyArray<{ value: 'yes' | 'no'; label: string }> = [
  { value: 'yes', label: 'yes, a core of the cable' },
  { value: 'no', label: 'no, a separate conductor' },
];

export function phasesValue(p: number | undefined): '' | '1' | '3' {
  return p === 1 ? '1' : p === 3 ? '3' : '';
}

/** A status by symbol and word (its colour from the class), inline beside a computed value. */
export function CheckMark({ status, check }: { status: keyof typeof STATUS_LOOK; check: string }) {
  const look = STATUS_LOOK[status];
  return (
    <span className={`lwp-status ${look.className}`} data-check={check} data-check-status={status}>
      <span aria-hidden="true" className="lwp-status-symbol">{look.symbol}</span> {look.word}
    </span>
  );
}

/** What the engine made of a link's phases: stated, or derived from the network. */
function phasesWord(link: Link, r: CircuitResult | undefined): string {
  if (!r) return '—';
  const word = r.phases === 3 ? 'three phase' : 'single phase';
  return link.phases === undefined ? `${word} (from the network)` : word;
}

export function LinkLoadFields({ link, result }: { link: Link; result: CircuitResult | undefined }) {
  const id = link.id;
  const set = (field: string) => (v: unknown) => editLink(id, field, v);
  const r = result;
  return (
    <fieldset className="lwp-group" data-group="load">
      <legend>Load and voltage drop</legend>
      <SelectField field="phases" label="Phases" value={phasesValue(link.phases)} options={PHASE_CHOICES}
        onCommit={(p) => editLink(id, 'phases', p === '' ? undefined : Number(p))} />
      <Readout label="Phases used"><span data-computed="phases">{phasesWord(link, r)}</span></Readout>
      <NumberField field="designCurrent" label="Design current override" unit="A" value={link.designCurrent} above={0}
        optional placeholder="from the loads below" hint="a maximum demand assessed some other way"
        onCommit={set('designCurrent')} />
      <NumberField field="powerFactor" label="Power factor cos φ" value={link.powerFactor} above={0} max={1} optional
        placeholder="from the loads below" onCommit={set('powerFactor')} />
      <Readout label="Design current Ib">
        <span data-computed="designCurrent">{r?.designCurrent != null ? amps(r.designCurrent) : 'no load below'}</span>
        {r?.powerFactor != null ? <span data-computed="powerFactor">, cos φ {powerFactor(r.powerFactor)}</span> : null}
      </Readout>
      <NumberField field="voltageDropLimit" label="Voltage-drop limit" unit="%" value={link.voltageDropLimit} above={0}
        max={100} optional placeholder="from the rules" onCommit={set('voltageDropLimit')} />
      <Readout label="Voltage drop">
        <span data-computed="voltageDrop">
          {r?.voltageDrop != null ? `own ${dropPercent(r.voltageDrop)}, total ${dropPercent(r.voltageDropTotal)}` : '—'}
          {r?.voltageDropLimit != null ? ` of ${dropPercent(r.voltageDropLimit)} allowed` : ''}
        </span>{' '}
        {r ? <CheckMark status={r.voltageStatus} check="voltage" /> : null}
      </Readout>
    </fieldset>
  );
}

const TOLERANCE = 1e-9;
const atMost = (a: number, b: number) => a <= b * (1 + TOLERANCE);

/** Ib ≤ In ≤ Iz spelt out with the numbers, '>' where an inequality fails. */
export function capacityInequality(ib: number | null, inn: number | null, iz: number | null): string {
  const show = (v: number | null, name: string) => (v === null ? `${name} unknown` : `${name} ${amps(v)}`);
  if (inn === null) {
    const rel = ib !== null && iz !== null ? (atMost(ib, iz) ? ' ≤ ' : ' > ') : ' ≤ ';
    return `${show(ib, 'Ib')}${rel}${show(iz, 'Iz')} (no device: Ib ≤ Iz alone)`;
  }
  const first = ib !== null ? (atMost(ib, inn) ? ' ≤ ' : ' > ') : ' ≤ ';
  const second = iz !== null ? (atMost(inn, iz) ? ' ≤ ' : ' > ') : ' ≤ ';
  return `${show(ib, 'Ib')}${first}${show(inn, 'In')}${second}${show(iz, 'Iz')}`;
}

export function LinkCableCapacityFields({ link, result, protectingRating }: {
  link: Link; result: CircuitResult | undefined; protectingRating: number | null;
}) {
  const id = link.id;
  const cable = link.cable;
  const set = (field: string) => (v: unknown) => editLink(id, field, v);
  const r = result;
  return (
    <fieldset className="lwp-group" data-group="capacity">
      <legend>Capacity and earth</legend>
      <SelectField field="cable.insulation" label="Insulation" value={cable.insulation ?? 'pvc'} options={INSULATIONS}
        onCommit={(v) => editLink(id, 'cable.insulation', v)} />
      <SelectField field="cable.earthInCable" label="Earth in the cable" value={cable.earthInCable === false ? 'no' : 'yes'}
        options={EARTH_PLACES} onCommit={(v) => editLink(id, 'cable.earthInCable', v === 'no' ? false : undefined)} />
      <NumberField field="cable.capacity" label="Capacity Iz" unit="A" value={cable.capacity} above={0} optional
        placeholder="from the table" hint="all parallel sets together, as installed (after derating)"
        onCommit={set('cable.capacity')} />
      <NumberField field="cable.derating" label="Derating factor" value={cable.derating} above={0} max={1} optional
        placeholder="1" hint="grouping × ambient, applied to the table's rating" onCommit={set('cable.derating')} />
      <Readout label="Ib ≤ In ≤ Iz">
        <span data-computed="capacity">{r ? capacityInequality(r.designCurrent, r.protectedBy ? protectingRating : null, r.capacity) : '—'}</span>{' '}
        {r ? <CheckMark status={r.capacityStatus} check="capacity" /> : null}
      </Readout>
      <Readout label="Fault level at the origin">
        <span data-computed="faultLevel">{amps(r?.faultLevel)}</span>{' '}
        {r ? <CheckMark status={r.breakingStatus} check="breaking" /> : null}
        {r && r.breakingStatus === 'unchecked' ? <span className="lwp-hint"> {link.device?.breaking === undefined ? 'enter the device\u2019s breaking capacity' : ''}</span> : null}
      </Readout>
      <Readout label="Earth minimum area">
        <span data-computed="earthMinArea">{r?.earthMinArea != null ? `${r.earthMinArea.toFixed(2)} mm² (fitted ${(cable.parallel ?? 1) * cable.earth} mm²)` : '—'}</span>{' '}
        {r ? <CheckMark status={r.withstandStatus} check="withstand" /> : null}
      </Readout>
    </fieldset>
  );
}

export function LinkReadingFields({ link, result }: { link: Link; result: CircuitResult | undefined }) {
  const id = link.id;
  const m = link.measured;
  const r = result;
  const setPart = (key: 'temperature' | 'date' | 'instrument') => (v: unknown) =>
    m ? editLink(id, `measured.${key}`, v) : ({ ok: false, reason: 'Enter the measured Zs first' } as const);
  return (
    <fieldset className="lwp-group" data-group="measured">
      <legend>Measured on site</legend>
      <Readout label="Test limit">
        <span data-computed="testLimit">{r?.testLimit != null ? `${ohms(r.testLimit)} at ${m?.temperature ?? 20} °C` : '—'}</span>
      </Readout>
      <NumberField field="measured.zs" label="Measured Zs" unit="Ω" value={m?.zs} above={0} optional
        placeholder="no reading" hint={m ? 'clear it to remove the reading' : undefined}
        onCommit={(v) =>
          v === undefined
            ? editLink(id, 'measured', undefined, `remove the reading of ${id}`)
            : editLink(id, 'measured', { ...(m ?? {}), zs: v }, m ? `edit the reading of ${id}` : `add a reading to ${id}`)
        } />
      <NumberField field="measured.temperature" label="Temperature at the test" unit="°C" value={m?.temperature}
        min={-30} max={60} optional placeholder="20" disabled={!m} onCommit={setPart('temperature')} />
      <TextField field="measured.date" label="Date" value={m?.date} placeholder="e.g. 2026-12-01" disabled={!m}
        onCommit={setPart('date')} />
      <TextField field="measured.instrument" label="Instrument" value={m?.instrument} disabled={!m}
        onCommit={setPart('instrument')} />
      {r?.measured ? (
        <Readout label="Result">
          <span data-computed="measured">
            corrected {ohms(r.measured.corrected)}{r.measured.ratio !== null ? `, ${percent(r.measured.ratio)} of the limit` : ''}
          </span>{' '}
          <CheckMark status={r.measured.status} check="measured" />
        </Readout>
      ) : null}
    </fieldset>
  );
}
