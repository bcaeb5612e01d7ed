// The source impedance Ze at a supply, when it is known.
//
// Given directly as R + jX, or from the prospective earth-fault current Ipf at the supply:
//   |Ze| = U0 / Ipf,  R = |Ze| / √(1 + (X/R)²),  X = R · X/R   (X/R defaults to 1)

import type { Source } from '../model/types.js';
import type { Complex } from './complex.js';

/** Ze, or null when the source impedance is unknown. */
export function sourceImpedance(source: Source, voltage: number): Complex | null {
  switch (source.type) {
    case 'impedance':
      return { re: source.r, im: source.x };
    case 'fault-current': {
      const xr = source.xr ?? 1;
      const ze = voltage / source.current;
      const r = ze / Math.sqrt(1 + xr * xr);
      return { re: r, im: r * xr };
    }
    default:
      return null;
  }
}
