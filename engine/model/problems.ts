// A problem found while reading a job: where it is, which field, and what is wrong.
// Messages read like `links[3] (C4): cable.length must be a number ≥ 0, got -5`.

export type Severity = 'error' | 'warning';

export interface Problem {
  severity: Severity;
  /** Where: `links[3] (C4)`, `nodes[0] (S1)`, `rules`, `job`, or `file`. */
  where: string;
  /** The element's id when the problem belongs to one node or link. */
  id?: string;
  /** The field inside the element, dotted: `cable.length`; empty for the element itself. */
  field: string;
  /** The sentence after the location: `cable.length must be a number ≥ 0, got -5`. */
  message: string;
}

export function formatProblem(p: Problem): string {
  return `${p.where}: ${p.message}`;
}

/** Characters a terminal or a message box could act on or hide behind, written as \u escapes:
 *  DEL, the C1 controls and the bidirectional controls (JSON.stringify escapes only C0). */
const HIDDEN = /[\u007f-\u009f\u200b-\u200f\u2028\u2029\u202a-\u202e\u2060-\u2069\ufeff]/g;

function unhide(text: string): string {
  return text.replace(HIDDEN, (c) => `\\u${c.charCodeAt(0).toString(16).padStart(4, '0')}`);
}

/** At most `max` characters of `text`, never splitting a character made of two code units. */
function cut(text: string, max: number): string {
  if (text.length <= max) return text;
  let end = max;
  const last = text.charCodeAt(end - 1);
  if (last >= 0xd800 && last <= 0xdbff) end--;
  return `${text.slice(0, end)}…`;
}

/** Keeps JSON.stringify's work on a big bad value small: long texts and lists are cut first. */
function shorten(_key: string, v: unknown): unknown {
  if (typeof v === 'string') return cut(v, 40);
  if (Array.isArray(v) && v.length > 8) return [...v.slice(0, 8), '…'];
  if (typeof v === 'object' && v !== null && !Array.isArray(v)) {
    const keys = Object.keys(v);
    if (keys.length > 8) return Object.fromEntries([...keys.slice(0, 8).map((k) => [k, (v as Record<string, unknown>)[k]]), ['…', '…']]);
  }
  return v;
}

/** Show a bad value the way the user wrote it, briefly: texts cut to 40 characters, anything
 *  else to 60, control and invisible characters escaped. */
export function showValue(value: unknown): string {
  if (value === undefined) return 'nothing';
  if (typeof value === 'string') return unhide(JSON.stringify(cut(value, 40)));
  if (typeof value === 'number') return Number.isNaN(value) ? 'NaN' : String(value);
  try {
    const text = JSON.stringify(value, shorten);
    return unhide(cut(text, 60));
  } catch {
    return Array.isArray(value) ? 'a list' : typeof value === 'object' && value !== null ? 'an object' : String(value);
  }
}
