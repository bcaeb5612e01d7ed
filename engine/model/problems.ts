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

/** Show a bad value the way the user wrote it, briefly. */
export function showValue(value: unknown): string {
  if (value === undefined) return 'nothing';
  if (typeof value === 'string') return JSON.stringify(value.length > 40 ? `${value.slice(0, 40)}…` : value);
  if (typeof value === 'number') return Number.isNaN(value) ? 'NaN' : String(value);
  try {
    const text = JSON.stringify(value);
    return text.length > 60 ? `${text.slice(0, 60)}…` : text;
  } catch {
    return String(value);
  }
}
