// Local checks on what was typed into a number field, before the store and the engine see it.
// The engine's validation (through the store) is the final word; these catch plain typing
// mistakes early with a message that names the field and the bad text.

export interface NumberRule {
  /** Field label used in messages, e.g. "Length". */
  label: string;
  unit?: string;
  /** value ≥ min */
  min?: number;
  /** value > above */
  above?: number;
  /** value ≤ max */
  max?: number;
  integer?: boolean;
  /** Empty text clears the value (the field is optional). */
  optional?: boolean;
  /** Shown value = stored value × scale (e.g. 1000 to show A as mA). */
  scale?: number;
}

export type Parsed = { ok: true; value: number | undefined } | { ok: false; reason: string };

const NUMBER = /^[+-]?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?$/;

export function parseNumber(text: string, rule: NumberRule): Parsed {
  const t = text.trim();
  const unit = rule.unit ? ` ${rule.unit}` : '';
  if (t === '') {
    if (rule.optional) return { ok: true, value: undefined };
    return { ok: false, reason: `${rule.label} needs a number${unit ? ` (in${unit})` : ''}` };
  }
  if (!NUMBER.test(t)) {
    const hint = /^\d+,\d+$/.test(t) ? ' (use a point for decimals)' : '';
    return { ok: false, reason: `${rule.label}: "${t}" is not a number${hint}` };
  }
  const shown = Number(t);
  if (!Number.isFinite(shown)) return { ok: false, reason: `${rule.label}: "${t}" is out of range` };
  if (rule.integer && !Number.isInteger(shown)) {
    return { ok: false, reason: `${rule.label} must be a whole number, got ${t}` };
  }
  if (rule.min !== undefined && shown < rule.min) {
    return { ok: false, reason: `${rule.label} must be ≥ ${rule.min}${unit}, got ${t}` };
  }
  if (rule.above !== undefined && shown <= rule.above) {
    return { ok: false, reason: `${rule.label} must be greater than ${rule.above}${unit}, got ${t}` };
  }
  if (rule.max !== undefined && shown > rule.max) {
    return { ok: false, reason: `${rule.label} must be ≤ ${rule.max}${unit}, got ${t}` };
  }
  const scale = rule.scale ?? 1;
  // Undo the display scale without adding floating-point noise (30 mA → 0.03 A, not 0.030000000000000002).
  const value = scale === 1 ? shown : Number((shown / scale).toPrecision(12));
  return { ok: true, value };
}

/** The text shown for a stored value. */
export function showNumber(value: number | undefined | null, scale = 1): string {
  if (value === undefined || value === null) return '';
  if (scale === 1) return String(value);
  return String(Number((value * scale).toPrecision(12)));
}
