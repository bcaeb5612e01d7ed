// Protective devices: the trip current Ia (the current that disconnects within t_req) and the
// clearing time at a fault current.
//
//   breaker curve B / C / D     Ia = multiple × In (multiples from the basis)
//   adjustable breaker          Ia = Ii · (1 + τ), τ = 0.2 unless stated
//   time–current curve          Ia = current at t_req, log I against log t between points
//   stated trip current         Ia = that current

import type { CurveDevice, Device } from '../model/types.js';
import type { ResolvedRules } from './basis.js';
import { atMost } from './tolerance.js';

/** Instantaneous devices are relied on for their instantaneous operation only: ≤ 0.1 s. */
export const INSTANTANEOUS_TIME = 0.1;
export const DEFAULT_TOLERANCE = 0.2;

export type TripCurrent = { ia: number; note?: undefined } | { ia: null; note: string };

export function tripCurrent(device: Device, requiredTime: number, rules: ResolvedRules): TripCurrent {
  switch (device.type) {
    case 'mcb':
      return { ia: rules.multiples[device.curve].value * device.rating };
    case 'adjustable':
      return { ia: device.instantaneous * (1 + (device.tolerance ?? DEFAULT_TOLERANCE)) };
    case 'fixed':
      return { ia: device.tripCurrent };
    case 'curve':
      return curveCurrentAt(device, requiredTime);
  }
}

/** Ia as a number, NaN when unknown (tripCurrent gives the reason): no object per call. */
export function tripAmps(device: Device, requiredTime: number, rules: ResolvedRules): number {
  switch (device.type) {
    case 'mcb':
      return rules.multiples[device.curve].value * device.rating;
    case 'adjustable':
      return device.instantaneous * (1 + (device.tolerance ?? DEFAULT_TOLERANCE));
    case 'fixed':
      return device.tripCurrent;
    case 'curve': {
      const found = curveCurrentAt(device, requiredTime);
      return found.ia === null ? NaN : found.ia;
    }
  }
}

/** Interpolate y at x on a straight line through (x0, y0), (x1, y1) in log–log space. */
function logLog(x: number, x0: number, y0: number, x1: number, y1: number): number {
  const f = (Math.log(x) - Math.log(x0)) / (Math.log(x1) - Math.log(x0));
  return Math.exp(Math.log(y0) + f * (Math.log(y1) - Math.log(y0)));
}

/** The current at which a curve device disconnects in time t (points: current rising, time falling). */
export function curveCurrentAt(device: CurveDevice, t: number): TripCurrent {
  const points = device.points;
  const first = points[0]!;
  const last = points[points.length - 1]!;
  if (t >= first[1]) return { ia: first[0] };
  if (t < last[1]) {
    return { ia: null, note: `the device's time–current curve does not reach the required ${t} s (its shortest time is ${last[1]} s); the trip current is unknown` };
  }
  for (let i = 0; i < points.length - 1; i++) {
    const [i0, t0] = points[i]!;
    const [i1, t1] = points[i + 1]!;
    if (t <= t0 && t >= t1) return { ia: t === t1 ? i1 : logLog(t, t0, i0, t1, i1) };
  }
  return { ia: last[0] };
}

/** The time a curve device takes to clear current I; null below the curve's lowest current. */
export function curveTimeAt(device: CurveDevice, current: number): number | null {
  const points = device.points;
  const first = points[0]!;
  const last = points[points.length - 1]!;
  if (current < first[0]) return atMost(first[0], current) ? first[1] : null; // within 1e-9 of the lowest current: at it
  if (current >= last[0]) return last[1];
  for (let i = 0; i < points.length - 1; i++) {
    const [i0, t0] = points[i]!;
    const [i1, t1] = points[i + 1]!;
    if (current >= i0 && current <= i1) return current === i0 ? t0 : logLog(current, i0, t0, i1, t1);
  }
  return last[1];
}

/** The clearing time at fault current `current`, given the device's trip current `ia`. */
export function clearingTime(device: Device, current: number, ia: number | null): number | null {
  if (device.type === 'curve') return curveTimeAt(device, current);
  return ia !== null && current >= ia ? INSTANTANEOUS_TIME : null;
}

function amps(value: number): string {
  return Number.isInteger(value) && Math.abs(value) < 1e6 ? String(value) : `${Number(value.toPrecision(6))}`;
}

/**
 * A short mark for the device: its label, or e.g. `C20` for a breaker. Marks are made once per
 * kind and rating and shared (a job has few distinct ones; the cache is emptied past 4,096).
 */
export function deviceMark(device: Device): string {
  if (device.label) return device.label;
  const kind = device.type === 'mcb' ? device.curve : device.type;
  let byRating = MARKS.get(kind);
  if (byRating === undefined) {
    byRating = new Map();
    MARKS.set(kind, byRating);
  }
  let mark = byRating.get(device.rating);
  if (mark === undefined) {
    if (byRating.size >= 4096) byRating.clear();
    mark = makeMark(device);
    byRating.set(device.rating, mark);
  }
  return mark;
}

const MARKS = new Map<string, Map<number, string>>();

function makeMark(device: Device): string {
  switch (device.type) {
    case 'mcb':
      return `${device.curve}${amps(device.rating)}`;
    case 'adjustable':
      return `${amps(device.rating)} A adj.`;
    case 'curve':
      return `${amps(device.rating)} A curve`;
    case 'fixed':
      return `${amps(device.rating)} A`;
  }
}
