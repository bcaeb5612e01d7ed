// Standard nominal conductor areas (IEC 60228). Another size is accepted with a warning.

import type { Cable, Link } from './types.js';
import type { Problem } from './problems.js';

export const STANDARD_SIZES: readonly number[] = [1, 1.5, 2.5, 4, 6, 10, 16, 25, 35, 50, 70, 95, 120, 150, 185, 240, 300, 400, 500, 630];

export function isStandardSize(area: number): boolean {
  return STANDARD_SIZES.some((s) => Math.abs(s - area) < 1e-9);
}

/** Plain-words notes for the non-standard areas of one cable. */
export function sizeNotes(cable: Cable): string[] {
  const notes: string[] = [];
  for (const key of ['active', 'earth'] as const) {
    const area = cable[key];
    if (typeof area === 'number' && !isStandardSize(area)) {
      notes.push(`cable.${key} ${area} mm² is not a standard nominal area (IEC 60228); check it is available`);
    }
  }
  return notes;
}

export function sizeWarnings(links: Array<{ item: Link; index: number }>): Problem[] {
  const out: Problem[] = [];
  for (const { item, index } of links) {
    if (!item.cable || typeof item.cable !== 'object') continue;
    for (const note of sizeNotes(item.cable)) {
      out.push({ severity: 'warning', where: `links[${index}] (${item.id})`, id: item.id, field: note.split(' ')[0]!, message: note });
    }
  }
  return out;
}
