// The circuit schedule: one row per link, inputs, the loop, then every other check with the
// verdict, fixes and notes; failures first by verdict; the column heads repeated on every sheet.

import type { CircuitResult, Results, Status } from '../analysis/results.js';
import type { Job, Link } from '../model/types.js';
import { GREY, STATUS_COLOR, statusSymbol, stroke, text } from './draw.js';
import {
  fmtAmp, fmtArea, fmtCable, fmtDrop, fmtFixes, fmtKa, fmtMetre, fmtOhm, fmtPf, fmtRatio, fmtRcd, fmtSec, ROLE_SHORT, STATUS_WORD,
  verdictOrder,
} from './format.js';
import type { Box } from './paper.js';
import { textWidth, truncate, wrap } from './text.js';
import type { Item } from './types.js';

interface Column {
  head: string;
  /** Numbers are right-aligned. */
  numeric?: boolean;
  /** May wrap onto several lines; gives up width first. */
  flexible?: boolean;
  /** A status cell: drawn with its symbol, in bold and its colour, beside the word. */
  status?: (c: CircuitResult) => Status | null;
  value: (c: CircuitResult, link: Link | undefined) => string;
}

export function scheduleNotes(c: CircuitResult, results: Results): string[] {
  return results.worst?.link === c.link ? ['Worst fault path.', ...c.notes] : c.notes;
}

/** `3.21 / 5.00`, or the total alone for a link with no limit. */
function totalDrop(c: CircuitResult): string {
  if (c.voltageDropTotal === null) return '—';
  return c.voltageDropLimit === null ? fmtDrop(c.voltageDropTotal) : `${fmtDrop(c.voltageDropTotal)} / ${fmtDrop(c.voltageDropLimit)}`;
}

function check(head: string, pick: (c: CircuitResult) => Status | null): Column {
  return { head, status: pick, value: (c) => { const st = pick(c); return st === null ? '' : STATUS_WORD[st]; } };
}

/**
 * The columns in sections, each section kept whole on one table: inputs, the loop, load and
 * voltage drop, fault level and withstand, and the test limit with the verdict, fixes and notes.
 */
function sections(results: Results): Column[][] {
  return [
    [
      { head: 'Name', flexible: true, value: (c) => c.name ?? '' },
      { head: 'From', flexible: true, value: (c) => c.from },
      { head: 'To', flexible: true, value: (c) => c.to },
      { head: 'Role', value: (c) => ROLE_SHORT[c.role] },
      { head: 'Ph', numeric: true, value: (c) => String(c.phases) },
      { head: 'Cable (mm²)', value: (_c, l) => (l === undefined ? '' : fmtCable(l.cable)) },
      { head: 'Length (m)', numeric: true, value: (_c, l) => (l === undefined ? '' : fmtMetre(l.cable.length)) },
      { head: 'Device', flexible: true, value: (c) => (c.protectedBy === null ? 'none' : c.protectedBy === c.link ? (c.device ?? '') : `by ${c.protectedBy}`) },
      { head: 'RCD', value: (_c, l) => (l === undefined ? '' : fmtRcd(l) || '—') },
    ],
    [
      { head: 'Method', value: (c) => (c.method === 'known-source' ? 'known Ze' : c.method === 'unknown-source' ? '80 %' : 'no supply') },
      { head: 'Zs (Ω)', numeric: true, value: (c) => fmtOhm(c.zs) },
      { head: 'Own (Ω)', numeric: true, value: (c) => fmtOhm(c.own) },
      { head: 'Upstream (Ω)', numeric: true, value: (c) => fmtOhm(c.upstream) },
      { head: 'Limit (Ω)', numeric: true, value: (c) => fmtOhm(c.limit) },
      { head: 'Ia (A)', numeric: true, value: (c) => fmtAmp(c.tripCurrent) },
      { head: 't req (s)', numeric: true, value: (c) => fmtSec(c.requiredTime) },
      { head: 'If (A)', numeric: true, value: (c) => fmtAmp(c.faultCurrent) },
      { head: 'Clearing (s)', numeric: true, value: (c) => fmtSec(c.clearingTime) },
      { head: 'Ratio (% of limit)', numeric: true, value: (c) => fmtRatio(c.ratio) },
      { head: 'Max length (m)', numeric: true, value: (c) => fmtMetre(c.maxLength) },
      check('Status', (c) => c.status),
    ],
    [
      { head: 'Ib (A)', numeric: true, value: (c) => fmtAmp(c.designCurrent) },
      { head: 'cos φ', numeric: true, value: (c) => fmtPf(c.powerFactor) },
      { head: 'Drop (%)', numeric: true, value: (c) => fmtDrop(c.voltageDrop) },
      { head: 'Total / limit (%)', numeric: true, value: totalDrop },
      check('Voltage', (c) => c.voltageStatus),
      { head: 'Iz (A)', numeric: true, value: (c) => fmtAmp(c.capacity) },
      check('Capacity', (c) => c.capacityStatus),
    ],
    [
      { head: 'Fault level (kA)', numeric: true, value: (c) => fmtKa(c.faultLevel) },
      check('Breaking', (c) => c.breakingStatus),
      { head: 'Earth min (mm²)', numeric: true, value: (c) => fmtArea(c.earthMinArea) },
      check('Withstand', (c) => c.withstandStatus),
    ],
    [
      { head: 'Test limit (Ω)', numeric: true, value: (c) => fmtOhm(c.testLimit) },
      { head: 'Reading → corrected (Ω)', numeric: true, value: (c) => (c.measured === null ? '' : `${fmtOhm(c.measured.zs)} → ${fmtOhm(c.measured.corrected)}`) },
      check('Measured', (c) => c.measured?.status ?? null),
      check('Verdict', (c) => c.verdict),
      { head: 'Fixes', flexible: true, value: (c) => fmtFixes(c) },
      { head: 'Notes', flexible: true, value: (c) => scheduleNotes(c, results).join(' ') },
    ],
  ];
}

const LINK: Column = { head: 'Link', value: (c) => c.link };
/** What each table is called when the schedule is split, by the first section it holds. */
const PART_NAME = ['inputs', 'loop', 'load and voltage drop', 'fault level and withstand', 'test limit, verdict and fixes'];

const PAD = 0.8;
const STATUS_SYMBOL_W = 3;

/** Column widths fitting `width`: natural widths, then flexible columns give way. */
function widths(cols: Column[], contentWidth: (col: Column, bold: boolean) => number, width: number, size: number): number[] {
  const natural = cols.map((col, i) => {
    const headWord = Math.max(...col.head.split(' ').map((w) => textWidth(w, 'bold', size)));
    const content = contentWidth(col, col.status !== undefined || i === 0);
    const extra = col.status !== undefined ? STATUS_SYMBOL_W : 0;
    // + 0.1 mm: a head word exactly as wide as its column must not wrap on rounding.
    return Math.max(headWord, col.flexible === true ? Math.min(content, 45) : content) + 2 * PAD + extra + 0.1;
  });
  const notes = cols.length - 1;
  const fixed = natural.reduce((s, w, i) => s + (i === notes ? 0 : w), 0);
  const out = [...natural];
  out[notes] = Math.max(width - fixed, 30);
  let total = out.reduce((s, w) => s + w, 0);
  // Squeeze the other flexible columns, never below the width of their head word.
  for (let pass = 0; pass < 20 && total > width + 0.01; pass++) {
    const flex = cols.map((c, i) => (c.flexible === true && i !== notes ? i : -1)).filter((i) => i >= 0);
    for (const i of flex) {
      const floor = Math.max(...(cols[i]?.head.split(' ') ?? ['']).map((w) => textWidth(w, 'bold', size))) + 2 * PAD + 6;
      out[i] = Math.max(floor, (out[i] ?? 0) - (total - width) / flex.length);
    }
    total = out.reduce((s, w) => s + w, 0);
    if (total > width + 0.01) out[notes] = Math.max(20, (out[notes] ?? 0) - (total - width));
    total = out.reduce((s, w) => s + w, 0);
  }
  return out;
}

export interface SchedulePage {
  items: Item[];
}

/**
 * The schedule as pages of items, each page filling `box`: one table when every column fits,
 * else the sections packed in order into as few tables as fit, each row led by its link id.
 */
export function schedulePages(job: Job, results: Results, box: Box): Item[][] {
  const size = box.w >= 380 ? 2.2 : 2;
  const secs = sections(results);
  const links = new Map(job.links.map((l) => [l.id, l]));
  const ordered = verdictOrder(results.circuits);
  // Each column's cells and widest cell worked out once, however many ways the columns are tried.
  const cellCache = new Map<Column, string[]>();
  const columnCells = (col: Column): string[] => {
    let cells = cellCache.get(col);
    if (cells === undefined) {
      cells = ordered.map((c) => col.value(c, links.get(c.link)));
      cellCache.set(col, cells);
    }
    return cells;
  };
  const widest = { regular: new Map<Column, number>(), bold: new Map<Column, number>() };
  const contentWidth = (col: Column, bold: boolean): number => {
    const weight = bold ? 'bold' : 'regular';
    let w = widest[weight].get(col);
    if (w === undefined) {
      w = 0;
      for (const cell of columnCells(col)) w = Math.max(w, textWidth(cell, weight, size));
      widest[weight].set(col, w);
    }
    return w;
  };
  const cellsOf = (cols: Column[]): string[][] => {
    const byColumn = cols.map(columnCells);
    return ordered.map((_, r) => byColumn.map((cells) => cells[r] ?? ''));
  };
  const fits = (cols: Column[]): boolean => widths(cols, contentWidth, box.w, size).reduce((a, w) => a + w, 0) <= box.w + 0.01;
  // Greedy: each table takes the next sections while they still fit.
  const groups: number[][] = [];
  for (let k = 0; k < secs.length; k++) {
    const last = groups[groups.length - 1];
    if (last !== undefined && fits([LINK, ...[...last, k].flatMap((i) => secs[i] ?? [])])) last.push(k);
    else groups.push([k]);
  }
  return groups.flatMap((g) => {
    const cols = [LINK, ...g.flatMap((i) => secs[i] ?? [])];
    const cells = cellsOf(cols);
    const part = groups.length === 1 ? '' : `, ${g.map((i) => PART_NAME[i] ?? '').join(', ')}`;
    return table(results, ordered, cols, cells, widths(cols, contentWidth, box.w, size), box, size, part);
  });
}

function table(
  results: Results, ordered: CircuitResult[], cols: Column[], cells: string[][], ws: number[], box: Box, size: number, part: string,
): Item[][] {
  const lh = size * 1.25;
  const xs: number[] = [];
  ws.reduce((x, w) => (xs.push(x), x + w), box.x);

  const headLines = cols.map((col, i) => wrap(col.head, 'bold', size, (ws[i] ?? 10) - 2 * PAD, 3));
  const headH = Math.max(...headLines.map((l) => l.length)) * lh + 1.6;
  const s = results.summary;
  const v = s.verdict;
  const title = truncate(`Circuit schedule${part}: ${results.circuits.length} links, verdicts ${v.fail} fail, ${v.rcd} RCD, ${v.pass} pass, ${v.unchecked} unchecked (loop ${s.fail} fail, ${s.rcd} RCD, ${s.pass} pass); failures first by verdict, then by share of the loop limit`, 'bold', 2.6, box.w);

  const pages: Item[][] = [];
  let page: Item[] = [];
  let y = 0;
  const startPage = (): void => {
    page = [];
    pages.push(page);
    page.push(text(box.x, box.y + 3, title, 2.6, 'bold'));
    y = box.y + 5;
    page.push({ kind: 'rect', x: box.x, y, w: box.w, h: headH, fill: '#d9d9d9', stroke: stroke(0.3) });
    headLines.forEach((lines, i) => {
      const col = cols[i];
      lines.forEach((l, k) => {
        const x = col?.numeric === true ? (xs[i] ?? 0) + (ws[i] ?? 0) - PAD : (xs[i] ?? 0) + PAD;
        page.push(text(x, y + 0.8 + lh * (k + 0.8), l, size, 'bold', col?.numeric === true ? 'end' : 'start'));
      });
    });
    y += headH;
  };
  startPage();
  ordered.forEach((c, r) => {
    const lines = cols.map((col, i) => {
      const w = (ws[i] ?? 10) - 2 * PAD - (col.status !== undefined ? STATUS_SYMBOL_W : 0);
      return col.flexible === true ? wrap(cells[r]?.[i] ?? '', 'regular', size, w) : wrap(cells[r]?.[i] ?? '', 'regular', size, w, 1);
    });
    const rowH = Math.max(...lines.map((l) => l.length)) * lh + 1.2;
    if (y + rowH > box.y + box.h) startPage();
    if (r % 2 === 1) page.push({ kind: 'rect', x: box.x, y, w: box.w, h: rowH, fill: '#f2f2f2' });
    lines.forEach((ls, i) => {
      const col = cols[i];
      const st = col?.status?.(c) ?? null;
      if (st !== null) page.push(...statusSymbol(st, (xs[i] ?? 0) + PAD + 1.2, y + 0.6 + lh * 0.8 - size * 0.36, size));
      ls.forEach((l, k) => {
        const base = y + 0.6 + lh * (k + 0.8);
        if (col?.numeric === true) page.push(text((xs[i] ?? 0) + (ws[i] ?? 0) - PAD, base, l, size, 'regular', 'end'));
        else if (st !== null) page.push(text((xs[i] ?? 0) + PAD + STATUS_SYMBOL_W, base, l, size, 'bold', 'start', STATUS_COLOR[st]));
        else page.push(text((xs[i] ?? 0) + PAD, base, l, size, i === 0 ? 'bold' : 'regular'));
      });
    });
    y += rowH;
    page.push({ kind: 'line', x1: box.x, y1: y, x2: box.x + box.w, y2: y, stroke: stroke(0.15, GREY) });
  });
  // Column rules on every page, from the head to the last row of that page.
  for (const p of pages) {
    const rows = p.filter((i) => i.kind === 'line');
    const last = rows.length > 0 ? Math.max(...rows.map((i) => (i.kind === 'line' ? i.y1 : 0))) : box.y + 5 + headH;
    xs.slice(1).forEach((x) => p.push({ kind: 'line', x1: x, y1: box.y + 5, x2: x, y2: last, stroke: stroke(0.15, GREY) }));
    p.push({ kind: 'rect', x: box.x, y: box.y + 5, w: box.w, h: last - box.y - 5, stroke: stroke(0.3) });
  }
  return pages;
}
