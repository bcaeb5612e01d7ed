// analyse(job): every link checked, in file order, with the worst fault path, the supplies'
// fault levels and headroom, and a summary. The sheet, the command line, the printout and the
// tests all call this one function.
//
// A few passes over one ordered tree (order.ts): the loop sums and the fault-level sums down the
// tree, the design currents up it, then the checks of each link from the values at its ends.

import type { Device, Job, PointNode, SupplyNode } from '../model/types.js';
import { resolveRules, type ResolvedRules } from './basis.js';
import { applyCapacity } from './capacity.js';
import { blankResult, checkLoopInto, LoopTable } from './check.js';
import { loadTable, type LoadTable } from './design-current.js';
import { faultTable, faultTableWithLink, type FaultTable } from './fault-level.js';
import { findFixes, fixInputsOf, type FixInputs } from './fixes.js';
import { largestSourceOf, sourcePhasor } from './headroom.js';
import type { Complex } from './complex.js';
import { correctedReading, correctionFactor, readingTemperature, testLimit } from './measured.js';
import { phaseTable, asPhases, type PhaseTable } from './phases.js';
import type { CheckCounts, CircuitResult, CheckStatus, Results, Status, StatusCounts, SupplyResult, Summary } from './results.js';
import { Sums } from './sums.js';
import { atMost, fixedOrRange, toFixed } from './tolerance.js';
import { dropTable, dropTableWithLink, voltageDropLimit, type DropTable } from './voltage-drop.js';
import { checkWithstand } from './withstand.js';
import { worstPathOf } from './worst-path.js';
import { Version } from './versions.js';

const kA = (a: number): string => `${toFixed(a / 1000, 2)} kA`;
const orNull = (v: number): number | null => (Number.isNaN(v) ? null : v);

/** A finished analysis: the results and what produced them, for a quick re-analysis after an edit. */
export interface Analysis {
  readonly job: Job;
  readonly results: Results;
  /** Internal: the passes' values. */
  readonly state: State;
}

interface State {
  rules: ResolvedRules;
  sums: Sums;
  phases: PhaseTable;
  loads: LoadTable;
  drops: DropTable;
  faults: FaultTable;
  facts: LoopTable;
  circuits: CircuitResult[];
  /** The largest source impedance each checked link tolerates (NaN when it does not count). */
  headroom: Float64Array;
  /** Each link's ratio for the worst path (NaN when unchecked or without a ratio). */
  ratios: Float64Array;
  /** Which version of the shared tables this state reads (versions.ts). */
  version: Version;
  /** Each supply's source phasor, by node index (filled as needed). */
  phasors: Array<Complex | undefined>;
  /** The fixes' inputs, filled for each link that needs fixes (one object for every link). */
  fixInputs: FixInputs | undefined;
}

export function analyse(job: Job): Results {
  return createAnalysis(job).results;
}

export function createAnalysis(job: Job): Analysis {
  const rules = resolveRules(job.rules);
  const sums = new Sums(job, rules);
  const order = sums.order;
  const phases = phaseTable(order);
  const loads = loadTable(order, phases);
  const drops = dropTable(order, phases, loads, rules);
  const faults = faultTable(order, phases, rules);
  const nl = job.links.length;
  const facts = new LoopTable(nl);
  const headroom = new Float64Array(nl).fill(NaN);
  const ratios = new Float64Array(nl).fill(NaN);
  // Every table a length change writes, shared by the analyses derived from this one.
  const version = new Version({
    link: [sums.linkRe, sums.linkIm, drops.own, headroom, ratios, facts.protecting, facts.budget, facts.beforeRe, facts.beforeIm, facts.perRe, facts.perIm, facts.zeRe, facts.zeIm, facts.zeroLoop],
    node: [sums.nodeRe, sums.nodeIm, drops.atNode, faults.imax, faults.re, faults.im],
  });
  const state: State = { rules, sums, phases, loads, drops, faults, facts, circuits: new Array<CircuitResult>(nl), headroom, ratios, version, phasors: [], fixInputs: undefined };
  for (let l = 0; l < job.links.length; l++) checkOne(state, l);
  // Fixes need the protecting link's design current, known only now. Each circuit is counted
  // into the summary as it is finished (one walk over the results, not two).
  const summary = emptySummary();
  for (let l = 0; l < job.links.length; l++) {
    finishOne(state, l);
    count(summary, state.circuits[l]!, 1);
  }
  return { job, results: resultsOf(state, summary), state };
}

/**
 * The analysis of `job` after an edit of `previous.job`. When the only change is one link's
 * cable length, only what that changes is redone: the link's impedance and drop, the sums of the
 * subtree below it, the checks of the links in that subtree, then the supplies' headroom, the
 * worst path and the summary. Any other change is analysed afresh.
 */
/**
 * Runs the re-analysis of a length edit once, on a copy of the job with one final subcircuit's
 * cable half as long again, and hands back its results to be thrown away: the first real edit of
 * a large job then finds this code compiled and optimised instead of paying for that while the
 * user waits. `previous` is left exactly as it was (its tables are made current again:
 * versions.ts), so the next reanalyse from it is the same as without the rehearsal. Null when
 * the job has no link with a cable length to change.
 */
export function rehearseLengthEdit(previous: Analysis): Results | null {
  const links = previous.job.links;
  const roles = previous.state.sums.order.roles;
  let l = roles.lastIndexOf('final-subcircuit');
  if (l < 0 || !(links[l]!.cable.length > 0)) l = links.findIndex((x) => x.cable.length > 0);
  if (l < 0) return null;
  const link = links[l]!;
  const changed = links.slice();
  changed[l] = { ...link, cable: { ...link.cable, length: link.cable.length * 1.5 } };
  const rehearsed = reanalyse(previous, { ...previous.job, links: changed });
  previous.state.version.reroot();
  return rehearsed.results;
}

export function reanalyse(previous: Analysis, job: Job): Analysis {
  const l = onlyLengthChanged(previous.job, job);
  if (l < 0) return createAnalysis(job);
  const prev = previous.state;
  // The links redone (l and the feeders below it) and the nodes whose sums change (l's subtree).
  const before = prev.sums.order;
  const redo: number[] = [l];
  const changed: number[] = [];
  const to = before.linkTo[l]!;
  if (to >= 0 && before.feederOf[to] === l) {
    const { start, end } = before.subtree(to);
    for (let k = start; k < end; k++) {
      const n = before.pre[k]!;
      changed.push(n);
      const f = before.feederOf[n]!;
      if (k > start && f >= 0) redo.push(f);
    }
  }
  // The shared tables to the previous analysis's values, then a new version written in place
  // at those entries only (the previous analysis keeps its values: versions.ts).
  prev.version.reroot();
  const version = prev.version.derive(Int32Array.from(redo), Int32Array.from(changed));
  const sums = prev.sums.withLinkChanged(job, l);
  const order = sums.order;
  const state: State = {
    ...prev,
    sums,
    drops: dropTableWithLink(prev.drops, order, prev.phases, prev.loads, prev.rules, l),
    faults: faultTableWithLink(prev.faults, order, prev.phases, prev.rules, l),
    circuits: prev.circuits.slice(),
    version,
  };
  const summary = cloneSummary(previous.results.summary);
  for (const k of redo) count(summary, prev.circuits[k]!, -1);
  for (const k of redo) checkOne(state, k);
  for (const k of redo) {
    finishOne(state, k);
    count(summary, state.circuits[k]!, 1);
  }
  return { job, results: resultsOf(state, summary), state };
}

/** The index of the one link whose cable length alone differs, or −1. */
function onlyLengthChanged(before: Job, after: Job): number {
  if (before.rules !== after.rules || before.nodes !== after.nodes && !sameItems(before.nodes, after.nodes)) return -1;
  if (before.links.length !== after.links.length) return -1;
  let changed = -1;
  for (let i = 0; i < after.links.length; i++) {
    if (before.links[i] === after.links[i]) continue;
    if (changed >= 0) return -1;
    changed = i;
  }
  if (changed < 0) return -1;
  const a = before.links[changed]!;
  const b = after.links[changed]!;
  return sameValue(a, b, 'cable') && sameValue(a.cable, b.cable, 'length') ? changed : -1;
}

/**
 * Two values of a job equal as JSON (a key holding undefined counts as absent, as in the file),
 * leaving out the key `skip` of these two objects. The records' values nest a few levels at
 * most (the loader's limits), so the comparison recurses.
 */
function sameValue(x: unknown, y: unknown, skip: string | null = null): boolean {
  if (x === y) return true;
  if (typeof x !== 'object' || typeof y !== 'object' || x === null || y === null) return false;
  if (Array.isArray(x) !== Array.isArray(y)) return false;
  if (Array.isArray(x)) {
    const ys = y as unknown[];
    if (x.length !== ys.length) return false;
    for (let i = 0; i < x.length; i++) if (!sameValue(x[i], ys[i])) return false;
    return true;
  }
  const a = x as Record<string, unknown>;
  const b = y as Record<string, unknown>;
  let count = 0;
  for (const k in a) {
    if (k === skip || a[k] === undefined) continue;
    count++;
    if (!sameValue(a[k], b[k])) return false;
  }
  for (const k in b) if (k !== skip && b[k] !== undefined) count--;
  return count === 0;
}

function sameItems<T>(a: readonly T[], b: readonly T[]): boolean {
  return a.length === b.length && a.every((x, i) => x === b[i]);
}

/** Every check of link l from the values the passes left. */
function checkOne(state: State, l: number): void {
  const { rules, sums, phases, loads, drops, faults } = state;
  const order = sums.order;
  const link = order.links[l]!;
  const result = blankResult(link, order.roles[l]!);
  const loop = state.facts;
  checkLoopInto(sums, l, result, loop);
  const device = loop.deviceOf(order, l);
  const budget = loop.budgetOf(l);
  state.circuits[l] = result;
  const reached = sums.reached(l);
  const to = order.linkTo[l]!;
  const from = order.linkFrom[l]!;
  // Notes a circuit often carries are joined, not templated: a template's result keeps each piece
  // as a string of its own for as long as the results live.
  const notes = result.notes;
  result.phases = asPhases(phases.link[l]!);

  // Design current and voltage drop.
  result.designCurrent = orNull(loads.ib[l]!);
  // With Ib known, a NaN here comes from extreme values (0 · Infinity): out of range, not absent.
  result.powerFactor = result.designCurrent === null ? null : loads.pf[l]!;
  result.voltageDrop = result.designCurrent === null ? null : drops.own[l]!;
  const far = to >= 0 && order.nodes[to]!.kind === 'point' ? (order.nodes[to] as PointNode) : null;
  result.voltageDropLimit = voltageDropLimit(link, far, rules);
  if (result.voltageDrop !== null && reached) {
    const total = drops.atNode[to]!;
    result.voltageDropTotal = total;
    if (result.voltageDropLimit !== null) {
      result.voltageStatus = atMost(total, result.voltageDropLimit) ? 'pass' : 'fail';
      if (result.voltageStatus === 'fail') {
        notes.push(['voltage drop: the total ', fixedOrRange(total, 2, ' %'), ' from the supply to ', link.to, ' exceeds the limit ', String(result.voltageDropLimit), ' %'].join(''));
      }
    }
  }

  // Capacity: Ib ≤ In ≤ Iz.
  const rating = device ? device.rating : null;
  applyCapacity(link, result.phases, result.designCurrent, rating, rules, notes, result);

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
      notes.push(["breaking capacity: the device's ", String(own.breaking), ' kA is below the ', kA(result.faultLevel), ' maximum prospective fault current at its origin'].join(''));
    }
  }

  // Withstand of the protective conductor.
  checkWithstand(link, device, loop.knownSource(l), result.faultCurrent, loop.zeroLoop[l] === 1, result.clearingTime, notes, result);

  // Measured reading and the test limit.
  measuredResult(result, budget, device, loop.protecting[l]!, l, sums, rules);

  // What this link allows of the source (source headroom).
  state.headroom[l] = NaN;
  if (budget !== null && reached) {
    state.headroom[l] = largestSourceOf(phasorOf(state, order.supplyOf[to]!), sums.nodeRe[to]!, sums.nodeIm[to]!, budget);
  }
}

/** The unit phasor of supply node s's source, worked out once per supply. */
function phasorOf(state: State, s: number): Complex {
  let u = state.phasors[s];
  if (u === undefined) {
    u = sourcePhasor((state.sums.order.nodes[s] as SupplyNode).source);
    state.phasors[s] = u;
  }
  return u;
}

/** The fixes and the verdict of link l, once every link's design current is known. */
function finishOne(state: State, l: number): void {
  const { sums, circuits, facts, rules } = state;
  const result = circuits[l]!;
  const needsFixes = result.status === 'fail' || result.status === 'rcd' || result.voltageStatus === 'fail';
  if (needsFixes) {
    const p = facts.protecting[l]!;
    const x = fixInputsOf(facts, sums.order, l, result, rules, p >= 0 ? circuits[p]!.designCurrent : null, state.fixInputs);
    state.fixInputs = x;
    result.fixes = findFixes(x);
  }
  result.verdict = verdictOf(result);
  keepFinite(result);
  state.ratios[l] = result.status === 'unchecked' || result.ratio === null ? NaN : result.ratio;
}

/** What each number of a circuit is, for the note when it leaves the range of numbers. */
const QUANTITIES = [
  ['tripCurrent', 'the trip current Ia'],
  ['zs', 'Zs'],
  ['own', "the circuit's own loop impedance"],
  ['upstream', 'the upstream loop impedance'],
  ['limit', 'the loop limit'],
  ['faultCurrent', 'the fault current'],
  ['clearingTime', 'the clearing time'],
  ['ratio', 'the loop ratio'],
  ['maxLength', 'the maximum length'],
  ['designCurrent', 'the design current Ib'],
  ['powerFactor', 'the power factor'],
  ['voltageDrop', "the link's own voltage drop"],
  ['voltageDropTotal', 'the total voltage drop'],
  ['capacity', 'the capacity Iz'],
  ['faultLevel', 'the fault level'],
  ['earthMinArea', 'the minimum earth area'],
  ['testLimit', 'the test limit'],
] as const;

const READING_WORD: Record<Status, string> = { pass: 'passing', fail: 'failing', rcd: 'relying on the RCD', unchecked: 'not checked' };

const outOfRange = (what: string): string => `${what} is out of range: the job's values are too extreme to compute it, so it is left empty`;

/**
 * Numbers at the edges (method-depth.md): an extreme but valid value can take a result past the
 * range of numbers (Infinity, or NaN from Infinity − Infinity, 0 · Infinity). Such a number is
 * given as null with a note, never as NaN or Infinity. One sum tells whether any is out of range
 * (a sum of finite values that overflows only sends the circuit through the closer look).
 */
function keepFinite(c: CircuitResult): void {
  const m = c.measured;
  const sum =
    (c.tripCurrent ?? 0) + (c.zs ?? 0) + (c.own ?? 0) + (c.upstream ?? 0) + (c.limit ?? 0) + (c.faultCurrent ?? 0) + (c.clearingTime ?? 0) +
    (c.ratio ?? 0) + (c.maxLength ?? 0) + (c.designCurrent ?? 0) + (c.powerFactor ?? 0) + (c.voltageDrop ?? 0) + (c.voltageDropTotal ?? 0) +
    (c.capacity ?? 0) + (c.faultLevel ?? 0) + (c.earthMinArea ?? 0) + (c.testLimit ?? 0) + (m === null ? 0 : m.corrected + (m.ratio ?? 0));
  if (Number.isFinite(sum)) return;
  const numbers = c as unknown as Record<string, number | null>;
  for (const [key, what] of QUANTITIES) {
    const v = numbers[key]!;
    if (v !== null && !Number.isFinite(v)) {
      numbers[key] = null;
      c.notes.push(outOfRange(what));
    }
  }
  if (m !== null) {
    if (!Number.isFinite(m.corrected)) {
      // The format has no empty corrected reading: the reading is left out, its verdict kept.
      c.notes.push(`measured: the reading ${m.zs} Ω cannot be corrected (out of range: the job's values are too extreme), so it is left out; it counts as ${READING_WORD[m.status]}`);
      c.measured = null;
    } else if (m.ratio !== null && !Number.isFinite(m.ratio)) {
      m.ratio = null;
      c.notes.push(outOfRange("the reading's ratio"));
    }
  }
}

function resultsOf(state: State, summary: Summary = summarise(state.circuits)): Results {
  const { sums, phases, faults, circuits, headroom, rules } = state;
  const order = sums.order;
  const supplies: SupplyResult[] = [];
  const bySupply: Array<SupplyResult | undefined> = [];
  for (const n of order.supplies) {
    const imax = faults.imax[n]!;
    const entry: SupplyResult = { node: order.nodes[n]!.id, phases: asPhases(phases.supply[n]!), faultLevel: Number.isFinite(imax) ? imax : null, maxZe: null, minFaultCurrent: null, setBy: null };
    supplies.push(entry);
    bySupply[n] = entry;
  }
  for (let l = 0; l < headroom.length; l++) {
    const z = headroom[l]!;
    if (!Number.isFinite(z)) continue; // NaN: does not count; Infinity (extreme values): no limit on the source
    const entry = bySupply[order.supplyOf[order.linkTo[l]!]!];
    if (entry && (entry.maxZe === null || z < entry.maxZe)) {
      entry.maxZe = z;
      entry.setBy = circuits[l]!.link;
    }
  }
  for (const entry of supplies) {
    if (entry.maxZe !== null && entry.maxZe > 0) entry.minFaultCurrent = rules.voltage.value / entry.maxZe;
    // A maxZe too small to divide U0 by (extreme values): null, as the format allows (a supply
    // carries no notes, and the circuits may be shared with an earlier analysis).
    if (entry.minFaultCurrent === Infinity) entry.minFaultCurrent = null;
  }
  return {
    format: 'loopwright.results',
    version: 2,
    basis: rules.basis,
    circuits,
    worst: worstPathOf(order, state.ratios),
    supplies,
    summary,
  };
}

function measuredResult(result: CircuitResult, budget: number | null, device: Device | null, protectingIndex: number, l: number, sums: Sums, rules: ResolvedRules): void {
  const link = sums.order.links[l]!;
  if (!sums.reached(l)) {
    // No supply, so no budget and no measured Ze: the reading is still corrected (Zem = 0).
    if (link.measured) {
      const factor = correctionFactor(link.cable.material, readingTemperature(link), rules);
      result.measured = { zs: link.measured.zs, corrected: correctedReading(link.measured.zs, 0, factor), ratio: null, status: 'unchecked' };
    }
    return;
  }
  const supply = sums.order.supplyNode(sums.order.linkTo[l]!);
  const zem = supply?.measured?.ze ?? 0;
  const reading = link.measured;
  if (!reading && budget === null) return;
  const factor = correctionFactor(link.cable.material, readingTemperature(link), rules);
  if (budget !== null) result.testLimit = testLimit(budget, zem, factor);
  if (!reading) return;
  const corrected = correctedReading(reading.zs, zem, factor);
  if (budget === null || !device) {
    result.measured = { zs: reading.zs, corrected, ratio: null, status: 'unchecked' };
    return;
  }
  const ratio = corrected / budget;
  let status: Status = atMost(ratio, 1) ? 'pass' : 'fail';
  const protecting = sums.order.links[protectingIndex]!;
  if (status === 'fail') {
    result.notes.push(['measured: the reading ', String(reading.zs), ' Ω, corrected to ', fixedOrRange(corrected, 3, ' Ω'), ', exceeds the limit ', fixedOrRange(budget, 3, ' Ω'), ' (largest passing reading ', fixedOrRange(result.testLimit, 3, ' Ω'), ')'].join(''));
    if (protecting.rcd) status = 'rcd';
  }
  result.measured = { zs: reading.zs, corrected, ratio, status };
}

function verdictOf(c: CircuitResult): Status {
  const anyFails = c.voltageStatus === 'fail' || c.capacityStatus === 'fail' || c.breakingStatus === 'fail' || c.withstandStatus === 'fail';
  if (c.status === 'fail' || c.measured?.status === 'fail' || anyFails) return 'fail';
  if (c.status === 'rcd' || c.measured?.status === 'rcd') return 'rcd';
  return c.status === 'pass' ? 'pass' : 'unchecked';
}

function emptySummary(): Summary {
  const counts = () => ({ pass: 0, fail: 0, rcd: 0, unchecked: 0 });
  const checkCounts = () => ({ pass: 0, fail: 0, unchecked: 0 });
  return {
    ...counts(),
    verdict: counts(),
    checks: { voltage: checkCounts(), capacity: checkCounts(), breaking: checkCounts(), withstand: checkCounts(), measured: counts() },
  };
}

function summarise(circuits: readonly CircuitResult[]): Summary {
  const summary = emptySummary();
  for (let i = 0; i < circuits.length; i++) count(summary, circuits[i]!, 1);
  return summary;
}

/** Add (by = 1) or take away (by = −1) one circuit's statuses. */
function count(summary: Summary, c: CircuitResult, by: 1 | -1): void {
  addStatus(summary, c.status, by);
  addStatus(summary.verdict, c.verdict, by);
  const checks = summary.checks;
  addCheck(checks.voltage, c.voltageStatus, by);
  addCheck(checks.capacity, c.capacityStatus, by);
  addCheck(checks.breaking, c.breakingStatus, by);
  addCheck(checks.withstand, c.withstandStatus, by);
  if (c.measured) addStatus(checks.measured, c.measured.status, by);
}

// Spelt out rather than counts[status] += by: a property named by a variable is a slow lookup.
function addStatus(counts: StatusCounts, status: Status, by: number): void {
  if (status === 'pass') counts.pass += by;
  else if (status === 'fail') counts.fail += by;
  else if (status === 'rcd') counts.rcd += by;
  else counts.unchecked += by;
}

function addCheck(counts: CheckCounts, status: CheckStatus, by: number): void {
  if (status === 'pass') counts.pass += by;
  else if (status === 'fail') counts.fail += by;
  else counts.unchecked += by;
}

function cloneSummary(s: Summary): Summary {
  const { checks } = s;
  return {
    pass: s.pass,
    fail: s.fail,
    rcd: s.rcd,
    unchecked: s.unchecked,
    verdict: { ...s.verdict },
    checks: { voltage: { ...checks.voltage }, capacity: { ...checks.capacity }, breaking: { ...checks.breaking }, withstand: { ...checks.withstand }, measured: { ...checks.measured } },
  };
}
