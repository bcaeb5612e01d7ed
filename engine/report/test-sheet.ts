// The test sheets (method-depth.md §7): one per board (and supply), listing every circuit that
// leaves it with its test limit, the largest loop impedance measured at its far end that still
// passes, at the temperature shown; the readings with their results where the job has them, and
// ruled blank cells to write them in where it has none. Each sheet states the method of
// correction and carries the caution in full.

import type { ResolvedRules } from '../analysis/basis.js';
import { MEASURED_SOURCE } from '../analysis/basis.js';
import type { CircuitResult, Results } from '../analysis/results.js';
import type { Job, JobNode, Link, SupplyNode } from '../model/types.js';
import { GREY, STATUS_COLOR, statusSymbol, stroke, text } from './draw.js';
import { fmtCable, fmtMetre, fmtOhm, fmtPlain, fmtRatio, STATUS_WORD } from './format.js';
import type { Box } from './paper.js';
import { textWidth, truncate, wrap } from './text.js';
import type { Item } from './types.js';

const PAD = 0.8;
const SYMBOL_W = 3;
/** Height of a row left blank for a reading to be written in, mm. */
const WRITE_IN_H = 7;

export interface TestSheetPage {
  /** The board (or supply) whose circuits the page lists. */
  node: string;
  title: string;
  items: Item[];
}

interface Column {
  head: string;
  numeric?: boolean;
  /** Gives up width first, and wraps onto two lines. */
  flexible?: boolean;
  /** Kept at least this wide (mm) for a reading written in by hand. */
  writeIn?: number;
  value: (c: CircuitResult, link: Link | undefined) => string;
  status?: (c: CircuitResult) => CircuitResult['status'] | null;
}

/** The temperature a link's test limit is stated at: its reading's, else 20 °C. */
function limitTemperature(link: Link | undefined): number {
  return link?.measured?.temperature ?? 20;
}

const COLUMNS: Column[] = [
  { head: 'Link', value: (c) => c.link },
  { head: 'Circuit', flexible: true, value: (c) => c.name ?? '' },
  { head: 'To', value: (c) => c.to },
  { head: 'Device', value: (c) => (c.protectedBy === null ? 'none' : c.protectedBy === c.link ? (c.device ?? '') : `by ${c.protectedBy}`) },
  { head: 'Cable (mm²), length (m)', value: (_c, l) => (l === undefined ? '' : `${fmtCable(l.cable)}, ${fmtMetre(l.cable.length)}`) },
  { head: 'Test limit (Ω)', numeric: true, value: (c) => fmtOhm(c.testLimit) },
  { head: 'at (°C)', numeric: true, value: (c, l) => (c.testLimit === null ? '' : fmtPlain(limitTemperature(l))) },
  { head: 'Zs measured (Ω)', numeric: true, writeIn: 16, value: (c) => (c.measured === null ? '' : fmtOhm(c.measured.zs)) },
  { head: 'Temp. (°C)', numeric: true, writeIn: 11, value: (c, l) => (c.measured === null || l?.measured === undefined ? '' : fmtPlain(l.measured.temperature ?? 20)) },
  { head: 'Date', writeIn: 20, value: (_c, l) => l?.measured?.date ?? '' },
  { head: 'Instrument', writeIn: 26, value: (_c, l) => l?.measured?.instrument ?? '' },
  { head: 'Corrected (Ω)', numeric: true, value: (c) => (c.measured === null ? '' : fmtOhm(c.measured.corrected)) },
  { head: 'Ratio', numeric: true, value: (c) => (c.measured === null ? '' : fmtRatio(c.measured.ratio)) },
  { head: 'Result', writeIn: 18, value: (c) => (c.measured === null ? '' : STATUS_WORD[c.measured.status]), status: (c) => c.measured?.status ?? null },
];

/** The board or supply a link's circuit is tested from: its origin, or the board above a point it leaves. */
function boardOf(link: Link, nodes: Map<string, JobNode>, feeder: Map<string, Link>, memo: Map<string, string>): string {
  // Up through the points to the board, remembering the answer for every point passed, so a
  // chain of points is walked once in all rather than once per circuit.
  const passed: string[] = [];
  let id = link.from;
  let found: string | undefined;
  const seen = new Set<string>();
  while (nodes.get(id)?.kind === 'point' && !seen.has(id)) {
    found = memo.get(id);
    if (found !== undefined) break;
    seen.add(id);
    passed.push(id);
    const up = feeder.get(id);
    if (up === undefined) break;
    id = up.from;
  }
  const board = found ?? id;
  for (const p of passed) memo.set(p, board);
  return board;
}

/** The method of correction in words, and the supply's measured Ze where it is used. */
export function correctionMethod(rules: ResolvedRules, supplies: SupplyNode[]): string {
  const method = rules.measuredRule.value === 'fixed-factor'
    ? `Method of correction: fixed factor. A reading passes when it is at most ${fmtPlain(rules.measuredFactor.value * 100)} % of the loop budget c·U0/Ia (${rules.measuredFactor.source}). ` +
      'Test limit = Zem + (c·U0/Ia − Zem) × factor.'
    : 'Method of correction: to fault temperature. A reading taken with the conductors at θ is raised by F = ρf/ρθ, the ratio of the resistivity at fault ' +
      `temperature the design uses to the resistivity at θ (${MEASURED_SOURCE}): corrected = Zem + (Zs − Zem)·F, and the reading passes when the corrected value is ` +
      'within c·U0/Ia. Test limit = Zem + (c·U0/Ia − Zem)/F at the temperature shown.';
  const ze = supplies.map((s) =>
    s.measured !== undefined
      ? `${s.id}: Zem = ${fmtOhm(s.measured.ze)} Ω measured${s.measured.date !== undefined && s.measured.date !== '' ? ` on ${s.measured.date}` : ''}${s.measured.instrument !== undefined && s.measured.instrument !== '' ? ` with ${s.measured.instrument}` : ''}.`
      : `${s.id}: Ze not measured, Zem = 0 (the whole reading is corrected).`,
  );
  return `${method} ${ze.join(' ')}`;
}

/** Column widths filling `width`: natural widths, write-in columns at their minimum, the circuit name taking what is left. */
function widths(cells: string[][], width: number, size: number, blank: boolean): number[] {
  const natural = COLUMNS.map((col, i) => {
    const head = Math.max(...col.head.split(' ').map((w) => textWidth(w, 'bold', size)));
    const content = Math.max(0, ...cells.map((r) => textWidth(r[i] ?? '', i === 0 || col.status !== undefined ? 'bold' : 'regular', size)));
    const hand = blank && col.writeIn !== undefined ? col.writeIn : 0;
    return Math.max(head, col.flexible === true ? Math.min(content, 50) : content, hand) + 2 * PAD + (col.status !== undefined ? SYMBOL_W : 0) + 0.1;
  });
  const flex = COLUMNS.findIndex((c) => c.flexible === true);
  const fixed = natural.reduce((s, w, i) => s + (i === flex ? 0 : w), 0);
  const out = [...natural];
  out[flex] = Math.max(width - fixed, 18);
  // Room to spare: the name takes at most 60 mm, the write-in columns (when blank) the rest.
  const spare = (out[flex] ?? 0) - 60;
  const hands = COLUMNS.map((c, i) => (blank && c.writeIn !== undefined ? i : -1)).filter((i) => i >= 0);
  if (spare > 0 && hands.length > 0) {
    const total = hands.reduce((sum, i) => sum + (COLUMNS[i]?.writeIn ?? 0), 0);
    for (const i of hands) out[i] = (out[i] ?? 0) + (spare * (COLUMNS[i]?.writeIn ?? 0)) / total;
    out[flex] = 60;
  }
  let over = out.reduce((s, w) => s + w, 0) - width;
  // Still too wide: the write-in columns give way, never below their head word.
  if (over > 0.01) {
    COLUMNS.forEach((col, i) => {
      if (col.writeIn === undefined || over <= 0.01) return;
      const floor = Math.max(...col.head.split(' ').map((w) => textWidth(w, 'bold', size))) + 2 * PAD + (col.status !== undefined ? SYMBOL_W : 0) + 0.1;
      const give = Math.min(over, (out[i] ?? 0) - floor);
      if (give > 0) {
        out[i] = (out[i] ?? 0) - give;
        over -= give;
      }
    });
  }
  return out;
}

/** Every test sheet of the job: one or more pages per board or supply that has circuits leaving it. */
export function testSheetPages(job: Job, results: Results, rules: ResolvedRules, caution: string, box: Box): TestSheetPage[] {
  const size = box.w >= 380 ? 2.2 : 2;
  const lh = size * 1.25;
  const nodes = new Map(job.nodes.map((n) => [n.id, n] as const));
  const feeder = new Map(job.links.map((l) => [l.to, l] as const));
  const links = new Map(job.links.map((l) => [l.id, l] as const));
  const byBoard = new Map<string, CircuitResult[]>();
  const memo = new Map<string, string>();
  for (const c of results.circuits) {
    const link = links.get(c.link);
    if (link === undefined) continue;
    const board = boardOf(link, nodes, feeder, memo);
    const list = byBoard.get(board);
    if (list !== undefined) list.push(c);
    else byBoard.set(board, [c]);
  }
  // Boards in file order (supplies first when they come first), each with its circuits in file order.
  const order = job.nodes.filter((n) => byBoard.has(n.id)).map((n) => n.id);
  const supplies = job.nodes.filter((n): n is SupplyNode => n.kind === 'supply');
  const method = correctionMethod(rules, supplies);
  const methodLines = wrap(method, 'regular', 2.4, box.w);
  const guide = 'Test limit: the largest earth-fault loop impedance measured at the circuit\'s far end that passes, at the conductor temperature shown (20 °C where no reading is recorded). ' +
    'Record every reading with its temperature, date and instrument; a corrected reading above c·U0/Ia fails (marked RCD-RELIANT where the protecting link has an RCD).';
  const guideLines = wrap(guide, 'regular', 2.4, box.w);
  const cautionLines = wrap(caution, 'bold', 2.4, box.w - 4);
  const cautionH = cautionLines.length * 3.1 + 2;

  const pages: TestSheetPage[] = [];
  for (const id of order) {
    const circuits = byBoard.get(id) ?? [];
    const node = nodes.get(id);
    const blank = circuits.some((c) => c.measured === null);
    const cells = circuits.map((c) => COLUMNS.map((col) => col.value(c, links.get(c.link))));
    const ws = widths(cells, box.w, size, blank);
    const xs: number[] = [];
    ws.reduce((x, w) => (xs.push(x), x + w), box.x);
    const headLines = COLUMNS.map((col, i) => wrap(col.head, 'bold', size, (ws[i] ?? 10) - 2 * PAD, 3));
    const headH = Math.max(...headLines.map((l) => l.length)) * lh + 1.6;
    const feed = feeder.get(id);
    const name = node?.name !== undefined && node.name !== '' ? ` ${node.name}` : '';
    const heading = `Test sheet: ${id}${name}`;
    const sub = `${circuits.length} circuit${circuits.length === 1 ? '' : 's'} leaving ${id}${feed !== undefined ? `, fed from ${feed.from} by ${feed.id}` : node?.kind === 'supply' ? ' (the point of supply)' : ''}.`;

    let page: Item[] = [];
    let y = 0;
    let tableTop = 0;
    const bottom = box.y + box.h - cautionH - 3;
    const closePage = (): void => {
      // Column rules from the head to the last row, the frame, then the caution.
      xs.slice(1).forEach((x) => page.push({ kind: 'line', x1: x, y1: tableTop, x2: x, y2: y, stroke: stroke(0.15, GREY) }));
      page.push({ kind: 'rect', x: box.x, y: tableTop, w: box.w, h: y - tableTop, stroke: stroke(0.3) });
      const cy = y + 3;
      page.push({ kind: 'rect', x: box.x, y: cy, w: box.w, h: cautionH, stroke: stroke(0.5) });
      cautionLines.forEach((l, i) => page.push(text(box.x + 2, cy + 3.1 * (i + 0.9), l, 2.4, 'bold')));
    };
    const startPage = (): void => {
      page = [];
      const n = pages.filter((p) => p.node === id).length;
      pages.push({ node: id, title: `Test sheet: ${id}${n > 0 ? ' (cont.)' : ''}`, items: page });
      page.push(text(box.x, box.y + 4, truncate(`${heading}${n > 0 ? ' (continued)' : ''}`, 'bold', 3.5, box.w), 3.5, 'bold'));
      y = box.y + 8;
      page.push(text(box.x, y, truncate(sub, 'regular', 2.4, box.w), 2.4));
      y += 3.4;
      for (const l of [...methodLines, ...guideLines]) {
        page.push(text(box.x, y, l, 2.4, 'regular', 'start', GREY));
        y += 3.1;
      }
      y += 1;
      tableTop = y;
      page.push({ kind: 'rect', x: box.x, y, w: box.w, h: headH, fill: '#d9d9d9', stroke: stroke(0.3) });
      headLines.forEach((lines, i) => {
        const col = COLUMNS[i];
        lines.forEach((l, k) => {
          const x = col?.numeric === true ? (xs[i] ?? 0) + (ws[i] ?? 0) - PAD : (xs[i] ?? 0) + PAD;
          page.push(text(x, y + 0.8 + lh * (k + 0.8), l, size, 'bold', col?.numeric === true ? 'end' : 'start'));
        });
      });
      y += headH;
    };
    startPage();
    circuits.forEach((c, r) => {
      const lines = COLUMNS.map((col, i) => {
        const w = (ws[i] ?? 10) - 2 * PAD - (col.status !== undefined ? SYMBOL_W : 0);
        return wrap(cells[r]?.[i] ?? '', 'regular', size, w, col.flexible === true ? 2 : 1);
      });
      const rowH = Math.max(c.measured === null ? WRITE_IN_H : 0, Math.max(...lines.map((l) => l.length)) * lh + 1.2);
      if (y + rowH > bottom) {
        closePage();
        startPage();
      }
      lines.forEach((ls, i) => {
        const col = COLUMNS[i];
        const st = col?.status?.(c) ?? null;
        if (st !== null) page.push(...statusSymbol(st, (xs[i] ?? 0) + PAD + 1.2, y + 0.6 + lh * 0.8 - size * 0.36, size));
        ls.forEach((l, k) => {
          const base = y + 0.6 + lh * (k + 0.8);
          if (col?.numeric === true) page.push(text((xs[i] ?? 0) + (ws[i] ?? 0) - PAD, base, l, size, 'regular', 'end'));
          else if (st !== null) page.push(text((xs[i] ?? 0) + PAD + SYMBOL_W, base, l, size, 'bold', 'start', STATUS_COLOR[st]));
          else page.push(text((xs[i] ?? 0) + PAD, base, l, size, i === 0 ? 'bold' : 'regular'));
        });
      });
      y += rowH;
      page.push({ kind: 'line', x1: box.x, y1: y, x2: box.x + box.w, y2: y, stroke: stroke(0.15, GREY) });
    });
    closePage();
  }
  return pages;
}
