// Maximum prospective fault current at every node, with the conductors cold and the voltage
// high (method-depth.md §5), for the breaking-capacity check.
//
// Source: the supply's `maxFault` gives Zsrc = cmax · U0 / current, R = Zsrc / √(1 + xr²),
// X = R · xr. Without it, when Ze is known, Zsrc = Ze / 2 for a three-phase supply (half the
// earth-fault loop taken as the phase path) or Ze for a single-phase one (common practice, from
// memory). Otherwise fault levels are unknown. cmax = 1.10 (IEC 60909-0:2016 Table 1, from
// memory).
// Each link adds Zp = ρ20,a · L / Sa + j · x · L per set, divided by n: once for 3 phases,
// twice for 1 phase (out on the active, back on a neutral taken equal to it).
//   Imax(node) = cmax · U0 / |Zsrc + Σ contributions from the supply to the node|

import type { Link, SupplyNode } from '../model/types.js';
import type { ResolvedRules } from './basis.js';
import { abs, type Complex } from './complex.js';
import type { TreeOrder } from './order.js';
import type { PhaseTable } from './phases.js';
import { sourceImpedance } from './source.js';

export type FaultSourceKind = 'stated' | 'from-ze' | 'unknown';

/** Zsrc for fault levels, and how it was found. */
export function faultSource(supply: SupplyNode, phases: number, rules: ResolvedRules): { z: Complex | null; kind: FaultSourceKind } {
  const u = rules.maxVoltageFactor.value * rules.voltage.value;
  if (supply.maxFault) {
    const xr = supply.maxFault.xr ?? 1;
    const z = u / supply.maxFault.current;
    const r = z / Math.sqrt(1 + xr * xr);
    return { z: { re: r, im: r * xr }, kind: 'stated' };
  }
  const ze = sourceImpedance(supply.source, rules.voltage.value);
  if (!ze) return { z: null, kind: 'unknown' };
  const k = phases === 3 ? 0.5 : 1;
  return { z: { re: ze.re * k, im: ze.im * k }, kind: 'from-ze' };
}

/** One link's contribution to the fault-level impedance. */
export function faultContribution(link: Link, phases: number, rules: ResolvedRules): Complex {
  const c = link.cable;
  const n = c.parallel ?? 1;
  const k = (phases === 3 ? 1 : 2) / n;
  const rho = rules.shortCircuitResistivity[c.material].value;
  const x = c.reactance ?? rules.reactance.value;
  return { re: (k * rho * c.length) / c.active, im: k * x * c.length };
}

export interface FaultTable {
  /** Imax at each node, A (NaN when unknown, Infinity when the impedance is zero). */
  imax: Float64Array;
  /** Zsrc + Σ contributions at each node (NaN when unknown). */
  re: Float64Array;
  im: Float64Array;
}

export function faultTable(order: TreeOrder, phases: PhaseTable, rules: ResolvedRules): FaultTable {
  const { nodes, pre } = order;
  const re = new Float64Array(nodes.length).fill(NaN);
  const im = new Float64Array(nodes.length).fill(NaN);
  const imax = new Float64Array(nodes.length).fill(NaN);
  const table = { imax, re, im };
  for (let at = 0; at < pre.length; at++) faultAt(table, order, phases, rules, pre[at]!);
  return table;
}

/**
 * The fault levels over a job in which only link l's cable changed: its subtree is redone, in
 * place (the tables are shared between versions, versions.ts; the caller saved those entries).
 */
export function faultTableWithLink(prev: FaultTable, order: TreeOrder, phases: PhaseTable, rules: ResolvedRules, l: number): FaultTable {
  const table = prev;
  const to = order.linkTo[l]!;
  if (to >= 0 && order.feederOf[to] === l) {
    const { start, end } = order.subtree(to);
    for (let k = start; k < end; k++) faultAt(table, order, phases, rules, order.pre[k]!);
  }
  return table;
}

/** Zsrc + Σ and Imax at node n, from its parent's (already done). */
function faultAt(table: FaultTable, order: TreeOrder, phases: PhaseTable, rules: ResolvedRules, n: number): void {
  const { re, im, imax } = table;
  const node = order.nodes[n]!;
  const f = order.feederOf[n]!;
  if (node.kind === 'supply') {
    const src = faultSource(node, phases.supply[n]!, rules).z;
    if (src) {
      re[n] = src.re;
      im[n] = src.im;
    }
  } else if (f >= 0) {
    // faultContribution's arithmetic, without an object per link.
    const c = order.links[f]!.cable;
    const k = (phases.link[f] === 3 ? 1 : 2) / (c.parallel ?? 1);
    const rho = rules.shortCircuitResistivity[c.material].value;
    const x = c.reactance ?? rules.reactance.value;
    const p = order.linkFrom[f]!;
    re[n] = re[p]! + (k * rho * c.length) / c.active;
    im[n] = im[p]! + k * x * c.length;
  }
  const mag = abs(re[n]!, im[n]!);
  imax[n] = Number.isNaN(mag) ? NaN : mag > 0 ? (rules.maxVoltageFactor.value * rules.voltage.value) / mag : Infinity;
}
