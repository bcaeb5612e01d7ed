// Property tests (fast-check) over random valid jobs: Zs never falls going downstream, grows
// with length, two parallel sets halve a link's impedance, the file survives a round trip, and
// the status always agrees with the ratio.

import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { analyse, loadJob, parseJob, serialiseJob, toFileObject } from '../../engine/index.js';
import { cableArb, deviceArb, jobArb, sourceArb } from './arbitraries.js';
import { board, circuit, jobFile, link, point, run, unknownSupply } from './helpers.js';
import type { Obj } from './helpers.js';

const knownSource = sourceArb.filter((s) => s.type !== 'unknown');
const links = (file: Obj) => file.links as Obj[];

/** Links below link `id` (fed from its far end, directly or further down). */
function descendants(file: Obj, id: string): Set<string> {
  const all = links(file);
  const below = new Set<string>();
  let frontier = [all.find((l) => l.id === id)?.to];
  while (frontier.length) {
    const next: unknown[] = [];
    for (const node of frontier) {
      for (const l of all) if (l.from === node && !below.has(l.id as string)) {
        below.add(l.id as string);
        next.push(l.to);
      }
    }
    frontier = next;
  }
  return below;
}

describe('properties', () => {
  it('parse(serialise(job)) keeps the job, and the file keeps everything the user wrote', () => {
    fc.assert(
      fc.property(jobArb(), (file) => {
        const copy = structuredClone(file);
        const first = loadJob(file);
        expect(first.ok).toBe(true);
        expect(file).toEqual(copy); // loading never changes what the user gave it
        if (!first.ok) return;
        const jobCopy = structuredClone(first.job);
        analyse(first.job);
        expect(first.job).toEqual(jobCopy); // nor does analysing
        const text = serialiseJob(first.job);
        const second = parseJob(text);
        expect(second.ok).toBe(true);
        if (!second.ok) return;
        expect(second.job).toEqual(first.job);
        expect(serialiseJob(second.job)).toBe(text);
        expect(toFileObject(first.job)).toMatchObject(file);
        expect(analyse(second.job)).toEqual(analyse(first.job));
      }),
      { numRuns: 150 },
    );
  });

  it('Zs never falls going downstream (known source)', () => {
    fc.assert(
      fc.property(jobArb({ source: knownSource }), (file) => {
        const r = run(file);
        for (const l of links(file)) {
          const here = circuit(r, l.id as string).zs;
          expect(here).not.toBeNull();
          const parent = links(file).find((p) => p.to === l.from);
          if (!parent) continue;
          const above = circuit(r, parent.id as string).zs as number;
          expect(here as number).toBeGreaterThanOrEqual(above - 1e-12);
        }
      }),
      { numRuns: 150 },
    );
  });

  it('Zs grows with length: at the lengthened link and everywhere below it; nothing else moves', () => {
    fc.assert(
      fc.property(
        jobArb({ source: knownSource }),
        fc.nat(),
        fc.integer({ min: 1, max: 50_000 }).map((v) => v / 100),
        (file, pick, delta) => {
          const ls = links(file);
          const target = ls[pick % ls.length] as Obj;
          const longer = structuredClone(file);
          const cab = (links(longer).find((l) => l.id === target.id) as Obj).cable as Obj;
          cab.length = (cab.length as number) + delta;
          const before = run(file);
          const after = run(longer);
          const below = descendants(file, target.id as string);
          for (const l of ls) {
            const id = l.id as string;
            const a = circuit(before, id).zs as number;
            const b = circuit(after, id).zs as number;
            if (id === target.id) expect(b).toBeGreaterThan(a);
            else if (below.has(id)) expect(b).toBeGreaterThanOrEqual(a - 1e-12);
            else expect(b).toBe(a);
          }
        },
      ),
      { numRuns: 100 },
    );
  });

  it('two parallel sets of the same cable halve the link’s impedance (own loop of one link)', () => {
    fc.assert(
      fc.property(cableArb, deviceArb, (cab, device) => {
        const make = (parallel: number) =>
          jobFile({
            nodes: [unknownSupply('S1'), board('MSB'), point('P1', 'fixed-equipment')],
            links: [
              link('M1', 'S1', 'MSB', { length: 10, material: 'Cu', active: 16, earth: 6 }),
              link('C1', 'MSB', 'P1', { ...cab, parallel }, { device }),
            ],
          });
        const one = circuit(run(make(1)), 'C1');
        const two = circuit(run(make(2)), 'C1');
        expect(one.own).not.toBeNull();
        const own1 = one.own as number;
        const own2 = two.own as number;
        if (own1 === 0) expect(own2).toBe(0);
        else expect(Math.abs(own2 / own1 - 0.5)).toBeLessThan(1e-9);
        // with nothing before the link (own loop starts at its origin) the maximum length doubles
        if (one.maxLength !== null && two.maxLength !== null) {
          expect(Math.abs(two.maxLength / one.maxLength - 2)).toBeLessThan(1e-9);
        }
      }),
      { numRuns: 150 },
    );
  });

  it('status agrees with the ratio, RCDs and summary', () => {
    fc.assert(
      fc.property(jobArb(), (file) => {
        const r = run(file);
        const byId = new Map(links(file).map((l) => [l.id as string, l]));
        let worst: number | null = null;
        for (const c of r.circuits) {
          if (c.status === 'unchecked') {
            expect(c.tripCurrent).toBeNull();
            expect(c.ratio).toBeNull();
            continue;
          }
          expect(c.protectedBy).not.toBeNull();
          const protecting = byId.get(c.protectedBy as string) as Obj;
          expect(protecting.device).toBeDefined();
          if (c.ratio !== null) {
            // "A link passes exactly when its ratio is at most 1."
            expect(c.status === 'pass').toBe(c.ratio <= 1);
            worst = worst === null ? c.ratio : Math.max(worst, c.ratio);
          } else {
            expect(c.status).not.toBe('pass');
          }
          if (c.status === 'rcd') expect(protecting.rcd).toBeDefined();
          if (c.status === 'fail') expect(protecting.rcd).toBeUndefined();
        }
        if (worst === null) expect(r.worst).toBeNull();
        else expect(r.worst?.ratio).toBe(worst);
        const s = r.summary;
        expect(s.pass + s.fail + s.rcd + s.unchecked).toBe(r.circuits.length);
        expect(s.fail).toBe(r.circuits.filter((c) => c.status === 'fail').length);
        expect(s.rcd).toBe(r.circuits.filter((c) => c.status === 'rcd').length);
      }),
      { numRuns: 150 },
    );
  });

  it('worst.path alternates node and link ids from the supply to the worst link’s far end', () => {
    fc.assert(
      fc.property(jobArb({ allDevices: true }), (file) => {
        const r = run(file);
        if (!r.worst) return;
        const path = r.worst.path;
        expect(path[0]).toBe('N0');
        expect(path[path.length - 1]).toBe((links(file).find((l) => l.id === r.worst?.link) as Obj).to);
        expect(path[path.length - 2]).toBe(r.worst.link);
        for (let i = 1; i < path.length; i += 2) {
          const l = links(file).find((x) => x.id === path[i]) as Obj;
          expect(l).toBeDefined();
          expect(l.from).toBe(path[i - 1]);
          expect(l.to).toBe(path[i + 1]);
        }
      }),
      { numRuns: 100 },
    );
  });
});
