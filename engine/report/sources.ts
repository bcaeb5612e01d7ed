// How a supply's source impedance, its fault level and its headroom are described on the printout.

import type { SupplyResult } from '../analysis/results.js';
import type { Source, SupplyNode } from '../model/types.js';
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

/** A supply's headroom on one line beside its symbol: `max Ze 0.852 Ω (C07)`, `ask for Ze ≤ 0.852 Ω (C07)`. */
export function describeHeadroomShort(supply: SupplyNode, result: SupplyResult | undefined): string | null {
  if (result === undefined || result.maxZe === null) return null;
  const by = result.setBy !== null ? ` (${result.setBy})` : '';
  if (result.maxZe <= 0) return `no Ze headroom${by}`;
  if (supply.source.type === 'unknown') return `ask for Ze ≤ ${fmtOhm(result.maxZe)} Ω${by}`;
  return `max Ze ${fmtOhm(result.maxZe)} Ω${by}`;
}

/**
 * A supply's headroom as a sentence (method-depth.md §9): the largest source impedance for which
 * every circuit it feeds still passes, and the smallest prospective earth-fault current; for an
 * unknown source, worded as the figure to ask the distributor for.
 */
export function describeHeadroomLong(supply: SupplyNode, result: SupplyResult | undefined, u0: number): string {
  if (result === undefined) return 'Headroom not computed.';
  if (result.maxZe === null) return 'Headroom: none stated, the supply feeds no circuit that could be checked (a protective device with a known trip current).';
  const by = result.setBy !== null ? `, set by ${result.setBy}` : '';
  if (result.maxZe <= 0) {
    return `Headroom: none. No source impedance leaves every circuit passing: the drawn loop${result.setBy !== null ? ` of ${result.setBy}` : ''} alone uses the whole budget.`;
  }
  const current = result.minFaultCurrent !== null ? fmtCurrent(result.minFaultCurrent) : '—';
  if (supply.source.type === 'unknown') {
    return `Headroom: ask the distributor for a source impedance of at most ${fmtOhm(result.maxZe)} Ω (a prospective earth-fault current of at least ${current})${by}. Every circuit then passes for any source at least this strong.`;
  }
  const present = sourceMagnitude(supply.source, u0);
  return `Headroom: every circuit still passes with a source impedance up to ${fmtOhm(result.maxZe)} Ω (a prospective earth-fault current down to ${current})${by}; the source stated is ${fmtOhm(present)} Ω.`;
}

/** How the source impedance for fault levels was found (method-depth.md §5), and the result. */
export function describeFaultSource(supply: SupplyNode, result: SupplyResult | undefined, u0: number, cmax: number): string {
  const phases = result?.phases ?? supply.phases ?? 1;
  const level = result?.faultLevel ?? null;
  const at = level !== null ? ` Maximum prospective fault current at the terminals: ${fmtCurrent(level)}.` : '';
  if (supply.maxFault !== undefined) {
    const xr = supply.maxFault.xr ?? 1;
    const z = (cmax * u0) / supply.maxFault.current;
    return `Fault levels: the distributor's maximum prospective short-circuit current ${fmtCurrent(supply.maxFault.current)} (X/R ${fmtPlain(xr)}) as stated: Zsrc = cmax·U0/I = ${fmtOhm(z)} Ω.${at}`;
  }
  const ze = sourceMagnitude(supply.source, u0);
  if (ze !== null) {
    return phases === 3
      ? `Fault levels: no maximum fault current stated; Zsrc = Ze/2 = ${fmtOhm(ze / 2)} Ω for this three-phase supply (half the earth-fault loop taken as the phase path; common practice, from memory).${at}`
      : `Fault levels: no maximum fault current stated; Zsrc = Ze = ${fmtOhm(ze)} Ω for this single-phase supply (the whole loop, line out and back; common practice, from memory).${at}`;
  }
  return 'Fault levels: unknown (no maximum fault current stated and the source impedance unknown), so breaking capacity is not checked; state the distributor\'s maximum prospective fault current (maxFault) to check it.';
}
