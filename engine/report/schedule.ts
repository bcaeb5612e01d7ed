// The circuit schedule: one row per link, inputs then results, failures first, the column
// heads repeated on every sheet.

import type { CircuitResult, Results } from '../analysis/results.js';
import type { Job, Link } from '../model/types.js';
import { GREY, STATUS_COLOR, statusSymbol, stroke, text } from './draw.js';
import {
  fmtAmp, fmtCable, fmtMetre, fmtOhm, fmtRatio, fmtRcd, fmtSec, ROLE_SHORT, scheduleOrder, STATUS_WORD,
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
  value: (c: CircuitResult, link: Link | undefined) => string;
}

export function scheduleNotes(c: CircuitResult, results: Results): string[] {
  return results.worst?.link === c.link ? ['Worst fault path.', ...c.notes] : c.notes;
}

function columns(results: Results): Column[] {
  return [
    { head: 'Link', value: (c) => c.link },
    { head: 'Name', flexible: true, value: (c) => c.name ?? '' },
    { head: 'From', flexible: true, value: (c) => c.from },
    { head: 'To', flexible: true, value: (c) => c.to },
    { head: 'Role', value: (c) => ROLE_SHORT[c.role] },
    { head: 'Cable (mm²)', value: (_c, l) => (l === undefined ? '' : fmtCable(l.cable)) },
    { head: 'Length (m)', numeric: true, value: (_c, l) => (l === undefined ? '' : fmtMetre(l.cable.length)) },
    { head: 'Device', flexible: true, value: (c) => (c.protectedBy === null ? 'none' : c.protectedBy === c.link ? (c.device ?? '') : `by ${c.protectedBy}`) },
    { head: 'RCD', value: (_c, l) => (l === undefined ? '' : fmtRcd(l) || '—') },
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
    { head: 'Status', value: (c) => STATUS_WORD[c.status] },
    { head: 'Notes', flexible: true, value: (c) => scheduleNotes(c, results).join(' ') },
  ];
}

const PAD = 0.8;
const STATUS_SYMBOL_W = 3;

/** Column widths fitting `width`: natural widths, then flexible columns give way. */
function widths(cols: Column[], rows: string[][], width: number, size: number): number[] {
  const natural = cols.map((col, i) => {
    const headWord = Math.max(...col.head.split(' ').map((w) => textWidth(w, 'bold', size)));
    const content = Math.max(0, ...rows.map((r) => textWidth(r[i] ?? '', col.head === 'Status' || i === 0 ? 'bold' : 'regular', size)));
    const extra = col.head === 'Status' ? STATUS_SYMBOL_W : 0;
    return Math.max(headWord, col.flexible === true ? Math.min(content, 45) : content) + 2 * PAD + extra;
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

/** The schedule as pages of items, each page filling `box`. */
export function schedulePages(job: Job, results: Results, box: Box): Item[][] {
  const size = box.w >= 380 ? 2.2 : 2;
  const all = columns(results);
  const links = new Map(job.links.map((l) => [l.id, l]));
  const ordered = scheduleOrder(results.circuits);
  const cells = ordered.map((c) => all.map((col) => col.value(c, links.get(c.link))));
  const ws = widths(all, cells, box.w, size);
  if (ws.reduce((a, w) => a + w, 0) <= box.w + 0.01) return table(results, ordered, all, cells, ws, box, size, '');
  // Too narrow for one table: inputs, then results, each row led by its link id.
  const split = all.findIndex((c) => c.head === 'Method');
  const groups = [[0, ...range(1, split)], [0, ...range(split, all.length)]];
  return groups.flatMap((g, k) => {
    const cols = g.map((i) => all[i]).filter((c): c is Column => c !== undefined);
    const sub = cells.map((row) => g.map((i) => row[i] ?? ''));
    return table(results, ordered, cols, sub, widths(cols, sub, box.w, size), box, size, k === 0 ? ', inputs' : ', results');
  });
}

function range(from: number, to: number): number[] {
  return Array.from({ length: Math.max(0, to - from) }, (_, i) => from + i);
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
  const title = truncate(`Circuit schedule${part}: ${results.circuits.length} links (${s.fail} fail, ${s.rcd} RCD, ${s.pass} pass, ${s.unchecked} unchecked), failures first, then by share of the limit, unchecked last`, 'bold', 2.6, box.w);

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
      const w = (ws[i] ?? 10) - 2 * PAD - (col.head === 'Status' ? STATUS_SYMBOL_W : 0);
      return col.flexible === true ? wrap(cells[r]?.[i] ?? '', 'regular', size, w) : wrap(cells[r]?.[i] ?? '', 'regular', size, w, 1);
    });
    const rowH = Math.max(...lines.map((l) => l.length)) * lh + 1.2;
    if (y + rowH > box.y + box.h) startPage();
    if (r % 2 === 1) page.push({ kind: 'rect', x: box.x, y, w: box.w, h: rowH, fill: '#f2f2f2' });
    lines.forEach((ls, i) => {
      const col = cols[i];
      const isStatus = col?.head === 'Status';
      if (isStatus) page.push(...statusSymbol(c.status, (xs[i] ?? 0) + PAD + 1.2, y + 0.6 + lh * 0.8 - size * 0.36, size));
      ls.forEach((l, k) => {
        const base = y + 0.6 + lh * (k + 0.8);
        if (col?.numeric === true) page.push(text((xs[i] ?? 0) + (ws[i] ?? 0) - PAD, base, l, size, 'regular', 'end'));
        else if (isStatus) page.push(text((xs[i] ?? 0) + PAD + STATUS_SYMBOL_W, base, l, size, 'bold', 'start', STATUS_COLOR[c.status]));
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
