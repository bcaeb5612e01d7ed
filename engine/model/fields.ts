// Small readers that check one field of a record and collect a problem when it is wrong.
// Every problem names where it is (`links[3] (C4)`), the field, the bad value and what is allowed.

import { showValue, type Problem, type Severity } from './problems.js';

export type Json = Record<string, unknown>;

export function isObject(value: unknown): value is Json {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}

/** A place in the file that problems are reported against. */
export class Site {
  private place: string | (() => string);

  /** `where` may be given as a function, so a record with no problem never builds its text. */
  constructor(
    readonly problems: Problem[],
    where: string | (() => string),
    readonly id?: string,
  ) {
    this.place = where;
  }

  get where(): string {
    if (typeof this.place === 'function') this.place = this.place();
    return this.place;
  }

  report(field: string, message: string, severity: Severity = 'error'): void {
    const p: Problem = { severity, where: this.where, field, message };
    if (this.id !== undefined) p.id = this.id;
    this.problems.push(p);
  }

  /** Report that `field` holds `value` but must be `allowed`. */
  bad(field: string, allowed: string, value: unknown): void {
    this.report(field, `${field} must be ${allowed}, got ${showValue(value)}`);
  }
}

export interface NumberRule {
  /** value ≥ min */
  min?: number;
  /** value > above */
  above?: number;
  /** value ≤ max */
  max?: number;
  /** value < below */
  below?: number;
  integer?: boolean;
}

export function describeRule(rule: NumberRule): string {
  const parts: string[] = [];
  if (rule.above !== undefined) parts.push(`> ${rule.above}`);
  if (rule.min !== undefined) parts.push(`≥ ${rule.min}`);
  if (rule.below !== undefined) parts.push(`< ${rule.below}`);
  if (rule.max !== undefined) parts.push(`≤ ${rule.max}`);
  const kind = rule.integer ? 'a whole number' : 'a number';
  return parts.length ? `${kind} ${parts.join(' and ')}` : kind;
}

export function fitsRule(value: number, rule: NumberRule): boolean {
  if (!Number.isFinite(value)) return false;
  if (rule.integer && !Number.isInteger(value)) return false;
  if (rule.min !== undefined && value < rule.min) return false;
  if (rule.above !== undefined && value <= rule.above) return false;
  if (rule.max !== undefined && value > rule.max) return false;
  if (rule.below !== undefined && value >= rule.below) return false;
  return true;
}

/**
 * Read a number field. Returns the number when valid, undefined otherwise (absent or bad);
 * a bad value, or a required one that is absent, is reported.
 */
export function readNumber(site: Site, obj: Json, key: string, rule: NumberRule, opts: { required?: boolean; path?: string } = {}): number | undefined {
  const field = opts.path ?? key;
  const value = obj[key];
  if (value === undefined) {
    if (opts.required) site.bad(field, describeRule(rule), value);
    return undefined;
  }
  if (typeof value !== 'number' || !fitsRule(value, rule)) {
    site.bad(field, describeRule(rule), value);
    return undefined;
  }
  return value;
}

export function readString(site: Site, obj: Json, key: string, opts: { required?: boolean; path?: string; nonEmpty?: boolean } = {}): string | undefined {
  const field = opts.path ?? key;
  const value = obj[key];
  // An optional text given as null reads as absent (other tools write null for "none").
  if (value === undefined || (value === null && !opts.required)) {
    if (opts.required) site.bad(field, opts.nonEmpty ? 'a non-empty text' : 'a text', value);
    return undefined;
  }
  if (typeof value !== 'string' || (opts.nonEmpty && value.trim() === '')) {
    site.bad(field, opts.nonEmpty ? 'a non-empty text' : 'a text', value);
    return undefined;
  }
  return value;
}

export function readChoice<T extends string | number>(site: Site, obj: Json, key: string, choices: readonly T[], opts: { required?: boolean; path?: string } = {}): T | undefined {
  const value = obj[key];
  if (value !== undefined && (choices as readonly unknown[]).includes(value)) return value as T;
  if (value !== undefined || opts.required) site.bad(opts.path ?? key, `one of ${choices.map((c) => JSON.stringify(c)).join(', ')}`, value);
  return undefined;
}

export function readBoolean(site: Site, obj: Json, key: string, opts: { path?: string } = {}): boolean | undefined {
  const value = obj[key];
  if (value === undefined) return undefined;
  if (typeof value !== 'boolean') {
    site.bad(opts.path ?? key, 'true or false', value);
    return undefined;
  }
  return value;
}

/** Read a nested object field; reports when present but not an object (or absent and required). */
export function readObject(site: Site, obj: Json, key: string, opts: { required?: boolean; path?: string } = {}): Json | undefined {
  const field = opts.path ?? key;
  const value = obj[key];
  if (value === undefined) {
    if (opts.required) site.bad(field, 'an object', value);
    return undefined;
  }
  if (!isObject(value)) {
    site.bad(field, 'an object', value);
    return undefined;
  }
  return value;
}
