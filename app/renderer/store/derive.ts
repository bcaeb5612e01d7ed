// Derived state: validation of a candidate job and its results, recomputed once per change.
import {
  analyse,
  formatProblem,
  loadJob as readJob,
  toFileObject,
  type CircuitResult,
  type Job,
  type Problem,
  type Results,
} from '../../../engine/index.js';

/** The first error the engine's validator finds in the job, preferring one about the touched ids. */
export function firstError(job: Job, touched: string[]): Problem | null {
  const loaded = readJob(toFileObject(job));
  if (loaded.ok) return null;
  const errors = loaded.problems.filter((p) => p.severity === 'error');
  if (errors.length === 0) return null;
  const mine = errors.find((p) => p.id !== undefined && touched.includes(p.id));
  return mine ?? errors[0]!;
}

export function describe(p: Problem): string {
  return formatProblem(p);
}

export const EMPTY_RESULTS: Results = {
  format: 'loopwright.results',
  version: 1,
  basis: 'au-nz',
  circuits: [],
  worst: null,
  summary: { pass: 0, fail: 0, rcd: 0, unchecked: 0 },
};

function sameResult(a: CircuitResult, b: CircuitResult): boolean {
  for (const key of Object.keys(a) as Array<keyof CircuitResult>) {
    if (key === 'notes') continue;
    if (a[key] !== b[key]) return false;
  }
  return a.notes.length === b.notes.length && a.notes.every((n, i) => n === b.notes[i]);
}

export interface Derived {
  results: Results;
  resultById: Record<string, CircuitResult>;
  error: string | null;
}

/**
 * analyse(job), keeping the previous object for every circuit whose result did not change,
 * so only the labels whose numbers moved re-render.
 */
export function derive(job: Job, previous: Record<string, CircuitResult>): Derived {
  let results: Results;
  try {
    results = analyse(job);
  } catch (e) {
    return {
      results: { ...EMPTY_RESULTS, basis: job.rules.basis },
      resultById: {},
      error: `The analysis failed: ${e instanceof Error ? e.message : String(e)}`,
    };
  }
  const resultById: Record<string, CircuitResult> = {};
  const circuits = results.circuits.map((c) => {
    const old = previous[c.link];
    const kept = old && sameResult(old, c) ? old : c;
    resultById[c.link] = kept;
    return kept;
  });
  return { results: { ...results, circuits }, resultById, error: null };
}
