// The pieces the record checks share: where a problem is (Site), number rules and their words.
// The records' fields are defined in schema.ts and checked by check-spec.ts. Every problem names
// where it is (`links[3] (C4)`), the field, the bad value and what is allowed.

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
