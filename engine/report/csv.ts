// scheduleCsv: the circuit schedule for spreadsheets. One header row with the units in the
// names, one row per link in file order, RFC 4180 quoting and CRLF line ends. Numbers are
// rounded to 6 significant figures (no float noise); empty cells where a value is null.

import type { CircuitResult, Results } from '../analysis/results.js';
import type { Job, Link } from '../model/types.js';

function num(v: number | null | undefined): string {
  if (v === null || v === undefined) return '';
  return String(Number(v.toPrecision(6)));
}

/** RFC 4180: quote a field holding a comma, a quote or a line break; double inner quotes. */
export function csvField(value: string): string {
  return /[",\r\n]/.test(value) ? `"${value.replace(/"/g, '""')}"` : value;
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
];

export const CSV_HEADER: readonly string[] = COLUMNS.map(([h]) => h);

export function scheduleCsv(job: Job, results: Results): string {
  const links = new Map(job.links.map((l) => [l.id, l]));
  const rows = [COLUMNS.map(([h]) => h)];
  for (const c of results.circuits) rows.push(COLUMNS.map(([, f]) => f(c, links.get(c.link))));
  return rows.map((r) => r.map(csvField).join(',')).join('\r\n') + '\r\n';
}
