// How a supply's source impedance is described on the printout.

import type { Source } from '../model/types.js';
import { fmtAmp, fmtOhm, fmtPlain } from './format.js';

/** |Ze| of a known source, Ω; null when unknown. Ze = U0 / Ipf for a stated fault current. */
export function sourceMagnitude(source: Source, u0: number): number | null {
  switch (source.type) {
    case 'unknown':
      return null;
    case 'impedance':
      return Math.hypot(source.r, source.x);
    case 'fault-current':
      return u0 / source.current;
  }
}

function fmtCurrent(a: number): string {
  return a >= 1000 ? `${fmtPlain(a / 1000)} kA` : `${fmtAmp(a)} A`;
}

/** One short line beside the supply symbol. */
export function describeSourceShort(source: Source, u0: number): string {
  switch (source.type) {
    case 'unknown':
      return 'Ze unknown (80 % method)';
    case 'impedance':
      return `Ze ${fmtOhm(sourceMagnitude(source, u0))} Ω`;
    case 'fault-current':
      return `Ipf ${fmtCurrent(source.current)}, Ze ${fmtOhm(sourceMagnitude(source, u0))} Ω`;
  }
}

/** A sentence for the assumptions sheet: the value, how it was obtained, and the method used. */
export function describeSourceLong(source: Source, u0: number, share: number): string {
  const pct = Math.round(share * 100);
  switch (source.type) {
    case 'unknown':
      return (
        `Source impedance unknown. The simplified method is used: each circuit may use ${pct} % of its loop ` +
        `budget c·U0/Ia from its protective device on, and the drawn links upstream of the device are tested ` +
        `against the remaining ${100 - pct} %.`
      );
    case 'impedance':
      return (
        `Ze = ${fmtOhm(source.r)} + j${fmtOhm(source.x)} Ω (|Ze| = ${fmtOhm(sourceMagnitude(source, u0))} Ω), as stated in the job. ` +
        'Zs at each far end is |Ze + Σ links from the supply|, checked against c·U0/Ia.'
      );
    case 'fault-current': {
      const xr = source.xr ?? 1;
      const z = u0 / source.current;
      const r = z / Math.sqrt(1 + xr * xr);
      return (
        `Prospective earth-fault current at the supply Ipf = ${fmtCurrent(source.current)}, X/R = ${fmtPlain(xr)}: ` +
        `Ze = U0/Ipf = ${fmtOhm(z)} Ω (R ${fmtOhm(r)} Ω, X ${fmtOhm(r * xr)} Ω). ` +
        'Zs at each far end is |Ze + Σ links from the supply|, checked against c·U0/Ia.'
      );
    }
  }
}
