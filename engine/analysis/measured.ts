// Measured results: a reading of Zs at a circuit's far end, corrected to the temperature the
// design assumes at fault, against the whole loop budget (method-depth.md §7).
//
//   ρθ = ρ20 · (1 + α · (θ − 20))     (ρ20 Cu 1/58, Al 0.028264 Ω·mm²/m; α Cu 0.00393,
//                                      Al 0.00403 /K: IEC 60028, IEC 60889, from memory)
//   F = ρf / ρθ                       (ρf: the design's fault resistivity of the active's metal)
//   corrected = Zem + (Zsm − Zem) · F (Zem: the supply's measured Ze; 0 when not measured)
//   ratio = corrected / B,  B = c · U0 / Ia;  test limit = Zem + (B − Zem) / F
// Rule "fixed-factor": F = 1 / measuredFactor (default 0.8: a reading must not exceed 80 % of
// the limit, the common rule of thumb; common practice).

import type { Link, Material } from '../model/types.js';
import { MEASURED_ALPHA, MEASURED_RHO20, type ResolvedRules } from './basis.js';

/** The correction factor F for a reading taken at `temperature` °C on a cable of `material`. */
export function correctionFactor(material: Material, temperature: number, rules: ResolvedRules): number {
  if (rules.measuredRule.value === 'fixed-factor') return 1 / rules.measuredFactor.value;
  const rhoTheta = MEASURED_RHO20[material] * (1 + MEASURED_ALPHA[material] * (temperature - 20));
  return rules.resistivity[material].value / rhoTheta;
}

export function readingTemperature(link: Link): number {
  return link.measured?.temperature ?? 20;
}

export function testLimit(budget: number, zem: number, factor: number): number {
  return zem + (budget - zem) / factor;
}

export function correctedReading(zsm: number, zem: number, factor: number): number {
  return zem + (zsm - zem) * factor;
}
