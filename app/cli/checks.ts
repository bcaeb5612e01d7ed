// The checks beside the loop, for the readable output of `check`: the `--checks` table (phases,
// Ib, drop, capacity, fault level, withstand, test limit, reading, verdict), the fixes in
// words, each supply's fault level and headroom, and the summary lines of every check.
// It only arranges what analyse(job) computed.

import type { CircuitResult, Job, Results, SupplyNode } from '../../engine/index.js';
import { describeHeadroomLong, fmtFixes, verdictNote } from '../../engine/report/index.js';
import {
  amps, area, checkCountsLine, dropPercent, kiloamps, marked, ohms, powerFactor, summaryLine,
} from './format.js';
import type { Column } from './table.js';

interface Row {
  result: CircuitResult;
}

/** `3.21 / 5.00` for a link with a limit, `3.21` without one. */
function totalCell(c: CircuitResult): string {
  if (c.voltageDropTotal === null) return dropPercent(null);
  return c.voltageDropLimit === null ? dropPercent(c.voltageDropTotal) : `${dropPercent(c.voltageDropTotal)} / ${dropPercent(c.voltageDropLimit)}`;
}

/** `0.612 → 0.781` (the reading and its corrected value), blank without a reading. */
function readingCell(c: CircuitResult): string {
  if (c.measured === null) return '';
  return `${ohms(c.measured.zs)} → ${ohms(c.measured.corrected)}`;
}

export const CHECK_COLUMNS: Column<Row>[] = [
  { head: 'link', align: 'left', cell: (r) => r.result.link },
  { head: 'ph', align: 'right', cell: (r) => String(r.result.phases) },
  { head: 'Ib A', align: 'right', cell: (r) => amps(r.result.designCurrent) },
  { head: 'cos φ', align: 'right', cell: (r) => powerFactor(r.result.powerFactor) },
  { head: 'drop %', align: 'right', cell: (r) => dropPercent(r.result.voltageDrop) },
  { head: 'total / limit %', align: 'right', cell: (r) => totalCell(r.result) },
  { head: 'voltage', align: 'left', cell: (r) => marked(r.result.voltageStatus) },
  { head: 'Iz A', align: 'right', cell: (r) => amps(r.result.capacity) },
  { head: 'capacity', align: 'left', cell: (r) => marked(r.result.capacityStatus) },
  { head: 'Ik kA', align: 'right', cell: (r) => kiloamps(r.result.faultLevel) },
  { head: 'breaking', align: 'left', cell: (r) => marked(r.result.breakingStatus) },
  { head: 'S_pe min mm²', align: 'right', cell: (r) => area(r.result.earthMinArea) },
  { head: 'withstand', align: 'left', cell: (r) => marked(r.result.withstandStatus) },
  { head: 'test limit Ω', align: 'right', cell: (r) => ohms(r.result.testLimit) },
  { head: 'reading → corrected Ω', align: 'right', cell: (r) => readingCell(r.result) },
  { head: 'measured', align: 'left', cell: (r) => (r.result.measured === null ? '' : marked(r.result.measured.status)) },
  { head: 'verdict', align: 'left', cell: (r) => marked(r.result.verdict) },
];

export function checkRows(results: Results): Row[] {
  return results.circuits.map((result) => ({ result }));
}

/** Every link's fixes in words, and the verdicts that say more than the loop status. */
export function fixLines(results: Results): string[] {
  const lines: string[] = [];
  const verdicts = results.circuits.flatMap((c) => {
    const note = verdictNote(c);
    return note === null ? [] : [`  ${c.link}: ${note}`];
  });
  if (verdicts.length > 0) lines.push('', 'Verdicts beyond the loop (the failing checks):', ...verdicts);
  const fixed = results.circuits.filter((c) => c.fixes.length > 0);
  if (fixed.length > 0) {
    lines.push('', 'Fixes (each alone, everything else unchanged):');
    for (const c of fixed) lines.push(`  ${c.link}: ${fmtFixes(c)}`);
  }
  return lines;
}

/** Each supply's fault level at its terminals and its headroom (the figure to ask for when unknown). */
export function supplyLines(job: Job, results: Results, u0: number): string[] {
  const supplies = job.nodes.filter((n): n is SupplyNode => n.kind === 'supply');
  if (supplies.length === 0) return [];
  const lines = ['', 'Supplies:'];
  for (const s of supplies) {
    const r = results.supplies.find((x) => x.node === s.id);
    const name = s.name !== undefined && s.name !== '' ? ` ${s.name}` : '';
    const level = r?.faultLevel ?? null;
    const fault = level !== null
      ? `maximum prospective fault current at the terminals ${kiloamps(level)} kA`
      : 'fault level unknown (no maximum fault current stated and the source impedance unknown)';
    lines.push(`  ${s.id}${name}: ${fault}.`);
    lines.push(`    ${describeHeadroomLong(s, r, u0)}`);
  }
  return lines;
}

/** The summary lines: the loop counts, the verdicts, and each check's counts. */
export function summaryLines(results: Results): string[] {
  const s = results.summary;
  const k = s.checks;
  const readings = k.measured.pass + k.measured.fail + k.measured.rcd + k.measured.unchecked;
  return [
    `Loop: ${summaryLine(s)}`,
    `Verdict (every check): ${summaryLine(s.verdict)}`,
    `Checks: voltage drop ${checkCountsLine(k.voltage)}; capacity ${checkCountsLine(k.capacity)};`,
    `        breaking ${checkCountsLine(k.breaking)}; withstand ${checkCountsLine(k.withstand)};`,
    `        ${readings === 0 ? 'measured: no readings' : `measured ${summaryLine(k.measured)} (of ${readings} reading${readings === 1 ? '' : 's'})`}`,
  ];
}
