// Comparing two computed numbers: equal within a relative 1e-9 of the limit, so a ratio of
// 1.0000000000000002 passes (method-depth.md "Numbers at the edges"). Ranking uses exact values.

export const RELATIVE_TOLERANCE = 1e-9;

/** value ≤ limit, within the tolerance. */
export function atMost(value: number, limit: number): boolean {
  return value <= limit + Math.abs(limit) * RELATIVE_TOLERANCE;
}

/**
 * A computed number for a note: `v.toFixed(digits)` and its unit, or "out of range" when an
 * extreme (valid) value made it NaN or ±Infinity: no output shows NaN or Infinity.
 */
export function fixedOrRange(v: number | null, digits: number, unit = ''): string {
  return v !== null && Number.isFinite(v) ? `${v.toFixed(digits)}${unit}` : 'out of range';
}
