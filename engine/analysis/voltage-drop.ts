// Voltage drop of every link and its total from the supply (method-depth.md §3).
//
//   vd(L) = 100 · b · Ib · L · (ρv,a / Sa · cos φ + x · sin φ) / (n · U0)     % of U0
//   b = 2 for 1 phase (out and back, the neutral taken equal to the active),
//   b = 1 for 3 phases (balanced: one phase against U0, equal to √3 · Ib · … / U).
// ρv is the resistivity in normal service (Cu 0.0225, Al 0.036 Ω·mm²/m: 1.25 × ρ20,
// IEC 60364-5-52 Annex G). The total at a link's far end sums vd over every link from the
// supply to it, itself included (a link above with Ib null adds 0).
// Limits, for links arriving at a point: au-nz 5 % (AS/NZS 3000:2018 clause 3.6.2, from
// memory); iec 3 % for lighting, 5 % otherwise (IEC 60364-5-52:2009 Table G.52.1).

import type { Link, PointNode } from '../model/types.js';
import type { ResolvedRules } from './basis.js';
import type { LoadTable } from './design-current.js';
import type { TreeOrder } from './order.js';
import type { PhaseTable } from './phases.js';

/** The drop of one link, %, for design current ib (A) and power factor pf. */
export function linkVoltageDrop(link: Link, active: number, phases: number, ib: number, pf: number, rules: ResolvedRules): number {
  const cable = link.cable;
  const b = phases === 3 ? 1 : 2;
  const rho = rules.voltageDropResistivity[cable.material].value;
  const x = cable.reactance ?? rules.reactance.value;
  const sin = Math.sqrt(Math.max(0, 1 - pf * pf));
  const n = cable.parallel ?? 1;
  return (100 * b * ib * cable.length * ((rho / active) * pf + x * sin)) / (n * rules.voltage.value);
}

export interface DropTable {
  /** Own drop per link, % (NaN where Ib is null). */
  own: Float64Array;
  /** Total drop at each node, % (0 at a supply). */
  atNode: Float64Array;
}

export function dropTable(order: TreeOrder, phases: PhaseTable, loads: LoadTable, rules: ResolvedRules): DropTable {
  const { links, nodes, pre, feederOf, linkFrom } = order;
  const own = new Float64Array(links.length).fill(NaN);
  links.forEach((link, l) => {
    const ib = loads.ib[l]!;
    if (!Number.isNaN(ib)) own[l] = linkVoltageDrop(link, link.cable.active, phases.link[l]!, ib, loads.pf[l]!, rules);
  });
  const atNode = new Float64Array(nodes.length);
  for (let at = 0; at < pre.length; at++) {
    const n = pre[at]!;
    const f = feederOf[n]!;
    if (f < 0) continue;
    // a link with Ib null adds 0; a drop made NaN by extreme values makes the totals below NaN
    atNode[n] = atNode[linkFrom[f]!]! + (Number.isNaN(loads.ib[f]!) ? 0 : own[f]!);
  }
  return { own, atNode };
}

/**
 * The drops over a job in which only link l's cable changed: its own drop and its subtree's
 * totals, in place (the tables are shared between versions, versions.ts; the caller saved those
 * entries).
 */
export function dropTableWithLink(prev: DropTable, order: TreeOrder, phases: PhaseTable, loads: LoadTable, rules: ResolvedRules, l: number): DropTable {
  const { own, atNode } = prev;
  const ib = loads.ib[l]!;
  own[l] = Number.isNaN(ib) ? NaN : linkVoltageDrop(order.links[l]!, order.links[l]!.cable.active, phases.link[l]!, ib, loads.pf[l]!, rules);
  const to = order.linkTo[l]!;
  if (to >= 0 && order.feederOf[to] === l) {
    const { start, end } = order.subtree(to);
    for (let k = start; k < end; k++) {
      const n = order.pre[k]!;
      const f = order.feederOf[n]!;
      atNode[n] = atNode[order.linkFrom[f]!]! + (Number.isNaN(loads.ib[f]!) ? 0 : own[f]!);
    }
  }
  return { own, atNode };
}

/** The voltage-drop limit of a link, %, or null when it does not arrive at a point. */
export function voltageDropLimit(link: Link, far: PointNode | null, rules: ResolvedRules): number | null {
  if (!far) return null;
  if (link.voltageDropLimit !== undefined) return link.voltageDropLimit;
  if (rules.voltageDropLimit) return rules.voltageDropLimit.value;
  return far.use === 'lighting' ? rules.voltageDropLimits.lighting.value : rules.voltageDropLimits.other.value;
}
