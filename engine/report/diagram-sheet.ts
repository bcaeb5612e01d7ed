// Drawing the diagram split by subtree (diagram-sections.ts): each piece is a board's section —
// the "fed from" head repeating the feeding link, the board (and boards fed one by one below it),
// a trunk down the left and one bus per row of circuits, each circuit with its full label.

import type { Link } from '../model/types.js';
import { type Ctx, linkLabel, linkStroke, nodeBlock } from './diagram.js';
import { BLOCK, BUS } from './diagram-plan.js';
import { CONT_H, CW, DROP, FED_H, GUTTER, LEVEL, type Piece, type SectionPlan } from './diagram-sections.js';
import { arrowHead, deviceSymbol, line, rcdSymbol, stroke, SYMBOL_HALF, text } from './draw.js';
import { truncate } from './text.js';
import type { Item } from './types.js';

const T = 2.2;

function half(ctx: Ctx, id: string): number {
  return SYMBOL_HALF[ctx.nodes.get(id)?.kind ?? 'point'].h;
}

/** Where a node is drawn in full, as the reader of sheet `here` (0-based) should be told. */
function where(plan: SectionPlan, id: string, here: number, sheetOf: (i: number) => number): string {
  const s = plan.sheetOf.get(id);
  if (s === undefined) return 'another sheet';
  return s === here ? 'this sheet' : `sheet ${sheetOf(s)}`;
}

/** The stub's note: the sheet its board continues on, or where on this sheet. */
function stubNote(plan: SectionPlan, id: string, piece: Piece, here: number, sheetOf: (i: number) => number): string {
  const s = plan.sheetOf.get(id);
  if (s !== here) return `cont. on ${where(plan, id, here, sheetOf)}`;
  const target = (plan.sheets[here] ?? []).find((p) => p.first && p.section.root === id);
  if (target === undefined) return 'cont. on this sheet';
  return target.y > piece.y + 1 ? 'cont. below' : target.x > piece.x ? 'cont. to the right' : 'cont. to the left';
}

/** The link's device and RCD symbols on its drop line, and its label, for a far node at (x, y). */
function annotate(ctx: Ctx, link: Link, x: number, y: number, out: Item[]): void {
  if (link.device !== undefined) out.push(deviceSymbol(x, y + BLOCK.top + 2));
  if (link.rcd !== undefined) out.push(rcdSymbol(x, y + BLOCK.top + 5.2));
  out.push(...linkLabel(ctx, link, x, y));
}

/** Every item of one piece on diagram sheet `here` (0-based). */
export function drawPiece(ctx: Ctx, plan: SectionPlan, piece: Piece, here: number, sheetOf: (i: number) => number): Item[] {
  const s = piece.section;
  const lines: Item[] = [];
  const labels: Item[] = [];
  const x0 = piece.x + 6;
  const end = s.spine[s.spine.length - 1] ?? { id: s.root, link: null };
  let endY: number;
  if (piece.first) {
    const rootY = piece.y + (s.fedBy !== null ? FED_H : 4);
    if (s.fedBy !== null) {
      const from = ctx.nodes.get(s.fedBy.from);
      const head = `fed from ${s.fedBy.from}${from?.name !== undefined && from.name !== '' ? ` ${from.name}` : ''} (${where(plan, s.fedBy.from, here, sheetOf)})`;
      labels.push(text(x0 + 2, piece.y + 3, truncate(head, 'bold', T, s.w - 10), T, 'bold'));
      lines.push(line(x0, piece.y + 1, x0, rootY - half(ctx, s.root), linkStroke(ctx, s.fedBy)));
      lines.push(arrowHead(x0, piece.y + 0.5, x0, piece.y + 5, 2));
      annotate(ctx, s.fedBy, x0, rootY, labels);
    }
    s.spine.forEach((n, i) => {
      const y = rootY + i * LEVEL;
      const node = ctx.nodes.get(n.id);
      if (n.link !== null) {
        lines.push(line(x0, y - LEVEL + half(ctx, n.link.from), x0, y - half(ctx, n.id), linkStroke(ctx, n.link)));
        annotate(ctx, n.link, x0, y, labels);
      }
      if (node !== undefined) labels.push(...nodeBlock(ctx, node, x0, y));
    });
    endY = rootY + (s.spine.length - 1) * LEVEL;
  } else {
    endY = piece.y + CONT_H - 2;
    const node = ctx.nodes.get(end.id);
    if (node !== undefined) labels.push(...nodeBlock(ctx, node, x0, endY, `cont. from sheet ${sheetOf(here - 1)}`));
  }

  let busY = endY + BUS;
  let lastBus = busY;
  for (let r = piece.from; r < piece.to; r++) {
    const row = s.rows[r] ?? [];
    let slot = 0;
    for (const col of row) {
      const pos = new Map<string, { x: number; y: number }>();
      for (const n of col.nodes) {
        const x = x0 + GUTTER + (slot + n.slot) * CW;
        const y = busY + DROP + n.level * LEVEL;
        pos.set(n.id, { x, y });
        const st = linkStroke(ctx, n.link);
        if (n.parent === null) {
          lines.push(line(x0, endY + half(ctx, end.id), x0, busY, st), line(x0, busY, x, busY, st));
          lines.push(line(x, busY, x, y - half(ctx, n.id), st));
        } else {
          const p = pos.get(n.parent) ?? { x, y: y - LEVEL };
          const bus = p.y + BUS;
          lines.push(line(p.x, p.y + half(ctx, n.parent), p.x, bus, st), line(p.x, bus, x, bus, st), line(x, bus, x, y - half(ctx, n.id), st));
        }
        annotate(ctx, n.link, x, y, labels);
        const node = ctx.nodes.get(n.id);
        if (node === undefined) continue;
        labels.push(...nodeBlock(ctx, node, x, y, n.stub ? stubNote(plan, n.id, piece, here, sheetOf) : undefined));
      }
      slot += col.slots;
    }
    lastBus = busY;
    busY += s.rowH[r] ?? 0;
  }
  if (piece.to < s.rows.length) {
    const y = piece.y + piece.h;
    lines.push(line(x0, lastBus, x0, y - 2, stroke(0.35)));
    lines.push(arrowHead(x0, y - 4, x0, y + 0.5, 2));
    labels.push(text(x0 + 2, y - 0.3, `${end.id} continues on sheet ${sheetOf(here + 1)}`, T, 'bold'));
  }
  return [...lines, ...labels];
}
