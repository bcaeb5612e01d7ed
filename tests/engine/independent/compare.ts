// Compare the engine's results with the independent calculator, field by field: numbers to a
// relative 2e-3, statuses, roles, phases and fix kinds exactly. Returns the disagreements in
// words (job-independent: `L3.voltageDrop: expected 1.234, got 1.5`), empty when they agree.

import type { Results } from '../../../engine/index.js';
import type { XResults } from './calc.js';

export const REL = 2e-3;

function close(a: unknown, b: unknown, rel = REL): boolean {
  if (a === null || b === null || a === undefined || b === undefined) return a === b || (a == null && b == null);
  if (typeof a === 'number' && typeof b === 'number') {
    if (a === b) return true;
    return Math.abs(a - b) <= rel * Math.max(Math.abs(a), Math.abs(b)) + 1e-12;
  }
  return a === b;
}

const NUMERIC = [
  'tripCurrent', 'requiredTime', 'zs', 'own', 'upstream', 'limit', 'faultCurrent', 'clearingTime', 'ratio', 'maxLength',
  'designCurrent', 'powerFactor', 'voltageDrop', 'voltageDropTotal', 'voltageDropLimit', 'capacity', 'faultLevel',
  'earthMinArea', 'testLimit',
] as const;
const EXACT = [
  'role', 'method', 'protectedBy', 'status', 'phases', 'voltageStatus', 'capacityStatus', 'breakingStatus', 'withstandStatus', 'verdict',
] as const;

export interface CompareOptions {
  /** Fields to leave out of the comparison (a known, reported disagreement). */
  skip?: Set<string>;
}

export function compare(got: Results, want: XResults, opts: CompareOptions = {}): string[] {
  const skip = opts.skip ?? new Set<string>();
  const out: string[] = [];
  const show = (v: unknown) => JSON.stringify(v);
  if (got.circuits.length !== want.circuits.length) out.push(`circuits: expected ${want.circuits.length}, got ${got.circuits.length}`);
  want.circuits.forEach((w, i) => {
    const g = got.circuits[i];
    if (!g) return;
    const at = w.link;
    if (g.link !== w.link) out.push(`circuits[${i}].link: expected ${w.link}, got ${g.link}`);
    for (const f of EXACT) if (!skip.has(f) && g[f] !== w[f]) out.push(`${at}.${f}: expected ${show(w[f])}, got ${show(g[f])}`);
    for (const f of NUMERIC) if (!skip.has(f) && !close(g[f], w[f])) out.push(`${at}.${f}: expected ${show(w[f])}, got ${show(g[f])}`);
    if (!skip.has('measured')) {
      const gm = g.measured;
      const wm = w.measured;
      if ((gm === null) !== (wm === null)) out.push(`${at}.measured: expected ${show(wm)}, got ${show(gm)}`);
      else if (gm && wm) {
        for (const f of ['zs', 'corrected', 'ratio'] as const) if (!close(gm[f], wm[f])) out.push(`${at}.measured.${f}: expected ${show(wm[f])}, got ${show(gm[f])}`);
        if (gm.status !== wm.status) out.push(`${at}.measured.status: expected ${wm.status}, got ${gm.status}`);
      }
    }
    if (!skip.has('fixes')) {
      const gk = g.fixes.map((f) => f.kind).join(',');
      const wk = w.fixes.map((f) => f.kind).join(',');
      if (gk !== wk) out.push(`${at}.fixes: expected ${show(w.fixes)}, got ${show(g.fixes)}`);
      else
        w.fixes.forEach((wf, j) => {
          const gf = g.fixes[j] as unknown as Record<string, unknown>;
          for (const [k, v] of Object.entries(wf)) {
            if (!close(gf[k], v)) out.push(`${at}.fixes[${j}].${k}: expected ${show(v)}, got ${show(gf[k])}`);
          }
        });
    }
  });
  if (!skip.has('worst')) {
    const gw = got.worst;
    const ww = want.worst;
    if ((gw === null) !== (ww === null)) out.push(`worst: expected ${show(ww)}, got ${show(gw)}`);
    else if (gw && ww) {
      if (gw.link !== ww.link && !close(gw.ratio, ww.ratio, 1e-9)) out.push(`worst.link: expected ${ww.link}, got ${gw.link}`);
      if (!close(gw.ratio, ww.ratio)) out.push(`worst.ratio: expected ${ww.ratio}, got ${gw.ratio}`);
      if (gw.link === ww.link && gw.path.join(' ') !== ww.path.join(' ')) out.push(`worst.path: expected ${ww.path.join(' ')}, got ${gw.path.join(' ')}`);
    }
  }
  if (!skip.has('supplies')) {
    if (got.supplies.length !== want.supplies.length) out.push(`supplies: expected ${want.supplies.length}, got ${got.supplies.length}`);
    want.supplies.forEach((w, i) => {
      const g = got.supplies[i];
      if (!g) return;
      if (g.node !== w.node) out.push(`supplies[${i}].node: expected ${w.node}, got ${g.node}`);
      if (g.phases !== w.phases) out.push(`${w.node}.phases: expected ${w.phases}, got ${g.phases}`);
      for (const f of ['faultLevel', 'maxZe', 'minFaultCurrent'] as const) if (!skip.has(`supply.${f}`) && !close(g[f], w[f])) out.push(`${w.node}.${f}: expected ${show(w[f])}, got ${show(g[f])}`);
    });
  }
  if (!skip.has('summary')) {
    const gs = got.summary as unknown as Record<string, unknown>;
    const ws = want.summary as unknown as Record<string, unknown>;
    if (JSON.stringify(pick(gs)) !== JSON.stringify(pick(ws))) out.push(`summary: expected ${show(pick(ws))}, got ${show(pick(gs))}`);
  }
  return out;
}

function pick(s: Record<string, unknown>): unknown {
  const c = s.checks as Record<string, Record<string, number>>;
  const norm = (o: Record<string, number> | undefined) => (o ? Object.fromEntries(Object.keys(o).sort().map((k) => [k, o[k]])) : o);
  return {
    pass: s.pass,
    fail: s.fail,
    rcd: s.rcd,
    unchecked: s.unchecked,
    verdict: norm(s.verdict as Record<string, number>),
    checks: Object.fromEntries(['voltage', 'capacity', 'breaking', 'withstand', 'measured'].map((k) => [k, norm(c?.[k])])),
  };
}
