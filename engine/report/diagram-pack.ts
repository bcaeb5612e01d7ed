// Packing the diagram's sections (diagram-sections.ts) onto sheets, in reading order from the
// supply down, shelf by shelf; a section too long for the room left continues on the next sheet
// at a row boundary, its board repeated at the head. The full legend takes the foot of one
// diagram sheet (the first that can hold it without costing a sheet or a split section: on the
// first four sheets the sections may move on to make room, past those only a sheet that already
// has the room takes it); the others carry a one-line key. Then the sheets are balanced: the
// same number of sheets and no more split sections, but the smallest height every sheet must
// hold, so the last sheet is not left with one board while the first is crammed.

import type { Job } from '../model/types.js';
import { buildSections, headHeight, type Piece, type Section, type SectionPlan } from './diagram-sections.js';
import type { Box } from './paper.js';

const PIECE_GAP = 4;
/** Step of the balancing search, mm. */
const BALANCE_STEP = 1;

/** A placement fits when it overshoots the room by no more than this, mm (sums taken in
 *  different orders differ in the last bits). */
const FIT_SLACK = 1e-9;
/** Candidate sheets for the legend that are tried by packing again from scratch; past these, a
 *  sheet takes it only when it already has the room (the same packing, so no pack at all). */
const LEGEND_REPACKS = 4;

/** Running sums of each section's row heights, so any run of rows is summed in constant time. */
const prefixes = new WeakMap<Section, Float64Array>();
function sum(s: Section, from: number, to: number): number {
  let p = prefixes.get(s);
  if (p === undefined) {
    p = new Float64Array(s.rowH.length + 1);
    for (let i = 0; i < s.rowH.length; i++) p[i + 1] = p[i]! + (s.rowH[i] ?? 0);
    prefixes.set(s, p);
  }
  return p[to]! - p[from]!;
}

/** Pack limits past which the caller has no use for the result: more sheets or split sections. */
interface Stop {
  sheets: number;
  splits: number;
}

/**
 * Pack the sections onto sheets of width `width`, sheet i holding at most `room(i)` mm of height;
 * null when a row cannot fit an empty sheet.
 */
function pack(sections: Section[], width: number, room: (sheet: number) => number, stop?: Stop): Piece[][] | null {
  const sheets: Piece[][] = [[]];
  let cut = 0;
  let over = false;
  let shelfY = 0;
  let shelfBottom = 0;
  let cursorX = 0;
  const newSheet = (): void => {
    sheets.push([]);
    shelfY = 0;
    shelfBottom = 0;
    cursorX = 0;
  };
  for (const s of sections) {
    let from = 0;
    let first = true;
    const rowsLeft = (): number => s.rows.length - from;
    while (first || rowsLeft() > 0) {
      const h = room(sheets.length - 1);
      const head = headHeight(s, first);
      const whole = head + sum(s, from, s.rows.length);
      const sheet = sheets[sheets.length - 1] ?? [];
      const place = (x: number, y: number, to: number, ph: number, as = s): void => {
        sheet.push({ section: as, first, from, to, x, y, w: as.w, h: ph });
        if (!first) cut++;
        if (stop !== undefined && (sheets.length > stop.sheets || cut > stop.splits)) over = true;
        cursorX = x + as.w + PIECE_GAP;
        shelfBottom = Math.max(shelfBottom, y + ph);
        from = to;
        first = false;
      };
      // Beside the pieces already on this shelf, in a narrower shape if that one fits.
      const beside = sheet.length === 0 ? undefined : (first ? [s, ...s.alts] : [s]).find((v) =>
        cursorX + v.w <= width + FIT_SLACK && shelfY + headHeight(v, first) + sum(v, from, v.rows.length) <= h + FIT_SLACK);
      if (beside !== undefined) {
        place(cursorX, shelfY, beside.rows.length, headHeight(beside, first) + sum(beside, from, beside.rows.length), beside);
        if (over) return null;
        continue;
      }
      // On a new shelf below, whole or as many rows as fit.
      const y = sheet.length === 0 ? 0 : shelfBottom + PIECE_GAP;
      if (y + whole <= h + FIT_SLACK) {
        shelfY = y;
        place(0, y, s.rows.length, whole);
        if (over) return null;
        continue;
      }
      let fit = from;
      while (fit < s.rows.length && y + head + sum(s, from, fit + 1) <= h + FIT_SLACK) fit++;
      if (fit > from) {
        shelfY = y;
        place(0, y, fit, head + sum(s, from, fit));
        if (over) return null;
        newSheet();
        continue;
      }
      if (sheet.length === 0) return null; // not even one row fits an empty sheet
      newSheet();
    }
  }
  return sheets.filter((sh) => sh.length > 0);
}

/** How many sections are cut over more than one piece. */
function splits(sheets: Piece[][]): number {
  return sheets.reduce((n, pieces) => n + pieces.filter((p) => !p.first).length, 0);
}

function used(pieces: Piece[]): number {
  return Math.max(0, ...pieces.map((p) => p.y + p.h));
}

/**
 * The section plan for `area` (the drawing room of a sheet with the one-line key at its foot),
 * or null when the drawing cannot be split this way. `legendExtra` is how much more height the
 * full legend takes than the key line.
 */
export function planSections(job: Job, area: Box, legendExtra: number): SectionPlan | null {
  for (const inline of [true, false]) {
    const sections = buildSections(job, area, inline);
    if (sections === null) continue;
    const base = pack(sections, area.w, () => area.h);
    if (base === null) continue;
    const count = base.length;
    // The legend on the earliest sheet that can take it at no cost, else after the diagram. A
    // sheet whose content already leaves the room packs exactly as before; the first few are
    // also tried by packing again (the legend may push a section on and keep the count), so a
    // job of thousands of sheets is not packed thousands of times.
    let legendSheet: number | null = null;
    let best = base;
    const baseSplits = splits(base);
    const short = area.h - legendExtra;
    for (let k = 0; k < count; k++) {
      if (used(base[k] ?? []) <= short + FIT_SLACK) {
        legendSheet = k;
        break;
      }
      if (k >= LEGEND_REPACKS) continue;
      const p = pack(sections, area.w, (i) => (i === k ? short : area.h), { sheets: count, splits: baseSplits });
      if (p !== null && p.length === count && splits(p) <= baseSplits) {
        legendSheet = k;
        best = p;
        break;
      }
    }
    const room = (i: number): number => (i === legendSheet ? area.h - legendExtra : area.h);
    // Balance: the lowest ceiling that keeps the sheet count and the splits.
    const limitSplits = splits(best);
    const floor = Math.max(...sections.map((s) => headHeight(s, true)));
    for (let limit = Math.max(...best.map(used)) - BALANCE_STEP; limit >= floor; limit -= BALANCE_STEP) {
      const p = pack(sections, area.w, (i) => Math.min(limit, room(i)), { sheets: count, splits: limitSplits });
      if (p === null || p.length !== count || splits(p) > limitSplits) continue;
      best = p;
    }
    const sheets = best;
    const sheetOf = new Map<string, number>();
    sheets.forEach((pieces, i) => pieces.forEach((p) => {
      if (p.first) for (const s of p.section.spine) sheetOf.set(s.id, i);
      for (const row of p.section.rows.slice(p.from, p.to)) {
        for (const c of row) for (const n of c.nodes) if (!n.stub) sheetOf.set(n.id, i);
      }
    }));
    // Centre each sheet's content in its room.
    sheets.forEach((pieces, i) => {
      const w = Math.max(...pieces.map((p) => p.x + p.w));
      const h = used(pieces);
      const dx = area.x + Math.max(0, (area.w - w) / 2);
      const dy = area.y + Math.max(0, (room(i) - h) / 2);
      for (const p of pieces) {
        p.x += dx;
        p.y += dy;
      }
    });
    return { sheets, legendSheet, sheetOf };
  }
  return null;
}
