// Fixes that pass (method-depth.md §8): for a link whose loop fails (or relies on an RCD) or
// whose voltage drop fails, the changes that make it pass, each with everything else
// unchanged, in this order: length, size, device, rcd. Each candidate is judged in closed form
// from the sums already known (the loop before the link, its impedance per metre, its current),
// never by re-running the analysis.

import type { Curve, Link } from '../model/types.js';
import { STANDARD_SIZES } from '../model/sizes.js';
import type { ResolvedRules } from './basis.js';
import type { LoopFacts } from './check.js';
import { abs } from './complex.js';
import type { CircuitResult, Fix } from './results.js';
import { atMost } from './tolerance.js';
import { linkVoltageDrop } from './voltage-drop.js';

export const FIX_RATINGS: readonly number[] = [6, 10, 16, 20, 25, 32, 40, 50, 63, 80, 100, 125];
const CURVE_ORDER: readonly Curve[] = ['B', 'C', 'D'];
export const RCD_FIX_SENSITIVITY = 0.03;

export interface FixInputs {
  link: Link;
  result: CircuitResult;
  facts: LoopFacts;
  rules: ResolvedRules;
  /** The protecting link, when there is one. */
  protecting: Link | null;
  /** Ib of the protecting link (A), when known. */
  protectingIb: number | null;
  /** This link's Ib (A), cos φ and phases, for the drop of a candidate size. */
  ib: number | null;
  pf: number | null;
}

/**
 * Whether the loop passes with this link's cable at a candidate size, given its impedance per
 * metre: impedancePerMetre's and the loop check's arithmetic written out, with no objects (a job
 * whose circuits mostly fail asks this many times for each of them).
 */
function candidatePasses(x: FixInputs, rePerMetre: number, imPerMetre: number): boolean {
  const { facts, result, rules } = x;
  const before = facts.before!;
  const l = x.link.cable.length;
  const z = abs(before.re + rePerMetre * l, before.im + imPerMetre * l);
  const budget = facts.budget!;
  if (facts.ze) return atMost(z / budget, 1);
  const share = rules.unknownSourceShare.value;
  const up = (1 - share) * budget;
  const upRatio = up > 0 ? result.upstream! / up : result.upstream! > 0 ? Number.MAX_VALUE : 0;
  return atMost(Math.max(z / (share * budget), upRatio), 1);
}

export function findFixes(x: FixInputs): Fix[] {
  const { link, result, facts } = x;
  const loopFails = result.status === 'fail' || result.status === 'rcd';
  const dropFails = result.voltageStatus === 'fail';
  if (!loopFails && !dropFails) return [];
  const fixes: Fix[] = [];
  const cable = link.cable;

  if (loopFails && result.maxLength !== null && result.maxLength > 0 && result.maxLength < cable.length) {
    fixes.push({ kind: 'length', maxLength: result.maxLength });
  }

  const size = findSize(x);
  if (size) fixes.push(size);

  const device = x.protecting?.device;
  if (loopFails && device?.type === 'mcb' && facts.budget !== null && result.own !== null) {
    const fix = findDevice(x, device.curve, device.rating);
    if (fix) fixes.push(fix);
  }

  if (loopFails && result.status === 'fail' && x.protecting && !x.protecting.rcd) {
    fixes.push({ kind: 'rcd', sensitivity: RCD_FIX_SENSITIVITY });
  }
  return fixes;
}

function findSize(x: FixInputs): Fix | null {
  const { link, result, facts, rules } = x;
  const cable = link.cable;
  const loopApplies = facts.device !== null;
  if (loopApplies && (facts.budget === null || facts.before === null)) return null;
  const dropApplies = result.voltageStatus !== 'unchecked';
  const dropBase = dropApplies ? result.voltageDropTotal! - result.voltageDrop! : 0;
  const rhoActive = rules.resistivity[cable.material].value;
  const rhoEarth = rules.resistivity[cable.earthMaterial ?? cable.material].value;
  const n = cable.parallel ?? 1;
  const imPerMetre = (2 * (cable.reactance ?? rules.reactance.value)) / n;
  for (const a of STANDARD_SIZES) {
    if (a < cable.active - 1e-9) continue;
    // The drop depends on the active size alone: a size that fails it fails with every earth.
    if (dropApplies) {
      const vd = linkVoltageDrop(link, a, result.phases, x.ib!, x.pf!, rules);
      if (!atMost(dropBase + vd, result.voltageDropLimit!)) continue;
    }
    // The earths allowed with this active: from the present earth up to the larger of the two.
    const top = Math.max(a, cable.earth) + 1e-9;
    let first = -1;
    let last = -1;
    for (let k = 0; k < STANDARD_SIZES.length; k++) {
      const e = STANDARD_SIZES[k]!;
      if (e < cable.earth - 1e-9 || e > top) continue;
      if (first < 0) first = k;
      last = k;
    }
    if (first < 0) continue;
    if (!loopApplies) return { kind: 'size', active: a, earth: STANDARD_SIZES[first]! };
    // A larger earth only lowers the loop: when the largest allowed fails, every one does.
    if (!candidatePasses(x, (rhoActive / a + rhoEarth / STANDARD_SIZES[last]!) / n, imPerMetre)) continue;
    for (let k = first; k <= last; k++) {
      const e = STANDARD_SIZES[k]!;
      if (candidatePasses(x, (rhoActive / a + rhoEarth / e) / n, imPerMetre)) return { kind: 'size', active: a, earth: e };
    }
  }
  return null;
}

function findDevice(x: FixInputs, curve: Curve, rating: number): Fix | null {
  const { result, facts, rules } = x;
  const c = rules.voltageFactor.value;
  const u0 = rules.voltage.value;
  const s = rules.unknownSourceShare.value;
  const curves = CURVE_ORDER.slice(0, CURVE_ORDER.indexOf(curve) + 1);
  for (let r = FIX_RATINGS.length - 1; r >= 0; r--) {
    const candidate = FIX_RATINGS[r]!;
    if (candidate > rating + 1e-9) continue;
    if (x.protectingIb !== null && candidate < x.protectingIb - 1e-9) break;
    for (let k = curves.length - 1; k >= 0; k--) {
      const cv = curves[k]!;
      const budget = (c * u0) / (rules.multiples[cv].value * candidate);
      let ratio: number;
      if (facts.ze) ratio = result.zs! / budget;
      else {
        const up = (1 - s) * budget;
        const upRatio = up > 0 ? result.upstream! / up : result.upstream! > 0 ? Number.MAX_VALUE : 0;
        ratio = Math.max(result.own! / (s * budget), upRatio);
      }
      if (atMost(ratio, 1)) return { kind: 'device', curve: cv, rating: candidate };
    }
  }
  return null;
}
