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

/** Where the check writes: a circuit's results, or any object with these two fields. */
export interface WithstandInto {
  earthMinArea: number | null;
  withstandStatus: CheckStatus;
}

/**
 * The adiabatic check of link l's protective conductor, its minimum area and status written into
 * `out` and its note (when it fails) added to `notes`; no objects made for a link that passes.
 * faultCurrent null with zeroLoop true: a loop of 0 Ω, checked only through the let-through.
 * clearing: the device's time at the fault current (null when unknown).
 */
export function checkWithstand(link: Link, device: Device | null, knownSource: boolean, faultCurrent: number | null, zeroLoop: boolean, clearing: number | null, notes: string[], out: WithstandInto): void {
  out.earthMinArea = null;
  out.withstandStatus = 'unchecked';
  if (!device || !knownSource || clearing === null) return;
  let energy: number;
  if (faultCurrent === null) {
    if (!zeroLoop || device.letThrough === undefined) return;
    energy = device.letThrough;
  } else {
    energy = faultCurrent * faultCurrent * clearing;
    if (device.letThrough !== undefined) energy = Math.min(energy, device.letThrough);
  }
  const cable = link.cable;
  const k = kFactor(cable.earthMaterial ?? cable.material, cable.insulation ?? 'pvc', cable.earthInCable ?? true);
  const min = Math.sqrt(energy) / k;
  const area = cable.earth * (cable.parallel ?? 1);
  out.earthMinArea = min;
  if (atMost(min, area)) {
    out.withstandStatus = 'pass';
    return;
  }
  out.withstandStatus = 'fail';
  notes.push(['withstand: the protective conductor ', Number.isFinite(area) ? `${area} mm²` : 'out of range', ' is below the ', fixedOrRange(min, 2, ' mm²'), ' it needs to carry the fault until the device clears it (S = √(I²t) / k, k = ', String(k), ')'].join(''));
}
