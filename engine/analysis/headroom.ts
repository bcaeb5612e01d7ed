// Source headroom (method-depth.md §9): for each supply, the largest source impedance for which
// every checked circuit it feeds still passes, and the smallest prospective earth-fault current.
//
// For a link with loop Σ (supply to far end, Ze excluded) and budget B = c · U0 / Ia, solve
// |Ze · u + Σ| = B for |Ze|, u the unit phasor of the source's angle:
//   h = u.re · Σ.re + u.im · Σ.im;   |Ze| = −h + √(h² − |Σ|² + B²);   0 when |Σ| ≥ B.
// maxZe is the least over the links; minFaultCurrent = U0 / maxZe (null when maxZe is 0).
// For an unknown source (u = 1, purely resistive) it is the figure to ask the distributor for.

import type { Source } from '../model/types.js';
import type { Complex } from './complex.js';

export function sourcePhasor(source: Source): Complex {
  if (source.type === 'impedance') {
    const m = Math.hypot(source.r, source.x);
    return m > 0 ? { re: source.r / m, im: source.x / m } : { re: 1, im: 0 };
  }
  if (source.type === 'fault-current') {
    const xr = source.xr ?? 1;
    const m = Math.sqrt(1 + xr * xr);
    return { re: 1 / m, im: xr / m };
  }
  return { re: 1, im: 0 };
}

/** The largest |Ze| for which |Ze · u + Σ| ≤ B. */
export function largestSource(u: Complex, loop: Complex, budget: number): number {
  return largestSourceOf(u, loop.re, loop.im, budget);
}

/** largestSource with the loop Σ as its two parts. */
export function largestSourceOf(u: Complex, re: number, im: number, budget: number): number {
  const m2 = re * re + im * im;
  if (m2 >= budget * budget) return 0;
  const h = u.re * re + u.im * im;
  return -h + Math.sqrt(h * h - m2 + budget * budget);
}
