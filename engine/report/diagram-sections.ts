// The diagram split by subtree, for a drawing too large for one sheet at a readable size: one
// section per board (or supply), its circuits hanging in rows from a bus, every board fed from
// it drawn as a stub that names the sheet it continues on, and each board's own section headed
// by a "fed from" stub repeating the link that feeds it. diagram-pack.ts packs the sections onto
// sheets. Circuits keep the order drawn (left to right), or file order for a job without positions.

import type { Job, JobNode, Link } from '../model/types.js';
import { BLOCK, BUS } from './diagram-plan.js';
import type { Box } from './paper.js';

/** Width of one circuit's column (its label and name block plus a gap), mm. */
export const CW = BLOCK.right - BLOCK.left + 1;
/** From a node's centre to the centre of the node it feeds, in a column or the spine, mm. */
export const LEVEL = 32;
/** From a bus to the centre of the nodes hanging from it, mm (room for the link's label). */
export const DROP = LEVEL - BUS;
/** Below a node's centre: its id, name and one more line, mm. */
export const NODE_BOTTOM = 7.4;
/** From a section's trunk to its first column, mm. */
export const GUTTER = 8;
/** Height of the "fed from" head above a section's root, mm. */
export const FED_H = 26;
/** Height of the head of a section continued from an earlier sheet, mm. */
export const CONT_H = 5;
const ROW_GAP = 3;
/** How many narrower shapes a section offers the packer. */
const MAX_ALTS = 3;

export interface ColumnNode {
  id: string;
  /** The link feeding it. */
  link: Link;
  /** Leaf slot (0-based, in CW units) within the column, and depth (0 = hangs from the bus). */
  slot: number;
  level: number;
  /** Parent within the column, or null for the column's top node (hangs from the bus). */
  parent: string | null;
  /** A board with its own section elsewhere: drawn as a stub naming its sheet. */
  stub: boolean;
}

export interface Column {
  nodes: ColumnNode[];
  /** Width in leaf slots, and depth in levels. */
  slots: number;
  levels: number;
}

export interface Section {
  root: string;
  /** The link feeding the root from another section, if any. */
  fedBy: Link | null;
  /** The root and the boards fed one by one below it; the last one's circuits hang in rows. */
  spine: Array<{ id: string; link: Link | null }>;
  rows: Column[][];
  /** Height of each row, bus to bottom, mm. */
  rowH: number[];
  w: number;
  /** The same section in narrower shapes (more rows), narrowest last. */
  alts: Section[];
}

export interface Piece {
  section: Section;
  first: boolean;
  /** Rows [from, to) of the section on this piece. */
  from: number;
  to: number;
  x: number;
  y: number;
  w: number;
  h: number;
}

export interface SectionPlan {
  sheets: Piece[][];
  /** The diagram sheet (0-based) whose foot holds the full legend, or null for none (it goes after the diagram). */
  legendSheet: number | null;
  /** Sheet index (0-based) where each node is drawn in full (a stub's is its own section's). */
  sheetOf: Map<string, number>;
}

/** Links leaving each node, in drawing order: by the far end's position where every node has
 *  one (else as in the file), ties in file order. Worked out once per job, each list sorted once. */
function childLists(job: Job, nodes: Map<string, JobNode>): (id: string) => Link[] {
  const kids = new Map<string, Link[]>();
  for (const l of job.links) {
    const list = kids.get(l.from);
    if (list) list.push(l);
    else kids.set(l.from, [l]);
  }
  const drawn = job.nodes.every((n) => n.at !== undefined);
  const idx = new Map(job.links.map((l, i) => [l.id, i]));
  const sorted = new Set<string>();
  const none: Link[] = [];
  return (id) => {
    const list = kids.get(id);
    if (!list) return none;
    if (drawn && !sorted.has(id)) {
      sorted.add(id);
      list.sort((a, b) => {
        const pa = nodes.get(a.to)?.at ?? { x: 0, y: 0 };
        const pb = nodes.get(b.to)?.at ?? { x: 0, y: 0 };
        return pa.x - pb.x || pa.y - pb.y || (idx.get(a.id) ?? 0) - (idx.get(b.id) ?? 0);
      });
    }
    return list;
  };
}

/** Sections in reading order, or null when one cannot fit the area at all. */
export function buildSections(job: Job, area: Box, inline: boolean): Section[] | null {
  const nodes = new Map(job.nodes.map((n) => [n.id, n]));
  const feed = new Map<string, Link>();
  for (const l of job.links) feed.set(l.to, l);
  const children = childLists(job, nodes);
  const isBoard = (id: string): boolean => nodes.get(id)?.kind === 'board';
  const maxCols = Math.floor((area.w - 6 - GUTTER - 32) / CW) + 1;
  const sections: Section[] = [];

  const column = (top: Link): Column => {
    const list: ColumnNode[] = [];
    let slots = 0;
    let levels = 0;
    // Pre-order with a stack of its own (a chain of points can be as deep as the file makes it).
    // A node's slot is the first free slot when it is reached; only a node with nothing drawn
    // below it takes one.
    const stack: Array<{ link: Link; parent: string | null; level: number }> = [{ link: top, parent: null, level: 0 }];
    while (stack.length > 0) {
      const { link, parent, level } = stack.pop()!;
      levels = Math.max(levels, level + 1);
      const stub = isBoard(link.to);
      const below = stub ? [] : children(link.to);
      list.push({ id: link.to, link, slot: slots, level, parent, stub });
      if (below.length === 0) slots++;
      else for (let k = below.length - 1; k >= 0; k--) stack.push({ link: below[k]!, parent: link.to, level: level + 1 });
    }
    return { nodes: list, slots, levels };
  };

  type Made = { made: Section; stubs: Array<{ root: string; fedBy: Link | null }> };
  /** One section from `root`: false when it cannot fit, 'apart' when its spine must be split. */
  const one = (root: string, fedBy: Link | null, join: boolean): Made | false | 'apart' => {
    const spine: Array<{ id: string; link: Link | null }> = [{ id: root, link: null }];
    let end = root;
    // A spine whose head alone is taller than the area is split whatever hangs below it; stop
    // there rather than walk on down a chain of boards (walking it from every board is quadratic).
    const tallest = Math.floor((area.h - (fedBy !== null ? FED_H : 4) - Math.min(BUS, NODE_BOTTOM)) / LEVEL) + 1;
    for (;;) {
      const k = children(end);
      const only = k[0];
      if (!join || k.length !== 1 || only === undefined || !isBoard(only.to)) break;
      spine.push({ id: only.to, link: only });
      end = only.to;
      if (spine.length > tallest + 1) return 'apart';
    }
    const cols = children(end).map(column);
    if (cols.some((c) => c.slots > maxCols)) return false;
    // Balanced rows: as few as the width allows, the columns spread evenly over them; narrower
    // shapes (more rows) kept as alternatives for the packer to set beside another section.
    const total = cols.reduce((s, c) => s + c.slots, 0);
    const rowsNeeded = total === 0 ? 0 : Math.ceil(total / maxCols);
    const made: Section = { root, fedBy, spine, ...shape(cols, rowsNeeded, maxCols), alts: [] };
    for (let n = rowsNeeded + 1; n <= Math.min(cols.length, rowsNeeded + MAX_ALTS); n++) {
      const alt = shape(cols, n, maxCols);
      const last = made.alts[made.alts.length - 1] ?? made;
      if (alt.w < last.w) made.alts.push({ root, fedBy, spine, ...alt, alts: [] });
    }
    const { rows, rowH } = made;
    // A spine so long that its head and first row no longer fit a sheet: each board on its own.
    if (join && spine.length > 1 && headHeight(made, true) + (rowH[0] ?? 0) > area.h) return 'apart';
    const stubs: Made['stubs'] = [];
    for (const r of rows) for (const c of r) for (const n of c.nodes) if (n.stub) stubs.push({ root: n.id, fedBy: n.link });
    return { made, stubs };
  };

  // Sections in reading order (each followed by the sections its stubs continue on), without
  // recursion: a chain of boards may be tens of thousands deep.
  const section = (root: string, fedBy: Link | null): boolean => {
    const stack = [{ root, fedBy }];
    while (stack.length) {
      const next = stack.pop()!;
      let r = one(next.root, next.fedBy, inline);
      if (r === 'apart') r = one(next.root, next.fedBy, false);
      if (r === false || r === 'apart') return false;
      sections.push(r.made);
      for (let i = r.stubs.length - 1; i >= 0; i--) stack.push(r.stubs[i]!);
    }
    return true;
  };

  for (const n of job.nodes) if (!feed.has(n.id) && !section(n.id, null)) return null;
  return sections;
}

/** Columns in `n` rows of about equal width (none wider than `maxCols` slots), with their size. */
function shape(cols: Column[], n: number, maxCols: number): { rows: Column[][]; rowH: number[]; w: number } {
  const total = cols.reduce((s, c) => s + c.slots, 0);
  const rows: Column[][] = [];
  let current: Column[] = [];
  let used = 0;
  const target = n === 0 ? 0 : Math.ceil(total / n);
  for (const c of cols) {
    if (current.length > 0 && (used + c.slots > maxCols || used >= target)) {
      rows.push(current);
      current = [];
      used = 0;
    }
    current.push(c);
    used += c.slots;
  }
  if (current.length > 0) rows.push(current);
  const rowH = rows.map((r) => DROP + (Math.max(...r.map((c) => c.levels)) - 1) * LEVEL + NODE_BOTTOM + ROW_GAP);
  const widest = Math.max(0, ...rows.map((r) => r.reduce((s, c) => s + c.slots, 0)));
  const w = widest === 0 ? 6 + 32 : 6 + GUTTER + (widest - 1) * CW + 32;
  return { rows, rowH, w };
}

/** Height of a section's head: the fed-from stub and the spine down to the first bus. */
export function headHeight(s: Section, first: boolean): number {
  if (!first) return CONT_H + BUS;
  const top = s.fedBy !== null ? FED_H : 4;
  return top + (s.spine.length - 1) * LEVEL + (s.rows.length > 0 ? BUS : NODE_BOTTOM);
}
