// The notes' number formatting (tolerance.ts toFixed) must give exactly what
// Number.prototype.toFixed gives (ECMAScript's definition of toFixed: the nearest integer to
// v·10^digits, a tie going up), for every double and 0–9 digits: the fast path is only a way of
// getting there sooner, so every case is compared with toFixed itself.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { toFixed } from '../../engine/analysis/tolerance.js';

const digits = fc.integer({ min: 0, max: 9 });

describe('toFixed for notes', () => {
  it('equals Number.prototype.toFixed on any double', () => {
    fc.assert(
      fc.property(fc.double(), digits, (v, d) => {
        expect(toFixed(v, d)).toBe(v.toFixed(d));
      }),
      { numRuns: 20_000 },
    );
  });

  it('equals it on the values notes carry (ohms, amps, volts, percentages) and at ties', () => {
    const everyday = fc.oneof(
      fc.double({ min: -1e6, max: 1e6, noNaN: true }),
      fc.double({ min: 0, max: 10, noNaN: true }),
      // Decimal ties and their neighbours: k + 0.5 units of the last digit, one ulp either side.
      fc.tuple(fc.integer({ min: -1_000_000, max: 1_000_000 }), digits).map(([k, d]) => (k + 0.5) / 10 ** d),
      fc.tuple(fc.integer({ min: 0, max: 1_000_000 }), digits, fc.constantFrom(-1, 1)).map(([k, d, s]) => {
        const x = (k + 0.5) / 10 ** d;
        return x + s * Number.EPSILON * Math.max(1, Math.abs(x));
      }),
    );
    fc.assert(
      fc.property(everyday, digits, (v, d) => {
        expect(toFixed(v, d), `${v} to ${d}`).toBe(v.toFixed(d));
      }),
      { numRuns: 50_000 },
    );
  });

  it('equals it at the edges: zero of either sign, tiny, huge, non-finite, and known ties', () => {
    // 1.005 is stored just under 1.005, 1.255 just over, 2.5 and 0.125 exactly (common practice).
    const cases = [0, -0, 5e-324, -5e-324, 1e-7, 0.5, 1.5, 2.5, -2.5, 0.125, 1.005, 1.255, 10.235, 2 ** 52, 2 ** 53 + 2, 1e21, 1.7976931348623157e308, Infinity, -Infinity, NaN];
    for (const v of cases) for (let d = 0; d <= 9; d++) expect(toFixed(v, d), `${v} to ${d}`).toBe(v.toFixed(d));
    // Digits outside 0–9 are left to toFixed (it refuses more than 100).
    expect(toFixed(1 / 3, 12)).toBe((1 / 3).toFixed(12));
    expect(() => toFixed(1, 101)).toThrow(RangeError);
  });
});
