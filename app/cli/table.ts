// The readable output of `check`: an aligned table of every link (the loop, or with --checks the
// other checks), the notes, the supplies' fault level and headroom, the worst fault path, the
// summary of every check and the caution. It only arranges what analyse(job) computed.

import { CAUTION, plainText, resolveRules, terminalText, type CircuitResult, type Job, type Link, type Results } from '../../engine/index.js';
import { ROLE_SHORT } from '../../engine/report/index.js';
import { CHECK_COLUMNS, checkRows, fixLines, summaryLines, supplyLines } from './checks.js';
import { amps, cableMark, clip, metres, ohms, percent, seconds, STATUS_WORD } from './format.js';

type Align = 'left' | 'right';

export interface Column<Row> {
  head: string;
  align: Align;
  cell(row: Row): string;
}

/** Lay rows out under their heads, each column as wide as its widest cell. */
export function alignTable<Row>(columns: readonly Column<Row>[], rows: readonly Row[]): string[] {
  const cells = rows.map((row) => columns.map((c) => plainText(c.cell(row)))); // no control characters (sanitise.ts)
  const widths = columns.map((c, i) => Math.max(c.head.length, ...cells.map((r) => (r[i] ?? '').length)));
  const line = (texts: readonly string[]): string =>
    texts
      .map((t, i) => (columns[i]?.align === 'right' ? t.padStart(widths[i] ?? 0) : t.padEnd(widths[i] ?? 0)))
      .join('  ')
      .trimEnd();
  const rule = widths.map((w) => '-'.repeat(w)).join('  ');
  return [line(columns.map((c) => c.head)), rule, ...cells.map(line)];
}

interface Row {
  result: CircuitResult;
  link: Link | undefined;
  protecting: Link | undefined;
}

function deviceCell(row: Row): string {
  const { result, protecting } = row;
  if (result.device === null) return 'none';
  const rcd = protecting?.rcd !== undefined ? ' +RCD' : '';
  const via = result.protectedBy !== null && result.protectedBy !== result.link ? ` (${result.protectedBy})` : '';
  return `${result.device}${rcd}${via}`;
}

function columnsFor(results: Results): Column<Row>[] {
  const known = results.circuits.some((c) => c.method === 'known-source');
  const unknown = results.circuits.some((c) => c.method !== 'known-source');
  const columns: Column<Row>[] = [
    { head: 'link', align: 'left', cell: (r) => r.result.link },
    { head: 'name', align: 'left', cell: (r) => clip(r.result.name ?? '', 28) },
    { head: 'role', align: 'left', cell: (r) => ROLE_SHORT[r.result.role] },
    { head: 'from→to', align: 'left', cell: (r) => `${r.result.from}→${r.result.to}` },
    { head: 'device', align: 'left', cell: deviceCell },
    { head: 'cable mm²', align: 'left', cell: (r) => (r.link !== undefined ? cableMark(r.link.cable) : '') },
    { head: 'length m', align: 'right', cell: (r) => (r.link !== undefined ? metres(r.link.cable.length) : '') },
  ];
  if (known) columns.push({ head: 'Zs Ω', align: 'right', cell: (r) => ohms(r.result.zs) });
  if (unknown) {
    columns.push({ head: 'own Ω', align: 'right', cell: (r) => (r.result.method === 'known-source' ? '' : ohms(r.result.own)) });
    columns.push({
      head: 'upstream Ω',
      align: 'right',
      cell: (r) => (r.result.method === 'known-source' ? '' : ohms(r.result.upstream)),
    });
  }
  columns.push(
    { head: 'limit Ω', align: 'right', cell: (r) => ohms(r.result.limit) },
    { head: 'Ia A', align: 'right', cell: (r) => amps(r.result.tripCurrent) },
    { head: 't_req s', align: 'right', cell: (r) => seconds(r.result.requiredTime) },
    { head: 'ratio %', align: 'right', cell: (r) => percent(r.result.ratio) },
    { head: 'max length m', align: 'right', cell: (r) => metres(r.result.maxLength) },
    { head: 'status', align: 'left', cell: (r) => STATUS_WORD[r.result.status] },
  );
  return columns;
}

/** The heading: what job this is and on which basis it was checked. */
function heading(job: Job, results: Results): string[] {
  const d = job.job;
  const title = d.title !== '' ? d.title : 'Untitled job';
  const ref = [d.reference, d.revision !== '' ? `rev ${d.revision}` : '', d.date].filter((t) => t !== '').join(', ');
  const lines = [`${title}${ref !== '' ? ` (${ref})` : ''}`];
  if (d.site !== '') lines.push(`Site: ${d.site}`);
  lines.push(`Basis: ${results.basis}`);
  return lines;
}

/** The worst fault path on its own line, with the ratio that puts it there. */
export function worstLine(results: Results): string {
  const worst = results.worst;
  if (worst === null) return 'Worst fault path: none (no circuit could be checked)';
  return `Worst fault path: ${worst.path.join(' → ')} (ratio ${percent(worst.ratio)} %)`;
}

/** Which table `check` prints: the loop (default) or the other checks (`--checks`). */
export type CheckView = 'loop' | 'checks';

/** The whole readable output of `check`, ending with a newline. */
export function renderCheck(job: Job, results: Results, view: CheckView = 'loop'): string {
  const byId = new Map(job.links.map((l) => [l.id, l] as const));
  const rows: Row[] = results.circuits.map((result) => ({
    result,
    link: byId.get(result.link),
    protecting: result.protectedBy !== null ? byId.get(result.protectedBy) : undefined,
  }));
  const table = view === 'checks' ? alignTable(CHECK_COLUMNS, checkRows(results)) : alignTable(columnsFor(results), rows);
  const lines = [...heading(job, results), '', ...table];

  const noted = results.circuits.filter((c) => c.notes.length > 0);
  if (noted.length > 0) {
    lines.push('', 'Notes:');
    for (const c of noted) {
      for (const note of c.notes) lines.push(`  ${c.link}: ${note}`);
    }
  }
  if (view === 'checks') lines.push(...fixLines(results));
  lines.push(...supplyLines(job, results, resolveRules(job.rules).voltage.value));
  lines.push('', worstLine(results), ...summaryLines(results));
  if (view === 'loop') lines.push('Drop, capacity, fault level, withstand, test limit, readings, verdict and fixes per link: check --checks.');
  lines.push('', `Caution: ${CAUTION}`);
  return `${terminalText(lines.join('\n'))}\n`;
}
