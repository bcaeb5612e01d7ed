// Number and word formatting for the readable output. Rounding is for display only:
// the JSON results are never rounded.

import type { Cable, Status } from '../../engine/index.js';

const DASH = '–';

function fixed(value: number, digits: number): string {
  // A value past the range of numbers (a ratio near the largest number, times 100) is not a
  // figure to print: the table shows it as out of range, never "Infinity" or "NaN".
  if (!Number.isFinite(value)) return 'out of range';
  const text = value.toFixed(digits);
  return text === `-${(0).toFixed(digits)}` ? (0).toFixed(digits) : text;
}

/** Ω: three decimals, four below 0.1 Ω so small mains and submains still show. */
export function ohms(value: number | null): string {
  if (value === null) return DASH;
  return fixed(value, Math.abs(value) < 0.1 ? 4 : 3);
}

/** A current (A): whole amperes from 100 A, one decimal below. */
export function amps(value: number | null): string {
  if (value === null) return DASH;
  return Math.abs(value) >= 100 ? fixed(value, 0) : trim(fixed(value, 1));
}

/** A time (s), as briefly as it reads exactly: 0.4, 5, 0.02. */
export function seconds(value: number | null): string {
  if (value === null) return DASH;
  if (value > 0 && value < 0.001) return value.toPrecision(2);
  return trim(fixed(value, 3));
}

/** A length (m), one decimal. */
export function metres(value: number | null): string {
  if (value === null) return DASH;
  return fixed(value, 1);
}

/** A ratio as a whole percentage. */
export function percent(ratio: number | null): string {
  if (ratio === null) return DASH;
  return fixed(ratio * 100, 0);
}

function trim(text: string): string {
  return text.includes('.') ? text.replace(/0+$/, '').replace(/\.$/, '') : text;
}

/** A cable as the trade writes it: `2.5/2.5 Cu`, `2×95/50 Al`, `95 Al/50 Cu`. */
export function cableMark(cable: Cable): string {
  const sets = cable.parallel !== undefined && cable.parallel > 1 ? `${cable.parallel}×` : '';
  const earthMaterial = cable.earthMaterial ?? cable.material;
  const sizes =
    earthMaterial === cable.material
      ? `${cable.active}/${cable.earth} ${cable.material}`
      : `${cable.active} ${cable.material}/${cable.earth} ${earthMaterial}`;
  return `${sets}${sizes}`;
}

/** The status in plain words. */
export const STATUS_WORD: Record<Status, string> = {
  pass: 'pass',
  fail: 'FAIL',
  rcd: 'RCD-reliant',
  unchecked: 'unchecked',
};

/** The summary line: `12 pass, 1 fail, 1 RCD-reliant, 2 unchecked`. */
export function summaryLine(summary: Record<Status, number>): string {
  return `${summary.pass} pass, ${summary.fail} fail, ${summary.rcd} RCD-reliant, ${summary.unchecked} unchecked`;
}

/** Cut free text to a column width, marking the cut. */
export function clip(text: string, width: number): string {
  return text.length <= width ? text : `${text.slice(0, width - 1)}…`;
}

/** A percentage of U0 (a voltage drop): two decimals below 10 %, one above. */
export function dropPercent(value: number | null): string {
  if (value === null) return DASH;
  return fixed(value, Math.abs(value) >= 10 ? 1 : 2);
}

/** A prospective fault current in kA: two decimals below 10 kA, one above. */
export function kiloamps(value: number | null): string {
  if (value === null) return DASH;
  const ka = value / 1000;
  return fixed(ka, Math.abs(ka) >= 10 ? 1 : 2);
}

/** A computed cross-section (mm²), two decimals. */
export function area(value: number | null): string {
  if (value === null) return DASH;
  return fixed(value, 2);
}

/** A power factor, two decimals. */
export function powerFactor(value: number | null): string {
  if (value === null) return DASH;
  return fixed(value, 2);
}

/** The symbol shown before a status word, so a status never rests on one cue alone. */
export const STATUS_MARK: Record<Status, string> = {
  pass: '✓',
  fail: '✗',
  rcd: '!',
  unchecked: '–',
};

/** Symbol and word: `✓ pass`, `✗ FAIL`, `! RCD-reliant`, `– unchecked`. */
export function marked(status: Status): string {
  return `${STATUS_MARK[status]} ${STATUS_WORD[status]}`;
}

/** Counts of a check with no RCD case: `3 pass, 1 fail, 2 unchecked`. */
export function checkCountsLine(counts: { pass: number; fail: number; unchecked: number }): string {
  return `${counts.pass} pass, ${counts.fail} fail, ${counts.unchecked} unchecked`;
}
