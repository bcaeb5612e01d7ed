// Impedance of one link around the earth-fault loop: out on the active, back on the protective earth.
//
//   R = (ρa · L / Sa + ρe · L / Se) / n
//   X = 2 · x · L / n

import type { Cable } from '../model/types.js';
import type { Complex } from './complex.js';
import type { ResolvedRules } from './basis.js';

/** The loop impedance of a cable per metre of route length (Ω/m). */
export function impedancePerMetre(cable: Cable, rules: ResolvedRules): Complex {
  const rhoActive = rules.resistivity[cable.material].value;
  const rhoEarth = rules.resistivity[cable.earthMaterial ?? cable.material].value;
  const n = cable.parallel ?? 1;
  const x = cable.reactance ?? rules.reactance.value;
  return {
    re: (rhoActive / cable.active + rhoEarth / cable.earth) / n,
    im: (2 * x) / n,
  };
}

/** The loop impedance of a whole cable (Ω). */
export function linkImpedance(cable: Cable, rules: ResolvedRules): Complex {
  const z = impedancePerMetre(cable, rules);
  return { re: z.re * cable.length, im: z.im * cable.length };
}

/** linkImpedance of `cable` written into re[l] and im[l] (the same arithmetic, no object). */
export function linkImpedanceInto(cable: Cable, rules: ResolvedRules, re: Float64Array, im: Float64Array, l: number): void {
  const rhoActive = rules.resistivity[cable.material].value;
  const rhoEarth = rules.resistivity[cable.earthMaterial ?? cable.material].value;
  const n = cable.parallel ?? 1;
  const x = cable.reactance ?? rules.reactance.value;
  re[l] = ((rhoActive / cable.active + rhoEarth / cable.earth) / n) * cable.length;
  im[l] = ((2 * x) / n) * cable.length;
}
