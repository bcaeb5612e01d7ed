// Measured loop impedances (method-depth.md §7), worked by hand: the temperature correction for
// copper and aluminium at 10, 20 and 30 °C, the fixed-factor rule, the supply's measured Ze, and
// the test limit (the largest reading that passes).

import { describe, expect, it } from 'vitest';
import { cable, circuit, expectRel, jobFile, link, mcb, point, run, unknownSupply } from './helpers.js';
import type { Obj } from './helpers.js';

const v2 = (parts: Parameters<typeof jobFile>[0]): Obj => ({ ...jobFile(parts), version: 2 });

// One circuit: C1 from the supply to P1, 2.5 mm² of the given material, a C20 breaker.
// au-nz: Ia = 7.5 · 20 = 150 A (AS/NZS 3000:2018 Table B5.1 note); B = 230 / 150 = 1.533333 Ω
const B = 230 / 150;
function reading(material: 'Cu' | 'Al', zs: number, temperature?: number, extra: { rules?: Obj; ze?: number; rcd?: boolean } = {}): Obj {
  return v2({
    rules: extra.rules,
    nodes: [{ ...unknownSupply('S1'), ...(extra.ze === undefined ? {} : { measured: { ze: extra.ze, date: '2026-11-30' } }) }, point('P1', 'socket-outlets')],
    links: [
      link('C1', 'S1', 'P1', cable(10, 2.5, 2.5, { material }), {
        device: mcb('C', 20),
        measured: temperature === undefined ? { zs } : { zs, temperature, instrument: 'loop tester' },
        ...(extra.rcd ? { rcd: { sensitivity: 0.03 } } : {}),
      }),
    ],
  });
}

describe('the temperature correction, worked by hand', () => {
  // F = ρf / ρθ, ρθ = ρ20 · (1 + α · (θ − 20)); ρf the design's fault resistivity, au-nz Cu 0.0225,
  // Al 0.036 (AS/NZS 3000:2018 B5.2.2); ρ20 Cu 1/58, Al 0.028264; α Cu 0.00393, Al 0.00403
  // (IEC 60028 and IEC 60889, from memory)
  it.each([
    // material, θ, F worked out:
    // Cu 10 °C: ρθ = (1/58) · (1 − 0.0393) = 0.0165638; F = 0.0225 / 0.0165638 = 1.358385
    ['Cu', 10, 1.3583845],
    // Cu 20 °C: F = 0.0225 · 58 = 1.305
    ['Cu', 20, 1.305],
    // Cu 30 °C: ρθ = (1/58) · 1.0393 = 0.0179190; F = 1.255653
    ['Cu', 30, 1.2556528],
    // Al 10 °C: ρθ = 0.028264 · 0.9597 = 0.0271250; F = 0.036 / 0.0271250 = 1.327191
    ['Al', 10, 1.3271909],
    // Al 20 °C: F = 0.036 / 0.028264 = 1.273705
    ['Al', 20, 1.2737051],
    // Al 30 °C: ρθ = 0.028264 · 1.0403 = 0.0294030; F = 1.224363
    ['Al', 30, 1.2243632],
  ] as const)('%s at %d °C: F = %f; a 0.8 Ω reading becomes 0.8 · F, the test limit B / F', (material, theta, F) => {
    const c = circuit(run(reading(material, 0.8, theta)), 'C1');
    expect(c.measured).not.toBeNull();
    expect(c.measured?.zs).toBe(0.8);
    expectRel(c.measured?.corrected, 0.8 * F, 1e-6);
    expectRel(c.measured?.ratio, (0.8 * F) / B, 1e-6);
    expect(c.measured?.status).toBe('pass'); // 0.8 · 1.36 = 1.09 Ω ≤ 1.53 Ω
    // testLimit = Zem + (B − Zem) / F with Zem = 0: e.g. Cu at 20 °C: 1.533333 / 1.305 = 1.174968 Ω
    expectRel(c.testLimit, B / F, 1e-6);
  });

  it('no temperature stated reads as 20 °C', () => {
    const c = circuit(run(reading('Cu', 0.8)), 'C1');
    expectRel(c.measured?.corrected, 1.044, 1e-9); // 0.8 · 1.305
    expectRel(c.testLimit, 1.1749681, 1e-6);
  });

  it('a reading just above the test limit fails, just below passes', () => {
    // Cu at 20 °C: testLimit 1.174968 Ω
    const below = circuit(run(reading('Cu', 1.17, 20)), 'C1');
    expect(below.measured?.status).toBe('pass');
    const above = circuit(run(reading('Cu', 1.18, 20)), 'C1');
    expect(above.measured?.status).toBe('fail');
    expectRel(above.measured?.ratio, (1.18 * 1.305) / B, 1e-9); // 1.5399 / 1.5333 = 1.00430
    // with an RCD on the protecting link the failing reading relies on it
    expect(circuit(run(reading('Cu', 1.18, 20, { rcd: true })), 'C1').measured?.status).toBe('rcd');
  });

  it('the iec basis: ρf = ρ20 · (1 + α · 50), so F = 1.1965 for copper at 20 °C', () => {
    // ρf Cu = (1/58) · (1 + 0.00393 · 50) = (1/58) · 1.1965 (IEC 60028, from memory); F at 20 °C = 1.1965
    // iec C20: Ia = 10 · 20 = 200 A (IEC 60898-1, from memory); B = 230 / 200 = 1.15 Ω
    const c = circuit(run(reading('Cu', 0.8, 20, { rules: { basis: 'iec' } })), 'C1');
    expectRel(c.measured?.corrected, 0.8 * 1.1965, 1e-9);
    expectRel(c.testLimit, 1.15 / 1.1965, 1e-9);
  });
});

describe("the supply's measured Ze in the correction", () => {
  it('corrected = Zem + (Zsm − Zem) · F, testLimit = Zem + (B − Zem) / F', () => {
    // Zem = 0.3 Ω, Cu at 20 °C (F = 1.305), reading 0.8 Ω:
    // corrected = 0.3 + 0.5 · 1.305 = 0.9525 Ω; testLimit = 0.3 + (1.533333 − 0.3) / 1.305 = 1.245083 Ω
    const c = circuit(run(reading('Cu', 0.8, 20, { ze: 0.3 })), 'C1');
    expectRel(c.measured?.corrected, 0.9525, 1e-9);
    expectRel(c.measured?.ratio, 0.9525 / B, 1e-9);
    expectRel(c.testLimit, 1.2450830, 1e-6);
    // aluminium at 30 °C (F = 1.224363): corrected = 0.3 + 0.5 · 1.224363 = 0.912182; testLimit = 1.307326
    const al = circuit(run(reading('Al', 0.8, 30, { ze: 0.3 })), 'C1');
    expectRel(al.measured?.corrected, 0.9121816, 1e-6);
    expectRel(al.testLimit, 1.3073263, 1e-6);
  });
});

describe('the fixed-factor rule (a reading must not exceed 80 % of the limit; common practice)', () => {
  it('F is replaced by 1 / measuredFactor, whatever the temperature', () => {
    // measuredFactor 0.8 (default): F = 1.25; a 0.8 Ω reading at 30 °C becomes 1.0 Ω
    // testLimit = 0.8 · B = 0.8 · 1.533333 = 1.226667 Ω
    const rules = { basis: 'au-nz', measuredRule: 'fixed-factor' };
    const c = circuit(run(reading('Cu', 0.8, 30, { rules })), 'C1');
    expectRel(c.measured?.corrected, 1.0, 1e-9);
    expectRel(c.testLimit, 1.2266667, 1e-6);
    // aluminium: the same (the rule does not look at the material)
    expectRel(circuit(run(reading('Al', 0.8, 10, { rules })), 'C1').measured?.corrected, 1.0, 1e-9);
    // with Zem 0.3: corrected = 0.3 + 0.5 · 1.25 = 0.925; testLimit = 0.3 + (1.533333 − 0.3) · 0.8 = 1.286667
    const ze = circuit(run(reading('Cu', 0.8, 30, { rules, ze: 0.3 })), 'C1');
    expectRel(ze.measured?.corrected, 0.925, 1e-9);
    expectRel(ze.testLimit, 1.2866667, 1e-6);
    // measuredFactor 0.75: F = 1 / 0.75; testLimit = 0.75 · B = 1.15 Ω
    const f75 = circuit(run(reading('Cu', 0.8, 20, { rules: { ...rules, measuredFactor: 0.75 } })), 'C1');
    expectRel(f75.measured?.corrected, 0.8 / 0.75, 1e-9);
    expectRel(f75.testLimit, 1.15, 1e-9);
  });
});

describe('the test limit and the reading where the design has no check', () => {
  it('an unprotected link: testLimit null, the reading unchecked with ratio null', () => {
    const file = reading('Cu', 0.8, 20);
    delete ((file.links as Obj[])[0] as Obj).device;
    const c = circuit(run(file), 'C1');
    expect(c.testLimit).toBeNull();
    expect(c.measured?.status).toBe('unchecked');
    expect(c.measured?.ratio).toBeNull();
    expectRel(c.measured?.corrected, 1.044, 1e-9); // still corrected
  });

  it('a protected link with no reading still has its test limit, and measured null', () => {
    const file = reading('Cu', 0.8, 20);
    delete ((file.links as Obj[])[0] as Obj).measured;
    const c = circuit(run(file), 'C1');
    expect(c.measured).toBeNull();
    expectRel(c.testLimit, 1.1749681, 1e-6);
  });

  it('Ia unknown (a curve that does not reach t_req): testLimit null, reading unchecked', () => {
    const file = reading('Cu', 0.8, 20);
    // t_req 0.4 s (socket-outlets, rating ≤ 63 A); the curve's shortest time is 1 s
    ((file.links as Obj[])[0] as Obj).device = { type: 'curve', rating: 20, points: [[60, 100], [300, 1]] };
    const c = circuit(run(file), 'C1');
    expect(c.tripCurrent).toBeNull();
    expect(c.testLimit).toBeNull();
    expect(c.measured?.status).toBe('unchecked');
    expect(c.measured?.ratio).toBeNull();
  });
});
