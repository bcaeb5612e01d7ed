// Fixes that pass (method-depth.md §8): for a link whose loop fails (or relies on an RCD) or
// whose voltage drop fails, the changes that make it pass, each with everything else
// unchanged, in this order: length, size, device, rcd. Each candidate is judged in closed form
// from the sums already known (the loop before the link, its impedance per metre, its current),
// never by re-running the analysis.

import type { Curve, Link } from '../model/types.js';
import { STANDARD_SIZES } from '../model/sizes.js';
import type { ResolvedRules } from './basis.js';
import type { LoopTable } from './check.js';
import type { TreeOrder } from './order.js';
import { abs } from './complex.js';
import type { CircuitResult, Fix } from './results.js';
import { atMost } from './tolerance.js';
import { linkVoltageDrop } from './voltage-drop.js';

export const FIX_RATINGS: readonly number[] = [6, 10, 16, 20, 25, 32, 40, 50, 63, 80, 100, 125];
const CURVE_ORDER: readonly Curve[] = ['B', 'C', 'D'];
export const RCD_FIX_SENSITIVITY = 0.03;

/**
 * The fixes a link with none has, and the size, device and RCD fixes, each made once and shared
 * by every link it fixes (frozen: results are read, never changed). A job whose circuits mostly
 * fail asks for tens of thousands of fixes; only a length fix is the link's own.
 */
export const NO_FIXES: Fix[] = Object.freeze([]) as unknown as Fix[];
const RCD_FIX: Fix = Object.freeze({ kind: 'rcd', sensitivity: RCD_FIX_SENSITIVITY });
const SIZE_FIXES: Array<Fix | undefined> = [];
const DEVICE_FIXES: Array<Fix | undefined> = [];

/** The size fix to STANDARD_SIZES[i] active and STANDARD_SIZES[k] earth. */
function sizeFix(i: number, k: number): Fix {
  const at = i * STANDARD_SIZES.length + k;
  return (SIZE_FIXES[at] ??= Object.freeze({ kind: 'size', active: STANDARD_SIZES[i]!, earth: STANDARD_SIZES[k]! }));
}

/** The device fix to curve CURVE_ORDER[c] at FIX_RATINGS[r]. */
function deviceFix(c: number, r: number): Fix {
  const at = c * FIX_RATINGS.length + r;
  return (DEVICE_FIXES[at] ??= Object.freeze({ kind: 'device', curve: CURVE_ORDER[c]!, rating: FIX_RATINGS[r]! }));
}

/**
 * What the fixes of one link read. The analysis keeps one of these and fills it for each
 * failing link (a job whose circuits mostly fail asks for thousands of fixes, and an object per
 * link, kept or not, costs the collector's time): the loop facts are the loop table's numbers.
 */
export interface FixInputs {
  link: Link;
  result: CircuitResult;
  rules: ResolvedRules;
  /** The loop table's entries of the link (LoopTable): NaN stands for null. */
  budget: number;
  beforeRe: number;
  beforeIm: number;
  /** Ze is known at the link's supply. */
  knownSource: boolean;
  /** The protecting link, when there is one. */
  protecting: Link | null;
  /** Ib of the protecting link (A), when known. */
  protectingIb: number | null;
  /** This link's Ib (A) and cos φ, for the drop of a candidate size. */
  ib: number | null;
  pf: number | null;
}

/** The inputs of the fixes of link l, from the loop table (into `into` when given). */
export function fixInputsOf(table: LoopTable, order: TreeOrder, l: number, result: CircuitResult, rules: ResolvedRules, protectingIb: number | null, into?: FixInputs): FixInputs {
  const p = table.protecting[l]!;
  const x: FixInputs = into ?? { link: order.links[l]!, result, rules, budget: NaN, beforeRe: NaN, beforeIm: NaN, knownSource: false, protecting: null, protectingIb: null, ib: null, pf: null };
  x.link = order.links[l]!;
  x.result = result;
  x.rules = rules;
  x.budget = table.budget[l]!;
  x.beforeRe = table.beforeRe[l]!;
  x.beforeIm = table.beforeIm[l]!;
  x.knownSource = table.knownSource(l);
  x.protecting = p >= 0 ? order.links[p]! : null;
  x.protectingIb = p >= 0 ? protectingIb : null;
  x.ib = result.designCurrent;
  x.pf = result.powerFactor;
  return x;
}

/**
 * Whether the loop passes with this link's cable at a candidate size, given its impedance per
 * metre: impedancePerMetre's and the loop check's arithmetic written out, with no objects.
 */
function candidatePasses(x: FixInputs, rePerMetre: number, imPerMetre: number): boolean {
  const { result, rules } = x;
  const l = x.link.cable.length;
  const z = abs(x.beforeRe + rePerMetre * l, x.beforeIm + imPerMetre * l);
  const budget = x.budget;
  if (x.knownSource) return atMost(z / budget, 1);
  const share = rules.unknownSourceShare.value;
  const up = (1 - share) * budget;
  const upRatio = up > 0 ? result.upstream! / up : result.upstream! > 0 ? Number.MAX_VALUE : 0;
  return atMost(Math.max(z / (share * budget), upRatio), 1);
}

/** The fixes of a link, in their order; the list is made at its length (no spare room kept). */
export function findFixes(x: FixInputs): Fix[] {
  const { link, result } = x;
  const loopFails = result.status === 'fail' || result.status === 'rcd';
  const dropFails = result.voltageStatus === 'fail';
  if (!loopFails && !dropFails) return NO_FIXES;
  const cable = link.cable;
  const length: Fix | null =
    loopFails && result.maxLength !== null && result.maxLength > 0 && result.maxLength < cable.length ? { kind: 'length', maxLength: result.maxLength } : null;
  const size = findSize(x);
  const device = x.protecting?.device;
  const devicePick = loopFails && device?.type === 'mcb' && !Number.isNaN(x.budget) && result.own !== null ? findDevice(x, device.curve, device.rating) : null;
  const rcd: Fix | null = loopFails && result.status === 'fail' && x.protecting && !x.protecting.rcd ? RCD_FIX : null;
  const n = (length ? 1 : 0) + (size ? 1 : 0) + (devicePick ? 1 : 0) + (rcd ? 1 : 0);
  if (n === 0) return NO_FIXES;
  const fixes: Fix[] = new Array<Fix>(n);
  let k = 0;
  if (length) fixes[k++] = length;
  if (size) fixes[k++] = size;
  if (devicePick) fixes[k++] = devicePick;
  if (rcd) fixes[k++] = rcd;
  return fixes;
}

/** The index in STANDARD_SIZES of the first size ≥ area (within 1e-9), or their count. */
function firstAtLeast(area: number): number {
  let k = 0;
  while (k < STANDARD_SIZES.length && STANDARD_SIZES[k]! < area - 1e-9) k++;
  return k;
}

function findSize(x: FixInputs): Fix | null {
  const { link, result, rules } = x;
  const cable = link.cable;
  const loopApplies = result.device !== null;
  if (loopApplies && (Number.isNaN(x.budget) || Number.isNaN(x.beforeRe))) return null;
  const dropApplies = result.voltageStatus !== 'unchecked';
  const dropBase = dropApplies ? result.voltageDropTotal! - result.voltageDrop! : 0;
  const rhoActive = rules.resistivity[cable.material].value;
  const rhoEarth = rules.resistivity[cable.earthMaterial ?? cable.material].value;
  const n = cable.parallel ?? 1;
  const imPerMetre = (2 * (cable.reactance ?? rules.reactance.value)) / n;
  // The earths allowed with an active: from the present earth up to the larger of the two.
  const first = firstAtLeast(cable.earth);
  if (first === STANDARD_SIZES.length) return null;
  for (let i = firstAtLeast(cable.active); i < STANDARD_SIZES.length; i++) {
    const a = STANDARD_SIZES[i]!;
    // The drop depends on the active size alone: a size that fails it fails with every earth.
    if (dropApplies) {
      const vd = linkVoltageDrop(link, a, result.phases, x.ib!, x.pf!, rules);
      if (!atMost(dropBase + vd, result.voltageDropLimit!)) continue;
    }
    // The last standard size ≤ max(a, earth), within 1e-9.
    const top = Math.max(a, cable.earth) + 1e-9;
    let last = first - 1;
    while (last + 1 < STANDARD_SIZES.length && STANDARD_SIZES[last + 1]! <= top) last++;
    if (last < first) continue;
    if (!loopApplies) return sizeFix(i, first);
    // A larger earth only lowers the loop: when the largest allowed fails, every one does.
    if (!candidatePasses(x, (rhoActive / a + rhoEarth / STANDARD_SIZES[last]!) / n, imPerMetre)) continue;
    for (let k = first; k <= last; k++) {
      const e = STANDARD_SIZES[k]!;
      if (candidatePasses(x, (rhoActive / a + rhoEarth / e) / n, imPerMetre)) return sizeFix(i, k);
    }
  }
  return null;
}

function findDevice(x: FixInputs, curve: Curve, rating: number): Fix | null {
  const { result, rules } = x;
  const c = rules.voltageFactor.value;
  const u0 = rules.voltage.value;
  const s = rules.unknownSourceShare.value;
  const top = CURVE_ORDER.indexOf(curve);
  for (let r = FIX_RATINGS.length - 1; r >= 0; r--) {
    const candidate = FIX_RATINGS[r]!;
    if (candidate > rating + 1e-9) continue;
    if (x.protectingIb !== null && candidate < x.protectingIb - 1e-9) break;
    for (let k = top; k >= 0; k--) {
      const cv = CURVE_ORDER[k]!;
      const budget = (c * u0) / (rules.multiples[cv].value * candidate);
      let ratio: number;
      if (x.knownSource) ratio = result.zs! / budget;
      else {
        const up = (1 - s) * budget;
        const upRatio = up > 0 ? result.upstream! / up : result.upstream! > 0 ? Number.MAX_VALUE : 0;
        ratio = Math.max(result.own! / (s * budget), upRatio);
      }
      if (atMost(ratio, 1)) return deviceFix(k, r);
    }
  }
  return null;
}
