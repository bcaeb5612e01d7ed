// The bases: named sets of default values, each with its source. A job's rules may override them.

import type { BasisName, Curve, Material, MeasuredRule, Rules } from '../model/types.js';

export interface RuleValue {
  value: number;
  source: string;
  overridden: boolean;
}

export interface ResolvedRules {
  basis: BasisName;
  /** U0, V */
  voltage: RuleValue;
  /** c */
  voltageFactor: RuleValue;
  /** s */
  unknownSourceShare: RuleValue;
  /** x per conductor, Ω/m */
  reactance: RuleValue;
  /** ρ at fault temperature, Ω·mm²/m */
  resistivity: Record<Material, RuleValue>;
  /** instantaneous trip multiples of In */
  multiples: Record<Curve, RuleValue>;
  /** Where the required disconnection times come from. */
  timeSource: string;
  /** ρ in normal service for the voltage drop, Ω·mm²/m (method-depth.md §3). */
  voltageDropResistivity: Record<Material, RuleValue>;
  /** The job-wide voltage-drop limit override (%), or null: the basis limits by use apply. */
  voltageDropLimit: RuleValue | null;
  /** The basis voltage-drop limits, % of U0, by the point's use ('lighting' or any other). */
  voltageDropLimits: { lighting: RuleValue; other: RuleValue };
  /** cmax, the voltage factor for maximum fault currents (method-depth.md §5). */
  maxVoltageFactor: RuleValue;
  /** ρ20 for fault levels, Ω·mm²/m (method-depth.md §5). */
  shortCircuitResistivity: Record<Material, RuleValue>;
  /** How measured readings are corrected (method-depth.md §7). */
  measuredRule: { value: MeasuredRule; source: string; overridden: boolean };
  /** The fixed factor for `measuredRule: "fixed-factor"`. */
  measuredFactor: RuleValue;
  /** Default power factor of a load whose own is not given. */
  powerFactor: RuleValue;
}

/** ρ20 and α for correcting a measured reading to its temperature (IEC 60028, IEC 60889, from memory). */
export const MEASURED_RHO20: Record<Material, number> = { Cu: 1 / 58, Al: 0.028264 };
export const MEASURED_ALPHA: Record<Material, number> = { Cu: 0.00393, Al: 0.00403 };
export const MEASURED_SOURCE = 'ρθ = ρ20 · (1 + α(θ − 20)), ρ20 Cu 1/58, Al 0.028264 Ω·mm²/m; α Cu 0.00393, Al 0.00403 /K (IEC 60028, IEC 60889, from memory)';

const VD_RHO_SOURCE = 'normal service, 1.25 × ρ20 (IEC 60364-5-52 Annex G)';
const SC_RHO_SOURCE = 'at 20 °C for maximum fault levels (IEC 60909-0, from memory; consistent with IEC 60228 class 2)';

interface BasisDefaults {
  voltage: [number, string];
  voltageFactor: [number, string];
  unknownSourceShare: [number, string];
  reactance: [number, string];
  resistivity: Record<Material, [number, string]>;
  multiples: Record<Curve, [number, string]>;
  timeSource: string;
  voltageDropLimits: { lighting: [number, string]; other: [number, string] };
}

/** IEC resistivity at the fault temperature θ = 70 °C: ρ20 · (1 + α(θ − 20)). */
function iecResistivity(rho20: number, alpha: number): number {
  return rho20 * (1 + alpha * (70 - 20));
}

const REACTANCE_SOURCE = '0.08 mΩ/m per conductor, common practice for multicore cables (from memory)';

export const BASIS_DEFAULTS: Record<BasisName, BasisDefaults> = {
  'au-nz': {
    voltage: [230, 'AS/NZS 3000:2018, nominal 230 V phase to earth'],
    voltageFactor: [1.0, 'AS/NZS 3000:2018 Appendix B (no voltage factor applied)'],
    unknownSourceShare: [0.8, 'AS/NZS 3000:2018 Appendix B, clause B5.2.2 (80 % of the supply voltage at the circuit)'],
    reactance: [0.08e-3, REACTANCE_SOURCE],
    resistivity: {
      Cu: [0.0225, 'AS/NZS 3000:2018 clause B5.2.2 (1.25 × ρ20, as IEC 60364-5-52 Annex G)'],
      Al: [0.036, 'AS/NZS 3000:2018 clause B5.2.2 (1.25 × ρ20, as IEC 60364-5-52 Annex G)'],
    },
    multiples: {
      B: [4, 'AS/NZS 3000:2018 Table B5.1 note'],
      C: [7.5, 'AS/NZS 3000:2018 Table B5.1 note'],
      D: [12.5, 'AS/NZS 3000:2018 Table B5.1 note'],
    },
    timeSource: 'AS/NZS 3000:2018 clause 5.7.4 (from memory): 0.4 s for final subcircuits to socket-outlets ≤ 63 A or hand-held Class I or portable equipment; 5 s otherwise',
    voltageDropLimits: {
      lighting: [5, 'AS/NZS 3000:2018 clause 3.6.2, 5 % for every use (from memory)'],
      other: [5, 'AS/NZS 3000:2018 clause 3.6.2, 5 % for every use (from memory)'],
    },
  },
  iec: {
    voltage: [230, 'IEC 60038, nominal 230 V phase to earth'],
    voltageFactor: [1.0, 'method default (0.95 is common UK and CENELEC practice)'],
    unknownSourceShare: [0.8, 'simplified method: 80 % of the loop budget for the circuit'],
    reactance: [0.08e-3, REACTANCE_SOURCE],
    resistivity: {
      Cu: [iecResistivity(1 / 58, 0.00393), 'IEC 60028: ρ20 = 1/58 Ω·mm²/m, α = 0.00393 /K, at 70 °C (from memory)'],
      Al: [iecResistivity(0.028264, 0.00403), 'IEC 60889: ρ20 = 0.028264 Ω·mm²/m, α = 0.00403 /K, at 70 °C (from memory)'],
    },
    multiples: {
      B: [5, 'IEC 60898-1, upper end of the type B instantaneous range 3–5 In (from memory)'],
      C: [10, 'IEC 60898-1, upper end of the type C instantaneous range 5–10 In (from memory)'],
      D: [20, 'IEC 60898-1, upper end of the type D instantaneous range 10–20 In (from memory)'],
    },
    timeSource: 'IEC 60364-4-41:2005 Table 41.1 and 411.3.2.3, TN system, 230 V (from memory): 0.4 s for final circuits ≤ 32 A; 5 s for distribution circuits and final circuits above 32 A',
    voltageDropLimits: {
      lighting: [3, 'IEC 60364-5-52:2009 Table G.52.1, lighting, supplied from a public low-voltage network'],
      other: [5, 'IEC 60364-5-52:2009 Table G.52.1, other uses, supplied from a public low-voltage network'],
    },
  },
};

function pick(defaults: [number, string], override: number | undefined): RuleValue {
  if (override !== undefined) return { value: override, source: 'set in this job (overrides the basis)', overridden: true };
  return { value: defaults[0], source: defaults[1], overridden: false };
}

export function resolveRules(rules: Rules): ResolvedRules {
  const basis: BasisName = rules.basis === 'iec' ? 'iec' : 'au-nz';
  const d = BASIS_DEFAULTS[basis];
  return {
    basis,
    voltage: pick(d.voltage, rules.voltage),
    voltageFactor: pick(d.voltageFactor, rules.voltageFactor),
    unknownSourceShare: pick(d.unknownSourceShare, rules.unknownSourceShare),
    reactance: pick(d.reactance, rules.reactance),
    resistivity: {
      Cu: pick(d.resistivity.Cu, rules.resistivity?.Cu),
      Al: pick(d.resistivity.Al, rules.resistivity?.Al),
    },
    multiples: {
      B: pick(d.multiples.B, rules.multiples?.B),
      C: pick(d.multiples.C, rules.multiples?.C),
      D: pick(d.multiples.D, rules.multiples?.D),
    },
    timeSource: d.timeSource,
    voltageDropResistivity: {
      Cu: pick([0.0225, VD_RHO_SOURCE], rules.voltageDropResistivity?.Cu),
      Al: pick([0.036, VD_RHO_SOURCE], rules.voltageDropResistivity?.Al),
    },
    voltageDropLimit: rules.voltageDropLimit !== undefined ? pick([0, ''], rules.voltageDropLimit) : null,
    voltageDropLimits: { lighting: pick(d.voltageDropLimits.lighting, undefined), other: pick(d.voltageDropLimits.other, undefined) },
    maxVoltageFactor: pick([1.1, 'IEC 60909-0:2016 Table 1, low voltage, systems with +10 % tolerance (from memory)'], rules.maxVoltageFactor),
    shortCircuitResistivity: {
      Cu: pick([0.0185, SC_RHO_SOURCE], rules.shortCircuitResistivity?.Cu),
      Al: pick([0.0294, SC_RHO_SOURCE], rules.shortCircuitResistivity?.Al),
    },
    measuredRule:
      rules.measuredRule !== undefined
        ? { value: rules.measuredRule, source: 'set in this job (overrides the basis)', overridden: true }
        : { value: 'temperature', source: `correction to fault temperature: ${MEASURED_SOURCE}`, overridden: false },
    measuredFactor: pick([0.8, 'a reading must not exceed 80 % of the limit (common practice rule of thumb)'], rules.measuredFactor),
    powerFactor: pick([0.8, 'IEC 60364-5-52 Annex G uses cos φ = 0.8 where the real value is unknown (from memory)'], undefined),
  };
}
