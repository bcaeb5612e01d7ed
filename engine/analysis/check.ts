// The check of one link: its loop against the budget of its protecting device.
//
//   budget B = c · U0 / Ia
//   known source:    Zs = |Ze + Σ links supply → far end| ≤ B;  ratio = Zs / B;  limit = B
//   unknown source:  own = |Σ origin → far end| ≤ s · B  and  upstream = |Σ supply → origin| ≤ (1 − s) · B
//                    ratio = max(own / (s·B), upstream / ((1 − s)·B));  limit = s · B
// A failing circuit whose protecting link has an RCD relies on it: status `rcd`.

import type { Link } from '../model/types.js';
import { sizeNotes } from '../model/sizes.js';
import { add, magnitude, sub } from './complex.js';
import { clearingTime, deviceMark, tripCurrent } from './devices.js';
import { impedancePerMetre } from './impedance.js';
import { loopParts, type LoopSums } from './loop.js';
import { maxLength } from './max-length.js';
import { requiredTime } from './required-time.js';
import type { CircuitResult, Status } from './results.js';

const pct = (v: number): string => `${(v * 100).toFixed(0)} %`;
const ohms = (v: number): string => `${v.toFixed(3)} Ω`;

export function checkLink(sums: LoopSums, link: Link): CircuitResult {
  const { net, rules } = sums;
  const role = net.role(link);
  const protecting = net.protectingLink(link);
  const device = protecting?.device ?? null;
  const notes = sizeNotes(link.cable);
  const result: CircuitResult = {
    link: link.id,
    name: link.name ?? null,
    from: link.from,
    to: link.to,
    role,
    method: null,
    protectedBy: protecting?.id ?? null,
    device: device ? deviceMark(device) : null,
    tripCurrent: null,
    requiredTime: null,
    zs: null,
    own: null,
    upstream: null,
    limit: null,
    faultCurrent: null,
    clearingTime: null,
    ratio: null,
    maxLength: null,
    status: 'unchecked',
    notes,
    phases: 1,
    designCurrent: null,
    powerFactor: null,
    voltageDrop: null,
    voltageDropTotal: null,
    voltageDropLimit: null,
    voltageStatus: 'unchecked',
    capacity: null,
    capacityStatus: 'unchecked',
    faultLevel: null,
    breakingStatus: 'unchecked',
    earthMinArea: null,
    withstandStatus: 'unchecked',
    testLimit: null,
    measured: null,
    fixes: [],
    verdict: 'unchecked',
  };

  const parts = loopParts(sums, link, protecting?.from ?? null);
  if (!parts) {
    notes.unshift('no supply reaches this link; it is not checked');
    return result;
  }
  const ze = sums.ze(link.to);
  result.method = ze ? 'known-source' : 'unknown-source';
  const c = rules.voltageFactor.value;
  const u0 = rules.voltage.value;
  if (ze) {
    result.zs = magnitude(add(ze, parts.drawn));
    result.faultCurrent = result.zs > 0 ? (c * u0) / result.zs : null;
  }
  if (!protecting || !device) {
    notes.unshift('no protective device at the origin of this circuit; its impedance is counted but it is not checked');
    return result;
  }

  result.own = magnitude(parts.own);
  result.upstream = magnitude(parts.upstream);
  const tReq = requiredTime(rules.basis, link, role, net.nodeById.get(link.to), device);
  result.requiredTime = tReq;
  const trip = tripCurrent(device, tReq, rules);
  if (ze && result.faultCurrent !== null) result.clearingTime = clearingTime(device, result.faultCurrent, trip.ia);
  let status: Status;
  if (trip.ia === null) {
    notes.unshift(trip.note);
    status = 'fail';
  } else {
    const ia = trip.ia;
    const budget = (c * u0) / ia;
    result.tripCurrent = ia;
    const perMetre = impedancePerMetre(link.cable, rules);
    if (ze) {
      result.limit = budget;
      result.ratio = result.zs! / budget;
      result.maxLength = maxLength(add(ze, parts.beforeLink), perMetre, budget);
      status = result.ratio <= 1 ? 'pass' : 'fail';
      if (status === 'fail') notes.push(`Zs ${ohms(result.zs!)} exceeds the limit ${ohms(budget)}: the fault current ${result.faultCurrent?.toFixed(0)} A is below the ${ia.toFixed(0)} A needed to disconnect within ${tReq} s`);
      if (result.clearingTime === null && device.type === 'curve') {
        status = 'fail';
        notes.push(`the fault current is below the lowest current of the device's time–current curve; its clearing time is unknown`);
      }
    } else {
      const share = rules.unknownSourceShare.value;
      const ownLimit = share * budget;
      const upLimit = (1 - share) * budget;
      const ownRatio = result.own / ownLimit;
      const upRatio = upLimit > 0 ? result.upstream / upLimit : result.upstream > 0 ? Number.MAX_VALUE : 0;
      result.limit = ownLimit;
      result.ratio = Math.max(ownRatio, upRatio);
      const beforeOwn = sub(parts.beforeLink, parts.upstream);
      result.maxLength = maxLength(beforeOwn, perMetre, ownLimit);
      status = result.ratio <= 1 ? 'pass' : 'fail';
      if (ownRatio > 1) notes.push(`the circuit's own loop ${ohms(result.own)} exceeds ${pct(share)} of the loop budget (${ohms(ownLimit)})`);
      if (upRatio > 1) {
        notes.push(
          `the drawn mains and submains upstream use ${ohms(result.upstream)}, more than the ${pct(1 - share)} of the loop budget (${ohms(upLimit)}) that the unknown-source method leaves for them`,
        );
      }
    }
  }
  if (status === 'fail' && protecting.rcd) {
    status = 'rcd';
    notes.push(`disconnection relies on the ${(protecting.rcd.sensitivity * 1000).toFixed(0)} mA RCD of ${protecting.id}`);
  }
  if (protecting.id !== link.id) notes.push(`protected by the device of ${protecting.id}`);
  result.status = status;
  return result;
}
