// The checks beside the loop on the command line: exit status by verdict, the --checks view, the
// supplies' fault level and headroom, the summary of every check. One process; the rest in-process.

import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { exitFor } from '../../app/cli/commands/check.js';
import { renderCheck } from '../../app/cli/table.js';
import { analyse, CAUTION, parseJob, type Job, type Results, type SupplyNode } from '../../engine/index.js';
import { describeHeadroomLong } from '../../engine/report/index.js';
import { cli, FIXTURES, looksLikeStackTrace, ROOT } from './run.js';

function load(path: string): Job {
  const loaded = parseJob(readFileSync(path, 'utf8'));
  if (!loaded.ok) throw new Error(`${path} does not load`);
  return loaded.job;
}

const dropFail = join(FIXTURES, 'drop-fail.lwj');

describe('a job whose loop passes but whose voltage drop fails', () => {
  const job = load(dropFail);
  const results = analyse(job);
  const c1 = results.circuits.find((c) => c.link === 'C1');

  it('is worked by hand: C1 loop passes, its total drop is over the limit', () => {
    // method.md, au-nz: Zs = |Ze + M1 + C1| = |0.1 + 0.0225·10·(1/16 + 1/6) + 0.0225·40·(2/2.5) + j·2·0.08e-3·50| = 0.8716 Ω
    // against c·U0/Ia = 230 / (7.5 · 20) = 1.5333 Ω (AS/NZS 3000:2018 Table B5.1 note: curve C at 7.5 In).
    expect(c1?.status).toBe('pass');
    expect(c1?.zs ?? NaN).toBeCloseTo(0.8716, 3);
    // method-depth.md §3, one phase, cos φ = 1: vd = 100 · 2 · Ib · L · ρv/S / U0.
    // C1: 100·2·20·40·0.0225/2.5/230 = 6.2609 %; M1 carries 25 A: 100·2·25·10·0.0225/16/230 = 0.3057 %.
    expect(c1?.voltageDrop ?? NaN).toBeCloseTo(6.2609, 3);
    expect(c1?.voltageDropTotal ?? NaN).toBeCloseTo(6.5666, 3);
    expect(c1?.voltageDropLimit).toBe(5); // AS/NZS 3000:2018 clause 3.6.2, 5 % (from memory)
    expect(c1?.voltageStatus).toBe('fail');
    expect(c1?.verdict).toBe('fail');
    expect(exitFor(results)).toBe(1);
  });

  it('check --checks exits 1 and prints the drop, the verdict, the note naming the limit and the summary of every check', () => {
    const run = cli('check', dropFail, '--checks');
    expect(run.stderr).toBe('');
    expect(looksLikeStackTrace(run.stderr)).toBe(false);
    expect(run.status).toBe(1);
    const out = run.stdout;
    for (const head of ['ph', 'Ib A', 'cos φ', 'drop %', 'total / limit %', 'voltage', 'Iz A', 'capacity', 'Ik kA', 'breaking', 'S_pe min mm²', 'withstand', 'test limit Ω', 'reading → corrected Ω', 'measured', 'verdict']) {
      expect(out.split('\n').find((l) => l.startsWith('link '))).toContain(head);
    }
    // C1: one phase, 20 A, cos φ 1.00, own 6.26 %, total 6.57 of 5.00 %, voltage fail, test limit at
    // 10 °C (method-depth.md §7: 1.5333 / F, F = 0.0225 / ((1/58)·(1 − 0.00393·10)) = 1.3584) = 1.129 Ω,
    // the reading 0.800 Ω corrected to 0.800 · 1.3584 = 1.087 Ω, passing; the verdict FAIL.
    expect(out).toMatch(/^C1 +1 +20 +1\.00 +6\.26 +6\.57 \/ 5\.00 +✗ FAIL .* 1\.129 +0\.800 → 1\.087 +✓ pass +✗ FAIL$/m);
    expect(out).toMatch(/^C2 +1 +5 +1\.00 +1\.30 +1\.61 \/ 5\.00 +✓ pass .* 4\.406 +✓ pass$/m);
    expect(out).toMatch(/C1: .*6\.57 %.*exceeds the limit 5 %/);
    expect(out).toContain('C1: FAIL: voltage drop');
    expect(out).toMatch(/Fixes \(each alone, everything else unchanged\):\n {2}C1: cable \d+(\.\d+)?\/\d+(\.\d+)? mm²/);
    expect(out).toContain('Loop: 2 pass, 0 fail, 0 RCD-reliant, 1 unchecked');
    expect(out).toContain('Verdict (every check): 1 pass, 1 fail, 0 RCD-reliant, 1 unchecked');
    expect(out).toMatch(/voltage drop 1 pass, 1 fail, 1 unchecked/);
    expect(out).toContain('measured 1 pass, 0 fail, 0 RCD-reliant, 0 unchecked (of 1 reading)');
    // The supply: fault level at its terminals, cmax·U0/Ze = 1.1·230/0.1 = 2530 A (IEC 60909-0 cmax,
    // from memory), and its headroom with the circuit that sets it.
    expect(out).toContain('S1 Point of supply: maximum prospective fault current at the terminals 2.53 kA.');
    expect(out).toMatch(/Headroom: every circuit still passes with a source impedance up to \d\.\d{3} Ω \(a prospective earth-fault current down to \d+ A\), set by C1/);
    expect(out).toContain(CAUTION);
  });
});

describe('the readable table in-process', () => {
  const demo = load(join(ROOT, 'assets/demo.lwj'));
  const results = analyse(demo);

  it('keeps the default table within 160 columns and points to --checks in the summary', () => {
    const out = renderCheck(demo, results);
    const table = out.split('\n').filter((l) => /^(link|-{4}|[A-Z]+\d+[a-z]?) /.test(l));
    expect(table.length).toBe(demo.links.length + 2);
    for (const line of table) expect(line.length).toBeLessThanOrEqual(160);
    expect(out).toContain('per link: check --checks.');
    expect(out).toMatch(/^Verdict \(every check\): /m);
  });

  it('prints every link in the --checks view with its verdict word and symbol', () => {
    const out = renderCheck(demo, results, 'checks');
    for (const c of results.circuits) {
      const row = out.split('\n').find((l) => l.startsWith(`${c.link} `));
      expect(row, c.link).toBeDefined();
      const word = { pass: '✓ pass', fail: '✗ FAIL', rcd: '! RCD-reliant', unchecked: '– unchecked' }[c.verdict];
      expect(row?.endsWith(word), `${c.link}: ${row}`).toBe(true);
    }
  });
});

describe('exit status by verdict', () => {
  const base = analyse(load(dropFail));
  const withCounts = (verdict: Partial<Results['summary']['verdict']>, loop: Partial<Results['summary']> = {}): Results => ({
    ...base,
    summary: { ...base.summary, pass: 1, fail: 0, rcd: 0, unchecked: 0, ...loop, verdict: { pass: 1, fail: 0, rcd: 0, unchecked: 0, ...verdict } },
  });

  it('is 0 when no verdict fails or relies on an RCD, 1 when one does', () => {
    expect(exitFor(withCounts({}))).toBe(0);
    expect(exitFor(withCounts({ unchecked: 3 }))).toBe(0);
    expect(exitFor(withCounts({ fail: 1 }))).toBe(1);
    expect(exitFor(withCounts({ rcd: 1 }))).toBe(1);
    // A loop failure is a failing verdict (job-format.md, results document version 2).
    expect(exitFor(withCounts({}, { fail: 1 }))).toBe(1);
  });
});

describe('the headroom in words', () => {
  const supply = (source: SupplyNode['source']): SupplyNode => ({ id: 'S1', kind: 'supply', source });
  const result = { node: 'S1', phases: 1 as const, faultLevel: null, maxZe: 0.45, minFaultCurrent: 230 / 0.45, setBy: 'C7' };

  it('asks the distributor for the figure when the source is unknown', () => {
    expect(describeHeadroomLong(supply({ type: 'unknown' }), result, 230)).toContain(
      'ask the distributor for a source impedance of at most 0.450 Ω (a prospective earth-fault current of at least 511 A), set by C7',
    );
  });

  it('says when the supply feeds nothing checked, or when no source is small enough', () => {
    expect(describeHeadroomLong(supply({ type: 'unknown' }), { ...result, maxZe: null, minFaultCurrent: null, setBy: null }, 230)).toMatch(/feeds no circuit that could be checked/);
    expect(describeHeadroomLong(supply({ type: 'impedance', r: 0.2, x: 0 }), { ...result, maxZe: 0, minFaultCurrent: null }, 230)).toMatch(/none\. .*C7 alone uses the whole budget/);
  });
});
