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

  it.each(['assets/demo.lwj', 'assets/demo-unknown-source.lwj', 'tests/fixtures/v1-minimal.lwj'])('on %s', (path) => {
    const loaded = parseJob(readFileSync(path, 'utf8'));
    expect(loaded.ok).toBe(true);
    if (!loaded.ok) return;
    const want = calculate(loaded.job);
    expect(compare(analyse(loaded.job), want)).toEqual([]);
    // the comparison is not empty-handed: the demo has checked circuits
    expect(want.circuits.some((c) => c.status !== 'unchecked')).toBe(true);
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
