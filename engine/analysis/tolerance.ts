// Comparing two computed numbers: equal within a relative 1e-9 of the limit, so a ratio of
// 1.0000000000000002 passes (method-depth.md "Numbers at the edges"). Ranking uses exact values.

export const RELATIVE_TOLERANCE = 1e-9;

/** value ≤ limit, within the tolerance. */
export function atMost(value: number, limit: number): boolean {
  return value <= limit + Math.abs(limit) * RELATIVE_TOLERANCE;
}
