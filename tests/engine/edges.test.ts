// Numbers at the edges (method-depth.md "Numbers at the edges"; issue 12 item 7): comparisons
// within a relative 1e-9 of the limit, a loop of 0 Ω as the contract says, and no NaN or
// ±Infinity in any output. The property test draws valid jobs whose numbers sit at the ends of
// what the loader accepts (engine/model/schema.ts): 0, the smallest double above 0, 1e-300,
// 1e300, the largest double, lengths of 1e6 m and so on, mixed with ordinary values (invented
// data). Every job is loaded through the engine's loader first, so only accepted values reach
// the analysis. The seed is fixed (FC_SEED=n repeats another draw).

import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { analyse, createAnalysis, formatProblem, layoutReport, loadJob, reanalyse, scheduleCsv, sheetToSvg } from '../../engine/index.js';
import type { CircuitResult, Job } from '../../engine/index.js';
import { renderCheck } from '../../app/cli/table.js';
import { cable, circuit, DETAILS, expectRel, impedanceSupply, jobFile, link, load, mcb, point, run, type Obj } from './helpers.js';

const SEED = process.env.FC_SEED ? Number(process.env.FC_SEED) : 12_012_026;

const TINY = Number.MIN_VALUE; // 5e-324, the smallest double above 0
const HUGE = Number.MAX_VALUE; // 1.7976931348623157e308

const optional = <T>(arb: fc.Arbitrary<T>) => fc.option(arb, { nil: undefined, freq: 2 });
/** One of the edge values, or (about half the time) an ordinary one. */
const edge = (edges: number[], ordinary: fc.Arbitrary<number>) => fc.oneof(fc.constantFrom(...edges), ordinary);

// Ranges as the loader states them (engine/model/schema.ts).
const positive = edge([TINY, 1e-300, 1e-9, 1e9, 1e300, HUGE], fc.constantFrom(0.5, 1, 16, 230, 6000)); // > 0
const nonNegative = fc.oneof(fc.constant(0), positive); // ≥ 0
const unit = edge([TINY, 1e-300, 1e-9, 1], fc.constantFrom(0.3, 0.8, 0.95)); // > 0 and ≤ 1
const area = edge([TINY, 1e-300, 1e-6, 1e6, 1e300, HUGE], fc.constantFrom(1, 1.5, 2.5, 16, 240, 630)); // mm², > 0
const length = edge([0, TINY, 1e-9, 1e6, 1e300, HUGE], fc.constantFrom(0, 0.5, 10, 45, 150)); // m, ≥ 0
const reactance = edge([0, TINY, 1e-300, 0.01], fc.constantFrom(0.00008, 0.0001)); // Ω/m, 0..0.01
const upTo = (max: number) => edge([TINY, 1e-300, max], fc.constantFrom(max / 2, max / 10)); // > 0 and ≤ max
const position = edge([-HUGE, -1e300, 0, 1e300, HUGE], fc.integer({ min: -900, max: 900 }));

/** A time–current curve: current rising, time falling, every number > 0 and finite. */
const curvePoints = fc.oneof(
  fc.constant<[number, number][]>([[TINY, HUGE], [HUGE, TINY]]),
  fc.constant<[number, number][]>([[1e-300, 3600], [1, 1e-300]]),
  fc.constant<[number, number][]>([[32, 10], [160, 0.1], [1e300, 1e-9]]),
  fc.constant<[number, number][]>([[100, 5], [1000, 0.4]]),
);

const deviceArb: fc.Arbitrary<Obj> = fc
  .tuple(
    fc.oneof(
      fc.record({ type: fc.constant('mcb'), curve: fc.constantFrom('B', 'C', 'D') }),
      fc.record({ type: fc.constant('adjustable'), instantaneous: positive, tolerance: optional(edge([0, 0.2, 1 - 2 ** -53], fc.constant(0.1))) }),
      fc.record({ type: fc.constant('curve'), points: curvePoints }),
      fc.record({ type: fc.constant('fixed'), tripCurrent: positive }),
    ),
    fc.record({ rating: positive, breaking: optional(positive), letThrough: optional(positive) }),
  )
  .map(([kind, common]) => clean({ ...kind, ...common }));

const sourceArb: fc.Arbitrary<Obj> = fc.oneof(
  fc.constant({ type: 'unknown' }),
  fc.record({ type: fc.constant('impedance'), r: nonNegative, x: nonNegative }),
  fc.record({ type: fc.constant('fault-current'), current: positive, xr: optional(nonNegative) }).map(clean),
);

const material = fc.constantFrom('Cu', 'Al');
const perMaterial = (value: fc.Arbitrary<number>) => fc.record({ Cu: optional(value), Al: optional(value) }).map(clean);

const rulesArb: fc.Arbitrary<Obj> = fc
  .record({
    basis: fc.constantFrom('au-nz', 'iec'),
    voltage: optional(upTo(1000)),
    voltageFactor: optional(upTo(2)),
    unknownSourceShare: optional(edge([TINY, 1e-300, 1 - 2 ** -53], fc.constantFrom(0.5, 0.8))),
    reactance: optional(reactance),
    resistivity: optional(perMaterial(unit)),
    voltageDropResistivity: optional(perMaterial(unit)),
    shortCircuitResistivity: optional(perMaterial(unit)),
    voltageDropLimit: optional(upTo(100)),
    maxVoltageFactor: optional(upTo(2)),
    measuredRule: optional(fc.constantFrom('temperature', 'fixed-factor')),
    measuredFactor: optional(unit),
    multiples: optional(fc.record({ B: optional(upTo(100)), C: optional(upTo(100)), D: optional(upTo(100)) }).map(clean)),
  })
  .map(clean);

const cableArb: fc.Arbitrary<Obj> = fc
  .record({
    length,
    material,
    active: area,
    earth: area,
    earthMaterial: optional(material),
    parallel: optional(edge([1, 2 ** 53, 1e300, HUGE], fc.constantFrom(1, 2, 4))), // whole numbers ≥ 1 (1e300 and the largest double are whole)
    reactance: optional(reactance),
    insulation: optional(fc.constantFrom('pvc', 'xlpe')),
    earthInCable: optional(fc.boolean()),
    capacity: optional(positive),
    derating: optional(unit),
  })
  .map(clean);

function clean(o: Record<string, unknown>): Obj {
  return Object.fromEntries(Object.entries(o).filter(([, v]) => v !== undefined));
}

const USES = ['socket-outlets', 'lighting', 'fixed-equipment', 'motor', 'other'] as const;

/** A radial tree: supply N0, nodes N1..Nn, link Li feeding Ni from an earlier node (boards only
 *  from the supply or a board), every number drawn at the edges. */
const jobArb: fc.Arbitrary<Obj> = fc
  .array(fc.tuple(fc.constantFrom<'board' | 'point'>('board', 'point'), fc.nat()), { minLength: 1, maxLength: 6 })
  .chain((raw) => {
    const kinds: Array<'board' | 'point'> = [];
    const parents: number[] = [];
    for (const [kind, pick] of raw) {
      const candidates = [0, ...kinds.map((_, j) => j + 1).filter((j) => kind === 'point' || kinds[j - 1] === 'board')];
      kinds.push(kind);
      parents.push(candidates[pick % candidates.length]!);
    }
    const at = optional(fc.record({ x: position, y: position }));
    const nodes = kinds.map((kind, i) =>
      kind === 'board'
        ? fc.record({ diversity: optional(unit), at }).map((o) => clean({ id: `N${i + 1}`, kind: 'board', ...o }))
        : fc
            .record({
              use: fc.constantFrom(...USES),
              handHeld: optional(fc.boolean()),
              current: optional(nonNegative),
              phases: optional(fc.constantFrom(1, 3)),
              powerFactor: optional(unit),
              at,
            })
            .map((o) => clean({ id: `N${i + 1}`, kind: 'point', ...o })),
    );
    const links = parents.map((parent, i) =>
      fc
        .record({
          cable: cableArb,
          device: optional(deviceArb),
          rcd: optional(fc.record({ sensitivity: upTo(10) })),
          requiredTime: optional(edge([TINY, 1e-300, 1e-9, 3600], fc.constantFrom(0.4, 5))),
          designCurrent: optional(positive),
          powerFactor: optional(unit),
          voltageDropLimit: optional(upTo(100)),
          measured: optional(fc.record({ zs: positive, temperature: optional(fc.constantFrom(-30, 20, 60)) }).map(clean)),
        })
        .map((o) => clean({ id: `L${i + 1}`, from: `N${parent}`, to: `N${i + 1}`, ...o })),
    );
    const supply = fc
      .record({
        source: sourceArb,
        phases: optional(fc.constantFrom(1, 3)),
        maxFault: optional(fc.record({ current: positive, xr: optional(nonNegative) }).map(clean)),
        measured: optional(fc.record({ ze: positive })),
        at,
      })
      .map((o) => clean({ id: 'N0', kind: 'supply', ...o }));
    return fc.record({ rules: rulesArb, supply, nodes: fc.tuple(...nodes), links: fc.tuple(...links) }).map(({ rules, supply, nodes, links }) => {
      // a point with 3 phases needs a three-phase supply (stated or derived): engine/model/phase-rules.ts
      if (supply.phases === 1 && nodes.some((n) => n.phases === 3)) delete supply.phases;
      return { format: 'loopwright.job', version: 2, job: { ...DETAILS }, rules, nodes: [supply, ...nodes], links };
    });
  });

/** Every number anywhere in `value` that is NaN or ±Infinity, by its path (walked with a stack). */
function nonFinite(value: unknown): string[] {
  const bad: string[] = [];
  const stack: Array<{ v: unknown; path: string }> = [{ v: value, path: '' }];
  while (stack.length > 0) {
    const { v, path } = stack.pop()!;
    if (typeof v === 'number') {
      if (!Number.isFinite(v)) bad.push(`${path} = ${v}`);
    } else if (Array.isArray(v)) v.forEach((x, i) => stack.push({ v: x, path: `${path}[${i}]` }));
    else if (typeof v === 'object' && v !== null) for (const [k, x] of Object.entries(v)) stack.push({ v: x, path: `${path}.${k}` });
  }
  return bad;
}

/** NaN or Infinity written out in a text output. */
const NON_FINITE_TEXT = /NaN|Infinity/;

/** Words that explain a null, by field: the note the engine gives for that case. */
const OUT_OF_RANGE = /out of range/;
const EXPLAINS: Record<string, RegExp> = {
  faultCurrent: /no impedance in the loop|out of range/, // method-depth.md "Numbers at the edges"
  faultLevel: /no impedance in the fault path|out of range/, // FORMAT.md "Fault level with a zero impedance"
  tripCurrent: /trip current is unknown|out of range/,
  limit: /trip current is unknown|out of range/,
  ratio: /trip current is unknown|out of range/,
  maxLength: /trip current is unknown|out of range/,
  testLimit: /trip current is unknown|out of range/,
  'measured.ratio': /trip current is unknown|out of range/,
};

/**
 * Whether a null in this field needs a note. The format gives these nulls without one
 * (FORMAT.md, "Results document"): an unprotected link, no supply, an unknown source, no Ib, a
 * link not arriving at a point, no stated or table capacity, an unchecked withstand or breaking
 * check. Any other null must come with a note saying why.
 */
function nullNeedsNote(c: CircuitResult, field: string, job: Job): boolean {
  const link = job.links.find((l) => l.id === c.link)!;
  const reached = c.method !== null;
  const checked = reached && c.protectedBy !== null;
  const known = c.method === 'known-source';
  switch (field) {
    case 'tripCurrent':
    case 'requiredTime':
    case 'own':
    case 'upstream':
      return checked;
    case 'limit':
    case 'ratio':
    case 'maxLength':
    case 'testLimit':
    case 'measured.ratio':
      return checked && (c.tripCurrent !== null || OUT_OF_RANGE.test(c.notes.join('\n')));
    case 'zs':
    case 'faultCurrent':
      return known;
    case 'clearingTime':
      // below Ia a breaker has no clearing time, and the loop fails with its own note
      return known && checked && c.tripCurrent !== null && c.status === 'pass';
    case 'designCurrent':
      return link.designCurrent !== undefined;
    case 'powerFactor':
    case 'voltageDrop':
      return c.designCurrent !== null;
    case 'voltageDropTotal':
      return c.designCurrent !== null && reached;
    case 'voltageDropLimit':
      return job.nodes.find((n) => n.id === c.to)?.kind === 'point';
    case 'capacity':
      return link.cable.capacity !== undefined;
    case 'faultLevel':
      return reached && c.breakingStatus !== 'unchecked';
    case 'earthMinArea':
      return c.withstandStatus !== 'unchecked';
    default:
      return true;
  }
}

const NUMERIC_FIELDS = [
  'tripCurrent', 'requiredTime', 'zs', 'own', 'upstream', 'limit', 'faultCurrent', 'clearingTime', 'ratio', 'maxLength',
  'designCurrent', 'powerFactor', 'voltageDrop', 'voltageDropTotal', 'voltageDropLimit', 'capacity', 'faultLevel',
  'earthMinArea', 'testLimit',
] as const;

/** The nulls in a circuit that need a note and have none that explains them. */
function unexplainedNulls(c: CircuitResult, job: Job): string[] {
  const notes = c.notes.join('\n');
  const explained = (field: string) => (EXPLAINS[field] ?? OUT_OF_RANGE).test(notes);
  const out: string[] = [];
  for (const f of NUMERIC_FIELDS) if (c[f] === null && nullNeedsNote(c, f, job) && !explained(f)) out.push(f);
  if (c.measured !== null && c.measured.ratio === null && nullNeedsNote(c, 'measured.ratio', job) && !explained('measured.ratio')) out.push('measured.ratio');
  // a reading that could not be corrected is left out with a note (the format has no empty corrected value)
  const link = job.links.find((l) => l.id === c.link)!;
  if (link.measured !== undefined && c.measured === null && !/^measured: .*cannot be corrected/m.test(notes)) out.push('measured');
  return out;
}

function loaded(file: Obj): Job {
  const result = loadJob(file);
  if (!result.ok) throw new Error(`the generator made a job the loader refuses:\n${result.problems.map(formatProblem).join('\n')}\n${JSON.stringify(file)}`);
  return result.job;
}

describe('numbers at the edges: no NaN or Infinity in any output', () => {
  it('valid jobs with extreme values give finite numbers, explained nulls and clean texts (300 jobs)', () => {
    fc.assert(
      fc.property(jobArb, (file) => {
        const job = loaded(file);
        const results = analyse(job);
        expect(nonFinite(results), 'NaN or Infinity in the results').toEqual([]);
        for (const c of results.circuits) expect(unexplainedNulls(c, job), `${c.link}: nulls without a note saying why`).toEqual([]);
        expect(JSON.stringify(results)).not.toMatch(NON_FINITE_TEXT); // the notes included
        expect(scheduleCsv(job, results)).not.toMatch(NON_FINITE_TEXT);
        for (const sheet of layoutReport(job, results)) expect(sheetToSvg(sheet)).not.toMatch(NON_FINITE_TEXT);
        expect(renderCheck(job, results, 'loop')).not.toMatch(NON_FINITE_TEXT);
        expect(renderCheck(job, results, 'checks')).not.toMatch(NON_FINITE_TEXT);
      }),
      { seed: SEED, numRuns: 300 },
    );
  });

  it('a re-analysis after a length change at the edges is as clean as a fresh one', () => {
    fc.assert(
      fc.property(jobArb, length, (file, newLength) => {
        const job = loaded(file);
        const first = createAnalysis(job);
        const links = job.links.slice();
        links[0] = { ...links[0]!, cable: { ...links[0]!.cable, length: newLength } };
        const after = reanalyse(first, { ...job, links }).results;
        expect(nonFinite(after)).toEqual([]);
        expect(after).toEqual(analyse({ ...job, links }));
      }),
      { seed: SEED, numRuns: 100 },
    );
  });
});

// Rules stated in full, so the hand arithmetic below does not depend on a basis's defaults.
const RULES = {
  basis: 'au-nz',
  voltage: 230,
  voltageFactor: 1,
  unknownSourceShare: 0.8,
  reactance: 0,
  resistivity: { Cu: 0.0225 },
  voltageDropResistivity: { Cu: 0.0225 },
  multiples: { B: 5, C: 10, D: 20 },
  maxVoltageFactor: 1.1,
  measuredRule: 'fixed-factor',
  measuredFactor: 1,
};
// B = c · U0 / Ia = 1 · 230 / (5 · 10 A) = 4.6 Ω for a B10 breaker
const B10 = 4.6;

describe('a loop of 0 Ω (method-depth.md "Numbers at the edges")', () => {
  // a 0 Ω source and a link of length 0: nothing in the loop
  const zeroLoop = (device: Obj, extra: Obj = {}) =>
    run(
      jobFile({
        rules: RULES,
        nodes: [impedanceSupply('S1', 0, 0), point('P1', 'other', { current: 10 })],
        links: [link('C1', 'S1', 'P1', cable(0, 2.5, 2.5, { capacity: 24 }), { device, ...extra })],
      }),
    );

  it('has no fault current, with the note, and is checked as if above every trip current', () => {
    const r = zeroLoop(mcb('B', 10, { breaking: 6 }));
    const c = circuit(r, 'C1');
    expect(c.zs).toBe(0);
    expect(c.faultCurrent).toBeNull();
    expect(c.notes.some((n) => n.includes('no impedance in the loop'))).toBe(true);
    expect(c.clearingTime).toBe(0.1); // a breaker at or above Ia: 0.1 s (FORMAT.md, clearingTime)
    expect(c.ratio).toBe(0);
    expect(c.status).toBe('pass');
    expectRel(c.limit, B10, 1e-12);
    // the length at which |0 + L · 0.018 Ω/m| = 4.6 Ω: 4.6 / (0.0225/2.5 + 0.0225/2.5) = 255.556 m
    expectRel(c.maxLength, 4.6 / 0.018, 1e-9);
    // Withstand unchecked without a let-through; the fault level would be infinite: null with the note
    expect(c.withstandStatus).toBe('unchecked');
    expect(c.earthMinArea).toBeNull();
    expect(c.faultLevel).toBeNull();
    expect(c.notes.some((n) => n.includes('no impedance in the fault path'))).toBe(true);
    expect(c.breakingStatus).toBe('unchecked');
    expect(r.supplies[0]!.faultLevel).toBeNull();
    expect(r.worst?.ratio).toBe(0);
    expect(nonFinite(r)).toEqual([]);
  });

  it('a device whose trip current is enormous still passes; a curve device takes its time at its highest current', () => {
    const fixed = circuit(zeroLoop({ type: 'fixed', rating: 10, tripCurrent: 1e12 }), 'C1');
    expect(fixed.status).toBe('pass');
    expect(fixed.clearingTime).toBe(0.1);
    const curve = circuit(zeroLoop({ type: 'curve', rating: 10, points: [[20, 10], [100, 0.2], [400, 0.02]] }), 'C1');
    expect(curve.status).toBe('pass');
    expect(curve.clearingTime).toBe(0.02); // the last point's time
    expect(curve.faultCurrent).toBeNull();
  });

  it('with a stated let-through the withstand is checked from it alone', () => {
    // S = √(I²t) / k = √40000 / 115 = 1.7391 mm² (k 115 for a copper core of a PVC cable: IEC 60364-5-54 Table A.54.3, from memory, as engine/analysis/k-table.ts)
    const c = circuit(zeroLoop(mcb('B', 10, { letThrough: 40000 })), 'C1');
    expectRel(c.earthMinArea, 200 / 115, 1e-9);
    expect(c.withstandStatus).toBe('pass'); // 2.5 mm² ≥ 1.739 mm²
  });

  it('the printed and tabled outputs of a 0 Ω loop show no NaN or Infinity', () => {
    const file = jobFile({
      rules: RULES,
      nodes: [impedanceSupply('S1', 0, 0), point('P1', 'other', { current: 10 })],
      links: [link('C1', 'S1', 'P1', cable(0, 2.5, 2.5), { device: mcb('B', 10), measured: { zs: 0.001 } })],
    });
    const job = load(file);
    const r = analyse(job);
    expect(scheduleCsv(job, r)).not.toMatch(NON_FINITE_TEXT);
    expect(renderCheck(job, r, 'loop')).not.toMatch(NON_FINITE_TEXT);
    expect(renderCheck(job, r, 'checks')).not.toMatch(NON_FINITE_TEXT);
    for (const sheet of layoutReport(job, r)) expect(sheetToSvg(sheet)).not.toMatch(NON_FINITE_TEXT);
  });
});

describe('comparisons within a relative 1e-9 of the limit (method-depth.md "Numbers at the edges")', () => {
  // k: the value against its limit. Exactly at it and within 1e-9 relative passes; 1e-6 beyond fails.
  const AT = 1;
  const WITHIN = 1 + 5e-10;
  const BEYOND = 1 + 1e-6;

  /** Known source, link of length 0: Zs = Ze = k · B. */
  const knownLoop = (k: number) =>
    circuit(run(jobFile({ rules: RULES, nodes: [impedanceSupply('S1', B10 * k, 0), point('P1', 'other')], links: [link('C1', 'S1', 'P1', cable(0, 2.5, 2.5), { device: mcb('B', 10) })] })), 'C1');

  it('the loop, known source: Zs at, just within and just beyond c·U0/Ia', () => {
    expect(knownLoop(AT).status).toBe('pass');
    expect(knownLoop(WITHIN).status).toBe('pass');
    expect(knownLoop(WITHIN).ratio).toBeGreaterThan(1);
    expect(knownLoop(BEYOND).status).toBe('fail');
    // the contract's own example: a ratio of 1.0000000000000002 passes
    const next = knownLoop(1 + Number.EPSILON);
    expect(next.ratio).toBeGreaterThan(1);
    expect(next.status).toBe('pass');
  });

  it('a curve device: a fault current just under its lowest current still clears, at that point\'s time', () => {
    // t_req 5 s reaches the first point, so Ia = 100 A; B = 230 / 100 = 2.3 Ω; If = 230 / Zs = 100 / k A
    const curve = (k: number) =>
      circuit(
        run(jobFile({ rules: RULES, nodes: [impedanceSupply('S1', 2.3 * k, 0), point('P1', 'other')], links: [link('C1', 'S1', 'P1', cable(0, 2.5, 2.5), { requiredTime: 5, device: { type: 'curve', rating: 32, points: [[100, 5], [1000, 0.1]] } })] })),
        'C1',
      );
    expect(curve(AT).clearingTime).toBe(5);
    expect(curve(WITHIN).status).toBe('pass');
    expect(curve(WITHIN).clearingTime).toBe(5);
    expect(curve(BEYOND).status).toBe('fail');
    expect(curve(BEYOND).clearingTime).toBeNull();
  });

  it("the loop, unknown source: the circuit's own loop at s · B", () => {
    // own = L · (0.0225/2.5 + 0.0225/2.5) = 0.018 Ω/m · L; s · B = 0.8 · 4.6 = 3.68 Ω; L = 3.68 / 0.018 · k
    const own = (k: number) =>
      circuit(
        run(jobFile({ rules: RULES, nodes: [{ id: 'S1', kind: 'supply', source: { type: 'unknown' } }, point('P1', 'other')], links: [link('C1', 'S1', 'P1', cable((3.68 / 0.018) * k, 2.5, 2.5), { device: mcb('B', 10) })] })),
        'C1',
      );
    expect(own(AT).status).toBe('pass');
    expect(own(WITHIN).status).toBe('pass');
    expect(own(BEYOND).status).toBe('fail');
  });

  it('the voltage drop at its limit', () => {
    // 1 phase, cos φ 1: vd = 100 · 2 · 10 A · L · 0.0225/2.5 / 230 = (18/230) % per m; limit 5 % at L = 5 · 230 / 18 · k
    const drop = (k: number) =>
      circuit(
        run(jobFile({ rules: RULES, nodes: [impedanceSupply('S1', 0.1, 0), point('P1', 'other', { current: 10, powerFactor: 1 })], links: [link('C1', 'S1', 'P1', cable(((5 * 230) / 18) * k, 2.5, 2.5), { voltageDropLimit: 5 })] })),
        'C1',
      );
    expect(drop(AT).voltageStatus).toBe('pass');
    expect(drop(WITHIN).voltageStatus).toBe('pass');
    expect(drop(BEYOND).voltageStatus).toBe('fail');
  });

  it('the capacity: Ib at In', () => {
    const ib = (k: number) =>
      circuit(run(jobFile({ rules: RULES, nodes: [impedanceSupply('S1', 0.1, 0), point('P1', 'other')], links: [link('C1', 'S1', 'P1', cable(1, 2.5, 2.5, { capacity: 24 }), { device: mcb('B', 10), designCurrent: 10 * k })] })), 'C1');
    expect(ib(AT).capacityStatus).toBe('pass');
    expect(ib(WITHIN).capacityStatus).toBe('pass');
    expect(ib(BEYOND).capacityStatus).toBe('fail');
  });

  it('the breaking capacity at the fault level', () => {
    // the consumer mains' fault level is the supply's stated maximum, 6000 · k A, against a 6 kA device
    const breaking = (k: number) =>
      circuit(
        run(jobFile({ rules: RULES, nodes: [{ ...impedanceSupply('S1', 0.1, 0), maxFault: { current: 6000 * k } }, point('P1', 'other')], links: [link('C1', 'S1', 'P1', cable(1, 2.5, 2.5), { device: mcb('B', 10, { breaking: 6 }) })] })),
        'C1',
      );
    expect(breaking(AT).breakingStatus).toBe('pass');
    expect(breaking(WITHIN).breakingStatus).toBe('pass');
    expect(breaking(BEYOND).breakingStatus).toBe('fail');
  });

  it('a measured reading at the budget', () => {
    // fixed factor 1: corrected = the reading; ratio = reading / B
    const reading = (k: number) =>
      circuit(run(jobFile({ rules: RULES, nodes: [impedanceSupply('S1', 0.1, 0), point('P1', 'other')], links: [link('C1', 'S1', 'P1', cable(1, 2.5, 2.5), { device: mcb('B', 10), measured: { zs: B10 * k } })] })), 'C1');
    expect(reading(AT).measured?.status).toBe('pass');
    expect(reading(WITHIN).measured?.status).toBe('pass');
    expect(reading(BEYOND).measured?.status).toBe('fail');
  });
});

describe('results past the range of numbers: null with a note', () => {
  it('a cable of the smallest area above 0 gives an out-of-range Zs, left empty with a note, and fails', () => {
    // ρ / 5e-324 mm² overflows: the loop impedance per metre is Infinity
    const r = run(jobFile({ rules: RULES, nodes: [impedanceSupply('S1', 0.1, 0), point('P1', 'other')], links: [link('C1', 'S1', 'P1', cable(10, TINY, 2.5), { device: mcb('B', 10) })] }));
    const c = circuit(r, 'C1');
    expect(c.zs).toBeNull();
    expect(c.ratio).toBeNull();
    expect(c.notes.some((n) => /^Zs is out of range/.test(n))).toBe(true);
    expect(c.status).toBe('fail');
    expect(c.notes.join('\n')).not.toMatch(NON_FINITE_TEXT);
    expect(nonFinite(r)).toEqual([]);
  });

  it('a reading that cannot be corrected is left out with a note and still counts as failing', () => {
    // fixed factor 5e-324: F = 1 / 5e-324 overflows
    const r = run(
      jobFile({
        rules: { ...RULES, measuredFactor: TINY },
        nodes: [impedanceSupply('S1', 0.1, 0), point('P1', 'other')],
        links: [link('C1', 'S1', 'P1', cable(1, 2.5, 2.5), { device: mcb('B', 10), measured: { zs: 0.5 } })],
      }),
    );
    const c = circuit(r, 'C1');
    expect(c.measured).toBeNull();
    expect(c.notes.some((n) => n.startsWith('measured: the reading 0.5 Ω cannot be corrected'))).toBe(true);
    expect(c.verdict).toBe('fail');
    expect(nonFinite(r)).toEqual([]);
  });
});
