// fast-check generators of valid version-2 job files for the cross-check: a forest of one or two
// radial trees (supplies, boards, points), loads with phases and power factors, diversity,
// devices of all four kinds with breaking and let-through, maximum fault levels, measured
// readings, both bases and rule overrides. Invented data, for tests only.
//
// Phases are drawn freely and then repaired so the file keeps the phase rules of
// method-depth.md §1 (a three-phase link or point is never fed through a single-phase link).

import fc from 'fast-check';
import type { Job } from '../../../engine/index.js';
import { DETAILS } from '../helpers.js';
import type { Obj } from '../helpers.js';
import { linkPhases, supplyPhases } from './calc.js';

export const ALL_SIZES = [1, 1.5, 2.5, 4, 6, 10, 16, 25, 35, 50, 70, 95, 120, 150, 185, 240, 300];
const USES = ['socket-outlets', 'lighting', 'fixed-equipment', 'motor', 'other'] as const;

/** A decimal in [lo, hi] with `places` decimals (built from integers: no -0, no NaN). */
export const dec = (lo: number, hi: number, places = 3) =>
  fc.integer({ min: Math.round(lo * 10 ** places), max: Math.round(hi * 10 ** places) }).map((v) => v / 10 ** places);

/** `arb` with probability `p`, else undefined (the field left out). */
const opt = <T>(arb: fc.Arbitrary<T>, p = 0.5): fc.Arbitrary<T | undefined> =>
  fc.oneof({ weight: Math.round((1 - p) * 100), arbitrary: fc.constant(undefined) }, { weight: Math.round(p * 100), arbitrary: arb });

export function clean(o: Record<string, unknown>): Obj {
  return Object.fromEntries(Object.entries(o).filter(([, v]) => v !== undefined));
}

// current rising by a factor 1.5–4 a point, time falling tenfold from 100 s or 3 s (so a 5 s
// t_req may lie beyond the longest time)
const curvePoints = fc
  .tuple(fc.integer({ min: 20, max: 200 }), fc.integer({ min: 2, max: 5 }), fc.integer({ min: 15, max: 40 }), fc.constantFrom(100, 3))
  .map(([first, n, step, top]) => Array.from({ length: n }, (_, i): [number, number] => [first * (step / 10) ** i, top / 10 ** i]));

export const deviceV2 = fc
  .oneof(
    { weight: 4, arbitrary: fc.record({ type: fc.constant('mcb'), curve: fc.constantFrom('B', 'C', 'D'), rating: fc.constantFrom(6, 10, 16, 20, 25, 32, 40, 50, 63, 80, 100, 125) }) },
    {
      weight: 1,
      arbitrary: fc
        .record({ type: fc.constant('adjustable'), rating: fc.constantFrom(100, 160, 250), instantaneous: fc.integer({ min: 200, max: 2500 }), tolerance: opt(dec(0, 0.3, 2)) })
        .map(clean),
    },
    { weight: 1, arbitrary: fc.record({ type: fc.constant('curve'), rating: fc.constantFrom(16, 32, 63, 100), points: curvePoints }) },
    { weight: 1, arbitrary: fc.record({ type: fc.constant('fixed'), rating: fc.constantFrom(10, 20, 32), tripCurrent: fc.integer({ min: 30, max: 800 }) }) },
  )
  .chain((d) =>
    fc
      .record({ breaking: opt(fc.constantFrom(1.5, 3, 6, 10, 25)), letThrough: opt(fc.integer({ min: 1000, max: 2_000_000 }), 0.3), label: opt(fc.string({ maxLength: 6 }), 0.2) })
      .map((extra) => clean({ ...d, ...extra })),
  );

const sourceV2 = fc.oneof(
  fc.constant({ type: 'unknown' }),
  fc.constant({ type: 'impedance', r: 0, x: 0 }),
  fc.record({ type: fc.constant('impedance'), r: dec(0, 0.5), x: dec(0, 0.5) }),
  fc.record({ type: fc.constant('fault-current'), current: fc.integer({ min: 200, max: 20000 }), xr: opt(dec(0, 5, 2), 0.6) }).map(clean),
);

const rulesV2 = fc
  .record({
    basis: fc.constantFrom('au-nz', 'iec'),
    voltage: opt(fc.constantFrom(220, 230, 240), 0.2),
    voltageFactor: opt(dec(0.9, 1.1, 2), 0.2),
    unknownSourceShare: opt(dec(0.5, 0.9, 2), 0.2),
    reactance: opt(dec(0, 0.0002, 6), 0.2),
    resistivity: opt(fc.record({ Cu: opt(dec(0.017, 0.025, 4)), Al: opt(dec(0.028, 0.04, 4)) }).map(clean), 0.15),
    multiples: opt(fc.record({ B: opt(dec(3, 5, 1)), C: opt(dec(5, 10, 1)), D: opt(dec(10, 20, 1)) }).map(clean), 0.15),
    voltageDropLimit: opt(dec(2, 8, 1), 0.2),
    voltageDropResistivity: opt(fc.record({ Cu: opt(dec(0.017, 0.025, 4)), Al: opt(dec(0.028, 0.04, 4)) }).map(clean), 0.15),
    maxVoltageFactor: opt(dec(1, 1.1, 2), 0.2),
    shortCircuitResistivity: opt(fc.record({ Cu: opt(dec(0.017, 0.02, 4)), Al: opt(dec(0.027, 0.03, 4)) }).map(clean), 0.15),
    measuredRule: opt(fc.constantFrom('temperature', 'fixed-factor'), 0.4),
    measuredFactor: opt(dec(0.6, 1, 2), 0.3),
  })
  .map(clean);

export const cableV2 = fc
  .record({
    length: fc.oneof({ weight: 1, arbitrary: fc.constant(0) }, { weight: 12, arbitrary: dec(0.1, 150, 1) }),
    material: fc.constantFrom('Cu', 'Al'),
    active: fc.oneof({ weight: 15, arbitrary: fc.constantFrom(...ALL_SIZES) }, { weight: 1, arbitrary: fc.constantFrom(2, 3, 5) }),
    earth: fc.oneof({ weight: 15, arbitrary: fc.constantFrom(...ALL_SIZES) }, { weight: 1, arbitrary: fc.constantFrom(2, 3, 5) }),
    earthMaterial: opt(fc.constantFrom('Cu', 'Al'), 0.25),
    parallel: opt(fc.integer({ min: 1, max: 3 }), 0.25),
    reactance: opt(dec(0, 0.0002, 6), 0.2),
    insulation: opt(fc.constantFrom('pvc', 'xlpe')),
    earthInCable: opt(fc.boolean(), 0.4),
    capacity: opt(fc.integer({ min: 5, max: 400 }), 0.3),
    derating: opt(dec(0.5, 1, 2), 0.4),
  })
  .map(clean);

interface Shape {
  supplies: number;
  kinds: Array<'board' | 'point'>;
  /** Parent index: −1 − k is supply k; j ≥ 0 is node j. */
  parents: number[];
}

const shape: fc.Arbitrary<Shape> = fc
  .record({
    supplies: fc.integer({ min: 1, max: 2 }),
    raw: fc.array(fc.tuple(fc.constantFrom<'board' | 'point'>('board', 'point', 'point'), fc.nat()), { minLength: 1, maxLength: 9 }),
  })
  .map(({ supplies, raw }) => {
    const kinds: Array<'board' | 'point'> = [];
    const parents: number[] = [];
    raw.forEach(([kind, pick], i) => {
      const cands = [
        ...Array.from({ length: supplies }, (_, k) => -1 - k),
        ...kinds.map((_, j) => j).filter((j) => kind === 'point' || kinds[j] === 'board'),
      ];
      // the first node of each supply hangs from it, so no supply stands alone
      const p = i < supplies ? -1 - i : (cands[pick % cands.length] as number);
      kinds.push(kind);
      parents.push(p);
    });
    return { supplies, kinds, parents };
  });

/** Make the file keep the phase rules (method-depth.md §1) by lowering offending 3s to 1. */
export function repairPhases(file: Obj): Obj {
  const job = file as unknown as Job;
  for (let round = 0; round < 20; round++) {
    let changed = false;
    const feeder = new Map(job.links.map((l) => [l.to, l] as const));
    const nodes = new Map(job.nodes.map((n) => [n.id, n] as const));
    for (const l of job.links) {
      if (linkPhases(job, l) !== 3) continue;
      const up = feeder.get(l.from);
      const top = nodes.get(l.from);
      const bad = up ? linkPhases(job, up) === 1 : top?.kind === 'supply' && supplyPhases(job, top) === 1;
      if (bad) {
        l.phases = 1;
        changed = true;
      }
    }
    for (const n of job.nodes) {
      if (n.kind !== 'point' || n.phases !== 3) continue;
      const up = feeder.get(n.id);
      if (up && linkPhases(job, up) === 1) {
        n.phases = 1;
        changed = true;
      }
    }
    if (!changed) break;
  }
  return file;
}

/** A board and a point that no supply reaches (a warning, not an error): unchecked, method null. */
const orphanArb = fc
  .record({
    cable: cableV2,
    device: opt(deviceV2, 0.6),
    current: opt(dec(1, 30, 1), 0.6),
    phases: opt(fc.constantFrom(1, 3), 0.4),
    measured: opt(fc.record({ zs: dec(0.02, 3, 3) }), 0.5),
  })
  .map(({ cable, device, current, phases, measured }) => ({
    nodes: [
      { id: 'O0', kind: 'board' },
      clean({ id: 'O1', kind: 'point', use: 'other', current, phases }),
    ],
    links: [clean({ id: 'LO', from: 'O0', to: 'O1', cable, device, phases, measured })],
  }));

export interface V2Options {
  /** Every link leaving a supply or board carries a device. */
  allDevices?: boolean;
  source?: fc.Arbitrary<Obj>;
  /** Devices are breakers only (for the device-fix properties). */
  mcbOnly?: boolean;
}

export function jobV2(opts: V2Options = {}): fc.Arbitrary<Obj> {
  const device = opts.mcbOnly ? deviceV2.filter((d) => d.type === 'mcb') : deviceV2;
  return shape.chain((sh) => {
    const supplyArbs = Array.from({ length: sh.supplies }, (_, k) =>
      fc
        .record({
          source: opts.source ?? sourceV2,
          phases: opt(fc.constantFrom(1, 3)),
          maxFault: opt(fc.record({ current: fc.integer({ min: 500, max: 30000 }), xr: opt(dec(0, 4, 2)) }).map(clean)),
          measured: opt(fc.record({ ze: dec(0.05, 0.8, 3), instrument: opt(fc.constant('tester')) }).map(clean), 0.4),
        })
        .map((o) => clean({ id: `S${k}`, kind: 'supply', ...o })),
    );
    const nodeArbs = sh.kinds.map((kind, i) =>
      kind === 'board'
        ? fc.record({ diversity: opt(dec(0.3, 1, 2)) }).map((o) => clean({ id: `N${i}`, kind: 'board', ...o }))
        : fc
            .record({
              use: fc.constantFrom(...USES),
              handHeld: opt(fc.boolean(), 0.3),
              current: opt(dec(0, 60, 1), 0.75),
              phases: opt(fc.constantFrom(1, 3)),
              powerFactor: opt(dec(0.5, 1, 2)),
            })
            .map((o) => clean({ id: `N${i}`, kind: 'point', ...o })),
    );
    const linkArbs = sh.parents.map((p, i) => {
      const fromPoint = p >= 0 && sh.kinds[p] === 'point';
      const dev = !fromPoint && opts.allDevices ? device : fromPoint ? opt(device, 0.2) : opt(device, 0.75);
      return fc
        .record({
          cable: cableV2,
          device: dev,
          rcd: opt(fc.record({ sensitivity: fc.constantFrom(0.01, 0.03, 0.1, 0.3) }), 0.3),
          requiredTime: opt(fc.constantFrom(0.2, 0.4, 1, 5), 0.15),
          phases: opt(fc.constantFrom(1, 3), 0.25),
          designCurrent: opt(dec(0.5, 200, 1), 0.15),
          powerFactor: opt(dec(0.5, 1, 2), 0.15),
          voltageDropLimit: opt(dec(1, 8, 1), 0.15),
          measured: opt(fc.record({ zs: dec(0.02, 3, 3), temperature: opt(fc.integer({ min: -30, max: 60 }), 0.6) }).map(clean), 0.4),
        })
        .map((o) => clean({ id: `L${i}`, from: p < 0 ? `S${-1 - p}` : `N${p}`, to: `N${i}`, ...o }));
    });
    return fc
      .record({ rules: rulesV2, supplies: fc.tuple(...supplyArbs), nodes: fc.tuple(...nodeArbs), links: fc.tuple(...linkArbs), orphan: opt(orphanArb, 0.25) })
      .map(({ rules, supplies, nodes, links, orphan }) =>
        repairPhases(
          structuredClone({
            format: 'loopwright.job',
            version: 2,
            job: { ...DETAILS },
            rules,
            nodes: [...supplies, ...nodes, ...(orphan?.nodes ?? [])],
            links: [...links, ...(orphan?.links ?? [])],
          }),
        ),
      );
  });
}
