// fast-check generators of valid job files: a radial tree from one supply, every optional field
// of the format drawn at random. Numbers are built from integers so that no -0 or NaN appears.

import fc from 'fast-check';
import type { Obj } from './helpers.js';
import { DETAILS } from './helpers.js';

const SIZES = [1, 1.5, 2.5, 4, 6, 10, 16, 25, 35, 50, 70, 95, 120];
const USES = ['socket-outlets', 'lighting', 'fixed-equipment', 'motor', 'other'] as const;

/** A decimal in [lo, hi] with `places` decimals. */
const dec = (lo: number, hi: number, places = 3) =>
  fc.integer({ min: Math.round(lo * 10 ** places), max: Math.round(hi * 10 ** places) }).map((v) => v / 10 ** places);

const optional = <T>(arb: fc.Arbitrary<T>) => fc.option(arb, { nil: undefined });
const text = fc.string({ maxLength: 12 });

/** Drop keys whose value is undefined, so the object is what a JSON file would hold. */
function clean(o: Record<string, unknown>): Obj {
  return Object.fromEntries(Object.entries(o).filter(([, v]) => v !== undefined));
}

export const cableArb = fc
  .record({
    length: dec(0, 150, 2),
    material: fc.constantFrom('Cu', 'Al'),
    active: fc.constantFrom(...SIZES),
    earth: fc.constantFrom(...SIZES),
    earthMaterial: optional(fc.constantFrom('Cu', 'Al')),
    parallel: optional(fc.integer({ min: 1, max: 4 })),
    reactance: optional(dec(0, 0.001, 6)),
  })
  .map(clean);

const points = fc
  .tuple(fc.integer({ min: 20, max: 200 }), fc.integer({ min: 2, max: 5 }))
  .map(([first, n]) => Array.from({ length: n }, (_, i): [number, number] => [first * 2 ** i, 100 / 10 ** i]));

export const deviceArb = fc.oneof(
  fc.record({ type: fc.constant('mcb'), curve: fc.constantFrom('B', 'C', 'D'), rating: fc.constantFrom(6, 10, 16, 20, 32, 40, 63) }),
  fc
    .record({ type: fc.constant('adjustable'), rating: fc.constantFrom(100, 160, 250), instantaneous: fc.integer({ min: 200, max: 2500 }), tolerance: optional(dec(0, 0.3, 2)) })
    .map(clean),
  fc.record({ type: fc.constant('curve'), rating: fc.constantFrom(16, 32, 63), points }),
  fc.record({ type: fc.constant('fixed'), rating: fc.constantFrom(10, 20, 32), tripCurrent: fc.integer({ min: 30, max: 800 }) }),
).chain((d) =>
  fc
    .record({ breaking: optional(fc.constantFrom(3, 6, 10, 25)), label: optional(text) })
    .map((extra) => clean({ ...d, ...extra })),
);

export const sourceArb = fc.oneof(
  fc.constant({ type: 'unknown' }),
  fc.record({ type: fc.constant('impedance'), r: dec(0, 0.5), x: dec(0, 0.5) }),
  fc.record({ type: fc.constant('fault-current'), current: fc.integer({ min: 200, max: 20000 }), xr: optional(dec(0, 5, 2)) }).map(clean),
);

export const rulesArb = fc
  .record({
    basis: fc.constantFrom('au-nz', 'iec'),
    voltage: optional(fc.constantFrom(220, 230, 240)),
    voltageFactor: optional(dec(0.9, 1.1, 2)),
    unknownSourceShare: optional(dec(0.5, 0.9, 2)),
    reactance: optional(dec(0, 0.0002, 6)),
    resistivity: optional(fc.record({ Cu: dec(0.017, 0.025, 4) })),
    multiples: optional(fc.record({ C: dec(5, 10, 1) })),
  })
  .map(clean);

interface Shape {
  kinds: Array<'board' | 'point'>;
  parents: number[];
}

/** Node i (1..n) is fed from an earlier node; boards only from the supply or a board. */
const shapeArb: fc.Arbitrary<Shape> = fc
  .array(fc.tuple(fc.constantFrom<'board' | 'point'>('board', 'point'), fc.nat()), { minLength: 1, maxLength: 10 })
  .map((raw) => {
    const kinds: Array<'board' | 'point'> = [];
    const parents: number[] = [];
    raw.forEach(([kind, pick]) => {
      // candidate parents: 0 = supply, j + 1 = node j
      const candidates = [0, ...kinds.map((_, j) => j + 1).filter((j) => kind === 'point' || kinds[j - 1] === 'board')];
      kinds.push(kind);
      parents.push(candidates[pick % candidates.length] as number);
    });
    return { kinds, parents };
  });

export interface TreeOptions {
  source?: fc.Arbitrary<Obj>;
  /** Every link leaving a supply or board gets a device (otherwise each may have one). */
  allDevices?: boolean;
}

/** A valid job file with one supply `N0` and nodes `N1..Nn`, link `Li` feeding `Ni`. */
export function jobArb(opts: TreeOptions = {}): fc.Arbitrary<Obj> {
  return shapeArb.chain((shape) => {
    const nodeArbs = shape.kinds.map((kind, i) =>
      kind === 'board'
        ? fc
            .record({ name: optional(text), diversity: optional(dec(0.01, 1, 2)), at: optional(fc.record({ x: fc.integer({ min: -500, max: 500 }), y: fc.integer({ min: 0, max: 900 }) })) })
            .map((o) => clean({ id: `N${i + 1}`, kind: 'board', ...o }))
        : fc
            .record({
              use: fc.constantFrom(...USES),
              name: optional(text),
              notes: optional(text),
              handHeld: optional(fc.boolean()),
              current: optional(dec(0, 60, 1)),
              phases: optional(fc.constantFrom(1, 3)),
              powerFactor: optional(dec(0.5, 1, 2)),
            })
            .map((o) => clean({ id: `N${i + 1}`, kind: 'point', ...o })),
    );
    const linkArbs = shape.parents.map((parent, i) => {
      const fromSupplyOrBoard = parent === 0 || shape.kinds[parent - 1] === 'board';
      const device = fromSupplyOrBoard && opts.allDevices ? deviceArb : optional(deviceArb);
      return fc
        .record({
          cable: cableArb,
          device,
          rcd: optional(fc.record({ sensitivity: fc.constantFrom(0.01, 0.03, 0.1, 0.3) })),
          requiredTime: optional(fc.constantFrom(0.2, 0.4, 1, 5)),
          name: optional(text),
        })
        .map((o) => clean({ id: `L${i + 1}`, from: `N${parent}`, to: `N${i + 1}`, ...o }));
    });
    return fc
      .record({
        rules: rulesArb,
        source: opts.source ?? sourceArb,
        nodes: fc.tuple(...nodeArbs),
        links: fc.tuple(...linkArbs),
        extra: fc.dictionary(fc.string({ minLength: 1, maxLength: 6 }).map((k) => `x_${k}`), fc.jsonValue({ maxDepth: 2 }).map((v) => JSON.parse(JSON.stringify(v)) as unknown) /* as read from a file: JSON has no -0 */, { maxKeys: 3 }),
      })
      .map(({ rules, source, nodes, links, extra }) => ({
        format: 'loopwright.job',
        version: 2,
        job: { ...DETAILS },
        rules,
        nodes: [{ id: 'N0', kind: 'supply', source }, ...nodes],
        links,
        ...extra,
      }));
  });
}
