// analyse(job): every link checked, in file order, with the worst fault path, the supplies'
// fault levels and headroom, and a summary. The sheet, the command line, the printout and the
// tests all call this one function.
//
// A few passes over one ordered tree (order.ts): the loop sums and the fault-level sums down the
// tree, the design currents up it, then the checks of each link from the values at its ends.

import type { Job, PointNode, SupplyNode } from '../model/types.js';
import { resolveRules, type ResolvedRules } from './basis.js';
import { checkCapacity } from './capacity.js';
import { blankResult, checkLoop, type LoopFacts } from './check.js';
import { loadTable } from './design-current.js';
import { faultTable } from './fault-level.js';
import { findFixes } from './fixes.js';
import { largestSource, sourcePhasor } from './headroom.js';
import { correctedReading, correctionFactor, readingTemperature, testLimit } from './measured.js';
import { phaseTable, asPhases } from './phases.js';
import type { CircuitResult, CheckStatus, Results, Status, SupplyResult, Summary } from './results.js';
import { Sums } from './sums.js';
import { atMost } from './tolerance.js';
import { dropTable, voltageDropLimit } from './voltage-drop.js';
import { checkWithstand } from './withstand.js';
import { worstPath } from './worst-path.js';

const kA = (a: number): string => `${(a / 1000).toFixed(2)} kA`;
const orNull = (v: number): number | null => (Number.isNaN(v) ? null : v);

export function analyse(job: Job): Results {
  const rules = resolveRules(job.rules);
  const sums = new Sums(job, rules);
  const order = sums.order;
  const phases = phaseTable(order);
  const loads = loadTable(order, phases);
  const drops = dropTable(order, phases, loads, rules);
  const faults = faultTable(order, phases, rules);

  const facts: LoopFacts[] = [];
  const circuits = job.links.map((link, l) => {
    const result = blankResult(link, order.roles[l]!);
    const loop = checkLoop(sums, l, result);
    facts.push(loop);
    const reached = sums.reached(l);
    const to = order.linkTo[l]!;
    const from = order.linkFrom[l]!;
    const notes = result.notes;
    result.phases = asPhases(phases.link[l]!);

    // Design current and voltage drop.
    result.designCurrent = orNull(loads.ib[l]!);
    result.powerFactor = orNull(loads.pf[l]!);
    result.voltageDrop = orNull(drops.own[l]!);
    const far = to >= 0 && order.nodes[to]!.kind === 'point' ? (order.nodes[to] as PointNode) : null;
    result.voltageDropLimit = voltageDropLimit(link, far, rules);
    if (result.voltageDrop !== null && reached) {
      const total = drops.atNode[to]!;
      result.voltageDropTotal = total;
      if (result.voltageDropLimit !== null) {
        result.voltageStatus = atMost(total, result.voltageDropLimit) ? 'pass' : 'fail';
        if (result.voltageStatus === 'fail') {
          notes.push(`voltage drop: the total ${total.toFixed(2)} % from the supply to ${link.to} exceeds the limit ${result.voltageDropLimit} %`);
        }
      }
    }

    // Capacity: Ib ≤ In ≤ Iz.
    const rating = loop.device ? loop.device.rating : null;
    const capacity = checkCapacity(link, result.phases, result.designCurrent, rating, rules);
    result.capacity = capacity.iz;
    result.capacityStatus = capacity.status;
    notes.push(...capacity.notes);

    // Fault level at the origin and the breaking capacity of the link's own device.
    if (reached && from >= 0) {
      const imax = faults.imax[from]!;
      if (imax === Infinity) notes.push('no impedance in the fault path: the maximum fault level cannot be computed');
      else result.faultLevel = orNull(imax);
    }
    const own = link.device;
    if (own?.breaking !== undefined && result.faultLevel !== null) {
      result.breakingStatus = own.breaking * 1000 >= result.faultLevel * (1 - 1e-9) ? 'pass' : 'fail';
      if (result.breakingStatus === 'fail') {
        notes.push(`breaking capacity: the device's ${own.breaking} kA is below the ${kA(result.faultLevel)} maximum prospective fault current at its origin`);
      }
    }

    // Withstand of the protective conductor.
    const withstand = checkWithstand(link, loop.device, loop.ze !== null, result.faultCurrent, loop.zeroLoop, result.clearingTime);
    result.earthMinArea = withstand.earthMinArea;
    result.withstandStatus = withstand.status;
    notes.push(...withstand.notes);

    // Measured reading and the test limit.
    measuredResult(result, loop, l, sums, rules);
    return result;
  });

  // Fixes need the protecting link's design current, known only now.
  job.links.forEach((link, l) => {
    const result = circuits[l]!;
    const p = facts[l]!.protecting;
    result.fixes = findFixes({
      link,
      result,
      facts: facts[l]!,
      rules,
      protecting: p >= 0 ? job.links[p]! : null,
      protectingIb: p >= 0 ? circuits[p]!.designCurrent : null,
      ib: result.designCurrent,
      pf: result.powerFactor,
    });
    result.verdict = verdictOf(result);
  });

  const supplies: SupplyResult[] = [];
  const supplyIndex = new Map<number, SupplyResult>();
  job.nodes.forEach((node, n) => {
    if (node.kind !== 'supply') return;
    const imax = faults.imax[n]!;
    const entry: SupplyResult = { node: node.id, phases: asPhases(phases.supply[n]!), faultLevel: Number.isFinite(imax) ? imax : null, maxZe: null, minFaultCurrent: null, setBy: null };
    supplies.push(entry);
    supplyIndex.set(n, entry);
  });
  circuits.forEach((c, l) => {
    const f = facts[l]!;
    if (f.budget === null || !sums.reached(l)) return;
    const to = order.linkTo[l]!;
    const s = order.supplyOf[to]!;
    const entry = supplyIndex.get(s);
    if (!entry) return;
    const u = sourcePhasor((order.nodes[s] as SupplyNode).source);
    const z = largestSource(u, sums.drawn(to), f.budget);
    if (entry.maxZe === null || z < entry.maxZe) {
      entry.maxZe = z;
      entry.setBy = c.link;
    }
  });
  for (const entry of supplies) {
    if (entry.maxZe !== null && entry.maxZe > 0) entry.minFaultCurrent = rules.voltage.value / entry.maxZe;
  }

  return {
    format: 'loopwright.results',
    version: 2,
    basis: rules.basis,
    circuits,
    worst: worstPath(order, circuits),
    supplies,
    summary: summarise(circuits),
  };
}

function measuredResult(result: CircuitResult, loop: LoopFacts, l: number, sums: Sums, rules: ResolvedRules): void {
  const link = sums.order.links[l]!;
  if (!sums.reached(l)) {
    if (link.measured) result.measured = { zs: link.measured.zs, corrected: link.measured.zs, ratio: null, status: 'unchecked' };
    return;
  }
  const supply = sums.order.supplyNode(sums.order.linkTo[l]!);
  const zem = supply?.measured?.ze ?? 0;
  const factor = correctionFactor(link.cable.material, readingTemperature(link), rules);
  if (loop.budget !== null) result.testLimit = testLimit(loop.budget, zem, factor);
  const reading = link.measured;
  if (!reading) return;
  const corrected = correctedReading(reading.zs, zem, factor);
  if (loop.budget === null || !loop.device) {
    result.measured = { zs: reading.zs, corrected, ratio: null, status: 'unchecked' };
    return;
  }
  const ratio = corrected / loop.budget;
  let status: Status = atMost(ratio, 1) ? 'pass' : 'fail';
  const protecting = sums.order.links[loop.protecting]!;
  if (status === 'fail') {
    result.notes.push(`measured: the reading ${reading.zs} Ω, corrected to ${corrected.toFixed(3)} Ω, exceeds the limit ${loop.budget.toFixed(3)} Ω (largest passing reading ${result.testLimit!.toFixed(3)} Ω)`);
    if (protecting.rcd) status = 'rcd';
  }
  result.measured = { zs: reading.zs, corrected, ratio, status };
}

function verdictOf(c: CircuitResult): Status {
  const checks: CheckStatus[] = [c.voltageStatus, c.capacityStatus, c.breakingStatus, c.withstandStatus];
  if (c.status === 'fail' || c.measured?.status === 'fail' || checks.includes('fail')) return 'fail';
  if (c.status === 'rcd' || c.measured?.status === 'rcd') return 'rcd';
  return c.status === 'pass' ? 'pass' : 'unchecked';
}

function summarise(circuits: readonly CircuitResult[]): Summary {
  const counts = () => ({ pass: 0, fail: 0, rcd: 0, unchecked: 0 });
  const checkCounts = () => ({ pass: 0, fail: 0, unchecked: 0 });
  const summary: Summary = {
    ...counts(),
    verdict: counts(),
    checks: { voltage: checkCounts(), capacity: checkCounts(), breaking: checkCounts(), withstand: checkCounts(), measured: counts() },
  };
  for (const c of circuits) {
    summary[c.status] += 1;
    summary.verdict[c.verdict] += 1;
    summary.checks.voltage[c.voltageStatus] += 1;
    summary.checks.capacity[c.capacityStatus] += 1;
    summary.checks.breaking[c.breakingStatus] += 1;
    summary.checks.withstand[c.withstandStatus] += 1;
    if (c.measured) summary.checks.measured[c.measured.status] += 1;
  }
  return summary;
}
