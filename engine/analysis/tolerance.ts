// Comparing two computed numbers: equal within a relative 1e-9 of the limit, so a ratio of
// 1.0000000000000002 passes (method-depth.md "Numbers at the edges"). Ranking uses exact values.

export const RELATIVE_TOLERANCE = 1e-9;

/** value ≤ limit, within the tolerance. */
export function atMost(value: number, limit: number): boolean {
  return value <= limit + Math.abs(limit) * RELATIVE_TOLERANCE;
}

const POW10 = [1, 1e1, 1e2, 1e3, 1e4, 1e5, 1e6, 1e7, 1e8, 1e9];
const ZEROS = '000000000';

/**
 * Exactly `v.toFixed(digits)`, for 0–9 digits, without its cost on the common case (notes are
 * written for every failing circuit). toFixed rounds the exact value of v·10^digits to the
 * nearest integer, a tie going up; the product computed in floating point is within half a unit
 * in its last place of that exact value, so rounding it gives the same integer unless a tie lies
 * that close, and there (and for values too large to hold as an integer, NaN or ±Infinity) this
 * asks toFixed itself. Checked against toFixed on every kind of double by tests/engine/fixed.test.ts.
 */
export function toFixed(v: number, digits: number): string {
  if (v < 0) return `-${toFixed(-v, digits)}`;
  const scale = POW10[digits];
  if (scale === undefined) return v.toFixed(digits);
  const p = v * scale;
  if (!(p < 2 ** 52)) return v.toFixed(digits);
  const whole = Math.floor(p);
  const frac = p - whole;
  // Within a few units in the last place of a tie: toFixed decides (exact decimal arithmetic).
  if (Math.abs(frac - 0.5) <= p * 2 ** -50) return v.toFixed(digits);
  const n = frac >= 0.5 ? whole + 1 : whole;
  const text = String(n);
  if (digits === 0) return text;
  const padded = text.length > digits ? text : ZEROS.slice(0, digits + 1 - text.length) + text;
  return `${padded.slice(0, padded.length - digits)}.${padded.slice(padded.length - digits)}`;
}

/**
 * A computed number for a note: `v.toFixed(digits)` and its unit, or "out of range" when an
 * extreme (valid) value made it NaN or ±Infinity: no output shows NaN or Infinity.
 */
export function fixedOrRange(v: number | null, digits: number, unit = ''): string {
  return v !== null && Number.isFinite(v) ? `${toFixed(v, digits)}${unit}` : 'out of range';
}
