// Rules: the basis (a named set of defaults) and the job's overrides of it. The fields are
// defined in schema.ts (RULES).

import type { BasisName, Curve, Material, MeasuredRule, Rules } from './types.js';
import { isObject, Site, type Json } from './fields.js';
import { reportFields } from './check-spec.js';
import { cleanRules } from './generated/clean.js';
import * as schema from './schema.js';

export const BASES: readonly BasisName[] = schema.BASES;
export const MATERIALS: readonly Material[] = schema.MATERIALS;
export const CURVES: readonly Curve[] = schema.CURVES;
export const MEASURED_RULES: readonly MeasuredRule[] = schema.MEASURED_RULES;

export function validateRules(value: unknown, site: Site): Rules {
  if (value === undefined) return { basis: 'au-nz' };
  if (!isObject(value)) {
    site.bad('rules', 'an object', value);
    return { basis: 'au-nz' };
  }
  const raw: Json = value;
  if (!cleanRules(raw)) reportFields(site, raw, schema.RULES);
  const basis = (BASES as readonly unknown[]).includes(raw.basis) ? (raw.basis as BasisName) : 'au-nz';
  return { ...raw, basis } as unknown as Rules;
}
