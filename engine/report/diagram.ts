// The diagram sheets: the single-line diagram at the user's positions, each link annotated,
// the worst fault path heavier, continuation marks where a link crosses to another sheet.

import type { CircuitResult, Results, SupplyResult } from '../analysis/results.js';
import type { Job, JobNode, Link } from '../model/types.js';
import {
  arrowHead, deviceSymbol, GREY, INK, line, nodeSymbol, rcdSymbol, STATUS_COLOR, statusSymbol, stroke, SYMBOL_HALF, text,
} from './draw.js';
import { BLOCK, BUS, type DiagramPlan, type Tile } from './diagram-plan.js';
import { fmtAmp, fmtCable, fmtDrop, fmtKa, fmtMetre, fmtPlain, fmtOhm, fmtRatio, fmtRcd, judgedLoop, STATUS_WORD, verdictNote } from './format.js';
import { describeHeadroomShort, describeSourceShort } from './sources.js';
import { textWidth, truncate, wrap } from './text.js';
import type { Item, Stroke, TextItem } from './types.js';

/** Annotation text size on paper, mm. */
export const LABEL_TEXT = 2.2;
const LH = 2.75;
const LABEL_X = 2;
const LABEL_W = BLOCK.right - LABEL_X;

export interface Ctx {
  job: Job;
  plan: DiagramPlan;
  byLink: Map<string, CircuitResult>;
  nodes: Map<string, JobNode>;
  children: Map<string, Link[]>;
  worstLinks: Set<string>;
  worstNodes: Set<string>;
  worstEnd: string | null;
  worstRatio: number | null;
  u0: number;
  /** The maximum prospective fault current at each node that has a link leaving it, A. */
  faultAt: Map<string, number | null>;
  supplies: Map<string, SupplyResult>;
  /** Sheet number of diagram tile i. */
  sheetOf: (tile: number) => number;
  /** The links with an end on each tile, in file order (worked out on the first tile drawn). */
  tileLinks?: Link[][];
}

/** The links touching tile `index`: one pass over the links for all tiles, not one per tile. */
function linksOnTile(ctx: Ctx, index: number): readonly Link[] {
  if (ctx.tileLinks === undefined) {
    const lists: Link[][] = ctx.plan.tiles.map(() => []);
    for (const link of ctx.job.links) {
      const from = ctx.plan.tileOf.get(link.from);
      const to = ctx.plan.tileOf.get(link.to);
      if (from !== undefined) lists[from]?.push(link);
      if (to !== undefined && to !== from) lists[to]?.push(link);
    }
    ctx.tileLinks = lists;
  }
  return ctx.tileLinks[index] ?? [];
}

export function linkStroke(ctx: Ctx, link: Link): Stroke {
  if (ctx.worstLinks.has(link.id)) return stroke(0.9);
  if (ctx.byLink.get(link.id)?.status === 'unchecked') return stroke(0.35, INK, [1.2, 0.8]);
  return stroke(0.35);
}

function at(ctx: Ctx, id: string, tile: Tile): { x: number; y: number } {
  const p = ctx.plan.pos.get(id) ?? { x: 0, y: 0 };
  return { x: p.x + tile.dx, y: p.y + tile.dy };
}

/** Spacing of a link label's lines, mm: up to seven lines between the drop's device and the node. */
const LABEL_LH = 2.5;
/** Baseline of a label's last line, relative to the far node's centre. */
const LAST_BASELINE = -4.1;

/** `Ib 16 A · ΔU 3.08 ≤ 5.00 %`, the load line of a link with a design current; null without one. */
export function loadLine(c: CircuitResult): string | null {
  if (c.designCurrent === null) return null;
  const ib = `Ib ${fmtAmp(c.designCurrent)} A`;
  if (c.voltageDropTotal === null) return ib;
  if (c.voltageDropLimit === null) return `${ib} · ΔU ${fmtDrop(c.voltageDropTotal)} %`;
  const sign = c.voltageStatus === 'fail' ? '>' : '≤';
  return `${ib} · ΔU ${fmtDrop(c.voltageDropTotal)} ${sign} ${fmtPlain(Number(c.voltageDropLimit.toFixed(2)))} %`;
}

/**
 * The label of a link, right of its drop line and above its far node at (x, y), bottom-aligned,
 * line by line: id and name; device and RCD; cable and length; Ib and the total drop against its
 * limit (when Ib is known); the loop against its limit; the loop status and share of the limit;
 * and the verdict naming the failed checks when it says more than the loop status.
 */
export function linkLabel(ctx: Ctx, link: Link, x: number, y: number): Item[] {
  const c = ctx.byLink.get(link.id);
  const items: Item[] = [];
  const lx = x + LABEL_X;
  const load = c !== undefined ? loadLine(c) : null;
  const verdict = c !== undefined ? verdictNote(c, true) : null;
  const count = 3 + (c !== undefined ? 2 : 0) + (load !== null ? 1 : 0) + (verdict !== null ? 1 : 0);
  let k = 0;
  const next = (): number => y + LAST_BASELINE - (count - 1 - k++) * LABEL_LH;
  const idW = textWidth(`${link.id} `, 'bold', LABEL_TEXT);
  const b0 = next();
  items.push(text(lx, b0, link.id, LABEL_TEXT, 'bold'));
  if (link.name !== undefined && link.name !== '') {
    items.push(text(lx + idW, b0, truncate(link.name, 'regular', LABEL_TEXT, LABEL_W - idW), LABEL_TEXT));
  }
  let device: string;
  if (c === undefined || c.protectedBy === null) device = 'no protective device';
  else if (c.protectedBy !== link.id) device = `protected by ${c.protectedBy} (${c.device ?? ''})`;
  else device = [c.device ?? '', fmtRcd(link) !== '' ? `RCD ${fmtRcd(link)}` : ''].filter((s) => s !== '').join(' · ');
  items.push(text(lx, next(), truncate(device, 'regular', LABEL_TEXT, LABEL_W), LABEL_TEXT));
  items.push(text(lx, next(), truncate(`${fmtCable(link.cable)} · ${fmtMetre(link.cable.length)} m`, 'regular', LABEL_TEXT, LABEL_W), LABEL_TEXT));
  if (c !== undefined) {
    if (load !== null) {
      // Over its limit: the '>' says so, in the failure colour; the verdict line names the check.
      const color = c.voltageStatus === 'fail' ? STATUS_COLOR.fail : undefined;
      items.push(text(lx, next(), truncate(load, 'regular', LABEL_TEXT, LABEL_W), LABEL_TEXT, 'regular', 'start', color));
    }
    const loop = judgedLoop(c);
    let loopText: string;
    if (loop.value === null) loopText = c.zs !== null ? `Zs ${fmtOhm(c.zs)} Ω` : 'loop not computed';
    else if (c.limit === null) loopText = `${loop.label} ${fmtOhm(loop.value)} Ω, no limit`;
    else loopText = `${loop.label} ${fmtOhm(loop.value)} ${loop.value <= c.limit ? '≤' : '>'} ${fmtOhm(c.limit)} Ω`;
    items.push(text(lx, next(), truncate(loopText, 'regular', LABEL_TEXT, LABEL_W), LABEL_TEXT));
    const bs = next();
    items.push(...statusSymbol(c.status, lx + 1.2, bs - 0.8, 2.2));
    const word = STATUS_WORD[c.status];
    items.push(text(lx + 3, bs, word, LABEL_TEXT, 'bold', 'start', STATUS_COLOR[c.status]));
    if (c.ratio !== null) {
      const wW = textWidth(`${word} `, 'bold', LABEL_TEXT);
      items.push(text(lx + 3 + wW, bs, truncate(`· ${fmtRatio(c.ratio)} of limit`, 'regular', LABEL_TEXT, LABEL_W - 3 - wW), LABEL_TEXT));
    }
    if (verdict !== null) {
      const bv = next();
      items.push(...statusSymbol(c.verdict, lx + 1.2, bv - 0.8, 2.2));
      items.push(text(lx + 3, bv, truncate(verdict, 'bold', LABEL_TEXT, LABEL_W - 3), LABEL_TEXT, 'bold', 'start', STATUS_COLOR[c.verdict]));
    }
  }
  return items;
}

/** `name` in at most `max` lines, the first `firstW` mm wide and the others `restW`; the last cut with "…". */
function nameLines(name: string, firstW: number, restW: number, max: number): string[] {
  const words = name.split(/\s+/).filter((w) => w !== '');
  const lines: string[] = [];
  let k = 0;
  while (k < words.length && lines.length < max) {
    const w = lines.length === 0 ? firstW : restW;
    if (lines.length === max - 1) {
      lines.push(truncate(words.slice(k).join(' '), 'regular', LABEL_TEXT, w));
      break;
    }
    let line = '';
    while (k < words.length) {
      const candidate = line === '' ? (words[k] ?? '') : `${line} ${words[k] ?? ''}`;
      if (textWidth(candidate, 'regular', LABEL_TEXT) > w) break;
      line = candidate;
      k++;
    }
    // A word wider than a whole line: cut it there rather than lose the rest of the name.
    if (line === '' && lines.length > 0) {
      line = truncate(words[k] ?? '', 'regular', LABEL_TEXT, w);
      k++;
    }
    lines.push(line);
  }
  return lines;
}

/**
 * The node's symbol and its id and name (on up to three lines) to the right, with lines kept for
 * `extra` (a stub's or a continued head's note, in bold), the worst-path mark, a board's fault
 * level, or the supply's source and headroom; the name gives way first.
 */
export function nodeBlock(ctx: Ctx, node: JobNode, x: number, y: number, extra?: string): Item[] {
  const items: Item[] = nodeSymbol(node.kind, x, y);
  const nx = x + SYMBOL_HALF[node.kind].w + 1;
  const width = x + BLOCK.right - nx;
  const idW = textWidth(`${node.id} `, 'bold', LABEL_TEXT);
  items.push(text(nx, y + 0.8, truncate(node.id, 'bold', LABEL_TEXT, width), LABEL_TEXT, 'bold'));
  // The lines below the name: the stub's note and the worst-path mark always (as many as fit),
  // then a board's fault level, or the supply's headroom and source, which give way to the name.
  type Line = { text: string; bold: boolean; color?: string; order: number };
  const must: Line[] = [];
  if (extra !== undefined) must.push({ text: extra, bold: true, order: 0 });
  if (ctx.worstEnd === node.id) must.push({ text: 'worst fault path', bold: true, order: 1 });
  const optional: Line[] = [];
  if (node.kind === 'board') {
    const level = ctx.faultAt.get(node.id) ?? null;
    if (level !== null) optional.push({ text: `Ik max ${fmtKa(level)} kA`, bold: false, color: GREY, order: 2 });
  }
  if (node.kind === 'supply' && extra === undefined) {
    const head = describeHeadroomShort(node, ctx.supplies.get(node.id));
    if (head !== null) optional.push({ text: head, bold: false, color: GREY, order: 4 });
    optional.push({ text: describeSourceShort(node.source, ctx.u0), bold: false, color: GREY, order: 3 });
  }
  // A board's fault level beside its id, the name below on up to two lines, when that keeps it whole.
  if (node.kind === 'board' && optional.length === 1 && must.length === 0) {
    const below = nameLines(node.name ?? '', width, width, 2);
    const level = optional[0];
    const ikW = textWidth(level?.text ?? '', 'regular', LABEL_TEXT);
    if (level !== undefined && !below.some((l) => l.endsWith('…')) && idW + ikW <= width) {
      items.push(text(nx + idW, y + 0.8, level.text, LABEL_TEXT, 'regular', 'start', GREY));
      below.forEach((l, i) => {
        if (l !== '') items.push(text(nx, y + 0.8 + (i + 1) * LH, l, LABEL_TEXT));
      });
      return items;
    }
  }
  let reserved = Math.min(must.length + optional.length, 2);
  let names = nameLines(node.name ?? '', width - idW, width, Math.max(1, 3 - reserved));
  while (reserved > must.length && names.some((l) => l.endsWith('…'))) {
    reserved--;
    names = nameLines(node.name ?? '', width - idW, width, Math.max(1, 3 - reserved));
  }
  names.forEach((l, i) => {
    if (l !== '') items.push(text(i === 0 ? nx + idW : nx, y + 0.8 + i * LH, l, LABEL_TEXT));
  });
  let lineNo = Math.max(1, names.length);
  const room = Math.max(0, 3 - lineNo);
  const shown = [...must, ...optional].slice(0, Math.max(room, must.length)).sort((p, q) => p.order - q.order);
  for (const l of shown) {
    const font = l.bold ? 'bold' : 'regular';
    items.push(text(nx, y + 0.8 + lineNo * LH, truncate(l.text, font, LABEL_TEXT, width), LABEL_TEXT, font, 'start', l.color));
    lineNo++;
  }
  return items;
}

type BoxMm = { x0: number; x1: number; y0: number; y1: number };

function boxOf(t: TextItem): BoxMm {
  const w = textWidth(t.text, t.font, t.size);
  const x0 = t.anchor === 'start' ? t.x : t.anchor === 'middle' ? t.x - w / 2 : t.x - w;
  return { x0, x1: x0 + w, y0: t.y - t.size * 0.8, y1: t.y + t.size * 0.3 };
}

function hits(a: BoxMm, list: BoxMm[]): boolean {
  return list.some((b) => a.x0 < b.x1 && b.x0 < a.x1 && a.y0 < b.y1 && b.y0 < a.y1);
}

/**
 * A continuation mark at the left or right edge of the area, on a bus at height y: the arrow on
 * the bus, the text just above it, or moved up or down until it clears the text already there.
 */
function edgeMark(ctx: Ctx, side: 'left' | 'right', y: number, lines: string[], occupied: BoxMm[]): Item[] {
  const a = ctx.plan.area;
  const edge = side === 'left' ? a.x : a.x + a.w;
  const tip = side === 'left' ? edge - 0.5 : edge + 0.5;
  const arrow = arrowHead(side === 'left' ? tip + 3 : tip - 3, y, tip, y, 2.2);
  const build = (bottom: number): TextItem[] =>
    lines.map((l, i) => text(side === 'left' ? edge + 1 : edge - 1, bottom - (lines.length - 1 - i) * LH, l, LABEL_TEXT, i === 0 ? 'bold' : 'regular', side === 'left' ? 'start' : 'end'));
  const offsets = Array.from({ length: 24 }, (_, k) => k).flatMap((k) => [-1.2 - k * LH, k === 0 ? NaN : 1.2 + lines.length * LH + (k - 1) * LH]);
  for (const off of offsets) {
    if (Number.isNaN(off)) continue;
    const candidate = build(y + off);
    const boxes = candidate.map(boxOf);
    if (boxes.every((b) => b.y0 >= a.y - 3.5 && b.y1 <= a.y + a.h + 3.5) && !boxes.some((b) => hits(b, occupied))) {
      occupied.push(...boxes);
      return [arrow, ...candidate];
    }
  }
  return [arrow, ...build(y - 1.2)];
}

function wrapList(head: string, ids: string[]): string[] {
  return [head, ...wrap(ids.join(', '), 'regular', LABEL_TEXT, 60, 1)];
}

/** Every item of diagram tile `index` (no title block). */
export function drawTile(ctx: Ctx, index: number): Item[] {
  const tile = ctx.plan.tiles[index];
  if (tile === undefined) return [];
  const a = ctx.plan.area;
  const items: Item[] = [];
  const here = (id: string): boolean => ctx.plan.tileOf.get(id) === index;
  const symbols: Item[] = [];
  const outgoing = new Map<string, { side: 'left' | 'right'; y: number; bySheet: Map<number, string[]> }>();
  const incoming = new Map<string, { side: 'left' | 'right'; y: number; parent: string; sheet: number }>();
  // Marks in the bands above and below the drawing, merged where several share one drop line.
  const band = new Map<string, { x: number; y: number; parts: string[]; tail: string }>();
  const addBand = (key: string, x: number, y: number, part: string, tail: string): void => {
    const entry = band.get(key) ?? { x, y, parts: [], tail };
    if (!entry.parts.includes(part)) entry.parts.push(part);
    band.set(key, entry);
  };

  for (const link of linksOnTile(ctx, index)) {
    const pIn = here(link.from);
    const cIn = here(link.to);
    if (!pIn && !cIn) continue;
    const st = linkStroke(ctx, link);
    const pt = ctx.plan.tileOf.get(link.from) ?? index;
    const ct = ctx.plan.tileOf.get(link.to) ?? index;
    const other = ctx.plan.tiles[pIn ? ct : pt] ?? tile;
    const pw = ctx.plan.pos.get(link.from) ?? { x: 0, y: 0 };
    const p = { x: pw.x + tile.dx, y: pw.y + tile.dy };
    const c = at(ctx, link.to, tile);
    const busY = p.y + BUS;
    const top = ctx.plan.area.y - 3.5;
    const bottom = a.y + a.h + 3.5;

    if (pIn) items.push(line(p.x, p.y + SYMBOL_HALF[ctx.nodes.get(link.from)?.kind ?? 'point'].h, p.x, busY, st));
    if (pIn && cIn) {
      items.push(line(p.x, busY, c.x, busY, st));
    } else if (pIn) {
      if (other.col !== tile.col) {
        const side = other.col < tile.col ? 'left' : 'right';
        items.push(line(p.x, busY, side === 'left' ? a.x : a.x + a.w - 3, busY, st));
        const key = `${link.from}|${side}`;
        const mark = outgoing.get(key) ?? { side, y: busY, bySheet: new Map<number, string[]>() };
        const list = mark.bySheet.get(ctx.sheetOf(ct)) ?? [];
        list.push(link.to);
        mark.bySheet.set(ctx.sheetOf(ct), list);
        outgoing.set(key, mark);
      } else {
        const down = other.row > tile.row;
        const edgeY = down ? bottom - 1 : top + 1;
        items.push(line(p.x, busY, c.x, busY, st), line(c.x, busY, c.x, edgeY, st), arrowHead(c.x, busY, c.x, down ? bottom + 1 : top - 1, 2));
        addBand(`${c.x}|${down ? 'b' : 't'}`, c.x + 1.5, down ? bottom + 0.3 : top + 0.3, `${link.to} · sheet ${ctx.sheetOf(ct)}`, down ? ' ↓' : ' ↑');
      }
      continue;
    }
    // The far node is here: its drop, device, RCD and label.
    let dropTop = busY;
    if (!pIn) {
      if (other.row === tile.row) {
        const side = other.col < tile.col ? 'left' : 'right';
        items.push(line(side === 'left' ? a.x + 3 : a.x + a.w, busY, c.x, busY, st));
        incoming.set(`${link.from}|${side}`, { side, y: busY, parent: link.from, sheet: ctx.sheetOf(pt) });
      } else {
        const fromAbove = other.row < tile.row;
        dropTop = fromAbove ? top - 1 : bottom + 1;
        items.push(arrowHead(c.x, fromAbove ? top - 3 : bottom + 3, c.x, fromAbove ? top + 1.5 : bottom - 1.5, 2));
        addBand(`${c.x}|${fromAbove ? 't' : 'b'}`, c.x + 1.5, fromAbove ? top + 0.3 : bottom + 0.3, `from ${link.from} · sheet ${ctx.sheetOf(pt)}`, '');
      }
    }
    const childHalf = SYMBOL_HALF[ctx.nodes.get(link.to)?.kind ?? 'point'].h;
    items.push(line(c.x, dropTop, c.x, c.y - childHalf, st));
    if (link.device !== undefined) symbols.push(deviceSymbol(c.x, c.y + BLOCK.top + 2));
    if (link.rcd !== undefined) symbols.push(rcdSymbol(c.x, c.y + BLOCK.top + 5.2));
    symbols.push(...linkLabel(ctx, link, c.x, c.y));
  }

  for (const id of tile.nodes) {
    const node = ctx.nodes.get(id);
    if (node === undefined) continue;
    const p = at(ctx, id, tile);
    symbols.push(...nodeBlock(ctx, node, p.x, p.y));
  }
  const bandItems = [...band.values()].sort((p, q) => p.x - q.x || p.y - q.y);
  bandItems.forEach((b, i) => {
    const next = bandItems.slice(i + 1).find((o) => o.y === b.y);
    const room = Math.min((next?.x ?? a.x + a.w) - b.x - 1, a.x + a.w - b.x);
    const label = `${b.parts.join(', ')}${b.tail}`;
    items.push(text(b.x, b.y, truncate(label, 'bold', LABEL_TEXT, Math.max(room, 4)), LABEL_TEXT, 'bold'));
  });
  const occupied = [...items, ...symbols].filter((i): i is TextItem => i.kind === 'text').map(boxOf);
  for (const { side, y, bySheet } of outgoing.values()) {
    const lines: string[] = [];
    for (const [sheet, ids] of [...bySheet.entries()].sort((x, y2) => x[0] - y2[0])) {
      lines.push(...wrapList(side === 'left' ? `← continued on sheet ${sheet}:` : `continued on sheet ${sheet} →`, ids));
    }
    items.push(...edgeMark(ctx, side, y, lines, occupied));
  }
  for (const { side, y, parent, sheet } of incoming.values()) {
    const node = ctx.nodes.get(parent);
    const name = truncate(`${parent}${node?.name !== undefined ? ` ${node.name}` : ''}`, 'regular', LABEL_TEXT, 60);
    const head = side === 'left' ? `← from sheet ${sheet}` : `from sheet ${sheet} →`;
    items.push(...edgeMark(ctx, side, y, [head, name], occupied));
  }
  return [...items, ...symbols];
}

export function diagramContext(job: Job, results: Results, plan: DiagramPlan, sheetOf: (tile: number) => number, u0: number): Ctx {
  const worstLinks = new Set<string>();
  const worstNodes = new Set<string>();
  const path = results.worst?.path ?? [];
  path.forEach((id, i) => (i % 2 === 1 ? worstLinks : worstNodes).add(id));
  const children = new Map<string, Link[]>();
  for (const l of job.links) {
    const list = children.get(l.from);
    if (list !== undefined) list.push(l);
    else children.set(l.from, [l]);
  }
  // A link's fault level is at its origin: the fault level of the node it leaves.
  const faultAt = new Map<string, number | null>();
  for (const c of results.circuits) if (c.faultLevel !== null && !faultAt.has(c.from)) faultAt.set(c.from, c.faultLevel);
  return {
    job,
    plan,
    byLink: new Map(results.circuits.map((c) => [c.link, c])),
    nodes: new Map(job.nodes.map((n) => [n.id, n])),
    children,
    worstLinks,
    worstNodes,
    worstEnd: path.length > 0 ? (path[path.length - 1] ?? null) : null,
    worstRatio: results.worst?.ratio ?? null,
    faultAt,
    supplies: new Map(results.supplies.map((r) => [r.node, r])),
    sheetOf,
    u0,
  };
}
