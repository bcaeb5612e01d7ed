// Rules: the basis (a named set of defaults) and the job's overrides of it.

import type { BasisName, Curve, Material, MeasuredRule, Rules } from './types.js';
import { isObject, readChoice, readNumber, readObject, Site, type Json } from './fields.js';

export const BASES: readonly BasisName[] = ['au-nz', 'iec'];
export const MATERIALS: readonly Material[] = ['Cu', 'Al'];
export const CURVES: readonly Curve[] = ['B', 'C', 'D'];
export const MEASURED_RULES: readonly MeasuredRule[] = ['temperature', 'fixed-factor'];

export function validateRules(value: unknown, site: Site): Rules {
  if (value === undefined) return { basis: 'au-nz' };
  if (!isObject(value)) {
    site.bad('rules', 'an object', value);
    return { basis: 'au-nz' };
  }
  const raw: Json = value;
  const rules: Json = { ...raw };
  const basis = raw.basis === undefined ? 'au-nz' : readChoice(site, raw, 'basis', BASES);
  rules.basis = basis ?? 'au-nz';
  readNumber(site, raw, 'voltage', { above: 0, max: 1000 });
  readNumber(site, raw, 'voltageFactor', { above: 0, max: 2 });
  readNumber(site, raw, 'unknownSourceShare', { above: 0, below: 1 });
  readNumber(site, raw, 'reactance', { min: 0, max: 0.01 });
  for (const field of ['resistivity', 'voltageDropResistivity', 'shortCircuitResistivity']) {
    const rho = readObject(site, raw, field);
    if (!rho) continue;
    for (const key of Object.keys(rho)) {
      if (!(MATERIALS as readonly string[]).includes(key)) site.report(`${field}.${key}`, `${field}.${key} is not a conductor material; use "Cu" or "Al"`);
      else readNumber(site, rho, key, { above: 0, max: 1 }, { path: `${field}.${key}` });
    }
  }
  readNumber(site, raw, 'voltageDropLimit', { above: 0, max: 100 });
  readNumber(site, raw, 'maxVoltageFactor', { above: 0, max: 2 });
  readChoice(site, raw, 'measuredRule', MEASURED_RULES);
  readNumber(site, raw, 'measuredFactor', { above: 0, max: 1 });
  const multiples = readObject(site, raw, 'multiples');
  if (multiples) {
    for (const key of Object.keys(multiples)) {
      if (!(CURVES as readonly string[]).includes(key)) site.report(`multiples.${key}`, `multiples.${key} is not a breaker curve; use "B", "C" or "D"`);
      else readNumber(site, multiples, key, { above: 0, max: 100 }, { path: `multiples.${key}` });
    }
  }
  return rules as unknown as Rules;
}
