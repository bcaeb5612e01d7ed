// Cable capacity: Ib ≤ In ≤ Iz (IEC 60364-4-43 clause 433.1, AS/NZS 3000:2018 clause 2.5.3.1,
// from memory; method-depth.md §4).
//
// Iz: the cable's stated `capacity` (all parallel sets together, as installed); otherwise under
// the iec basis the default table (capacity-table.ts) for its material, insulation and loaded
// conductors (2 for 1 phase, 3 for 3 phases), times `derating`, times n. Under au-nz there is no
// built-in table: Iz is null unless stated.

import type { Link } from '../model/types.js';
import type { ResolvedRules } from './basis.js';
import { tableCapacity } from './capacity-table.js';
import type { CheckStatus } from './results.js';
import { atMost } from './tolerance.js';

const amps = (v: number): string => {
  const shown = Number(v.toPrecision(4)); // near the largest double, 4 figures round up to Infinity
  return Number.isFinite(shown) ? `${shown} A` : Number.isFinite(v) ? `${v} A` : 'out of range';
};

export function cableCapacity(link: Link, phases: number, rules: ResolvedRules): { iz: number | null; note?: string } {
  const cable = link.cable;
  if (cable.capacity !== undefined) return { iz: cable.capacity };
  if (rules.basis !== 'iec') return { iz: null };
  const perSet = tableCapacity(cable.material, cable.insulation ?? 'pvc', phases === 3 ? 3 : 2, cable.active);
  if (perSet === null) {
    return { iz: null, note: `no default current rating for ${cable.active} mm² ${cable.material} ${(cable.insulation ?? 'pvc').toUpperCase()} in the built-in table; enter the cable's capacity Iz` };
  }
  return { iz: perSet * (cable.derating ?? 1) * (cable.parallel ?? 1) };
}

/** Where applyCapacity writes: a circuit's results, or any object with these two fields. */
export interface CapacityInto {
  capacity: number | null;
  capacityStatus: CheckStatus;
}

/** The capacity check, Ib ≤ In ≤ Iz (Ib ≤ Iz alone for a link without a protecting device): its
 *  notes added to `notes`, Iz and the status written into `out` (no objects made for a link that
 *  passes). */
export function applyCapacity(link: Link, phases: number, ib: number | null, rating: number | null, rules: ResolvedRules, notes: string[], out: CapacityInto): void {
  const cable = link.cable;
  let iz: number | null;
  if (cable.capacity !== undefined) iz = cable.capacity;
  else if (rules.basis !== 'iec') iz = null;
  else {
    const found = cableCapacity(link, phases, rules);
    iz = found.iz;
    if (found.note) notes.push(found.note);
  }
  out.capacity = iz;
  out.capacityStatus = 'unchecked';
  if (ib === null || iz === null) return;
  let ok = true;
  if (rating !== null) {
    if (!atMost(ib, rating)) {
      ok = false;
      notes.push(['capacity: Ib ≤ In fails: the design current ', amps(ib), ' exceeds the device rating ', amps(rating)].join(''));
    }
    if (!atMost(rating, iz)) {
      ok = false;
      notes.push(['capacity: In ≤ Iz fails: the device rating ', amps(rating), " exceeds the cable's capacity ", amps(iz)].join(''));
    }
  } else if (!atMost(ib, iz)) {
    ok = false;
    notes.push(['capacity: Ib ≤ Iz fails: the design current ', amps(ib), " exceeds the cable's capacity ", amps(iz)].join(''));
  }
  out.capacityStatus = ok ? 'pass' : 'fail';
}
