// Maximum length of a link: the length at which its own far end just meets its limit, with
// every other length unchanged. Solve |A + L·z| = B for L ≥ 0:
//
//   |z|² L² + 2 (A·z) L + |A|² − B² = 0,   A·z = Ar·zr + Ax·zx
//
// A is the impedance before the link (Ze included when known; from the protecting link's origin
// when the source is unknown), z the link's impedance per metre, B the limit. Take the positive
// root; 0 when A alone already reaches B.

import { abs, type Complex } from './complex.js';

export function maxLength(before: Complex, perMetre: Complex, limit: number): number {
  return maxLengthOf(before.re, before.im, perMetre.re, perMetre.im, limit);
}

/** maxLength with A and z as their parts. */
export function maxLengthOf(beforeRe: number, beforeIm: number, zRe: number, zIm: number, limit: number): number {
  if (abs(beforeRe, beforeIm) >= limit) return 0;
  const a = zRe * zRe + zIm * zIm;
  const b = beforeRe * zRe + beforeIm * zIm; // half the linear coefficient
  const c = beforeRe * beforeRe + beforeIm * beforeIm - limit * limit; // < 0 here
  if (a === 0) return Number.POSITIVE_INFINITY;
  return (-b + Math.sqrt(b * b - a * c)) / a;
}
