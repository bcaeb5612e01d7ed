// scheduleCsv: the circuit schedule for spreadsheets. One header row with the units in the
// names, one row per link in file order, RFC 4180 quoting and CRLF line ends. Numbers are
// rounded to 6 significant figures (no float noise); empty cells where a value is null. The
// fixes are in words (`shorten to 45.2 m or less; cable 4/2.5 mm²`), `; ` between them.

import type { CircuitResult, Results } from '../analysis/results.js';
import type { Job, Link } from '../model/types.js';
import { fmtFixes } from './format.js';
import { csvCell } from './sanitise.js';

function num(v: number | null | undefined): string {
  if (v === null || v === undefined) return '';
  return String(Number(v.toPrecision(6)));
}

/** RFC 4180: quote a field holding a comma, a quote or a line break; double inner quotes. */
export function csvField(value: string): string {
  return csvCell(value); // also defuses formulas and drops control characters (sanitise.ts)
}

const COLUMNS: Array<[string, (c: CircuitResult, l: Link | undefined) => string]> = [
  ['link', (c) => c.link],
  ['name', (c) => c.name ?? ''],
  ['from', (c) => c.from],
  ['to', (c) => c.to],
  ['role', (c) => c.role],
  ['method', (c) => c.method ?? ''],
  ['length (m)', (_c, l) => num(l?.cable.length)],
  ['material', (_c, l) => l?.cable.material ?? ''],
  ['active (mm²)', (_c, l) => num(l?.cable.active)],
  ['earth (mm²)', (_c, l) => num(l?.cable.earth)],
  ['earth material', (_c, l) => (l === undefined ? '' : (l.cable.earthMaterial ?? l.cable.material))],
  ['parallel sets', (_c, l) => (l === undefined ? '' : String(l.cable.parallel ?? 1))],
  ['device', (c) => c.device ?? ''],
  ['protected by', (c) => c.protectedBy ?? ''],
  ['rcd (mA)', (_c, l) => (l?.rcd === undefined ? '' : num(l.rcd.sensitivity * 1000))],
  ['ia (A)', (c) => num(c.tripCurrent)],
  ['t_req (s)', (c) => num(c.requiredTime)],
  ['zs (Ω)', (c) => num(c.zs)],
  ['own (Ω)', (c) => num(c.own)],
  ['upstream (Ω)', (c) => num(c.upstream)],
  ['limit (Ω)', (c) => num(c.limit)],
  ['fault current (A)', (c) => num(c.faultCurrent)],
  ['clearing time (s)', (c) => num(c.clearingTime)],
  ['ratio', (c) => num(c.ratio)],
  ['max length (m)', (c) => num(c.maxLength)],
  ['status', (c) => c.status],
  ['notes', (c) => c.notes.join('; ')],
  // Format version 2: the checks beside the loop (method-depth.md), after the version 1 columns.
  ['phases', (c) => String(c.phases)],
  ['ib (A)', (c) => num(c.designCurrent)],
  ['cos φ', (c) => num(c.powerFactor)],
  ['drop (%)', (c) => num(c.voltageDrop)],
  ['total drop (%)', (c) => num(c.voltageDropTotal)],
  ['drop limit (%)', (c) => num(c.voltageDropLimit)],
  ['voltage status', (c) => c.voltageStatus],
  ['iz (A)', (c) => num(c.capacity)],
  ['capacity status', (c) => c.capacityStatus],
  ['fault level (A)', (c) => num(c.faultLevel)],
  ['breaking status', (c) => c.breakingStatus],
  ['earth min (mm²)', (c) => num(c.earthMinArea)],
  ['withstand status', (c) => c.withstandStatus],
  ['test limit (Ω)', (c) => num(c.testLimit)],
  ['measured zs (Ω)', (c) => num(c.measured?.zs)],
  ['corrected (Ω)', (c) => num(c.measured?.corrected)],
  ['measured ratio', (c) => num(c.measured?.ratio)],
  ['measured status', (c) => c.measured?.status ?? ''],
  ['fixes', (c) => fmtFixes(c)],
  ['verdict', (c) => c.verdict],
];

export const CSV_HEADER: readonly string[] = COLUMNS.map(([h]) => h);

export function scheduleCsv(job: Job, results: Results): string {
  const links = new Map(job.links.map((l) => [l.id, l]));
  const rows = [COLUMNS.map(([h]) => h)];
  for (const c of results.circuits) rows.push(COLUMNS.map(([, f]) => f(c, links.get(c.link))));
  return rows.map((r) => r.map(csvField).join(',')).join('\r\n') + '\r\n';
}
