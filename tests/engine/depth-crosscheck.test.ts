// The engine against an independent calculator of the contract (tests/engine/independent/calc.ts,
// written from method.md and method-depth.md alone): every results field of version 2 on many
// random valid jobs, numbers to a relative 2e-3, statuses and fixes exactly; then the demo jobs.

import { readFileSync } from 'node:fs';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { analyse, formatProblem, loadJob, parseJob } from '../../engine/index.js';
import { calculate } from './independent/calc.js';
import { compare } from './independent/compare.js';
import { jobV2 } from './independent/jobs.js';

function agree(file: unknown): string[] {
  const loaded = loadJob(file);
  if (!loaded.ok) return [`refused:\n${loaded.problems.map(formatProblem).join('\n')}`];
  return compare(analyse(loaded.job), calculate(loaded.job));
}

describe('the engine agrees with an independent calculator of the contract', () => {
  it('on random version-2 jobs (both bases, every device kind, loads, phases, readings)', () => {
    fc.assert(
      fc.property(jobV2(), (file) => {
        expect(agree(file)).toEqual([]);
      }),
      { numRuns: 400 },
    );
  });

  it('on random jobs where every link leaving a supply or board is protected', () => {
    fc.assert(
      fc.property(jobV2({ allDevices: true }), (file) => {
        expect(agree(file)).toEqual([]);
      }),
      { numRuns: 200 },
    );
  });

  it.each(['assets/demo.lwj', 'assets/demo-unknown-source.lwj', 'tests/fixtures/v1-minimal.lwj', 'tests/fixtures/v2-depth.lwj'])('on %s', (path) => {
    const loaded = parseJob(readFileSync(path, 'utf8'));
    expect(loaded.ok).toBe(true);
    if (!loaded.ok) return;
    const want = calculate(loaded.job);
    expect(compare(analyse(loaded.job), want)).toEqual([]);
    // the comparison is not empty-handed: the demo has checked circuits
    expect(want.circuits.some((c) => c.status !== 'unchecked')).toBe(true);
  });

  it('a reading on a link that no supply reaches is still corrected: 0.8 Ω at 20 °C on copper gives 1.044 Ω', () => {
    // method-depth.md §7: corrected = Zem + (Zsm − Zem) · F, F = ρf / ρθ; nothing in it needs a supply
    // (Zem is 0 when no supply's ze is measured). au-nz Cu: F = 0.0225 / (1/58) = 1.305
    // (AS/NZS 3000:2018 B5.2.2; IEC 60028, from memory); 0.8 · 1.305 = 1.044 Ω (the engine gave 0.8 before d670adb)
    const file = {
      format: 'loopwright.job',
      version: 2,
      job: {},
      rules: { basis: 'au-nz' },
      nodes: [{ id: 'S1', kind: 'supply', source: { type: 'unknown' } }, { id: 'B1', kind: 'board' }, { id: 'P1', kind: 'point', use: 'other' }],
      links: [{ id: 'C1', from: 'B1', to: 'P1', cable: { length: 10, material: 'Cu', active: 2.5, earth: 2.5 }, device: { type: 'mcb', curve: 'C', rating: 20 }, measured: { zs: 0.8 } }],
    };
    const loaded = loadJob(file);
    if (!loaded.ok) throw new Error('refused');
    const c = analyse(loaded.job).circuits[0];
    expect(c?.measured?.status).toBe('unchecked');
    expect(Math.abs((c?.measured?.corrected as number) - 1.044)).toBeLessThan(1e-9);
  });

  it('the comparison itself notices a changed field (it can fail)', () => {
    const loaded = parseJob(readFileSync('assets/demo.lwj', 'utf8'));
    if (!loaded.ok) throw new Error('demo refused');
    const got = analyse(loaded.job);
    const want = calculate(loaded.job);
    const c = got.circuits.find((x) => x.voltageDrop !== null);
    expect(c).toBeDefined();
    if (!c) return;
    (c as { voltageDrop: number }).voltageDrop *= 1.01;
    expect(compare(got, want).some((m) => m.startsWith(`${c.link}.voltageDrop`))).toBe(true);
  });
});
