// Fixes that pass (method-depth.md §8) and source headroom (§9), as properties over random jobs:
// each fix, applied to a copy of the job, makes the circuit pass, and the next smaller change
// would not; the job passes with the source at maxZe and fails 1 % above it.

import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { analyse, loadJob } from '../../engine/index.js';
import type { CircuitResult, Fix, Results } from '../../engine/index.js';
import { cable, circuit, expectRel, jobFile, link, mcb, point, run, unknownSupply } from './helpers.js';
import type { Obj } from './helpers.js';
import { jobV2 } from './independent/jobs.js';

const SIZES = [1, 1.5, 2.5, 4, 6, 10, 16, 25, 35, 50, 70, 95, 120, 150, 185, 240, 300, 400, 500, 630];
const RATINGS = [6, 10, 16, 20, 25, 32, 40, 50, 63, 80, 100, 125];
const CURVES = ['B', 'C', 'D'] as const;
const ORDER = ['length', 'size', 'device', 'rcd'];

function analyseFile(file: Obj): Results {
  const loaded = loadJob(file);
  if (!loaded.ok) throw new Error(`a fixed copy was refused: ${JSON.stringify(loaded.problems)}`);
  return analyse(loaded.job);
}

function linkIn(file: Obj, id: string): Obj {
  return (file.links as Obj[]).find((l) => l.id === id) as Obj;
}

/** A copy of the file with `change` applied to link `id`. */
function changed(file: Obj, id: string, change: (l: Obj) => void): Obj {
  const copy = structuredClone(file);
  change(linkIn(copy, id));
  return copy;
}

const withCable = (file: Obj, id: string, c: Obj) => changed(file, id, (l) => (l.cable = { ...(l.cable as Obj), ...c }));
const withDevice = (file: Obj, id: string, curve: string, rating: number) =>
  changed(file, id, (l) => (l.device = { ...(l.device as Obj), curve, rating }));

/** The circuit passes what the size fix is for: its loop (when protected) and its drop (when checked). */
function sizePasses(before: CircuitResult, after: CircuitResult): boolean {
  const loopOk = before.protectedBy === null || before.status === 'unchecked' || after.status === 'pass';
  const dropOk = before.voltageStatus === 'unchecked' || after.voltageStatus === 'pass';
  return loopOk && dropOk;
}

/** The unknown-source upstream test (method.md) holds for this circuit (always, for a known source). */
function upstreamHolds(file: Obj, c: CircuitResult): boolean {
  if (c.method !== 'unknown-source' || c.limit === null || c.upstream === null) return true;
  const s = ((file.rules as Obj).unknownSourceShare as number | undefined) ?? 0.8;
  const B = c.limit / s;
  return c.upstream <= (1 - s) * B * (1 + 1e-9);
}

function checkFixes(file: Obj): void {
  const r = analyseFile(file);
  for (const c of r.circuits) {
    const kinds = c.fixes.map((f) => f.kind);
    // the order of the contract, each kind at most once
    expect(kinds).toEqual(ORDER.filter((k) => kinds.includes(k as Fix['kind'])));
    const loopFails = c.status === 'fail' || c.status === 'rcd';
    if (!loopFails && c.voltageStatus !== 'fail') expect(kinds).toEqual([]);
    if (!loopFails) expect(kinds.filter((k) => k !== 'size')).toEqual([]);
    for (const fix of c.fixes) {
      if (fix.kind === 'length') {
        const len = (linkIn(file, c.link).cable as Obj).length as number;
        expect(fix.maxLength).toBeGreaterThan(0);
        expect(fix.maxLength).toBeLessThan(len);
        // where the unknown-source upstream test fails as well, the literal rule still lists the
        // length fix, which mends the own test only: pinned by the worked case below
        if (!upstreamHolds(file, c)) continue;
        const at = circuit(analyseFile(withCable(file, c.link, { length: fix.maxLength })), c.link);
        const justBelow = circuit(analyseFile(withCable(file, c.link, { length: fix.maxLength * (1 - 1e-9) })), c.link);
        expect([at.status, justBelow.status]).toContain('pass');
        // a little longer fails again (1 % and 1 cm more: enough to clear the 1e-9 edge rule even
        // where this link is a small part of the loop)
        const longer = circuit(analyseFile(withCable(file, c.link, { length: fix.maxLength * 1.01 + 0.01 })), c.link);
        expect(longer.status).not.toBe('pass');
      }
      if (fix.kind === 'size') {
        const cab = linkIn(file, c.link).cable as Obj;
        const after = circuit(analyseFile(withCable(file, c.link, { active: fix.active, earth: fix.earth })), c.link);
        expect(sizePasses(c, after)).toBe(true);
        // the candidate just before it in the contract's order (ascending active, then earth) fails
        const candidates: Array<[number, number]> = [];
        for (const a of SIZES) {
          if (a < (cab.active as number)) continue;
          for (const e of SIZES) if (e >= (cab.earth as number) && e <= Math.max(a, cab.earth as number)) candidates.push([a, e]);
        }
        const i = candidates.findIndex(([a, e]) => a === fix.active && e === fix.earth);
        expect(i).toBeGreaterThanOrEqual(0);
        if (i > 0) {
          const [pa, pe] = candidates[i - 1] as [number, number];
          const prev = circuit(analyseFile(withCable(file, c.link, { active: pa, earth: pe })), c.link);
          expect(sizePasses(c, prev)).toBe(false);
        }
      }
      if (fix.kind === 'device') {
        const prot = linkIn(file, c.protectedBy as string);
        const dev = prot.device as Obj;
        expect(dev.type).toBe('mcb');
        const after = circuit(analyseFile(withDevice(file, c.protectedBy as string, fix.curve, fix.rating)), c.link);
        expect(after.status).toBe('pass');
        // no passing candidate above it: the same rating with a higher curve (no higher than the
        // present one), or the next rating up (no higher than the present one) on curve B; Ia = m · In
        // grows with the rating and the curve, so every candidate further up fails when these do
        const present = CURVES.indexOf(dev.curve as (typeof CURVES)[number]);
        const above: Array<[string, number]> = CURVES.filter((k, i) => i > CURVES.indexOf(fix.curve) && i <= present).map((k) => [k, fix.rating]);
        const next = RATINGS.find((x) => x > fix.rating);
        if (next !== undefined && next <= (dev.rating as number)) above.push(['B', next]);
        for (const [curve, rating] of above) {
          const other = circuit(analyseFile(withDevice(file, c.protectedBy as string, curve, rating)), c.link);
          expect(other.status, `${curve}${rating} also passes ${c.link}`).not.toBe('pass');
        }
      }
      if (fix.kind === 'rcd') {
        expect(fix.sensitivity).toBe(0.03);
        const after = circuit(analyseFile(changed(file, c.protectedBy as string, (l) => (l.rcd = { sensitivity: 0.03 }))), c.link);
        expect(after.status).toBe('rcd');
      }
    }
  }
}

describe('fixes that pass', () => {
  it('each fix applied to a copy makes the circuit pass; the next smaller change does not (random jobs)', () => {
    fc.assert(fc.property(jobV2({ allDevices: true }), checkFixes), { numRuns: 100 });
  });

  it('the same with breakers only (device fixes)', () => {
    fc.assert(fc.property(jobV2({ allDevices: true, mcbOnly: true }), checkFixes), { numRuns: 60 });
  });

  it('a worked case: a long 2.5 mm² C20 circuit lists length, size, device and rcd, in that order', () => {
    // au-nz, unknown source: Ia = 150 A, s · B = 0.8 · 230 / 150 = 1.226667 Ω
    // per metre, x = 0.08 mΩ/m: R' = 2 · 0.0225 / 2.5 = 0.018 Ω/m, X' = 0.00016 Ω/m, |z'| = 0.0180007 Ω/m
    // maxLength = 1.226667 / 0.0180007 = 68.145 m (as in job-format.md's example), so 80 m fails
    const file = { ...jobFile({
      nodes: [unknownSupply('S1'), point('P1', 'socket-outlets')],
      links: [link('C1', 'S1', 'P1', cable(80, 2.5, 2.5), { device: mcb('C', 20) })],
    }), version: 2 };
    const c = circuit(run(file), 'C1');
    expect(c.status).toBe('fail');
    expect(c.fixes.map((f) => f.kind)).toEqual(['length', 'size', 'device', 'rcd']);
    expectRel((c.fixes[0] as { maxLength: number }).maxLength, 68.145, 1e-4);
    // size: 4 / 2.5 first: R' = 0.0225 · (1/4 + 1/2.5) = 0.014625 Ω/m; · 80 = 1.17 Ω ≤ 1.2267 passes
    expect(c.fixes[1]).toEqual({ kind: 'size', active: 4, earth: 2.5 });
    // device: the highest rating first, then the highest curve: at 20 A, B20 (Ia = 4 · 20 = 80 A,
    // s · B = 0.8 · 230 / 80 = 2.3 Ω) passes at 80 · 0.0180007 = 1.44 Ω; C20 itself fails
    expect(c.fixes[2]).toEqual({ kind: 'device', curve: 'B', rating: 20 });
    expect(c.fixes[3]).toEqual({ kind: 'rcd', sensitivity: 0.03 });
  });
});

describe('fixes where the upstream test fails too', () => {
  // method-depth.md §8 lists the length fix "when 0 < maxLength < the link's length"; the lead's
  // reading (kept here) is that this condition is the whole rule, and "a failure that the upstream
  // test alone causes has no length fix" follows from it. So where the own and the upstream tests
  // both fail the length fix is still listed; applied, it mends the own test and leaves the
  // upstream one failing. Unknown source, au-nz, C20: B = 230 / 150 = 1.533333 Ω,
  // s · B = 1.226667 Ω, (1 − s) · B = 0.306667 Ω.
  // M1 (no device) 20 m of 2.5 / 2.5 mm²: upstream = 20 · 0.018 = 0.36 Ω (X 0.0032) > 0.306667: fails
  // C1 80 m: own = 1.44 Ω > 1.226667: fails; maxLength = 1.226667 / 0.0180007 = 68.145 m
  const file = {
    ...jobFile({
      nodes: [unknownSupply('S1'), { id: 'MSB', kind: 'board' }, point('P1', 'socket-outlets')],
      links: [link('M1', 'S1', 'MSB', cable(20, 2.5, 2.5)), link('C1', 'MSB', 'P1', cable(80, 2.5, 2.5), { device: mcb('C', 20) })],
    }),
    version: 2,
  };

  it('the device fix (B20: (1 − s) · B = 0.575 Ω ≥ 0.36, s · B = 2.3 Ω ≥ 1.44) passes, and no size fix is offered', () => {
    const c = circuit(run(file), 'C1');
    expect(c.status).toBe('fail');
    expect(c.fixes.find((f) => f.kind === 'size')).toBeUndefined(); // no cable of C1 mends M1's share
    expect(c.fixes.find((f) => f.kind === 'device')).toEqual({ kind: 'device', curve: 'B', rating: 20 });
    expect(circuit(analyseFile(withDevice(file, 'C1', 'B', 20)), 'C1').status).toBe('pass');
  });

  it('the literal rule: the length fix is listed; applied, the own test holds and the upstream test still fails', () => {
    const c = circuit(run(file), 'C1');
    expect(c.fixes.map((f) => f.kind)).toEqual(['length', 'device', 'rcd']);
    const fix = c.fixes[0] as { kind: 'length'; maxLength: number };
    expectRel(fix.maxLength, 68.145, 1e-4);
    const after = circuit(analyseFile(withCable(file, 'C1', { length: fix.maxLength })), 'C1');
    expect(after.own as number).toBeLessThanOrEqual((after.limit as number) * (1 + 1e-9)); // own ≤ s · B
    expectRel(after.upstream, 0.3600142, 1e-6); // unchanged: |0.36 + j0.0032|
    expect(after.status).toBe('fail');
  });
});

/** The unit phasor of a supply's source (method-depth.md §9). */
function phasor(source: Obj): [number, number] {
  if (source.type === 'impedance') {
    const m = Math.hypot(source.r as number, source.x as number);
    return m === 0 ? [1, 0] : [(source.r as number) / m, (source.x as number) / m];
  }
  if (source.type === 'fault-current') {
    const xr = (source.xr as number | undefined) ?? 1;
    return [1 / Math.sqrt(1 + xr * xr), xr / Math.sqrt(1 + xr * xr)];
  }
  return [1, 0];
}

function withSource(file: Obj, supply: string, ze: number, u: [number, number]): Obj {
  const copy = structuredClone(file);
  const node = (copy.nodes as Obj[]).find((n) => n.id === supply) as Obj;
  node.source = { type: 'impedance', r: ze * u[0], x: ze * u[1] };
  return copy;
}

describe('source headroom', () => {
  it('the job passes with the source at maxZe (along the same phasor) and fails 1 % above; minFaultCurrent = U0 / maxZe', () => {
    fc.assert(
      fc.property(jobV2({ allDevices: true }), (file) => {
        const r = analyseFile(file);
        const U0 = ((file.rules as Obj).voltage as number | undefined) ?? 230;
        for (const s of r.supplies) {
          const fed = r.circuits.filter((c) => c.protectedBy !== null && c.tripCurrent !== null && c.method !== null && supplyOf(file, c.link) === s.node);
          if (fed.length === 0) {
            expect(s.maxZe).toBeNull();
            expect(s.minFaultCurrent).toBeNull();
            continue;
          }
          expect(s.maxZe).not.toBeNull();
          const maxZe = s.maxZe as number;
          if (maxZe === 0) {
            expect(s.minFaultCurrent).toBeNull();
            continue;
          }
          expectRel(s.minFaultCurrent, U0 / maxZe, 1e-9);
          const node = (file.nodes as Obj[]).find((n) => n.id === s.node) as Obj;
          const u = phasor(node.source as Obj);
          const at = analyseFile(withSource(file, s.node, maxZe, u));
          for (const c of fed) expect(circuit(at, c.link).ratio as number).toBeLessThanOrEqual(1 + 1e-9);
          if (maxZe < 1e-6) continue; // 1 % of almost nothing is inside the 1e-9 edge rule
          const above = analyseFile(withSource(file, s.node, maxZe * 1.01, u));
          expect(fed.some((c) => (circuit(above, c.link).ratio as number) > 1)).toBe(true);
        }
      }),
      { numRuns: 200 },
    );
  });

  it('a worked case: one C20 circuit of 20 m on an unknown source', () => {
    // Σ = 20 · (0.018 + j0.00016) = 0.36 + j0.0032 Ω; B = 230 / 150 = 1.533333 Ω; u = 1 (unknown source)
    // h = 0.36; |Ze| = −0.36 + √(0.36² − |Σ|² + B²) = −0.36 + √(1.533333² − 0.0032²) = 1.173330 Ω
    // minFaultCurrent = 230 / 1.173330 = 196.02 A
    const file = { ...jobFile({
      nodes: [unknownSupply('S1'), point('P1', 'socket-outlets')],
      links: [link('C1', 'S1', 'P1', cable(20, 2.5, 2.5), { device: mcb('C', 20) })],
    }), version: 2 };
    const s = run(file).supplies[0];
    expectRel(s?.maxZe, 1.1733300, 1e-6);
    expectRel(s?.minFaultCurrent, 196.0233, 1e-5);
  });
});

function supplyOf(file: Obj, linkId: string): string | null {
  const links = file.links as Obj[];
  const nodes = new Map((file.nodes as Obj[]).map((n) => [n.id as string, n] as const));
  let here = links.find((l) => l.id === linkId);
  for (let i = 0; here && i < 100; i++) {
    const from = here.from as string;
    if (nodes.get(from)?.kind === 'supply') return from;
    here = links.find((l) => l.to === from);
  }
  return null;
}
