// Builders for job file objects (plain JSON, as a user or another tool would write them) and
// a runner that loads them through the engine's one parser before analysing. Expected values
// are never computed here: each test writes its own hand arithmetic beside its numbers.

import { analyse, formatProblem, loadJob } from '../../engine/index.js';
import type { CircuitResult, Job, Results } from '../../engine/index.js';

export type Obj = Record<string, unknown>;

export const DETAILS = {
  title: 'Test job',
  site: 'Test site',
  client: '',
  designer: '',
  reference: 'T-1',
  revision: 'A',
  date: '2026-01-01',
  notes: '',
};

export function jobFile(parts: { rules?: Obj; nodes: Obj[]; links: Obj[]; extra?: Obj }): Obj {
  return {
    format: 'loopwright.job',
    version: 1,
    job: { ...DETAILS },
    rules: { basis: 'au-nz', ...(parts.rules ?? {}) },
    nodes: parts.nodes,
    links: parts.links,
    ...(parts.extra ?? {}),
  };
}

export const unknownSupply = (id: string): Obj => ({ id, kind: 'supply', source: { type: 'unknown' } });
export const impedanceSupply = (id: string, r: number, x: number): Obj => ({
  id,
  kind: 'supply',
  source: { type: 'impedance', r, x },
});
export const faultCurrentSupply = (id: string, current: number, xr?: number): Obj => ({
  id,
  kind: 'supply',
  source: xr === undefined ? { type: 'fault-current', current } : { type: 'fault-current', current, xr },
});
export const board = (id: string, extra: Obj = {}): Obj => ({ id, kind: 'board', ...extra });
export const point = (id: string, use: string, extra: Obj = {}): Obj => ({ id, kind: 'point', use, ...extra });

/** Copper cable unless `extra` says otherwise. */
export const cable = (length: number, active: number, earth: number, extra: Obj = {}): Obj => ({
  length,
  material: 'Cu',
  active,
  earth,
  ...extra,
});

export const link = (id: string, from: string, to: string, cab: Obj, extra: Obj = {}): Obj => ({
  id,
  from,
  to,
  cable: cab,
  ...extra,
});

export const mcb = (curve: 'B' | 'C' | 'D', rating: number, extra: Obj = {}): Obj => ({
  type: 'mcb',
  curve,
  rating,
  ...extra,
});

/** Load a file object; throws with every problem listed when the engine refuses it. */
export function load(file: Obj): Job {
  const result = loadJob(file);
  if (!result.ok) throw new Error(`job refused:\n${result.problems.map(formatProblem).join('\n')}`);
  return result.job;
}

export function run(file: Obj): Results {
  return analyse(load(file));
}

export function circuit(results: Results, id: string): CircuitResult {
  const found = results.circuits.find((c) => c.link === id);
  if (!found) throw new Error(`no result for link ${id}`);
  return found;
}

/** Relative closeness: |actual − expected| ≤ rel · max(|expected|, 1e-12). */
export function expectRel(actual: number | null | undefined, expected: number, rel = 1e-6): void {
  if (typeof actual !== 'number' || !Number.isFinite(actual)) {
    throw new Error(`expected a number close to ${expected}, got ${String(actual)}`);
  }
  const tol = rel * Math.max(Math.abs(expected), 1e-12);
  if (Math.abs(actual - expected) > tol) {
    throw new Error(`expected ${expected} (±${tol.toExponential(2)}), got ${actual}`);
  }
}
