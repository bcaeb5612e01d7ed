// What one cell of the testing view does to a link's reading (pure, tested directly).
import type { LinkReading } from '../../../../engine/index.js';
import type { ReadingExtras } from './view.js';

export type ReadingField = 'zs' | 'temperature' | 'date' | 'instrument';
export const READING_FIELDS: readonly ReadingField[] = ['zs', 'temperature', 'date', 'instrument'];

export type ReadingChange =
  /** The link's new `measured` (undefined: the reading is removed). */
  | { kind: 'reading'; measured: LinkReading | undefined }
  /** No reading yet: keep what was typed until the Zs comes. */
  | { kind: 'draft'; draft: ReadingExtras }
  | { kind: 'none' };

/**
 * The change one committed cell makes. A Zs on a row with no reading starts one from the day's
 * defaults and what was typed on the row before; clearing the Zs removes the reading; the other
 * cells change only their own key (empty removes it).
 */
export function readingChange(
  current: LinkReading | undefined,
  field: ReadingField,
  value: number | string | undefined,
  defaults: ReadingExtras,
  draft: ReadingExtras | undefined,
): ReadingChange {
  if (field === 'zs') {
    if (value === undefined) return current ? { kind: 'reading', measured: undefined } : { kind: 'none' };
    if (typeof value !== 'number') return { kind: 'none' };
    const base = current ?? { ...defaults, ...(draft ?? {}) };
    return { kind: 'reading', measured: tidy({ ...base, zs: value }) };
  }
  if (current) return { kind: 'reading', measured: tidy({ ...current, [field]: value }) };
  return { kind: 'draft', draft: { ...(draft ?? {}), [field]: value } };
}

/** Keys in the format's order, without undefined ones (so saving writes a tidy object). */
function tidy(r: LinkReading): LinkReading {
  return {
    zs: r.zs,
    ...(r.temperature !== undefined ? { temperature: r.temperature } : {}),
    ...(r.date !== undefined && r.date !== '' ? { date: r.date } : {}),
    ...(r.instrument !== undefined && r.instrument !== '' ? { instrument: r.instrument } : {}),
  };
}
