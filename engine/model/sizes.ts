// Standard nominal conductor areas (IEC 60228). Another size is accepted with a warning.

import type { Cable, Link } from './types.js';
import type { Problem } from './problems.js';

export const STANDARD_SIZES: readonly number[] = [1, 1.5, 2.5, 4, 6, 10, 16, 25, 35, 50, 70, 95, 120, 150, 185, 240, 300, 400, 500, 630];

const EXACT = new Set(STANDARD_SIZES);

export function isStandardSize(area: number): boolean {
  if (EXACT.has(area)) return true;
  for (let i = 0; i < STANDARD_SIZES.length; i++) if (Math.abs(STANDARD_SIZES[i]! - area) < 1e-9) return true;
  return false;
}

function sizeNote(key: 'active' | 'earth', area: number): string {
  return `cable.${key} ${area} mm² is not a standard nominal area (IEC 60228); check it is available`;
}

/** Plain-words notes for the non-standard areas of one cable (a new list each time). */
export function sizeNotes(cable: Cable): string[] {
  const active = cable.active;
  const earth = cable.earth;
  const activeOdd = typeof active === 'number' && !isStandardSize(active);
  const earthOdd = typeof earth === 'number' && !isStandardSize(earth);
  if (!activeOdd && !earthOdd) return [];
  const notes: string[] = [];
  if (activeOdd) notes.push(sizeNote('active', active));
  if (earthOdd) notes.push(sizeNote('earth', earth));
  return notes;
}

/** Warnings for the non-standard areas of the links' cables; `linkAt` gives each link's place
 *  in the file (null when positions are places). */
export function sizeWarnings(links: readonly Link[], linkAt: readonly number[] | null = null): Problem[] {
  const out: Problem[] = [];
  for (let i = 0; i < links.length; i++) {
    const item = links[i]!;
    const cable = item.cable;
    if (!cable || typeof cable !== 'object') continue;
    if (isStandardSize(cable.active) && isStandardSize(cable.earth)) continue;
    const index = linkAt === null ? i : linkAt[i]!;
    for (const note of sizeNotes(cable)) {
      out.push({ severity: 'warning', where: `links[${index}] (${item.id})`, id: item.id, field: note.split(' ')[0]!, message: note });
    }
  }
  return out;
}
