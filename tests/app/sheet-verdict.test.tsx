// The sheet for a version 2 job: every link's verdict beside its loop status, labels with the
// load, drop and reading, a failing check named, and labels that stay readable at any zoom.
import { beforeEach, describe, expect, it } from 'vitest';
import { act, render } from '@testing-library/react';
import { ReactFlowProvider } from '@xyflow/react';
import { analyse, toFileObject, loadJob, type CircuitResult, type Job } from '../../engine/index.js';
import { Sheet } from '../../app/renderer/sheet/Sheet.js';
import {
  CHAR_WIDTH, LABEL_LINE, LABEL_PAD, MIN_LABEL_PX, fitLabel, fitVerdict, labelLines, loadLine, measuredLine, pickLines, verdictText,
} from '../../app/renderer/sheet/labels.js';
import { useEditor } from '../../app/renderer/store/index.js';
import { loadsJob } from './panels/fixture.js';

function renderSheet() {
  return render(
    <ReactFlowProvider>
      <div style={{ width: 1000, height: 800 }}><Sheet onContextMenu={() => undefined} /></div>
    </ReactFlowProvider>,
  );
}

/** loadsJob with C3's reading raised so that it fails while its design passes. */
function failingReadingJob(): Job {
  const file = toFileObject(loadsJob()) as { links: Array<{ id: string; measured?: { zs: number } }> };
  file.links.find((l) => l.id === 'C3')!.measured!.zs = 2.5;
  const loaded = loadJob(file);
  if (!loaded.ok) throw new Error('fixture does not load');
  return loaded.job;
}

describe('the sheet with loads, drops and readings', () => {
  beforeEach(() => useEditor.getState().loadJob(loadsJob(), { name: 'test.lwj' }));

  it('gives every link data-verdict beside data-status, as analyse() does', () => {
    const { container } = renderSheet();
    const results = analyse(useEditor.getState().job);
    for (const c of results.circuits) {
      const g = container.querySelector(`[data-link-id="${c.link}"]`)!;
      expect(g.getAttribute('data-status'), c.link).toBe(c.status);
      expect(g.getAttribute('data-verdict'), c.link).toBe(c.verdict);
    }
    // C2's loop passes but its drop fails: the status keeps the loop's word, the verdict the whole.
    expect(container.querySelector('[data-link-id="C2"]')?.getAttribute('data-status')).toBe('pass');
    expect(container.querySelector('[data-link-id="C2"]')?.getAttribute('data-verdict')).toBe('fail');
  });

  it('flags a voltage-drop failure like a loop failure, naming the check, with Ib and the drop against its limit', () => {
    const { container } = renderSheet();
    const r = useEditor.getState().resultById.C2!;
    const label = container.querySelector<HTMLElement>('[data-link-label="C2"]')!;
    expect(label.className).toContain('lw-status--fail');
    expect(container.querySelector('[data-link-id="C2"]')?.getAttribute('class')).toContain('lw-status--fail');
    expect(label.querySelector('[data-label-line="verdict"]')?.textContent).toMatch(/✗ FAIL: (voltage drop|drop)/);
    // 20 A at cos φ 1 over 120 m of 2.5 mm² Cu, 230 V: 18.8 % in C2 itself (method-depth.md section 3).
    expect(label.querySelector('[data-label-line="load"]')?.textContent).toBe(
      `Ib 20 A · Vd ${Number(r.voltageDropTotal!.toFixed(0))} / 5 %`,
    );
    expect(label.title).toContain('voltage drop');
  });

  it('shows a reading and its result, and says when the design passes but the reading fails', () => {
    useEditor.getState().loadJob(failingReadingJob(), { name: 'test.lwj' });
    const { container } = renderSheet();
    const r = useEditor.getState().resultById.C3!;
    expect(r.status).toBe('pass');
    expect(r.measured?.status).toBe('fail');
    const label = container.querySelector<HTMLElement>('[data-link-label="C3"]')!;
    expect(label.title).toContain(`meas. 2.50 → ${r.measured!.corrected.toFixed(2)} Ω, ✗ FAIL`);
    // At zoom 1 the short word; the whole phrase in the tooltip (and on the label zoomed in, e2e).
    expect(label.querySelector('[data-label-line="verdict"]')?.textContent).toBe('C3 ✗ FAIL: reading');
    expect(label.title).toContain('✗ FAIL: design passes, reading fails');
    expect(label.querySelector('[data-label-line="measured"]')?.textContent).toMatch(/✗ FAIL/);
    expect(label.className).toContain('lw-status--fail');
  });

  it('shows the fault level at a board and the supply\u2019s headroom', () => {
    const { container } = renderSheet();
    const results = analyse(useEditor.getState().job);
    const fromMsb = results.circuits.find((c) => c.from === 'MSB')!;
    expect(container.querySelector('[data-node-id="MSB"] [data-node-line="fault"]')?.textContent).toBe(` Imax ${Number((fromMsb.faultLevel! / 1000).toFixed(2))} kA`);
    const supply = results.supplies[0]!;
    const line = container.querySelector('[data-node-id="S1"] [data-node-line="headroom"]')?.textContent ?? '';
    expect(line).toContain('Imax 6 kA');
    expect(line).toContain(`Ze max ${supply.maxZe!.toFixed(2)} Ω`);
  });

  it('updates the verdict when an edit fixes the drop, and back on undo', () => {
    const { container } = renderSheet();
    const verdict = () => container.querySelector('[data-link-id="C2"]')?.getAttribute('data-verdict');
    expect(verdict()).toBe('fail');
    act(() => {
      useEditor.getState().apply({ op: 'update-link', id: 'C2', patch: { cable: { length: 20, material: 'Cu', active: 2.5, earth: 2.5 } } });
    });
    expect(verdict()).toBe('pass');
    act(() => useEditor.getState().undo());
    expect(verdict()).toBe('fail');
  });
});

const base: CircuitResult = {
  link: 'C1', name: null, from: 'A', to: 'B', role: 'final-subcircuit', method: 'known-source', protectedBy: 'C1', device: 'C20',
  tripCurrent: 200, requiredTime: 0.4, zs: 0.8, own: 0.6, upstream: 0.1, limit: 1.15, faultCurrent: 287, clearingTime: 0.1,
  ratio: 0.7, maxLength: 60, status: 'pass', notes: [], phases: 1, designCurrent: 16, powerFactor: 0.8, voltageDrop: 2.1,
  voltageDropTotal: 3.04, voltageDropLimit: 5, voltageStatus: 'pass', capacity: 27, capacityStatus: 'pass', faultLevel: 3000,
  breakingStatus: 'pass', earthMinArea: 0.9, withstandStatus: 'pass', testLimit: 0.95, measured: null, fixes: [], verdict: 'pass',
};
const link = { id: 'C1', from: 'A', to: 'B', cable: { length: 32, material: 'Cu' as const, active: 2.5, earth: 2.5 }, device: { type: 'mcb' as const, curve: 'C' as const, rating: 20 } };

describe('label text for loads, readings and verdicts', () => {
  it('gives Ib with the total drop against its limit, or Ib alone, or nothing', () => {
    expect(loadLine(base)).toBe('Ib 16 A · Vd 3 / 5 %');
    expect(loadLine({ ...base, voltageDropLimit: null })).toBe('Ib 16 A · Vd 3 %');
    expect(loadLine({ ...base, designCurrent: null, voltageDropTotal: null })).toBe('');
  });

  it('gives the reading, corrected, with its result by symbol and word', () => {
    expect(measuredLine(base)).toBe('');
    expect(measuredLine({ ...base, measured: { zs: 0.62, corrected: 0.744, ratio: 0.81, status: 'pass' } })).toBe('meas. 0.62 → 0.74 Ω, ✓ pass 81 %');
  });

  it('names every failing check, and a reading that fails on a passing design', () => {
    expect(verdictText(base)).toBe('✓ pass');
    expect(verdictText({ ...base, voltageStatus: 'fail', verdict: 'fail' })).toBe('✗ FAIL: voltage drop');
    expect(verdictText({ ...base, voltageStatus: 'fail', capacityStatus: 'fail', verdict: 'fail' }, true)).toBe('✗ FAIL: drop, capacity');
    expect(verdictText({ ...base, status: 'fail', verdict: 'fail' })).toBe('✗ FAIL: loop impedance');
    expect(verdictText({ ...base, verdict: 'fail', measured: { zs: 1.3, corrected: 1.5, ratio: 1.3, status: 'fail' } })).toBe('✗ FAIL: design passes, reading fails');
    // A failing loop is never drawn milder than FAIL, whatever the verdict says.
    expect(verdictText({ ...base, status: 'fail', verdict: 'unchecked' })).toMatch(/^✗ FAIL/);
  });

  it('keeps the verdict and the failing check\u2019s line first when only a few lines fit', () => {
    const r = { ...base, voltageStatus: 'fail' as const, verdict: 'fail' as const };
    const all = labelLines(link, r);
    expect(all.map((l) => l.key)).toEqual(['device', 'cable', 'result', 'load', 'verdict']);
    expect(pickLines(all, 1, r).map((l) => l.key)).toEqual(['verdict']);
    expect(pickLines(all, 2, r).map((l) => l.key)).toEqual(['load', 'verdict']);
    expect(pickLines(all, 3, r).map((l) => l.key)).toEqual(['result', 'load', 'verdict']);
    expect(pickLines(all, 9, r)).toEqual(all);
  });
});

describe('label fit at each zoom', () => {
  const room = 77; // rows 160 px apart: 104 px between nodes, less the bus run and margins

  it('zoomed out: fewer lines, never smaller than the readable size on screen, never taller than the room', () => {
    for (const zoom of [0.3, 0.45, 0.6, 0.8]) {
      const fit = fitLabel(6, room, zoom);
      expect(fit.font * zoom, `zoom ${zoom}`).toBeGreaterThanOrEqual(MIN_LABEL_PX - 1e-9);
      expect(fit.count * fit.font * LABEL_LINE + LABEL_PAD, `zoom ${zoom}`).toBeLessThanOrEqual(room + 1e-9);
    }
    expect(fitLabel(6, room, 0.3).count).toBe(1);
    expect(fitLabel(6, room, 0.6).count).toBe(3);
    expect(fitLabel(6, room, 0.3).count).toBeLessThan(fitLabel(6, room, 0.8).count);
  });

  it('zoomed in: every line', () => {
    expect(fitLabel(6, room, 1.2).count).toBe(6);
    expect(fitLabel(6, room, 2).count).toBe(6);
    expect(fitLabel(6, room, 2).font).toBeLessThanOrEqual(11);
  });

  it('keeps the status symbol and word whole on the verdict line, leaving out reasons and the id first', () => {
    const r = { ...base, voltageStatus: 'fail' as const, verdict: 'fail' as const };
    // The id on the device line: the whole reason fits at 11 px.
    expect(fitVerdict('C12', r, 11, 168, true)).toEqual({ withId: false, text: '✗ FAIL: voltage drop', font: 11 });
    // The id leading the line: the reason in its short word.
    expect(fitVerdict('C12', r, 11, 168, false)).toEqual({ withId: true, text: '✗ FAIL: drop', font: 11 });
    const narrow = fitVerdict('C12', r, 30, 168, false);
    expect(narrow.text).toBe('✗ FAIL');
    expect(narrow.text.length * CHAR_WIDTH * narrow.font).toBeLessThanOrEqual(168);
    // Too narrow even for the word at this size: smaller type, the word whole.
    const tiny = fitVerdict('C12', { ...base, status: 'unchecked', verdict: 'unchecked' }, 40, 168, false);
    expect(tiny.text).toBe('○ unchecked');
    expect(tiny.font).toBeLessThan(40);
  });
});
