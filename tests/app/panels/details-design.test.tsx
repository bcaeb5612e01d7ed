// The details panel's fields of format version 2 (loads, drop, capacity, faults, readings) and
// the computed values shown beside them.
import { act, render } from '@testing-library/react';
import { beforeEach, describe, expect, it } from 'vitest';
import { analyse, type CircuitResult, type SupplyResult } from '../../../engine/index.js';
import { DetailsPanel } from '../../../app/renderer/panels/index.js';
import { capacityInequality } from '../../../app/renderer/panels/details/LinkDesignFields.js';
import { amps } from '../../../app/renderer/panels/format.js';
import { useEditor } from '../../../app/renderer/store/index.js';
import { choose, field, fieldError, typeAndBlur, typeAndEnter } from './dom.js';
import { linkOf, load, loadsJob } from './fixture.js';

function select(kind: 'nodes' | 'links', id: string) {
  act(() => useEditor.getState().select(kind === 'nodes' ? { nodes: [id], links: [] } : { nodes: [], links: [id] }));
}

const nodeOf = (id: string) => useEditor.getState().job.nodes.find((n) => n.id === id)!;
const undo = () => act(() => useEditor.getState().undo());

/** Replaces one circuit's result in the store, as the engine would give it. */
function withResult(id: string, patch: Partial<CircuitResult>) {
  act(() => {
    const s = useEditor.getState();
    useEditor.setState({ resultById: { ...s.resultById, [id]: { ...s.resultById[id]!, ...patch } } });
  });
}

describe('details panel: a link\u2019s version 2 fields', () => {
  beforeEach(() => load(loadsJob()));

  it('shows every new field with its unit', () => {
    const { container } = render(<DetailsPanel />);
    select('links', 'C3');
    expect(field<HTMLSelectElement>(container, 'phases').value).toBe('');
    expect(field(container, 'designCurrent').value).toBe('');
    expect(field(container, 'powerFactor').value).toBe('');
    expect(field(container, 'voltageDropLimit').value).toBe('');
    expect(field<HTMLSelectElement>(container, 'cable.insulation').value).toBe('pvc');
    expect(field<HTMLSelectElement>(container, 'cable.earthInCable').value).toBe('yes');
    expect(field(container, 'cable.capacity').value).toBe('');
    expect(field(container, 'cable.derating').value).toBe('');
    expect(field(container, 'measured.zs').value).toBe('0.75');
    expect(field(container, 'measured.temperature').value).toBe('15');
    expect(field(container, 'measured.date').value).toBe('2026-11-30');
    expect(field(container, 'measured.instrument').value).toBe('LT-1');
    for (const [path, unit] of [['designCurrent', 'A'], ['voltageDropLimit', '%'], ['cable.capacity', 'A'], ['measured.zs', 'Ω'], ['measured.temperature', '°C']]) {
      expect(field(container, path!).getAttribute('aria-label'), path).toMatch(new RegExp(`\\(${unit}\\)$`));
    }
  });

  it('sets a design-current override as one undoable step, and undo takes it back', () => {
    const { container } = render(<DetailsPanel />);
    select('links', 'C1');
    typeAndEnter(field(container, 'designCurrent'), '25');
    expect(linkOf('C1').designCurrent).toBe(25);
    expect(useEditor.getState().undoLabel).toMatch(/C1/);
    undo();
    expect(linkOf('C1').designCurrent).toBeUndefined();
    expect(field(container, 'designCurrent').value).toBe('');
  });

  it('edits phases, power factor, drop limit, insulation, earth, capacity and derating; each undo takes one back', () => {
    const { container } = render(<DetailsPanel />);
    select('links', 'C1');
    choose(field<HTMLSelectElement>(container, 'phases'), '1');
    typeAndEnter(field(container, 'powerFactor'), '0.9');
    typeAndEnter(field(container, 'voltageDropLimit'), '4');
    choose(field<HTMLSelectElement>(container, 'cable.insulation'), 'xlpe');
    choose(field<HTMLSelectElement>(container, 'cable.earthInCable'), 'no');
    typeAndEnter(field(container, 'cable.capacity'), '18');
    typeAndBlur(field(container, 'cable.derating'), '0.8');
    expect(linkOf('C1')).toMatchObject({
      phases: 1, powerFactor: 0.9, voltageDropLimit: 4,
      cable: { insulation: 'xlpe', earthInCable: false, capacity: 18, derating: 0.8 },
    });
    undo();
    expect(linkOf('C1').cable.derating).toBeUndefined();
    expect(linkOf('C1').cable.capacity).toBe(18);
    undo();
    undo();
    expect(linkOf('C1').cable.earthInCable).toBeUndefined();
    expect(linkOf('C1').cable.insulation).toBe('xlpe');
  });

  it('refuses a value out of range beside its field and keeps the job', () => {
    const { container } = render(<DetailsPanel />);
    select('links', 'C1');
    const before = useEditor.getState().job;
    typeAndEnter(field(container, 'designCurrent'), '-2');
    expect(fieldError(container, 'designCurrent')?.textContent).toMatch(/Design current override must be greater than 0 A, got -2/);
    typeAndEnter(field(container, 'powerFactor'), '1.2');
    expect(fieldError(container, 'powerFactor')?.textContent).toMatch(/≤ 1/);
    typeAndEnter(field(container, 'cable.derating'), '0');
    expect(fieldError(container, 'cable.derating')?.textContent).toMatch(/greater than 0/);
    expect(useEditor.getState().job).toBe(before);
  });

  it('shows the engine\u2019s message when a phase rule refuses an edit', () => {
    const { container } = render(<DetailsPanel />);
    // C1 stated single phase; its point then may not be three phase (method-depth.md section 1).
    select('links', 'C1');
    choose(field<HTMLSelectElement>(container, 'phases'), '1');
    select('nodes', 'P1');
    const before = useEditor.getState().job;
    choose(field<HTMLSelectElement>(container, 'phases'), '3');
    const error = fieldError(container, 'phases');
    expect(error?.getAttribute('role')).toBe('alert');
    // The engine's message names the point and the link that feeds it.
    expect(error?.textContent).toMatch(/P1/);
    expect(error?.textContent).toMatch(/C1/);
    expect(error?.textContent).toMatch(/three-phase feed/);
    expect(field<HTMLSelectElement>(container, 'phases').value).toBe('');
    expect(useEditor.getState().job).toBe(before);
  });

  it('refuses a three-phase link under a single-phase supply, with the engine\u2019s reason', () => {
    const { container } = render(<DetailsPanel />);
    select('links', 'C3');
    const before = useEditor.getState().job;
    choose(field<HTMLSelectElement>(container, 'phases'), '3');
    expect(fieldError(container, 'phases')?.textContent).toMatch(/single-phase supply S1/);
    expect(useEditor.getState().job).toBe(before);
  });

  it('adds, edits and removes a measured reading, one undoable step each', () => {
    const { container } = render(<DetailsPanel />);
    select('links', 'C1');
    expect(field(container, 'measured.temperature').disabled).toBe(true);
    typeAndEnter(field(container, 'measured.zs'), '0.62');
    expect(linkOf('C1').measured).toEqual({ zs: 0.62 });
    typeAndEnter(field(container, 'measured.temperature'), '12');
    typeAndBlur(field(container, 'measured.instrument'), 'LT-1');
    expect(linkOf('C1').measured).toEqual({ zs: 0.62, temperature: 12, instrument: 'LT-1' });
    typeAndEnter(field(container, 'measured.temperature'), '75');
    expect(fieldError(container, 'measured.temperature')?.textContent).toMatch(/≤ 60 °C, got 75/);
    typeAndEnter(field(container, 'measured.zs'), '');
    expect(linkOf('C1').measured).toBeUndefined();
    undo();
    expect(linkOf('C1').measured).toEqual({ zs: 0.62, temperature: 12, instrument: 'LT-1' });
    undo();
    expect(linkOf('C1').measured).toEqual({ zs: 0.62, temperature: 12 });
  });

  it('shows the computed values of the circuit beside the inputs, as the engine gives them', () => {
    const { container } = render(<DetailsPanel />);
    select('links', 'C2');
    const r = analyse(useEditor.getState().job).circuits.find((c) => c.link === 'C2')!;
    const computed = (key: string) => container.querySelector(`[data-computed="${key}"]`)?.textContent ?? '';
    expect(computed('designCurrent')).toBe(r.designCurrent === null ? 'no load below' : amps(r.designCurrent));
    expect(container.querySelector('[data-check="voltage"]')?.getAttribute('data-check-status')).toBe(r.voltageStatus);
    expect(container.querySelector('[data-check="capacity"]')?.getAttribute('data-check-status')).toBe(r.capacityStatus);
    expect(container.querySelector('[data-check="breaking"]')?.getAttribute('data-check-status')).toBe(r.breakingStatus);
    expect(container.querySelector('[data-check="withstand"]')?.getAttribute('data-check-status')).toBe(r.withstandStatus);
    expect(container.querySelector('[data-verdict-line]')?.getAttribute('data-verdict-line')).toBe(r.verdict);
    for (const key of ['loop', 'voltage', 'capacity', 'breaking', 'withstand', 'measured']) {
      expect(container.querySelector(`[data-check-row="${key}"]`), key).not.toBeNull();
    }
  });

  it('spells out Ib ≤ In ≤ Iz with the numbers, and names a failing check in the verdict', () => {
    const { container } = render(<DetailsPanel />);
    select('links', 'C2');
    withResult('C2', {
      designCurrent: 25, powerFactor: 1, voltageDrop: 18.8, voltageDropTotal: 19.1, voltageDropLimit: 5, voltageStatus: 'fail',
      capacity: 27, capacityStatus: 'fail', status: 'pass', verdict: 'fail', faultLevel: 1840, breakingStatus: 'pass',
    });
    const computed = (key: string) => container.querySelector(`[data-computed="${key}"]`)?.textContent ?? '';
    expect(computed('designCurrent')).toBe('25 A');
    expect(computed('powerFactor')).toBe(', cos φ 1');
    expect(computed('voltageDrop')).toBe('own 18.8 %, total 19.1 % of 5 % allowed');
    expect(computed('capacity')).toBe('Ib 25 A > In 20 A ≤ Iz 27 A');
    expect(computed('faultLevel')).toBe('1.84 kA (1840 A)');
    const verdict = container.querySelector('[data-verdict-line]')!;
    expect(verdict.textContent).toContain('✗');
    expect(verdict.textContent).toContain('FAIL');
    expect(verdict.textContent).toContain('voltage drop, cable capacity');
    expect(container.querySelector('[data-check-row="voltage"]')?.textContent).toMatch(/19\.1 % of 5 %.*FAIL/);
  });

  it('says "design passes, reading fails" when only the measured reading fails', () => {
    const { container } = render(<DetailsPanel />);
    select('links', 'C3');
    withResult('C3', { status: 'pass', verdict: 'fail', testLimit: 1.1, measured: { zs: 1.3, corrected: 1.52, ratio: 1.2, status: 'fail' } });
    expect(container.querySelector('[data-verdict-line]')?.textContent).toContain('design passes, reading fails');
    expect(container.querySelector('[data-computed="measured"]')?.textContent).toBe('corrected 1.520 Ω, 120.0 % of the limit');
    expect(container.querySelector('[data-computed="testLimit"]')?.textContent).toBe('1.100 Ω at 15 °C');
  });
});

describe('capacityInequality', () => {
  it('marks each inequality that holds with ≤ and a failing one with >', () => {
    expect(capacityInequality(16, 20, 27)).toBe('Ib 16 A ≤ In 20 A ≤ Iz 27 A');
    expect(capacityInequality(16, 32, 27)).toBe('Ib 16 A ≤ In 32 A > Iz 27 A');
    expect(capacityInequality(null, 20, null)).toBe('Ib unknown ≤ In 20 A ≤ Iz unknown');
    expect(capacityInequality(30, null, 27)).toBe('Ib 30 A > Iz 27 A (no device: Ib ≤ Iz alone)');
    // Equal within the contract's relative 1e-9 counts as holding (method-depth.md "Numbers at the edges").
    expect(capacityInequality(20.000000000000004, 20, 20)).toBe('Ib 20 A ≤ In 20 A ≤ Iz 20 A');
  });
});

describe('details panel: a supply and a board', () => {
  beforeEach(() => load(loadsJob()));

  it('edits phases, the maximum fault and a measured Ze, each one undoable step', () => {
    const { container } = render(<DetailsPanel />);
    select('nodes', 'S1');
    expect(field(container, 'maxFault.current').value).toBe('6000');
    typeAndEnter(field(container, 'maxFault.xr'), '2');
    expect(nodeOf('S1')).toMatchObject({ maxFault: { current: 6000, xr: 2 } });
    typeAndEnter(field(container, 'maxFault.current'), '0');
    expect(fieldError(container, 'maxFault.current')?.textContent).toMatch(/greater than 0 A/);
    typeAndEnter(field(container, 'measured.ze'), '0.31');
    typeAndBlur(field(container, 'measured.date'), '2026-11-30');
    expect(nodeOf('S1')).toMatchObject({ measured: { ze: 0.31, date: '2026-11-30' } });
    undo();
    expect(nodeOf('S1')).toMatchObject({ measured: { ze: 0.31 } });
    expect((nodeOf('S1') as { measured?: { date?: string } }).measured?.date).toBeUndefined();
    typeAndEnter(field(container, 'maxFault.current'), '');
    expect((nodeOf('S1') as { maxFault?: unknown }).maxFault).toBeUndefined();
    expect(field(container, 'maxFault.xr').disabled).toBe(true);
    undo();
    expect(nodeOf('S1')).toMatchObject({ maxFault: { current: 6000, xr: 2 } });
  });

  it('shows the supply\u2019s results, worded for an unknown source as the figure to ask for', () => {
    act(() => {
      const s = useEditor.getState();
      const supply: SupplyResult = { node: 'S1', phases: 1, faultLevel: 5800, maxZe: 0.64, minFaultCurrent: 359.4, setBy: 'C2' };
      useEditor.setState({ results: { ...s.results, supplies: [supply] } });
    });
    const { container } = render(<DetailsPanel />);
    select('nodes', 'S1');
    const cell = (k: string) => container.querySelector(`[data-supply-results="S1"] [data-result="${k}"] td`)?.textContent;
    expect(cell('faultLevel')).toBe('5.8 kA (5800 A)');
    expect(cell('maxZe')).toBe('0.640 Ω');
    expect(cell('setBy')).toBe('C2');
    choose(field<HTMLSelectElement>(container, 'source.type'), 'unknown');
    // A new analysis replaced the injected supply result; put it back to see the wording.
    act(() => {
      const s = useEditor.getState();
      useEditor.setState({ results: { ...s.results, supplies: [{ node: 'S1', phases: 1, faultLevel: null, maxZe: 0.64, minFaultCurrent: 359.4, setBy: 'C2' }] } });
    });
    expect(container.querySelector('[data-headroom-note]')?.textContent).toMatch(/ask the distributor for a prospective fault current of at least 359\.4 A/);
  });

  it('edits board diversity and refuses 0 (it must be above 0)', () => {
    const { container } = render(<DetailsPanel />);
    select('nodes', 'MSB');
    expect(field(container, 'diversity').value).toBe('0.9');
    typeAndEnter(field(container, 'diversity'), '0');
    expect(fieldError(container, 'diversity')?.textContent).toMatch(/greater than 0/);
    typeAndEnter(field(container, 'diversity'), '0.6');
    expect(nodeOf('MSB')).toMatchObject({ diversity: 0.6 });
    undo();
    expect(nodeOf('MSB')).toMatchObject({ diversity: 0.9 });
  });

  it('edits a point\u2019s load current with its unit, and undo takes it back', () => {
    const { container } = render(<DetailsPanel />);
    select('nodes', 'P2');
    expect(field(container, 'current').getAttribute('aria-label')).toBe('Load current (A)');
    typeAndEnter(field(container, 'current'), '13');
    expect(nodeOf('P2')).toMatchObject({ current: 13 });
    undo();
    expect(nodeOf('P2')).toMatchObject({ current: 20 });
  });
});
