// Check values against published tables, and the basis constants they rest on.
// Every expected number is worked by hand from /work/shared/method.md in the comment beside it.

import { describe, expect, it } from 'vitest';
import { resolveRules } from '../../engine/index.js';
import {
  board,
  cable,
  circuit,
  expectRel,
  impedanceSupply,
  jobFile,
  link,
  mcb,
  point,
  run,
  unknownSupply,
} from './helpers.js';

/** Unknown source, a short mains to MSB, then one final subcircuit of the given cable and breaker. */
function oneFinal(curve: 'B' | 'C' | 'D', rating: number, active: number, earth: number, rules = {}) {
  return run(
    jobFile({
      rules,
      nodes: [unknownSupply('S1'), board('MSB'), point('P1', 'lighting')],
      links: [
        link('M1', 'S1', 'MSB', cable(5, 16, 6)),
        link('C1', 'MSB', 'P1', cable(20, active, earth), { device: mcb(curve, rating) }),
      ],
    }),
  );
}

describe('AS/NZS 3000:2018 Table B5.1 maximum lengths (unknown source, au-nz)', () => {
  it('C16 on 1.5/1.5 mm² Cu → 51 m', () => {
    // AS/NZS 3000:2018 Table B5.1: 51 m.
    // Ia = 7.5 × 16 = 120 A; limit = 0.8 × 230 / 120 = 1.533333 Ω.
    // Per metre: R' = 0.0225 × (1/1.5 + 1/1.5) = 0.03 Ω/m, X' = 2 × 0.00008 = 0.00016 Ω/m,
    // |z'| = √(0.03² + 0.00016²) = 0.0300004267 Ω/m; L = 1.533333 / 0.0300004267 = 51.1104 m.
    // (x = 0 closed form: 0.8·230·1.5·1.5 / (120·0.0225·3) = 414 / 8.1 = 51.111 m.)
    const c = circuit(oneFinal('C', 16, 1.5, 1.5), 'C1');
    expect(c.maxLength).not.toBeNull();
    expect(Math.abs((c.maxLength as number) - 51.1)).toBeLessThanOrEqual(0.1);
    expect(Math.round(c.maxLength as number)).toBe(51);
    expectRel(c.maxLength, 51.11038421, 1e-6);
  });

  // Further rows of Table B5.1, from memory (each agrees with the B5.2.2 formula to the metre):
  //   Lmax = 0.8·U0·Sa·Se / (Ia·ρ·(Sa+Se)); the engine's default reactance moves them < 0.01 m.
  const rows: Array<[string, 'B' | 'C' | 'D', number, number, number, number]> = [
    // B16 1.5/1.5: 0.8·230·2.25 / (64·0.0225·3) = 414 / 4.32 = 95.83 → 96 m (from memory)
    ['B16 1.5/1.5', 'B', 16, 1.5, 1.5, 96],
    // B10 1.5/1.5: 414 / (40·0.0225·3) = 414 / 2.7 = 153.3 → 153 m (from memory)
    ['B10 1.5/1.5', 'B', 10, 1.5, 1.5, 153],
    // C20 2.5/2.5: 0.8·230·6.25 / (150·0.0225·5) = 1150 / 16.875 = 68.15 → 68 m (from memory)
    ['C20 2.5/2.5', 'C', 20, 2.5, 2.5, 68],
    // D20 2.5/2.5: 1150 / (250·0.0225·5) = 1150 / 28.125 = 40.89 → 41 m (from memory)
    ['D20 2.5/2.5', 'D', 20, 2.5, 2.5, 41],
    // C32 4/2.5: 0.8·230·10 / (240·0.0225·6.5) = 1840 / 35.1 = 52.42 → 52 m (from memory)
    ['C32 4/2.5', 'C', 32, 4, 2.5, 52],
  ];
  for (const [name, curve, rating, a, e, metres] of rows) {
    it(`${name} → ${metres} m (from memory)`, () => {
      const c = circuit(oneFinal(curve, rating, a, e), 'C1');
      expect(Math.round(c.maxLength as number)).toBe(metres);
    });
  }
});

describe('BS 7671:2018 Table 41.3 maximum Zs (iec basis, c = 0.95, known source)', () => {
  // limit = c·U0/Ia with Ia = the upper end of the IEC 60898-1 instantaneous range.
  const cases: Array<[string, 'B' | 'C' | 'D', number, number, number]> = [
    // C16: Ia = 10 × 16 = 160 A; 0.95 × 230 / 160 = 218.5 / 160 = 1.365625 → 1.37 Ω (from memory)
    ['C16', 'C', 16, 1.365625, 1.37],
    // B16: Ia = 5 × 16 = 80 A; 218.5 / 80 = 2.73125 → 2.73 Ω (from memory)
    ['B16', 'B', 16, 2.73125, 2.73],
    // B6: Ia = 30 A; 218.5 / 30 = 7.28333 → 7.28 Ω (from memory)
    ['B6', 'B', 6, 7.283333333, 7.28],
    // B32: Ia = 160 A; 218.5 / 160 = 1.365625 → 1.37 Ω (from memory)
    ['B32', 'B', 32, 1.365625, 1.37],
    // C32: Ia = 320 A; 218.5 / 320 = 0.6828125 → 0.68 Ω (from memory)
    ['C32', 'C', 32, 0.6828125, 0.68],
    // D16: Ia = 20 × 16 = 320 A; 0.6828125 → 0.68 Ω (from memory)
    ['D16', 'D', 16, 0.6828125, 0.68],
  ];
  for (const [name, curve, rating, exact, table] of cases) {
    it(`${name} → ${table} Ω`, () => {
      const results = run(
        jobFile({
          rules: { basis: 'iec', voltageFactor: 0.95 },
          nodes: [impedanceSupply('S1', 0.1, 0), board('DB'), point('P1', 'socket-outlets')],
          links: [
            link('M1', 'S1', 'DB', cable(5, 16, 16)),
            link('C1', 'DB', 'P1', cable(10, 2.5, 2.5), { device: mcb(curve, rating) }),
          ],
        }),
      );
      const c = circuit(results, 'C1');
      expect(c.method).toBe('known-source');
      expectRel(c.limit, exact);
      expect(c.limit as number).toBeCloseTo(table, 2);
    });
  }
});

describe('breaker multiples', () => {
  it('iec uses the upper ends of the IEC 60898-1 instantaneous ranges B 3–5, C 5–10, D 10–20 In', () => {
    // IEC 60898-1 instantaneous tripping ranges (from memory): B 3–5 In, C 5–10 In, D 10–20 In.
    const ranges = { B: [3, 5], C: [5, 10], D: [10, 20] } as const;
    const rules = resolveRules({ basis: 'iec' });
    for (const curve of ['B', 'C', 'D'] as const) {
      const m = rules.multiples[curve].value;
      expect(m).toBeGreaterThanOrEqual(ranges[curve][0]);
      expect(m).toBe(ranges[curve][1]);
      expect(rules.multiples[curve].overridden).toBe(false);
    }
  });

  it('iec trip currents of 10 A breakers: B 50 A, C 100 A, D 200 A', () => {
    // 5 × 10, 10 × 10, 20 × 10 (IEC 60898-1 upper ends, from memory)
    for (const [curve, ia] of [['B', 50], ['C', 100], ['D', 200]] as const) {
      expectRel(circuit(oneFinal(curve, 10, 2.5, 2.5, { basis: 'iec' }), 'C1').tripCurrent, ia);
    }
  });

  it('au-nz uses 4 / 7.5 / 12.5 (AS/NZS 3000:2018 Table B5.1 note)', () => {
    const rules = resolveRules({ basis: 'au-nz' });
    expect(rules.multiples.B.value).toBe(4);
    expect(rules.multiples.C.value).toBe(7.5);
    expect(rules.multiples.D.value).toBe(12.5);
    // 20 A: 4 × 20 = 80, 7.5 × 20 = 150, 12.5 × 20 = 250
    for (const [curve, ia] of [['B', 80], ['C', 150], ['D', 250]] as const) {
      expectRel(circuit(oneFinal(curve, 20, 2.5, 2.5), 'C1').tripCurrent, ia);
    }
  });
});

describe('basis constants (method.md "Bases")', () => {
  it('au-nz defaults', () => {
    const r = resolveRules({ basis: 'au-nz' });
    expect(r.basis).toBe('au-nz');
    expect(r.voltage.value).toBe(230);
    expect(r.voltageFactor.value).toBe(1);
    expect(r.unknownSourceShare.value).toBe(0.8);
    expectRel(r.reactance.value, 0.00008); // 0.08 mΩ/m (common practice, from memory)
    expectRel(r.resistivity.Cu.value, 0.0225); // AS/NZS 3000:2018 B5.2.2
    expectRel(r.resistivity.Al.value, 0.036); // AS/NZS 3000:2018 B5.2.2
    for (const v of [r.voltage, r.voltageFactor, r.unknownSourceShare, r.reactance, r.resistivity.Cu]) {
      expect(v.overridden).toBe(false);
      expect(typeof v.source).toBe('string');
    }
  });

  it('iec resistivity at 70 °C from ρ20 and α (IEC 60028 / IEC 60889, from memory)', () => {
    const r = resolveRules({ basis: 'iec' });
    // Cu: (1/58) × (1 + 0.00393 × 50) = 0.0172414 × 1.1965 = 0.0206293 Ω·mm²/m
    expectRel(r.resistivity.Cu.value, 0.020629310345);
    // Al: 0.028264 × (1 + 0.00403 × 50) = 0.028264 × 1.2015 = 0.0339592 Ω·mm²/m
    expectRel(r.resistivity.Al.value, 0.033959196);
    expect(r.voltage.value).toBe(230); // IEC 60038
    expect(r.voltageFactor.value).toBe(1);
    expect(r.unknownSourceShare.value).toBe(0.8);
  });

  it('overrides are reported as overridden with the new value', () => {
    const r = resolveRules({
      basis: 'au-nz',
      voltage: 240,
      voltageFactor: 0.95,
      unknownSourceShare: 0.7,
      reactance: 0.0001,
      resistivity: { Cu: 0.02 },
      multiples: { C: 10 },
    });
    expect(r.voltage).toMatchObject({ value: 240, overridden: true });
    expect(r.voltageFactor).toMatchObject({ value: 0.95, overridden: true });
    expect(r.unknownSourceShare).toMatchObject({ value: 0.7, overridden: true });
    expect(r.reactance).toMatchObject({ value: 0.0001, overridden: true });
    expect(r.resistivity.Cu).toMatchObject({ value: 0.02, overridden: true });
    expect(r.resistivity.Al).toMatchObject({ value: 0.036, overridden: false });
    expect(r.multiples.C).toMatchObject({ value: 10, overridden: true });
    expect(r.multiples.B).toMatchObject({ value: 4, overridden: false });
  });
});
