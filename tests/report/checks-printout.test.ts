// The printout's checks beyond the loop: the test sheets (one per board, each circuit's test
// limit, readings or blank cells, the method of correction, the caution), the assumptions sheet's
// new values and sources, the schedule's new columns, the diagram's load, verdict, fault level and
// headroom. The drop fixture is worked by hand in tests/cli/checks.test.ts.

import { mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import {
  analyse, CAPACITY_TABLE_SOURCE, CAUTION, K_TABLE_SOURCE, MEASURED_SOURCE, parseJob, type Job,
} from '../../engine/index.js';
import { layoutReport, type ReportOptions, type Sheet } from '../../engine/report/index.js';
import { fmtOhm } from '../../engine/report/format.js';
import { cli } from '../cli/run.js';
import { demoJob, expectReadable, ROOT, texts, tool } from './helpers.js';

const FIXTURE = `${ROOT}tests/cli/fixtures/drop-fail.lwj`;

function fixture(): Job {
  const loaded = parseJob(readFileSync(FIXTURE, 'utf8'));
  if (!loaded.ok) throw new Error('drop-fail.lwj does not load');
  return loaded.job;
}

/** The text of some sheets, each line's items joined by spaces, wrapped lines closed up. */
function flat(sheets: Sheet[]): string {
  return sheets.flatMap((s) => texts(s).map((t) => t.text)).join(' ').replace(/\s+/g, ' ');
}

const PAPERS: ReportOptions[] = [{}, { paper: 'A4', orientation: 'portrait' }, { paper: 'A4', orientation: 'landscape' }];

describe('test sheets', () => {
  it.each(PAPERS)('one per board, every circuit leaving it, readable (%o)', (options) => {
    for (const job of [fixture(), demoJob()]) {
      const results = analyse(job);
      const sheets = layoutReport(job, results, { ...options, testSheet: 'only' });
      expect(sheets.length).toBeGreaterThan(0);
      for (const sheet of sheets) {
        expect(sheet.kind).toBe('test');
        expectReadable(sheet);
        const words = texts(sheet).map((t) => t.text);
        expect(flat([sheet])).toContain(CAUTION.replace(/\s+/g, ' '));
        expect(words.some((w) => w.startsWith('Method of correction: '))).toBe(true);
      }
      // Every link is listed once, on the sheet of the board (or supply) it is tested from.
      const listed = sheets.flatMap((s) => texts(s).filter((t) => t.font === 'bold').map((t) => t.text));
      for (const link of job.links) expect(listed.filter((t) => t === link.id), link.id).toHaveLength(1);
    }
  });

  it('appended after the rest of the printout with testSheet: include, leaving the other sheets as they were', () => {
    const job = fixture();
    const results = analyse(job);
    const plain = layoutReport(job, results);
    const both = layoutReport(job, results, { testSheet: 'include' });
    const tests = layoutReport(job, results, { testSheet: 'only' });
    expect(both.map((s) => s.kind)).toEqual([...plain.map((s) => s.kind), ...tests.map(() => 'test')]);
    expect(both.slice(0, plain.length).map((s) => s.title)).toEqual(plain.map((s) => s.title));
  });

  it('states the fixed-factor method and the supply\'s measured Ze, with the test limits that follow from them', () => {
    const job = fixture();
    job.rules = { ...job.rules, measuredRule: 'fixed-factor' };
    job.nodes = job.nodes.map((n) => (n.kind === 'supply' ? { ...n, measured: { ze: 0.12, date: '2026-11-29', instrument: 'tester T-1 (invented)' } } : n));
    const results = analyse(job);
    const sheets = layoutReport(job, results, { testSheet: 'only' });
    const text = flat(sheets);
    // The common rule of thumb: a reading must not exceed 80 % of the limit (common practice).
    expect(text).toContain('Method of correction: fixed factor. A reading passes when it is at most 80 % of the loop budget c·U0/Ia');
    expect(text).toContain('S1: Zem = 0.120 Ω measured on 2026-11-29 with tester T-1 (invented).');
    // method-depth.md §7 with F = 1/0.8: C1's limit 0.12 + (1.5333 − 0.12)·0.8 = 1.2507 Ω.
    const c1 = results.circuits.find((c) => c.link === 'C1');
    expect(c1?.testLimit ?? NaN).toBeCloseTo(1.2507, 3);
    for (const c of results.circuits) {
      if (c.testLimit !== null) expect(sheets.flatMap(texts).map((t) => t.text)).toContain(fmtOhm(c.testLimit));
    }
  });

  it('report --test-sheet writes a PDF where pdftotext finds each test limit as printed, the readings, the method and the caution', () => {
    const dir = mkdtempSync(join(tmpdir(), 'lw-test-sheet-'));
    const out = join(dir, 'tests.pdf');
    const run = cli('report', FIXTURE, '-o', out, '--test-sheet');
    expect(run.stderr).toBe('');
    expect(run.status).toBe(1); // C1's verdict fails (its voltage drop)
    expect(run.stdout).toMatch(/wrote .*tests\.pdf \(2 sheets, A3 landscape\)/);
    const text = tool('pdftotext', ['-layout', out, '-']);
    expect(text.status).toBe(0);
    const page = text.stdout;
    const results = analyse(fixture());
    for (const c of results.circuits) {
      const row = page.split('\n').find((l) => l.trim().split(/\s+/)[0] === c.link);
      expect(row, c.link).toBeDefined();
      if (c.testLimit !== null) expect(row?.split(/\s+/)).toContain(fmtOhm(c.testLimit));
    }
    // Worked by hand (method-depth.md §7): C1 at 10 °C, F = 0.0225 / ((1/58)·(1 − 0.00393·10)) =
    // 1.3584, limit 1.5333 / F = 1.129 Ω; the reading 0.800 Ω corrects to 1.087 Ω, 71 %, PASS.
    // C2 without a reading, at 20 °C: F = 0.0225·58 = 1.305, limit 230 / (4·10) / F = 4.406 Ω.
    const c1 = page.split('\n').find((l) => l.trim().startsWith('C1 ')) ?? '';
    expect(c1.split(/\s+/)).toEqual(expect.arrayContaining(['1.129', '10', '0.800', '2026-11-30', '1.087', '71', 'PASS']));
    const c2 = page.split('\n').find((l) => l.trim().startsWith('C2 ')) ?? '';
    expect(c2.split(/\s+/)).toEqual(expect.arrayContaining(['4.406', '20']));
    expect(c2).not.toMatch(/PASS|FAIL/);
    const closed = page.replace(/\s+/g, ' ');
    expect(closed).toContain(CAUTION.replace(/\s+/g, ' '));
    expect(closed).toContain('Method of correction: to fault temperature.');
    expect(closed).toMatch(/Zs measured \(Ω\)/);
    expect(closed).toMatch(/Instrument/);
  }, 60_000);
});

describe('assumptions sheet', () => {
  it('lists the drop, capacity, fault-level, withstand and reading values with their sources', () => {
    const job = fixture();
    const results = analyse(job);
    const text = flat(layoutReport(job, results).filter((s) => s.kind === 'assumptions'));
    expect(text).toContain('ρv copper in normal service, for the voltage drop 0.0225 Ω·mm²/m');
    expect(text).toContain('ρv aluminium in normal service, for the voltage drop 0.036 Ω·mm²/m');
    expect(text).toMatch(/Voltage-drop limit, supply to a lighting point .* 5 % AS\/NZS 3000:2018 clause 3\.6\.2/);
    expect(text).toMatch(/Power factor of a load that states none 0\.8 IEC 60364-5-52 Annex G/);
    expect(text).toContain('Balanced phases: single-phase loads below a three-phase link are taken as spread evenly over its phases');
    expect(text).toContain(CAPACITY_TABLE_SOURCE.replace(/\s+/g, ' '));
    expect(text).toContain('from memory, verify before relying on it');
    expect(text).toMatch(/cmax, voltage factor for maximum fault currents 1\.1 IEC 60909-0/);
    expect(text).toContain('ρ20 copper for fault levels 0.0185 Ω·mm²/m');
    expect(text).toContain('ρ20 aluminium for fault levels 0.0294 Ω·mm²/m');
    // IEC 60364-5-54 Tables A.54.2 and A.54.3 (from memory), as method-depth.md §6 lists them.
    expect(text).toContain('k, copper earth, a core of the cable PVC 115, XLPE 143');
    expect(text).toContain('k, aluminium earth, a separate insulated conductor PVC 95, XLPE 116');
    expect(text).toContain(K_TABLE_SOURCE.replace(/\s+/g, ' '));
    expect(text).toContain(MEASURED_SOURCE.replace(/\s+/g, ' '));
    // The supply: Ze known, single phase, no maxFault: Zsrc = Ze for fault levels; its headroom.
    expect(text).toContain('Zsrc = Ze = 0.100 Ω for this single-phase supply');
    expect(text).toMatch(/Headroom: every circuit still passes with a source impedance up to \d\.\d{3} Ω .*set by C1/);
  });

  it('words an unknown source\'s headroom as the figure to ask the distributor for, and its fault level as unknown', () => {
    const job = fixture();
    job.nodes = job.nodes.map((n) => (n.kind === 'supply' ? { ...n, source: { type: 'unknown' as const } } : n));
    const results = analyse(job);
    const s = results.supplies[0];
    expect(s?.maxZe ?? 0).toBeGreaterThan(0);
    const text = flat(layoutReport(job, results).filter((x) => x.kind === 'assumptions'));
    expect(text).toContain(`ask the distributor for a source impedance of at most ${fmtOhm(s?.maxZe ?? null)} Ω (a prospective earth-fault current of at least`);
    expect(text).toMatch(/Fault levels: unknown .*state the distributor's maximum prospective fault current/);
  });
});

describe('schedule and diagram', () => {
  const job = fixture();
  const results = analyse(job);
  const sheets = layoutReport(job, results);

  it('the schedule carries every check, the verdict and the fixes, failures first by verdict', () => {
    const schedule = sheets.filter((s) => s.kind === 'schedule');
    const words = new Set(schedule.flatMap((s) => texts(s).map((t) => t.text)));
    for (const head of ['Voltage', 'Capacity', 'Breaking', 'Withstand', 'Verdict', 'Fixes', 'Measured']) expect(words.has(head), head).toBe(true);
    // Rows in verdict order: C1 (verdict fail, loop pass) before C2 (pass) before M1 (unchecked).
    const first = schedule[0];
    const rows = texts(first!).filter((t) => t.font === 'bold' && ['C1', 'C2', 'M1'].includes(t.text)).map((t) => t.text);
    expect(rows).toEqual(['C1', 'C2', 'M1']);
    expect(flat(schedule)).toMatch(/cable \d+(\.\d+)?\/\d+(\.\d+)? mm²/);
  });

  it('the diagram gives C1 its Ib and drop over the limit and the verdict naming the failed check', () => {
    const diagram = sheets.filter((s) => s.kind === 'diagram');
    const lines = diagram.flatMap((s) => texts(s).map((t) => t.text));
    expect(lines).toContain('Ib 20 A · ΔU 6.57 > 5 %');
    expect(lines).toContain('Ib 5 A · ΔU 1.61 ≤ 5 %');
    expect(lines).toContain('FAIL: drop');
    // The loop status stays on its own line: C1's loop passes.
    expect(lines.filter((l) => l === 'PASS').length).toBeGreaterThanOrEqual(2);
    // The board's fault level, and the supply's headroom with the circuit that sets it.
    expect(lines.some((l) => /^Ik max \d+\.\d{2} kA$/.test(l))).toBe(true);
    expect(lines.some((l) => /^max Ze \d\.\d{3} Ω \(C1\)$/.test(l))).toBe(true);
    for (const s of diagram) expectReadable(s);
  });
});
