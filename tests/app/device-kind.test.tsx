// A device-kind change never yields a pass and never puts invented values into the job: the
// old device leaves the job, the new one is a draft until its required data is entered or
// picked, and the circuit says which data is missing meanwhile.
import { act, fireEvent, render } from '@testing-library/react';
import { beforeEach, describe, expect, it } from 'vitest';
import { layoutReport, scheduleCsv, serialiseJob } from '../../engine/index.js';
import { DetailsPanel } from '../../app/renderer/panels/index.js';
import { useEditor } from '../../app/renderer/store/index.js';
import { useDrafts } from '../../app/renderer/panels/devices/drafts.js';
import { choose, field, typeAndEnter } from './panels/dom.js';
import { linkOf, load, sampleJob } from './panels/fixture.js';

function selectLink(id: string) {
  act(() => useEditor.getState().select({ nodes: [], links: [id] }));
}

const status = (id: string) => useEditor.getState().resultById[id]!.status;
const kinds = ['mcb', 'adjustable', 'curve', 'fixed'] as const;

describe('changing the kind of a passing circuit’s device', () => {
  beforeEach(() => {
    // C1 passes on its own loop (an RCD would only matter if it failed); take the RCD off so
    // that "not pass" cannot come from the RCD case.
    const job = sampleJob();
    job.links[1] = { ...job.links[1]!, rcd: undefined };
    delete job.links[1]!.rcd;
    load(job);
    useDrafts.setState({ drafts: {} });
  });

  it('starts passing (the premise of these tests)', () => {
    expect(status('C1')).toBe('pass');
  });

  for (const kind of ['adjustable', 'curve', 'fixed'] as const) {
    it(`to ${kind}: no pass, no device in the job, and the panel names what is missing`, () => {
      const { container } = render(<DetailsPanel />);
      selectLink('C1');
      choose(field<HTMLSelectElement>(container, 'device.type'), kind);
      expect(linkOf('C1').device).toBeUndefined();
      expect(status('C1')).toBe('unchecked');
      expect(useEditor.getState().resultById.C1!.verdict).not.toBe('pass');
      const missing = container.querySelector('[data-device-missing="C1"]')!;
      expect(missing.textContent).toMatch(/Device data missing:/);
      expect(missing.textContent).toContain('rating In (A)');
      if (kind === 'adjustable') expect(missing.textContent).toContain('instantaneous pick-up Ii (A)');
      if (kind === 'fixed') expect(missing.textContent).toContain('trip current Ia (A)');
      if (kind === 'curve') expect(missing.textContent).toContain('time–current points');
      // The required fields are empty: nothing carried over, nothing made up.
      expect(field(container, 'device.rating').value).toBe('');
      if (kind === 'adjustable') expect(field(container, 'device.instantaneous').value).toBe('');
      if (kind === 'fixed') expect(field(container, 'device.tripCurrent').value).toBe('');
      if (kind === 'curve') {
        for (const input of container.querySelectorAll<HTMLInputElement>('[data-curve-row] input')) expect(input.value).toBe('');
      }
    });
  }

  it('from a breaker to a breaker of another curve is not a kind change; no device to a breaker asks for curve and rating', () => {
    const { container } = render(<DetailsPanel />);
    selectLink('C4'); // no device
    choose(field<HTMLSelectElement>(container, 'device.type'), 'mcb');
    expect(linkOf('C4').device).toBeUndefined();
    expect(field<HTMLSelectElement>(container, 'device.curve').value).toBe('');
    expect(container.querySelector('[data-device-missing="C4"]')!.textContent).toMatch(/curve \(B, C or D\), rating In \(A\)/);
    choose(field<HTMLSelectElement>(container, 'device.curve'), 'C');
    expect(linkOf('C4').device).toBeUndefined();
    typeAndEnter(field(container, 'device.rating'), '16');
    expect(linkOf('C4').device).toEqual({ type: 'mcb', curve: 'C', rating: 16 });
    expect(container.querySelector('[data-device-missing]')).toBeNull();
  });

  it('nothing invented reaches the file, the schedule or the printout while the data is missing', () => {
    const { container } = render(<DetailsPanel />);
    selectLink('C1');
    for (const kind of kinds.filter((k) => k !== 'mcb')) {
      choose(field<HTMLSelectElement>(container, 'device.type'), kind);
      const s = useEditor.getState();
      const text = serialiseJob(s.job);
      const saved = JSON.parse(text) as { links: Array<{ id: string; device?: unknown }> };
      expect(saved.links.find((l) => l.id === 'C1')!.device).toBeUndefined();
      // The old starting values (160 A pick-up, 80 A trip, the 32/80/320 A curve) are nowhere.
      expect(text).not.toMatch(/"instantaneous"|"tripCurrent"|"points"/);
      const csv = scheduleCsv(s.job, s.results).split(/\r?\n/);
      const head = csv[0]!.split(',');
      const row = csv.find((line) => line.startsWith('C1,'))!.split(',');
      expect(row[head.indexOf('status')]).toBe('unchecked');
      expect(row[head.indexOf('device')]).toBe('');
      // Printout: the schedule row of C1 (texts on its baseline) shows no pass.
      const sheets = layoutReport(s.job, s.results).filter((sh) => sh.kind === 'schedule');
      expect(sheets.length).toBeGreaterThan(0);
      const texts = sheets.flatMap((sh) => sh.items.flatMap((it) => (it.kind === 'text' ? [it] : [])));
      const cells = texts.filter((t) => t.text === 'C1');
      expect(cells.length).toBeGreaterThan(0);
      for (const c of cells) {
        const sheetRow = texts.filter((t) => Math.abs(t.y - c.y) < 0.5).map((t) => t.text);
        expect(sheetRow.join(' ')).not.toMatch(/\bpass\b/);
      }
    }
  });

  it('the draft becomes the job’s device only when complete, and then the circuit is checked on what was entered', () => {
    const { container } = render(<DetailsPanel />);
    selectLink('C1');
    choose(field<HTMLSelectElement>(container, 'device.type'), 'fixed');
    typeAndEnter(field(container, 'device.rating'), '20');
    expect(linkOf('C1').device).toBeUndefined();
    expect(status('C1')).toBe('unchecked');
    typeAndEnter(field(container, 'device.tripCurrent'), '150');
    expect(linkOf('C1').device).toEqual({ type: 'fixed', rating: 20, tripCurrent: 150 });
    // 150 A is C20 under au-nz (7.5 × 20 A, AS/NZS 3000:2018 Table B5.1 note): the same result.
    expect(useEditor.getState().resultById.C1!.tripCurrent).toBe(150);
    expect(status('C1')).toBe('pass');
  });

  it('a curve draft takes the designer’s points, refuses falling currents with the reason, and joins the job when good', () => {
    const { container } = render(<DetailsPanel />);
    selectLink('C1');
    choose(field<HTMLSelectElement>(container, 'device.type'), 'curve');
    typeAndEnter(field(container, 'device.rating'), '20');
    typeAndEnter(field(container, 'device.points.0.0'), '200');
    typeAndEnter(field(container, 'device.points.0.1'), '5');
    typeAndEnter(field(container, 'device.points.1.0'), '100');
    typeAndEnter(field(container, 'device.points.1.1'), '0.1');
    expect(linkOf('C1').device).toBeUndefined();
    expect(container.querySelector('[data-device-refused="C1"]')!.textContent).toMatch(/current must rise/);
    typeAndEnter(field(container, 'device.points.1.0'), '400');
    expect(linkOf('C1').device).toEqual({ type: 'curve', rating: 20, points: [[200, 5], [400, 0.1]] });
  });

  it('picking a library entry fills the device in one step; undo brings the old device back', () => {
    const { container } = render(<DetailsPanel />);
    selectLink('C1');
    choose(field<HTMLSelectElement>(container, 'device.type'), 'curve');
    expect(status('C1')).toBe('unchecked');
    choose(field<HTMLSelectElement>(container, 'device.library'), 'lib:gG-20');
    const device = linkOf('C1').device!;
    expect(device.type).toBe('curve');
    expect(device.rating).toBe(20);
    expect(container.querySelector('[data-device-source]')!.textContent).toMatch(/IEC 60269-1/);
    act(() => useEditor.getState().undo());
    expect(linkOf('C1').device).toBeUndefined();
    act(() => useEditor.getState().undo());
    expect(linkOf('C1').device).toEqual({ type: 'mcb', curve: 'C', rating: 20 });
  });

  it('a leg leaving a point (a fused spur) falls back to the device above it, and the form says so', () => {
    const job = useEditor.getState().job;
    load({
      ...job,
      nodes: [...job.nodes, { id: 'P9', kind: 'point', use: 'fixed-equipment', at: { x: -200, y: 480 } }],
      links: [...job.links, { id: 'S9', from: 'P1', to: 'P9', cable: { length: 2, material: 'Cu', active: 2.5, earth: 2.5 },
        device: { type: 'fixed', rating: 10, tripCurrent: 50 } }],
    });
    expect(useEditor.getState().resultById.S9!.protectedBy).toBe('S9');
    const { container } = render(<DetailsPanel />);
    selectLink('S9');
    choose(field<HTMLSelectElement>(container, 'device.type'), 'curve');
    expect(linkOf('S9').device).toBeUndefined();
    // Checked on real data only: the C20 on C1 that the spur's fault current passes through.
    expect(useEditor.getState().resultById.S9!.protectedBy).toBe('C1');
    expect(container.querySelector('[data-device-missing="S9"]')!.textContent).toMatch(/checked against the device above it, on C1/);
  });

  it('a draft follows its link through a rename and goes with a new document', () => {
    const { container } = render(<DetailsPanel />);
    selectLink('C1');
    choose(field<HTMLSelectElement>(container, 'device.type'), 'fixed');
    typeAndEnter(field(container, 'device.rating'), '25');
    typeAndEnter(field(container, 'id'), 'C1A');
    expect(useDrafts.getState().drafts.C1A?.rating).toBe(25);
    expect(field(container, 'device.rating').value).toBe('25');
    act(() => load(sampleJob()));
    expect(useDrafts.getState().drafts).toEqual({});
  });

  it('never shows a pass badge for the circuit straight after any kind change', () => {
    const { container } = render(<DetailsPanel />);
    selectLink('C1');
    for (const kind of ['fixed', 'curve', 'adjustable', 'mcb', 'fixed'] as const) {
      choose(field<HTMLSelectElement>(container, 'device.type'), kind);
      const results = container.querySelector('[data-results="C1"]') as HTMLElement;
      expect(results.querySelector('[data-status-badge]')).not.toBeNull();
      expect(results.querySelector('[data-status-badge="pass"]')).toBeNull();
      expect(status('C1')).not.toBe('pass');
    }
    fireEvent.click(container); // nothing else changes it
    expect(status('C1')).not.toBe('pass');
  });
});
