// Maximum length of a link: the length at which its own far end just meets its limit, with
// every other length unchanged. Solve |A + L·z| = B for L ≥ 0:
//
//   |z|² L² + 2 (A·z) L + |A|² − B² = 0,   A·z = Ar·zr + Ax·zx
//
// A is the impedance before the link (Ze included when known; from the protecting link's origin
// when the source is unknown), z the link's impedance per metre, B the limit. Take the positive
// root; 0 when A alone already reaches B.

import { magnitude, type Complex } from './complex.js';

export function maxLength(before: Complex, perMetre: Complex, limit: number): number {
  if (magnitude(before) >= limit) return 0;
  const a = perMetre.re * perMetre.re + perMetre.im * perMetre.im;
  const b = before.re * perMetre.re + before.im * perMetre.im; // half the linear coefficient
  const c = before.re * before.re + before.im * before.im - limit * limit; // < 0 here
  if (a === 0) return Number.POSITIVE_INFINITY;
  return (-b + Math.sqrt(b * b - a * c)) / a;
}
