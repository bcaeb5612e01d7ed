// The reporting check: walks a value against its definition (schema.ts) and reports every field
// that is wrong, with its path and what is allowed (`cable.length must be a number ≥ 0, got -5`).
// Run only on a record the quick check (generated/clean.ts) did not pass. No recursion that a
// file controls: definitions nest a fixed few levels, and lists are walked with loops.

import { describeRule, fitsRule, isObject, type Json, type Site } from './fields.js';
import { showValue } from './problems.js';
import type { ChoiceSpec, Field, MapSpec, NumberSpec, ObjectSpec, Spec, TextSpec } from './schema.js';

/** What a field must be, as the message says it. */
export function allowedText(spec: Spec): string {
  switch (spec.kind) {
    case 'number':
      return describeRule(spec.rule);
    case 'text':
      return spec.nonEmpty ? 'a non-empty text' : 'a text';
    case 'choice':
      return `one of ${spec.values.map((c) => JSON.stringify(c)).join(', ')}`;
    case 'boolean':
      return 'true or false';
    case 'object':
    case 'map':
      return 'an object';
    case 'points':
      return 'a list of at least two [current A, time s] points';
  }
}

/** Check the fields of `obj` (already known to be an object), paths starting with `prefix`. */
export function reportFields(site: Site, obj: Json, spec: ObjectSpec, prefix = ''): void {
  for (const f of spec.fields) reportField(site, obj, f, prefix);
  if (spec.variant) {
    const tag = obj[spec.variant.on];
    const cases = spec.variant.cases;
    if (typeof tag === 'string' && Object.prototype.hasOwnProperty.call(cases, tag)) {
      for (const f of cases[tag]!) reportField(site, obj, f, prefix);
    }
  }
}

function reportField(site: Site, obj: Json, f: Field, prefix: string): void {
  const path = prefix + f.key;
  const value = obj[f.key];
  const spec = f.spec;
  switch (spec.kind) {
    case 'number':
      return reportNumber(site, value, spec, path, f.required === true);
    case 'text':
      return reportText(site, value, spec, path, f.required === true);
    case 'choice':
      return reportChoice(site, value, spec, path, f.required === true);
    case 'boolean':
      if (value !== undefined && typeof value !== 'boolean') site.bad(path, 'true or false', value);
      return;
    case 'object':
      if (value === undefined) {
        if (f.required) site.bad(path, 'an object', value);
        return;
      }
      if (!isObject(value)) {
        site.bad(path, 'an object', value);
        return;
      }
      return reportFields(site, value, spec, `${path}.`);
    case 'map':
      return reportMap(site, value, spec, path, f.required === true);
    case 'points':
      return reportPoints(site, value, path);
  }
}

function reportNumber(site: Site, value: unknown, spec: NumberSpec, path: string, required: boolean): void {
  if (value === undefined) {
    if (required) site.bad(path, describeRule(spec.rule), value);
    return;
  }
  if (typeof value !== 'number' || !fitsRule(value, spec.rule)) site.bad(path, describeRule(spec.rule), value);
}

function reportText(site: Site, value: unknown, spec: TextSpec, path: string, required: boolean): void {
  // An optional text given as null reads as absent (other tools write null for "none").
  if (value === undefined || (value === null && !required)) {
    if (required) site.bad(path, allowedText(spec), value);
    return;
  }
  if (typeof value !== 'string' || (spec.nonEmpty && value.trim() === '')) site.bad(path, allowedText(spec), value);
}

function reportChoice(site: Site, value: unknown, spec: ChoiceSpec, path: string, required: boolean): void {
  if (value !== undefined && (spec.values as readonly unknown[]).includes(value)) return;
  if (value !== undefined || required) site.bad(path, allowedText(spec), value);
}

function reportMap(site: Site, value: unknown, spec: MapSpec, path: string, required: boolean): void {
  if (value === undefined) {
    if (required) site.bad(path, 'an object', value);
    return;
  }
  if (!isObject(value)) {
    site.bad(path, 'an object', value);
    return;
  }
  const list = spec.keys.map((k) => JSON.stringify(k));
  const use = list.length > 1 ? `${list.slice(0, -1).join(', ')} or ${list[list.length - 1]}` : list.join('');
  for (const key of Object.keys(value)) {
    if (!spec.keys.includes(key)) site.report(`${path}.${key}`, `${path}.${key} is not ${spec.noun}; use ${use}`);
    else reportNumber(site, value[key], spec.value, `${path}.${key}`, false);
  }
}

function reportPoints(site: Site, points: unknown, field: string): void {
  if (!Array.isArray(points) || points.length < 2) {
    site.bad(field, 'a list of at least two [current A, time s] points', points);
    return;
  }
  let previous: [number, number] | undefined;
  for (let i = 0; i < points.length; i++) {
    const point: unknown = points[i];
    const f = `${field}[${i}]`;
    const ok = Array.isArray(point) && point.length === 2 && point.every((v) => typeof v === 'number' && Number.isFinite(v) && v > 0);
    if (!ok) {
      site.bad(f, 'a pair [current A > 0, time s > 0]', point);
      previous = undefined;
      continue;
    }
    const [current, time] = point as [number, number];
    if (previous) {
      if (current <= previous[0]) site.report(f, `${f} current must rise from point to point: ${showValue(current)} A follows ${showValue(previous[0])} A`);
      if (time >= previous[1]) site.report(f, `${f} time must fall from point to point: ${showValue(time)} s follows ${showValue(previous[1])} s`);
    }
    previous = [current, time];
  }
}
