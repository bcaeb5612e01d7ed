// Display helpers shared by the panels: numbers with units, and the status vocabulary
// (symbol + word + colour together, never colour alone).

import type { CheckStatus, Status } from '../../../engine/index.js';
import { STATUS_SYMBOL, STATUS_WORD } from '../sheet/labels.js';

/** Ω to 3 decimals below 10 Ω, fewer above; '—' for null. */
export function ohms(z: number | null | undefined): string {
  if (z === null || z === undefined || !Number.isFinite(z)) return '—';
  return `${z < 10 ? z.toFixed(3) : z < 100 ? z.toFixed(2) : z.toFixed(1)} Ω`;
}

/** Ohms without the unit, for tables whose column head carries it. */
export function ohmsValue(z: number | null | undefined): string {
  return ohms(z).replace(' Ω', '');
}

/** A ratio as a percentage without the sign, for tables whose column head carries it. */
export function percentValue(ratio: number | null | undefined): string {
  return percent(ratio).replace(' %', '');
}

/** A plain number, trimmed of trailing zeros, with an optional unit. */
export function num(v: number | null | undefined, digits = 2, unit = ''): string {
  if (v === null || v === undefined || !Number.isFinite(v)) return '—';
  const text = Number(v.toFixed(digits)).toString();
  return unit ? `${text} ${unit}` : text;
}

export function amps(v: number | null | undefined): string {
  if (v === null || v === undefined || !Number.isFinite(v)) return '—';
  return v >= 1000 ? `${num(v / 1000, 2)} kA (${Math.round(v)} A)` : `${num(v, 1)} A`;
}

export function seconds(v: number | null | undefined): string {
  return num(v, 3, 's');
}

export function percent(ratio: number | null | undefined): string {
  if (ratio === null || ratio === undefined || !Number.isFinite(ratio)) return '—';
  return `${(ratio * 100).toFixed(ratio < 10 ? 1 : 0)} %`;
}

export function metres(v: number | null | undefined): string {
  return num(v, 1, 'm');
}

export interface StatusLook {
  symbol: string;
  word: string;
  /** CSS class carrying the colour; the symbol and word carry the meaning. */
  className: string;
}

// The same symbol and word as the drawing uses, so the panels and the sheet never disagree.
export const STATUS_LOOK: Record<Status, StatusLook> = {
  pass: { symbol: STATUS_SYMBOL.pass, word: STATUS_WORD.pass, className: 'lwp-status-pass' },
  fail: { symbol: STATUS_SYMBOL.fail, word: STATUS_WORD.fail, className: 'lwp-status-fail' },
  rcd: { symbol: STATUS_SYMBOL.rcd, word: STATUS_WORD.rcd, className: 'lwp-status-rcd' },
  unchecked: { symbol: STATUS_SYMBOL.unchecked, word: STATUS_WORD.unchecked, className: 'lwp-status-unchecked' },
};

// Role words: the same as the printout and the CLI use (short for narrow columns).
export { ROLE_SHORT, ROLE_LONG } from '../../../engine/report/index.js';

/** The look of a check that has no RCD case (voltage, capacity, breaking, withstand). */
export const CHECK_LOOK: Record<CheckStatus, StatusLook> = {
  pass: STATUS_LOOK.pass,
  fail: STATUS_LOOK.fail,
  unchecked: STATUS_LOOK.unchecked,
};

/** A voltage drop given in % of U0; '—' for null. */
export function dropPercent(v: number | null | undefined): string {
  return num(v, 2, '%');
}

/** A fault level: kA with the amps beside, or '—'. */
export function kiloamps(v: number | null | undefined): string {
  if (v === null || v === undefined || !Number.isFinite(v)) return '—';
  return `${num(v / 1000, 2)} kA`;
}

/** An area in mm², to two decimals (a minimum area is not rounded up to a standard size here). */
export function squareMm(v: number | null | undefined): string {
  return num(v, 2, 'mm²');
}

/** cos φ to two decimals. */
export function powerFactor(v: number | null | undefined): string {
  return num(v, 2);
}

// The checks of a verdict and their words: the same as the sheet's labels use.
export { CHECKS, checkStatuses, failingChecks, shownVerdict, verdictText, type CheckKey } from '../sheet/labels.js';
