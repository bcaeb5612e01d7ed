// Maximum fault levels and breaking capacity (method-depth.md §5) and the adiabatic check of the
// protective conductor (§6), worked by hand.

import { describe, expect, it } from 'vitest';
import { board, cable, circuit, expectRel, jobFile, link, mcb, point, run, unknownSupply } from './helpers.js';
import type { Obj } from './helpers.js';

const v2 = (parts: Parameters<typeof jobFile>[0]): Obj => ({ ...jobFile(parts), version: 2 });

describe('fault level at two levels, and the breaking check both ways', () => {
  // cmax = 1.10 (IEC 60909-0:2016 Table 1, low voltage, from memory); ρ20 Cu 0.0185 Ω·mm²/m
  // (IEC 60909-0, from memory); x = 0.08 mΩ/m (common practice, from memory); U0 230 V
  // cmax · U0 = 253 V
  const threePhase = (breaking: { m1: number; sm1: number; c1: number }) =>
    v2({
      nodes: [
        { ...unknownSupply('S1'), phases: 3, maxFault: { current: 10000, xr: 1 } },
        board('MSB'),
        board('DB'),
        point('P1', 'socket-outlets'),
      ],
      links: [
        link('M1', 'S1', 'MSB', cable(30, 35, 16), { device: { type: 'adjustable', rating: 160, instantaneous: 1600, breaking: breaking.m1 } }),
        link('SM1', 'MSB', 'DB', cable(25, 10, 10), { phases: 1, device: mcb('C', 40, { breaking: breaking.sm1 }) }),
        link('C1', 'DB', 'P1', cable(20, 2.5, 2.5), { device: mcb('C', 20, { breaking: breaking.c1 }) }),
      ],
    });

  it('a three-phase path with a single-phase submain: 10 kA at the supply, 6425 A at MSB, 1968 A at DB', () => {
    // source: Zsrc = 253 / 10000 = 0.0253 Ω, X/R 1: R = X = 0.0253 / √2 = 0.0178898 Ω
    // M1 (3 phases, counted once): 0.0185 · 30 / 35 = 0.0158571 Ω, X = 0.00008 · 30 = 0.0024 Ω
    //   at MSB: |0.0337469 + j0.0202898| = 0.0393768 Ω → 253 / 0.0393768 = 6425.10 A
    // SM1 (1 phase, counted twice): 2 · (0.0185 · 25 / 10 + j0.00008 · 25) = 0.0925 + j0.004 Ω
    //   at DB: |0.1262469 + j0.0242898| = 0.1285624 Ω → 253 / 0.1285624 = 1967.92 A
    const r = run(threePhase({ m1: 10, sm1: 6, c1: 3 }));
    expectRel(r.supplies[0]?.faultLevel, 10000, 1e-9);
    expectRel(circuit(r, 'M1').faultLevel, 10000, 1e-9); // consumer mains: at the supply terminals
    expectRel(circuit(r, 'SM1').faultLevel, 6425.103, 1e-6);
    expectRel(circuit(r, 'C1').faultLevel, 1967.916, 1e-6);
    // breaking · 1000 ≥ faultLevel passes: 10 kA against 10 kA (equal) passes; 6 kA < 6425 A fails; 3 kA ≥ 1968 A passes
    expect(circuit(r, 'M1').breakingStatus).toBe('pass');
    expect(circuit(r, 'SM1').breakingStatus).toBe('fail');
    expect(circuit(r, 'SM1').verdict).toBe('fail');
    expect(circuit(r, 'C1').breakingStatus).toBe('pass');
    // the other way round at the same places: 9 kA < 10 kA fails, 10 kA ≥ 6425 A passes, 1.5 kA < 1968 A fails
    const other = run(threePhase({ m1: 9, sm1: 10, c1: 1.5 }));
    expect(circuit(other, 'M1').breakingStatus).toBe('fail');
    expect(circuit(other, 'SM1').breakingStatus).toBe('pass');
    expect(circuit(other, 'C1').breakingStatus).toBe('fail');
    expect(other.summary.checks.breaking).toEqual({ pass: 1, fail: 2, unchecked: 0 });
  });

  it('a single-phase supply with no maxFault: the whole earth-fault loop Ze is the source', () => {
    // Ze = 0.2 + j0.1 Ω, single phase → Zsrc = Ze: |Ze| = 0.2236068 Ω → 253 / 0.2236068 = 1131.45 A
    // M2 (1 phase, twice): 2 · (0.0185 · 10 / 16 + j0.0008) = 0.023125 + j0.0016 Ω
    //   at B2: |0.223125 + j0.1016| = 0.2451702 Ω → 1031.95 A
    const file = (kA: number) =>
      v2({
        nodes: [{ id: 'S2', kind: 'supply', phases: 1, source: { type: 'impedance', r: 0.2, x: 0.1 } }, board('B2'), point('P2', 'other')],
        links: [
          link('M2', 'S2', 'B2', cable(10, 16, 16)),
          link('C2', 'B2', 'P2', cable(15, 2.5, 2.5), { device: mcb('B', 16, { breaking: kA }) }),
        ],
      });
    const r = run(file(1));
    expectRel(r.supplies[0]?.faultLevel, 1131.4504, 1e-6);
    expectRel(circuit(r, 'M2').faultLevel, 1131.4504, 1e-6);
    expect(circuit(r, 'M2').breakingStatus).toBe('unchecked'); // no device of its own
    expectRel(circuit(r, 'C2').faultLevel, 1031.9456, 1e-6);
    expect(circuit(r, 'C2').breakingStatus).toBe('fail'); // 1 kA < 1032 A
    expect(circuit(run(file(1.5)), 'C2').breakingStatus).toBe('pass');
    const none = structuredClone(file(1));
    delete (((none.links as Obj[])[1] as Obj).device as Obj).breaking;
    expect(circuit(run(none), 'C2').breakingStatus).toBe('unchecked'); // no breaking stated
  });

  it('a three-phase supply with no maxFault takes half the earth-fault loop; an unknown source has none', () => {
    // Ze = 0.3 + j0.1 Ω → Zsrc = Ze / 2 = 0.15 + j0.05 Ω, |Zsrc| = 0.1581139 → 253 / 0.1581139 = 1600.11 A (common practice, from memory)
    const r = run(
      v2({
        nodes: [{ id: 'S3', kind: 'supply', phases: 3, source: { type: 'impedance', r: 0.3, x: 0.1 } }, point('P3', 'other')],
        links: [link('C3', 'S3', 'P3', cable(15, 2.5, 2.5), { device: mcb('B', 16, { breaking: 6 }) })],
      }),
    );
    expectRel(r.supplies[0]?.faultLevel, 1600.1125, 1e-6);
    expectRel(circuit(r, 'C3').faultLevel, 1600.1125, 1e-6);
    const unknown = run(
      v2({
        nodes: [unknownSupply('S4'), point('P4', 'other')],
        links: [link('C4', 'S4', 'P4', cable(15, 2.5, 2.5), { device: mcb('B', 16, { breaking: 6 }) })],
      }),
    );
    expect(unknown.supplies[0]?.faultLevel).toBeNull();
    expect(circuit(unknown, 'C4').faultLevel).toBeNull();
    expect(circuit(unknown, 'C4').breakingStatus).toBe('unchecked');
  });
});

describe('the adiabatic check of the protective conductor', () => {
  // Zs = 0.5 Ω exactly (a 0.5 Ω source and a link of length 0): If = 230 / 0.5 = 460 A, above a
  // B16's Ia of 4 · 16 = 64 A (AS/NZS 3000:2018 Table B5.1 note), so it clears in 0.1 s
  const adiabatic = (cab: Obj, device: Obj = mcb('B', 16)) =>
    v2({
      nodes: [{ id: 'S1', kind: 'supply', source: { type: 'impedance', r: 0.5, x: 0 } }, point('P1', 'other')],
      links: [link('C1', 'S1', 'P1', cab, { device })],
    });

  it('a breaker clearing in 0.1 s at 460 A needs √(460² · 0.1) / 115 = 1.26 mm² (k = 115, Cu, PVC, in the cable)', () => {
    // E = 460² · 0.1 = 21160 A²s; √E = 145.465; / 115 = 1.26491 mm² (a figure often worked in practice;
    // k = 115: IEC 60364-5-54 Table A.54.3, from memory)
    const c = circuit(run(adiabatic(cable(0, 1.5, 1.5))), 'C1');
    expectRel(c.faultCurrent, 460, 1e-12);
    expect(c.clearingTime).toBe(0.1);
    expectRel(c.earthMinArea, 1.2649111, 1e-6);
    expect(c.withstandStatus).toBe('pass'); // 1.5 mm² ≥ 1.26 mm²
    const thin = circuit(run(adiabatic(cable(0, 1.5, 1))), 'C1');
    expect(thin.withstandStatus).toBe('fail'); // 1 mm² < 1.26 mm²
    expect(thin.verdict).toBe('fail');
    // two 1 mm² earths in parallel: n · Se = 2 mm² ≥ 1.26 mm² passes
    expect(circuit(run(adiabatic(cable(0, 1.5, 1, { parallel: 2 }))), 'C1').withstandStatus).toBe('pass');
  });

  it('the let-through energy caps E: min(If² · t, letThrough)', () => {
    // letThrough 10000 A²s < 21160: S = √10000 / 115 = 100 / 115 = 0.869565 mm², so 1 mm² passes
    const capped = circuit(run(adiabatic(cable(0, 1.5, 1), mcb('B', 16, { letThrough: 10000 }))), 'C1');
    expectRel(capped.earthMinArea, 0.8695652, 1e-6);
    expect(capped.withstandStatus).toBe('pass');
    // letThrough 50000 A²s > 21160: the fault's own energy stands
    const loose = circuit(run(adiabatic(cable(0, 1.5, 1), mcb('B', 16, { letThrough: 50000 }))), 'C1');
    expectRel(loose.earthMinArea, 1.2649111, 1e-6);
    expect(loose.withstandStatus).toBe('fail');
  });

  it.each([
    // IEC 60364-5-54 Tables A.54.2 and A.54.3, from memory (the same values in BS 7671:2018 Tables 54.2 and 54.3)
    ['Cu', 'pvc', true, 115],
    ['Cu', 'xlpe', true, 143],
    ['Cu', 'pvc', false, 143],
    ['Cu', 'xlpe', false, 176],
    ['Al', 'pvc', true, 76],
    ['Al', 'xlpe', true, 94],
    ['Al', 'pvc', false, 95],
    ['Al', 'xlpe', false, 116],
  ] as const)('k for a %s earth, %s, in the cable %s: %d', (earthMaterial, insulation, earthInCable, k) => {
    // the same 21160 A²s (the earth's material does not change Zs here: the link has length 0)
    const c = circuit(run(adiabatic(cable(0, 1.5, 1.5, { earthMaterial, insulation, earthInCable }))), 'C1');
    expectRel(c.earthMinArea, 145.46477 / k, 1e-6);
  });

  it('unchecked when the source is unknown, the link unprotected, or the clearing time unknown', () => {
    const unknown = v2({
      nodes: [unknownSupply('S1'), point('P1', 'other')],
      links: [link('C1', 'S1', 'P1', cable(10, 1.5, 1.5), { device: mcb('B', 16) })],
    });
    const u = circuit(run(unknown), 'C1');
    expect(u.withstandStatus).toBe('unchecked');
    expect(u.earthMinArea).toBeNull();
    const bare = structuredClone(adiabatic(cable(0, 1.5, 1.5)));
    delete ((bare.links as Obj[])[0] as Obj).device;
    expect(circuit(run(bare), 'C1').withstandStatus).toBe('unchecked');
    // a curve whose lowest current is 600 A: at 460 A its time is unknown (null), the loop fails
    const curve = circuit(run(adiabatic(cable(0, 1.5, 1.5), { type: 'curve', rating: 32, points: [[600, 5], [2000, 0.1]] })), 'C1');
    expect(curve.clearingTime).toBeNull();
    expect(curve.withstandStatus).toBe('unchecked');
    expect(curve.earthMinArea).toBeNull();
  });

  it('the 0 Ω loop: withstand unchecked unless the device states its let-through', () => {
    // a 0 Ω source and a link of length 0: no impedance in the loop (method-depth.md, numbers at the edges)
    const zero = (device: Obj) =>
      v2({
        nodes: [{ id: 'S1', kind: 'supply', source: { type: 'impedance', r: 0, x: 0 } }, point('P1', 'other')],
        links: [link('C1', 'S1', 'P1', cable(0, 1.5, 1.5), { device })],
      });
    const plain = circuit(run(zero(mcb('B', 16))), 'C1');
    expect(plain.faultCurrent).toBeNull();
    expect(plain.clearingTime).toBe(0.1);
    expect(plain.status).toBe('pass');
    expect(plain.notes.some((n) => n.includes('no impedance in the loop'))).toBe(true);
    expect(plain.withstandStatus).toBe('unchecked');
    expect(plain.faultLevel).toBeNull(); // Zsrc = Ze = 0 would be an infinite fault level
    // letThrough 40000 A²s: S = 200 / 115 = 1.73913 mm² > 1.5 mm² fails
    const lt = circuit(run(zero(mcb('B', 16, { letThrough: 40000 }))), 'C1');
    expectRel(lt.earthMinArea, 1.7391304, 1e-6);
    expect(lt.withstandStatus).toBe('fail');
  });
});
