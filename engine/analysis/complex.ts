// Complex impedance Z = R + jX (Ω). Loop impedances are summed as complex numbers;
// the magnitude is taken only at the end.

export interface Complex {
  re: number;
  im: number;
}

export const ZERO: Complex = { re: 0, im: 0 };

export function add(a: Complex, b: Complex): Complex {
  return { re: a.re + b.re, im: a.im + b.im };
}

export function sub(a: Complex, b: Complex): Complex {
  return { re: a.re - b.re, im: a.im - b.im };
}

export function scale(a: Complex, k: number): Complex {
  return { re: a.re * k, im: a.im * k };
}

export function magnitude(a: Complex): number {
  return abs(a.re, a.im);
}

/** |re + j·im|: the square root of the sum of squares, which is much quicker than Math.hypot,
 *  falling back to Math.hypot where the squares would overflow or underflow. */
export function abs(re: number, im: number): number {
  const m = Math.sqrt(re * re + im * im);
  return m < 1e150 && m > 1e-150 ? m : Math.hypot(re, im);
}

export function sum(values: readonly Complex[]): Complex {
  let re = 0;
  let im = 0;
  for (const v of values) {
    re += v.re;
    im += v.im;
  }
  return { re, im };
}
