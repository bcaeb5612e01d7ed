// The loop check of one link: its loop against the budget of its protecting device.
//
//   budget B = c · U0 / Ia
//   known source:    Zs = |Ze + Σ links supply → far end| ≤ B;  ratio = Zs / B;  limit = B
//   unknown source:  own = |Σ origin → far end| ≤ s · B  and  upstream = |Σ supply → origin| ≤ (1 − s) · B
//                    ratio = max(own / (s·B), upstream / ((1 − s)·B));  limit = s · B
// A failing circuit whose protecting link has an RCD relies on it: status `rcd`.
// A loop of 0 Ω has no fault current ("no impedance in the loop") and is checked as if the
// current were above every trip current.

import type { Device, Link } from '../model/types.js';
import { sizeNotes } from '../model/sizes.js';
import { abs, type Complex } from './complex.js';
import { clearingTime, deviceMark, INSTANTANEOUS_TIME, tripAmps, tripCurrent } from './devices.js';
import { NO_FIXES } from './fixes.js';
import { maxLengthOf } from './max-length.js';
import { requiredTime } from './required-time.js';
import type { CircuitResult, Status } from './results.js';
import type { Sums } from './sums.js';
import type { TreeOrder } from './order.js';
import { atMost, fixedOrRange, toFixed } from './tolerance.js';

const pct = (v: number): string => `${toFixed(v * 100, 0)} %`;
const ohms = (v: number): string => fixedOrRange(v, 3, ' Ω');

/** What the loop check leaves for the later checks and the fixes of one link. */
export interface LoopFacts {
  protecting: number;
  device: Device | null;
  /** Ze at this link's supply, when known. */
  ze: Complex | null;
  /** c·U0/Ia, Ω; null when Ia is unknown or the link is unprotected. */
  budget: number | null;
  /** The impedance before the link that its own length adds to (Ze included when known). */
  before: Complex | null;
  /** The loop of the link per metre. */
  perMetre: Complex;
  /** Known source and a loop of 0 Ω at the far end. */
  zeroLoop: boolean;
}

/**
 * The loop facts of every link, in typed arrays (no objects per link: the analysis keeps them
 * for the later checks, the fixes and a re-analysis). NaN stands for null.
 */
export class LoopTable {
  readonly protecting: Int32Array;
  readonly budget: Float64Array;
  readonly beforeRe: Float64Array;
  readonly beforeIm: Float64Array;
  readonly perRe: Float64Array;
  readonly perIm: Float64Array;
  /** Ze at the link's supply (NaN when unknown or unreached). */
  readonly zeRe: Float64Array;
  readonly zeIm: Float64Array;
  readonly zeroLoop: Uint8Array;

  constructor(links: number) {
    this.protecting = new Int32Array(links).fill(-1);
    this.budget = new Float64Array(links).fill(NaN);
    this.beforeRe = new Float64Array(links).fill(NaN);
    this.beforeIm = new Float64Array(links).fill(NaN);
    this.perRe = new Float64Array(links);
    this.perIm = new Float64Array(links);
    this.zeRe = new Float64Array(links).fill(NaN);
    this.zeIm = new Float64Array(links).fill(NaN);
    this.zeroLoop = new Uint8Array(links);
  }

  /** Forget what an earlier check of link l left. */
  clear(l: number): void {
    this.protecting[l] = -1;
    this.budget[l] = NaN;
    this.beforeRe[l] = NaN;
    this.beforeIm[l] = NaN;
    this.perRe[l] = 0;
    this.perIm[l] = 0;
    this.zeRe[l] = NaN;
    this.zeIm[l] = NaN;
    this.zeroLoop[l] = 0;
  }

  budgetOf(l: number): number | null {
    const b = this.budget[l]!;
    return Number.isNaN(b) ? null : b;
  }

  knownSource(l: number): boolean {
    return !Number.isNaN(this.zeRe[l]!);
  }

  /** The device protecting link l, or null. */
  deviceOf(order: TreeOrder, l: number): Device | null {
    const p = this.protecting[l]!;
    return p >= 0 ? order.links[p]!.device ?? null : null;
  }

  /** Link l's facts as one object (for the fixes and the breakdown). */
  factsOf(order: TreeOrder, l: number): LoopFacts {
    const before = Number.isNaN(this.beforeRe[l]!) ? null : { re: this.beforeRe[l]!, im: this.beforeIm[l]! };
    return {
      protecting: this.protecting[l]!,
      device: this.deviceOf(order, l),
      ze: this.knownSource(l) ? { re: this.zeRe[l]!, im: this.zeIm[l]! } : null,
      budget: this.budgetOf(l),
      before,
      perMetre: { re: this.perRe[l]!, im: this.perIm[l]! },
      zeroLoop: this.zeroLoop[l] === 1,
    };
  }
}

/** A circuit's results before any check (built by a constructor: see blankResult). */
class CircuitRecord implements CircuitResult {
  link: string;
  name: string | null;
  from: string;
  to: string;
  role: CircuitResult['role'];
  method: CircuitResult['method'] = null;
  protectedBy: string | null = null;
  device: string | null = null;
  tripCurrent: number | null = null;
  requiredTime: number | null = null;
  zs: number | null = null;
  own: number | null = null;
  upstream: number | null = null;
  limit: number | null = null;
  faultCurrent: number | null = null;
  clearingTime: number | null = null;
  ratio: number | null = null;
  maxLength: number | null = null;
  status: CircuitResult['status'] = 'unchecked';
  notes: string[];
  phases: CircuitResult['phases'] = 1;
  designCurrent: number | null = null;
  powerFactor: number | null = null;
  voltageDrop: number | null = null;
  voltageDropTotal: number | null = null;
  voltageDropLimit: number | null = null;
  voltageStatus: CircuitResult['voltageStatus'] = 'unchecked';
  capacity: number | null = null;
  capacityStatus: CircuitResult['capacityStatus'] = 'unchecked';
  faultLevel: number | null = null;
  breakingStatus: CircuitResult['breakingStatus'] = 'unchecked';
  earthMinArea: number | null = null;
  withstandStatus: CircuitResult['withstandStatus'] = 'unchecked';
  testLimit: number | null = null;
  measured: CircuitResult['measured'] = null;
  fixes: CircuitResult['fixes'] = NO_FIXES;
  verdict: CircuitResult['verdict'] = 'unchecked';

  constructor(link: Link, role: CircuitResult['role']) {
    this.link = link.id;
    this.name = link.name ?? null;
    this.from = link.from;
    this.to = link.to;
    this.role = role;
    this.notes = sizeNotes(link.cable);
  }
}

export function blankResult(link: Link, role: CircuitResult['role']): CircuitResult {
  return new CircuitRecord(link, role);
}

/** The loop check of link l on its own, its facts as one object (the breakdown's use). */
export function checkLoop(sums: Sums, l: number, result: CircuitResult): LoopFacts {
  const table = new LoopTable(sums.order.links.length);
  checkLoopInto(sums, l, result, table);
  return table.factsOf(sums.order, l);
}

/** The loop check of link l: its results into `result`, its facts into `table` at l. */
export function checkLoopInto(sums: Sums, l: number, result: CircuitResult, table: LoopTable): void {
  const { order, rules } = sums;
  const link = order.links[l]!;
  const notes = result.notes;
  const protecting = sums.protect[l]!;
  const device = protecting >= 0 ? order.links[protecting]!.device ?? null : null;
  result.protectedBy = protecting >= 0 ? order.links[protecting]!.id : null;
  result.device = device ? deviceMark(device) : null;
  table.clear(l);
  table.protecting[l] = protecting;
  // impedancePerMetre's arithmetic, into the table.
  const cable = link.cable;
  const n = cable.parallel ?? 1;
  const perRe = (rules.resistivity[cable.material].value / cable.active + rules.resistivity[cable.earthMaterial ?? cable.material].value / cable.earth) / n;
  const perIm = (2 * (cable.reactance ?? rules.reactance.value)) / n;
  table.perRe[l] = perRe;
  table.perIm[l] = perIm;

  const to = order.linkTo[l]!;
  const from = order.linkFrom[l]!;
  if (!sums.reached(l)) {
    notes.unshift('no supply reaches this link; it is not checked');
    return;
  }
  const ze = sums.zeOf(to);
  if (ze) {
    table.zeRe[l] = ze.re;
    table.zeIm[l] = ze.im;
  }
  let zeroLoop = false;
  result.method = ze ? 'known-source' : 'unknown-source';
  const c = rules.voltageFactor.value;
  const u0 = rules.voltage.value;
  const drawnRe = sums.nodeRe[to]!;
  const drawnIm = sums.nodeIm[to]!;
  if (ze) {
    result.zs = abs(ze.re + drawnRe, ze.im + drawnIm);
    if (result.zs > 0) result.faultCurrent = (c * u0) / result.zs;
    else if (result.zs === 0) {
      zeroLoop = true;
      table.zeroLoop[l] = 1;
      notes.push('no impedance in the loop: the fault current cannot be computed; checked as if it were above every trip current');
    }
  }
  if (!device) {
    notes.unshift('no protective device at the origin of this circuit; its impedance is counted but it is not checked');
    return;
  }

  const origin = order.linkFrom[protecting]!;
  const upRe = sums.nodeRe[origin]!;
  const upIm = sums.nodeIm[origin]!;
  result.own = abs(drawnRe - upRe, drawnIm - upIm);
  result.upstream = abs(upRe, upIm);
  const far = order.nodes[to];
  const tReq = requiredTime(rules.basis, link, order.roles[l]!, far, device);
  result.requiredTime = tReq;
  const amps = tripAmps(device, tReq, rules);
  const ia = Number.isNaN(amps) ? null : amps;
  if (ze) {
    if (zeroLoop) result.clearingTime = device.type === 'curve' ? device.points[device.points.length - 1]![1] : INSTANTANEOUS_TIME;
    else if (result.faultCurrent !== null) result.clearingTime = clearingTime(device, result.faultCurrent, ia);
  }
  const beforeRe = sums.nodeRe[from]!;
  const beforeIm = sums.nodeIm[from]!;
  let status: Status;
  if (ia === null) {
    notes.unshift(tripCurrent(device, tReq, rules).note ?? 'the trip current is unknown');
    status = 'fail';
  } else {
    const budget = (c * u0) / ia;
    table.budget[l] = budget;
    result.tripCurrent = ia;
    if (ze) {
      result.limit = budget;
      result.ratio = result.zs! / budget;
      const aRe = ze.re + beforeRe;
      const aIm = ze.im + beforeIm;
      table.beforeRe[l] = aRe;
      table.beforeIm[l] = aIm;
      result.maxLength = maxLengthOf(aRe, aIm, perRe, perIm, budget);
      status = atMost(result.ratio, 1) ? 'pass' : 'fail';
      // A breaker or stated trip current clears in 0.1 s when If ≥ Ia: the same comparison as the
      // ratio's, taken from it so that rounding (in the smallest numbers) cannot make them disagree.
      if (!zeroLoop && device.type !== 'curve') result.clearingTime = status === 'pass' ? INSTANTANEOUS_TIME : null;
      // Joined into one flat string: a template would keep ten pieces per failing circuit.
      if (status === 'fail') notes.push(['Zs ', ohms(result.zs!), ' exceeds the limit ', ohms(budget), ': the fault current ', fixedOrRange(result.faultCurrent, 0, ' A'), ' is below the ', fixedOrRange(ia, 0, ' A'), ' needed to disconnect within ', String(tReq), ' s'].join(''));
      if (!zeroLoop && result.clearingTime === null && device.type === 'curve') {
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
      const aRe = beforeRe - upRe;
      const aIm = beforeIm - upIm;
      table.beforeRe[l] = aRe;
      table.beforeIm[l] = aIm;
      result.maxLength = maxLengthOf(aRe, aIm, perRe, perIm, ownLimit);
      status = atMost(result.ratio, 1) ? 'pass' : 'fail';
      if (!atMost(ownRatio, 1)) notes.push(`the circuit's own loop ${ohms(result.own)} exceeds ${pct(share)} of the loop budget (${ohms(ownLimit)})`);
      if (!atMost(upRatio, 1)) {
        notes.push(
          `the drawn mains and submains upstream use ${ohms(result.upstream)}, more than the ${pct(1 - share)} of the loop budget (${ohms(upLimit)}) that the unknown-source method leaves for them`,
        );
      }
    }
  }
  const protectingLink = order.links[protecting]!;
  if (status === 'fail' && protectingLink.rcd) {
    status = 'rcd';
    notes.push(['disconnection relies on the ', toFixed(protectingLink.rcd.sensitivity * 1000, 0), ' mA RCD of ', protectingLink.id].join(''));
  }
  if (protecting !== l) notes.push(['protected by the device of ', protectingLink.id].join(''));
  result.status = status;
}
