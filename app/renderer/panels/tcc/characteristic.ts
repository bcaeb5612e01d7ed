// Time–current characteristics to draw, and the time a device takes at a current, consistent
// with how the engine reads devices (engine/analysis/devices.ts, method.md):
//   - a curve device: its own points, log I against log t between them; nothing below its first
//     current; its last time beyond its last current;
//   - a breaker, adjustable breaker or stated trip current: disconnects within 0.1 s from Ia up.
// Only the curve device's line is the device's own data. For the others the plot draws a
// stylised line (said so on the plot): the instantaneous step, a vertical at Ia down to 0.1 s;
// for a B/C/D breaker also an overload part through 1.45 In at 1 h and 2.55 In at 60 s (the
// IEC 60898-1 conventional tripping current and the 2.55 In test, from memory), falling as I⁻²
// to Ia. No check uses the overload part except the discrimination flag, which is a flag.

import type { Device, ResolvedRules } from '../../../../engine/index.js';

/** The engine's clearing time for a device relied on for instantaneous operation (s). */
export const INSTANT = 0.1;
/** The longest time the plot shows, s. */
export const TIME_MAX = 10_000;
/** The shortest time the plot shows, s. */
export const TIME_MIN = 0.01;

export interface Characteristic {
  /** Polyline points [A, s], current rising; the last one is extended to the right at its time. */
  points: Array<[number, number]>;
  /** Where the line is the device's own published data (false) or drawn by rule (true). */
  stylised: boolean;
  /** The current from which the device is taken to clear in INSTANT (null for a curve device). */
  ia: number | null;
  /** The lowest current the line starts at (a vertical from the top for a step-only device). */
  fromTop: boolean;
}

export function characteristic(device: Device, rules: ResolvedRules): Characteristic {
  const In = device.rating;
  switch (device.type) {
    case 'curve':
      return { points: device.points.map(([i, t]) => [i, t] as [number, number]), stylised: false, ia: null, fromTop: false };
    case 'mcb': {
      const ia = rules.multiples[device.curve].value * In;
      const pts: Array<[number, number]> = [[1.45 * In, 3600], [2.55 * In, In <= 32 ? 60 : 120]];
      const knee = pts[1]!;
      if (ia > knee[0]) pts.push([ia, Math.max(INSTANT, knee[1] * (knee[0] / ia) ** 2)]);
      pts.push([ia, INSTANT]);
      return { points: pts, stylised: true, ia, fromTop: false };
    }
    case 'adjustable': {
      const ia = device.instantaneous * (1 + (device.tolerance ?? 0.2));
      return { points: [[ia, TIME_MAX], [ia, INSTANT]], stylised: true, ia, fromTop: true };
    }
    case 'fixed':
      return { points: [[device.tripCurrent, TIME_MAX], [device.tripCurrent, INSTANT]], stylised: true, ia: device.tripCurrent, fromTop: true };
  }
}

/** log–log interpolation of y at x between (x0, y0) and (x1, y1). */
function logLog(x: number, x0: number, y0: number, x1: number, y1: number): number {
  if (x1 === x0) return Math.min(y0, y1);
  const f = (Math.log(x) - Math.log(x0)) / (Math.log(x1) - Math.log(x0));
  return Math.exp(Math.log(y0) + f * (Math.log(y1) - Math.log(y0)));
}

/**
 * The time the drawn characteristic gives at current I (s); null where the device is not taken
 * to operate (below a curve's first current, below Ia of a step-only device).
 */
export function timeAt(c: Characteristic, current: number): number | null {
  if (c.ia !== null && current >= c.ia) return INSTANT;
  if (c.fromTop) return null;
  const pts = c.points;
  const first = pts[0]!;
  const last = pts[pts.length - 1]!;
  if (current < first[0]) return null;
  if (current >= last[0]) return last[1];
  for (let i = 0; i < pts.length - 1; i++) {
    const [i0, t0] = pts[i]!;
    const [i1, t1] = pts[i + 1]!;
    if (current >= i0 && current <= i1) return current === i0 ? t0 : logLog(current, i0, t0, i1, t1);
  }
  return last[1];
}

export type Discrimination =
  | { kind: 'flag'; current: number; upstreamTime: number; downstreamTime: number }
  | { kind: 'clear'; current: number; upstreamTime: number | null; downstreamTime: number }
  | { kind: 'unknown'; reason: string };

/**
 * The discrimination flag: the upstream device would operate at the downstream maximum fault
 * current Imax within the downstream device's time at Imax. A flag, not a verdict.
 */
export function discrimination(down: Characteristic, up: Characteristic | null, imax: number | null, where: string): Discrimination {
  if (!up) return { kind: 'unknown', reason: 'no upstream device to compare with' };
  if (imax === null) return { kind: 'unknown', reason: `no maximum fault level at the origin of ${where} (the supply's maximum fault current or Ze is needed)` };
  const dt = timeAt(down, imax);
  if (dt === null) return { kind: 'unknown', reason: `this device's characteristic does not reach the maximum fault current ${Math.round(imax)} A` };
  const ut = timeAt(up, imax);
  if (ut !== null && ut <= dt) return { kind: 'flag', current: imax, upstreamTime: ut, downstreamTime: dt };
  return { kind: 'clear', current: imax, upstreamTime: ut, downstreamTime: dt };
}
