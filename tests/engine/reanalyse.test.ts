// The quick re-analysis after one link's length changes (reanalyse) must give exactly what a
// full analysis of the edited job gives: numbers equal to a relative 1e-9 (sums are updated by
// difference), every status, note, fix and verdict identical. Any other edit is analysed afresh.

import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { analyse, createAnalysis, loadJob, reanalyse, rehearseLengthEdit, type Job, type Results } from '../../engine/index.js';
import { jobArb } from './arbitraries.js';
import type { Obj } from './helpers.js';

const params = { numRuns: 80 }; // the seed: tests/engine/setup.ts

function close(a: unknown, b: unknown, path: string): void {
  if (typeof a === 'number' && typeof b === 'number') {
    if (Number.isFinite(a) && Number.isFinite(b)) expect(Math.abs(a - b), path).toBeLessThanOrEqual(1e-9 * Math.max(1, Math.abs(a), Math.abs(b)));
    else expect(a, path).toBe(b);
    return;
  }
  if (Array.isArray(a) && Array.isArray(b)) {
    expect(a.length, path).toBe(b.length);
    a.forEach((x, i) => close(x, b[i], `${path}[${i}]`));
    return;
  }
  if (a && b && typeof a === 'object' && typeof b === 'object') {
    expect(Object.keys(a).sort(), path).toEqual(Object.keys(b).sort());
    for (const k of Object.keys(a)) close((a as Obj)[k], (b as Obj)[k], `${path}.${k}`);
    return;
  }
  expect(a, path).toEqual(b);
}

function load(file: Obj): Job {
  const r = loadJob(file);
  if (!r.ok) throw new Error(r.problems.map((p) => p.message).join('\n'));
  return r.job;
}

/** Notes carry rounded numbers; a length change near a rounding edge may change a digit. */
function stripNotes(r: Results): Results {
  return { ...r, circuits: r.circuits.map((c) => ({ ...c, notes: c.notes.map((n) => n.replace(/[0-9.]+/g, '#')) })) };
}

describe('reanalyse after one length change', () => {
  it('equals a full analysis of the edited job', { timeout: 60_000 }, () => {
    fc.assert(
      fc.property(jobArb(), fc.nat(), fc.double({ min: 0, max: 300, noNaN: true }), (file, pick, length) => {
        const job = load(file);
        if (job.links.length === 0) return;
        const before = createAnalysis(job);
        const i = pick % job.links.length;
        const link = job.links[i]!;
        const edited: Job = { ...job, links: job.links.map((l, k) => (k === i ? { ...link, cable: { ...link.cable, length } } : l)) };
        const quick = reanalyse(before, edited).results;
        close(stripNotes(quick), stripNotes(analyse(edited)), 'results');
        // the earlier analysis is left as it was
        close(before.results, analyse(job), 'before');
      }),
      params,
    );
  });

  it('stays exact along any history of edits: each one made from any earlier analysis, and again', { timeout: 60_000 }, () => {
    // The analyses of a family share their tables (engine/analysis/versions.ts); making an older
    // one current again must give back its own values, whichever was current before.
    fc.assert(
      fc.property(
        jobArb(),
        fc.array(fc.record({ base: fc.nat(), pick: fc.nat(), length: fc.double({ min: 0, max: 300, noNaN: true }) }), { minLength: 1, maxLength: 8 }),
        (file, edits) => {
          const job = load(file);
          if (job.links.length === 0) return;
          const history = [createAnalysis(job)];
          for (const { base, pick, length } of [...edits, ...edits]) {
            const from = history[base % history.length]!;
            const i = pick % job.links.length;
            const link = from.job.links[i]!;
            const edited: Job = { ...from.job, links: from.job.links.map((l, k) => (k === i ? { ...link, cable: { ...link.cable, length } } : l)) };
            const next = reanalyse(from, edited);
            close(stripNotes(next.results), stripNotes(analyse(edited)), 'results');
            history.push(next);
          }
        },
      ),
      params,
    );
  });

  it('any other edit is analysed afresh', { timeout: 60_000 }, () => {
    fc.assert(
      fc.property(jobArb(), (file) => {
        const job = load(file);
        if (job.links.length === 0) return;
        const before = createAnalysis(job);
        const link = job.links[0]!;
        const edited: Job = { ...job, links: job.links.map((l, k) => (k === 0 ? { ...link, cable: { ...link.cable, active: link.cable.active * 2 } } : l)) };
        close(reanalyse(before, edited).results, analyse(edited), 'results');
      }),
      params,
    );
  });

  it('a rehearsal (rehearseLengthEdit) is the real re-analysis of a longer cable, and leaves the analysis it ran from as it was', { timeout: 60_000 }, () => {
    fc.assert(
      fc.property(jobArb(), fc.nat(), fc.double({ min: 0, max: 300, noNaN: true }), (file, pick, length) => {
        const job = load(file);
        const before = createAnalysis(job);
        const rehearsed = rehearseLengthEdit(before);
        const l = job.links.findIndex((x) => x.cable.length > 0);
        if (l < 0) {
          expect(rehearsed).toBeNull();
          return;
        }
        expect(rehearsed).not.toBeNull();
        // Exactly one link is half as long again in what was rehearsed: find it by its results.
        const changed = job.links.filter((x) => {
          const copy: Job = { ...job, links: job.links.map((y) => (y === x ? { ...x, cable: { ...x.cable, length: x.cable.length * 1.5 } } : y)) };
          try {
            close(stripNotes(rehearsed!), stripNotes(analyse(copy)), 'rehearsed');
            return true;
          } catch {
            return false;
          }
        });
        expect(changed.length).toBeGreaterThan(0);
        // The analysis it ran from is untouched, and a real edit from it is exact.
        close(before.results, analyse(job), 'before');
        if (job.links.length === 0) return;
        const i = pick % job.links.length;
        const link = job.links[i]!;
        const edited: Job = { ...job, links: job.links.map((x, k) => (k === i ? { ...link, cable: { ...link.cable, length } } : x)) };
        close(stripNotes(reanalyse(before, edited).results), stripNotes(analyse(edited)), 'after the rehearsal');
      }),
      { numRuns: 30 },
    );
  });
});
