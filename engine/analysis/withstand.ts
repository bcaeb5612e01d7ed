// Withstand of the protective conductor: the adiabatic check (method-depth.md §6;
// IEC 60364-5-54 clause 543.1.2, AS/NZS 3000:2018 clause 5.3.3.1.2, from memory).
//
//   S_pe,min = √E / k,   E = If² · t,   capped at the device's let-through I²t when stated
// If is the earth-fault current c · U0 / Zs (known source only), t the clearing time at If.
// Passes when the link's total earth area n · Se ≥ S_pe,min. k from k-table.ts.

import type { Device, Link } from '../model/types.js';
import type { CheckStatus } from './results.js';
import { kFactor } from './k-table.js';
import { atMost, fixedOrRange } from './tolerance.js';

export interface WithstandResult {
  earthMinArea: number | null;
  status: CheckStatus;
  notes: string[];
}

const UNCHECKED: WithstandResult = Object.freeze({ earthMinArea: null, status: 'unchecked', notes: Object.freeze([]) as unknown as string[] });
const NO_NOTES = Object.freeze([]) as unknown as string[];

/**
 * faultCurrent null with zeroLoop true: a loop of 0 Ω, checked only through the let-through.
 * clearing: the device's time at the fault current (null when unknown).
 */
export function checkWithstand(link: Link, device: Device | null, knownSource: boolean, faultCurrent: number | null, zeroLoop: boolean, clearing: number | null): WithstandResult {
  if (!device || !knownSource || clearing === null) return UNCHECKED;
  let energy: number;
  if (faultCurrent === null) {
    if (!zeroLoop || device.letThrough === undefined) return UNCHECKED;
    energy = device.letThrough;
  } else {
    energy = faultCurrent * faultCurrent * clearing;
    if (device.letThrough !== undefined) energy = Math.min(energy, device.letThrough);
  }
  const cable = link.cable;
  const k = kFactor(cable.earthMaterial ?? cable.material, cable.insulation ?? 'pvc', cable.earthInCable ?? true);
  const min = Math.sqrt(energy) / k;
  const area = cable.earth * (cable.parallel ?? 1);
  // The shared empty, frozen list of notes: callers copy notes out, never add to them.
  if (atMost(min, area)) return { earthMinArea: min, status: 'pass', notes: NO_NOTES };
  return {
    earthMinArea: min,
    status: 'fail',
    notes: [['withstand: the protective conductor ', Number.isFinite(area) ? `${area} mm²` : 'out of range', ' is below the ', fixedOrRange(min, 2, ' mm²'), ' it needs to carry the fault until the device clears it (S = √(I²t) / k, k = ', String(k), ')'].join('')],
  };
}
