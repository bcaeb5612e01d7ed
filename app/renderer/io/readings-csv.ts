// Readings taken on site, from a CSV file: parsing and checking (pure: text and job in, rows or
// problems out; no DOM, no store), and the one store edit that records a good file.
//
// The file has a header row naming its columns, in any order, matched without regard to case,
// spacing or a unit in brackets ("Zs (Ω)" is "zs"):
//
//   column        names accepted                         value
//   link id       link, link id, id, circuit, circuit id the id of a link in the job (required)
//   Zs            zs, measured zs, reading               Ω, a number > 0 (required)
//   temperature   temperature, temp                      °C, from −30 to 60; empty: 20 °C
//   date          date, test date                        free text; may be empty
//   instrument    instrument, meter, tester              free text; may be empty
//
// Values are separated by commas (or by semicolons or tabs, taken from the header row; then a
// decimal comma is accepted too). A value may be quoted with "…" ("" for a quote inside).
// Blank lines are skipped; other columns are ignored (and named in the message after import).
// Any bad value refuses the whole file, each problem named by its line and column.

import type { Job, LinkReading } from '../../../engine/index.js';
import type { Edit } from '../store/edits.js';

export type ReadingColumn = 'link' | 'zs' | 'temperature' | 'date' | 'instrument';

/** The header names each column accepts (after normalising: lower case, single spaces, no unit). */
export const READING_HEADERS: Record<ReadingColumn, readonly string[]> = {
  link: ['link', 'link id', 'linkid', 'id', 'circuit', 'circuit id'],
  zs: ['zs', 'measured zs', 'zs measured', 'reading'],
  temperature: ['temperature', 'temp'],
  date: ['date', 'test date'],
  instrument: ['instrument', 'meter', 'tester'],
};

/** The short names used in messages. */
const COLUMN_WORD: Record<ReadingColumn, string> = {
  link: 'link id', zs: 'Zs', temperature: 'temperature', date: 'date', instrument: 'instrument',
};

/** Temperature range of a reading, °C (job-format.md, version 2: link `measured.temperature`). */
export const TEMPERATURE_RANGE = { min: -30, max: 60 } as const;

/** At most this many problems are listed; the rest are counted. */
export const MAX_PROBLEMS = 30;

export interface ReadingRow {
  link: string;
  reading: LinkReading;
  /** Line of the file the row starts on (1 = the header). */
  line: number;
}

export type ReadingsParse =
  | { ok: true; rows: ReadingRow[]; ignored: string[] }
  | { ok: false; problems: string[] };

interface Cell {
  text: string;
  /** 1-based column number. */
  column: number;
}

interface Rec {
  line: number;
  cells: Cell[];
}

type Delimiter = ',' | ';' | '\t';

/** The delimiter the header row uses most, outside quotes (comma when none). */
function delimiterOf(text: string): Delimiter {
  const counts: Record<Delimiter, number> = { ',': 0, ';': 0, '\t': 0 };
  let quoted = false;
  for (const ch of text) {
    if (ch === '"') quoted = !quoted;
    else if (!quoted && (ch === '\n' || ch === '\r')) break;
    else if (!quoted && (ch === ',' || ch === ';' || ch === '\t')) counts[ch] += 1;
  }
  if (counts[';'] > counts[','] && counts[';'] >= counts['\t']) return ';';
  if (counts['\t'] > counts[','] && counts['\t'] > counts[';']) return '\t';
  return ',';
}

/** Splits CSV text into records, each with the line it starts on. */
function records(text: string, delimiter: Delimiter): { records: Rec[]; problem: string | null } {
  const out: Rec[] = [];
  let line = 1;
  let start = 1;
  let cells: Cell[] = [];
  let field = '';
  let quoted = false;
  let quoteLine = 0;
  let fieldStarted = false;
  const endField = () => {
    cells.push({ text: field, column: cells.length + 1 });
    field = '';
    fieldStarted = false;
  };
  const endRecord = () => {
    endField();
    out.push({ line: start, cells });
    cells = [];
  };
  for (let i = 0; i < text.length; i++) {
    const ch = text[i]!;
    if (quoted) {
      if (ch === '"') {
        if (text[i + 1] === '"') {
          field += '"';
          i += 1;
        } else quoted = false;
      } else {
        if (ch === '\n') line += 1;
        else if (ch === '\r' && text[i + 1] !== '\n') line += 1;
        field += ch;
      }
      continue;
    }
    if (ch === '"' && !fieldStarted) {
      quoted = true;
      quoteLine = line;
      fieldStarted = true;
    } else if (ch === delimiter) {
      endField();
    } else if (ch === '\n' || ch === '\r') {
      if (ch === '\r' && text[i + 1] === '\n') i += 1;
      endRecord();
      line += 1;
      start = line;
    } else {
      field += ch;
      fieldStarted = true;
    }
  }
  if (quoted) return { records: out, problem: `line ${quoteLine}: a quoted value is not closed (a " is missing)` };
  if (field !== '' || cells.length > 0) endRecord();
  return { records: out, problem: null };
}

/** A header name as it is matched: lower case, no unit in brackets, single spaces. */
export function normaliseHeader(name: string): string {
  return name
    .replace(/^\uFEFF/, '')
    .toLowerCase()
    .replace(/[([{][^)\]}]*[)\]}]/g, ' ')
    .replace(/[_\-.]+/g, ' ')
    .replace(/\s+/g, ' ')
    .trim();
}

function columnFor(name: string): ReadingColumn | null {
  const n = normaliseHeader(name);
  for (const [key, names] of Object.entries(READING_HEADERS) as Array<[ReadingColumn, readonly string[]]>) {
    if (names.includes(n)) return key;
  }
  return null;
}

const NUMBER = /^[+-]?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?$/;

function readNumber(text: string, decimalComma: boolean): number | null {
  let t = text.trim();
  if (decimalComma && /^[+-]?\d*,\d+$/.test(t)) t = t.replace(',', '.');
  if (!NUMBER.test(t)) return null;
  const v = Number(t);
  return Number.isFinite(v) ? v : null;
}

function show(text: string): string {
  const t = text.trim();
  return t.length > 40 ? `"${t.slice(0, 40)}…"` : `"${t}"`;
}

/**
 * Reads a readings file against the job. Either every row is good (ok, with the rows in file
 * order) or the file is refused with every problem found, each naming its line and column.
 */
export function parseReadingsCsv(text: string, job: Pick<Job, 'links' | 'nodes'>): ReadingsParse {
  const problems: string[] = [];
  const body = text.replace(/^\uFEFF/, '');
  if (body.trim() === '') return { ok: false, problems: ['the file is empty: it needs a header row (link id, Zs, …) and a row per reading'] };
  const delimiter = delimiterOf(body);
  const decimalComma = delimiter !== ',';
  const split = records(body, delimiter);
  if (split.problem) return { ok: false, problems: [split.problem] };
  const all = split.records.filter((r) => r.cells.some((c) => c.text.trim() !== ''));
  const header = all[0];
  if (!header) return { ok: false, problems: ['the file has no header row'] };

  // The header: which column is which.
  const at: Partial<Record<ReadingColumn, number>> = {};
  const ignored: string[] = [];
  for (const cell of header.cells) {
    const key = columnFor(cell.text);
    if (key === null) {
      if (cell.text.trim() !== '') ignored.push(cell.text.trim());
      continue;
    }
    const before = at[key];
    if (before !== undefined) {
      problems.push(`line ${header.line}, column ${cell.column}: a second ${COLUMN_WORD[key]} column (${show(cell.text)}; the first is column ${before + 1})`);
      continue;
    }
    at[key] = cell.column - 1;
  }
  for (const key of ['link', 'zs'] as const) {
    if (at[key] === undefined) {
      problems.push(`line ${header.line}: no ${COLUMN_WORD[key]} column; name one of: ${READING_HEADERS[key].join(', ')}`);
    }
  }
  if (problems.length > 0) return { ok: false, problems };

  const links = new Set(job.links.map((l) => l.id));
  const nodes = new Map(job.nodes.map((n) => [n.id, n.kind]));
  const seen = new Map<string, number>();
  const rows: ReadingRow[] = [];
  const width = header.cells.length;
  for (const rec of all.slice(1)) {
    const where = (key: ReadingColumn) => `line ${rec.line}, column ${at[key]! + 1} (${COLUMN_WORD[key]})`;
    const cell = (key: ReadingColumn): string | undefined => {
      const index = at[key];
      return index === undefined ? undefined : (rec.cells[index]?.text ?? '');
    };
    const extra = rec.cells.slice(width).filter((c) => c.text.trim() !== '');
    if (extra.length > 0) {
      problems.push(`line ${rec.line}, column ${extra[0]!.column}: ${rec.cells.length} values but the header has ${width} columns`);
    }
    let bad = false;
    const fail = (message: string) => {
      problems.push(message);
      bad = true;
    };

    const id = (cell('link') ?? '').trim();
    if (id === '') fail(`${where('link')}: the link id is empty`);
    else if (!links.has(id)) {
      const kind = nodes.get(id);
      fail(`${where('link')}: there is no link ${show(id)} in this job${kind === 'supply' ? ` (${id} is a supply: enter its measured Ze in the testing view or the details panel)` : kind ? ` (${id} is a ${kind}, not a link)` : ''}`);
    } else if (seen.has(id)) fail(`${where('link')}: ${id} has a reading already on line ${seen.get(id)}; give one reading per link`);
    else seen.set(id, rec.line);

    const zsText = cell('zs') ?? '';
    const zs = readNumber(zsText, decimalComma);
    if (zsText.trim() === '') fail(`${where('zs')}: Zs is empty; it must be a number greater than 0 (Ω)`);
    else if (zs === null || zs <= 0) fail(`${where('zs')}: Zs must be a number greater than 0 (Ω), got ${show(zsText)}`);

    const tText = cell('temperature') ?? '';
    let temperature: number | undefined;
    if (tText.trim() !== '') {
      const t = readNumber(tText, decimalComma);
      if (t === null) fail(`${where('temperature')}: the temperature must be a number of °C, got ${show(tText)}`);
      else if (t < TEMPERATURE_RANGE.min || t > TEMPERATURE_RANGE.max) {
        fail(`${where('temperature')}: the temperature must be from ${TEMPERATURE_RANGE.min} to ${TEMPERATURE_RANGE.max} °C, got ${show(tText)}`);
      } else temperature = t;
    }
    if (bad || zs === null) continue;
    const date = (cell('date') ?? '').trim();
    const instrument = (cell('instrument') ?? '').trim();
    const reading: LinkReading = {
      zs,
      ...(temperature !== undefined ? { temperature } : {}),
      ...(date !== '' ? { date } : {}),
      ...(instrument !== '' ? { instrument } : {}),
    };
    rows.push({ link: id, reading, line: rec.line });
  }
  if (problems.length === 0 && rows.length === 0) {
    problems.push(`the file has a header row but no readings below it (line ${header.line + 1} onwards)`);
  }
  if (problems.length > 0) {
    const shown = problems.slice(0, MAX_PROBLEMS);
    if (problems.length > MAX_PROBLEMS) shown.push(`… and ${problems.length - MAX_PROBLEMS} more problem(s)`);
    return { ok: false, problems: shown };
  }
  return { ok: true, rows, ignored };
}

/** The one store edit that records every row's reading (each replaces the link's reading). */
export function readingsEdit(rows: readonly ReadingRow[]): Edit {
  return { op: 'batch', edits: rows.map((r) => ({ op: 'update-link', id: r.link, patch: { measured: r.reading } })) };
}
