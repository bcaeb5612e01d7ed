// Fixes that pass (method-depth.md §8): for a link whose loop fails (or relies on an RCD) or
// whose voltage drop fails, the changes that make it pass, each with everything else
// unchanged, in this order: length, size, device, rcd. Each candidate is judged in closed form
// from the sums already known (the loop before the link, its impedance per metre, its current),
// never by re-running the analysis.

import type { Curve, Link } from '../model/types.js';
import { STANDARD_SIZES } from '../model/sizes.js';
import type { ResolvedRules } from './basis.js';
import type { LoopFacts } from './check.js';
import { magnitude } from './complex.js';
import { impedancePerMetre } from './impedance.js';
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

/** The loop ratio of this link with its loop before it and a new per-metre impedance. */
function ratioWith(x: FixInputs, perMetre: { re: number; im: number }, budget: number): number {
  const { facts, result, rules, link } = x;
  const before = facts.before!;
  const l = link.cable.length;
  const z = magnitude({ re: before.re + perMetre.re * l, im: before.im + perMetre.im * l });
  if (facts.ze) return z / budget;
  const s = rules.unknownSourceShare.value;
  const up = (1 - s) * budget;
  const upRatio = up > 0 ? result.upstream! / up : result.upstream! > 0 ? Number.MAX_VALUE : 0;
  return Math.max(z / (s * budget), upRatio);
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
  for (const a of STANDARD_SIZES) {
    if (a < cable.active - 1e-9) continue;
    // The drop depends on the active size alone: a size that fails it fails with every earth.
    if (dropApplies) {
      const vd = linkVoltageDrop(link, a, result.phases, x.ib!, x.pf!, rules);
      if (!atMost(dropBase + vd, result.voltageDropLimit!)) continue;
    }
    for (const e of STANDARD_SIZES) {
      if (e < cable.earth - 1e-9 || e > Math.max(a, cable.earth) + 1e-9) continue;
      if (loopApplies) {
        const perMetre = impedancePerMetre({ ...cable, active: a, earth: e }, rules);
        if (!atMost(ratioWith(x, perMetre, facts.budget!), 1)) continue;
      }
      return { kind: 'size', active: a, earth: e };
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
