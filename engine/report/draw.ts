// Small builders for display-list items, and the vector symbols of the printout.
// Status symbols are drawn as shapes, never as glyphs, and always sit beside the status word.

import type { Status } from '../analysis/results.js';
import type { Anchor, FontWeight, Item, Stroke, TextItem } from './types.js';
import { MIN_TEXT_MM } from './types.js';

export const INK = '#000000';
export const GREY = '#555555';
export const LIGHT = '#e6e6e6';
export const PAPER = '#ffffff';

export const STATUS_COLOR: Record<Status, string> = {
  pass: '#1a7f37',
  fail: '#c62828',
  rcd: '#a35a00',
  unchecked: '#555555',
};

export function stroke(width: number, color = INK, dash?: [number, number]): Stroke {
  return dash === undefined ? { width, color } : { width, color, dash };
}

export function text(
  x: number,
  y: number,
  value: string,
  size: number,
  font: FontWeight = 'regular',
  anchor: Anchor = 'start',
  color?: string,
): TextItem {
  const item: TextItem = { kind: 'text', x, y, text: value, size: Math.max(size, MIN_TEXT_MM), font, anchor };
  if (color !== undefined) item.color = color;
  return item;
}

export function line(x1: number, y1: number, x2: number, y2: number, s: Stroke): Item {
  return { kind: 'line', x1, y1, x2, y2, stroke: s };
}

/**
 * The status symbol in a square of side `size` whose centre is (cx, cy):
 * pass a tick, fail a cross, rcd a warning triangle, unchecked an open circle.
 */
export function statusSymbol(status: Status, cx: number, cy: number, size: number): Item[] {
  const h = size / 2;
  const color = STATUS_COLOR[status];
  const w = Math.max(size * 0.14, 0.25);
  switch (status) {
    case 'pass':
      return [{
        kind: 'polyline',
        points: [[cx - h * 0.85, cy], [cx - h * 0.25, cy + h * 0.7], [cx + h * 0.9, cy - h * 0.8]],
        stroke: stroke(w * 1.2, color),
      }];
    case 'fail':
      return [
        line(cx - h * 0.75, cy - h * 0.75, cx + h * 0.75, cy + h * 0.75, stroke(w * 1.2, color)),
        line(cx - h * 0.75, cy + h * 0.75, cx + h * 0.75, cy - h * 0.75, stroke(w * 1.2, color)),
      ];
    case 'rcd':
      return [
        { kind: 'polyline', points: [[cx, cy - h], [cx + h, cy + h * 0.85], [cx - h, cy + h * 0.85]], closed: true, stroke: stroke(w, color) },
        line(cx, cy - h * 0.35, cx, cy + h * 0.3, stroke(w, color)),
        { kind: 'circle', cx, cy: cy + h * 0.58, r: w * 0.6, fill: color },
      ];
    case 'unchecked':
      return [{ kind: 'circle', cx, cy, r: h * 0.8, stroke: stroke(w, color) }];
  }
}

/** A filled arrow head pointing from (x1, y1) to its tip (x2, y2). */
export function arrowHead(x1: number, y1: number, x2: number, y2: number, length = 2.2, color = INK): Item {
  const dx = x2 - x1;
  const dy = y2 - y1;
  const d = Math.hypot(dx, dy) || 1;
  const ux = dx / d;
  const uy = dy / d;
  const bx = x2 - ux * length;
  const by = y2 - uy * length;
  const wx = -uy * length * 0.4;
  const wy = ux * length * 0.4;
  return { kind: 'polyline', points: [[x2, y2], [bx + wx, by + wy], [bx - wx, by - wy]], closed: true, fill: color };
}

export type NodeSymbolKind = 'supply' | 'board' | 'point';

/** Half the width of a node's symbol, mm. */
export const SYMBOL_HALF: Record<NodeSymbolKind, { w: number; h: number }> = {
  supply: { w: 3, h: 3 },
  board: { w: 5, h: 2.5 },
  point: { w: 1.6, h: 1.6 },
};

/** Supply: a circle with a sine wave; board: a shaded rectangle; point: an open circle. */
export function nodeSymbol(kind: NodeSymbolKind, cx: number, cy: number): Item[] {
  switch (kind) {
    case 'supply': {
      const pts: Array<[number, number]> = [];
      for (let i = 0; i <= 16; i++) {
        const t = i / 16;
        pts.push([cx - 1.8 + 3.6 * t, cy - 0.9 * Math.sin(t * 2 * Math.PI)]);
      }
      return [
        { kind: 'circle', cx, cy, r: 3, stroke: stroke(0.4), fill: PAPER },
        { kind: 'polyline', points: pts.map(([x, y]) => [round(x), round(y)]), stroke: stroke(0.3) },
      ];
    }
    case 'board':
      return [{ kind: 'rect', x: cx - 5, y: cy - 2.5, w: 10, h: 5, stroke: stroke(0.45), fill: LIGHT }];
    case 'point':
      return [{ kind: 'circle', cx, cy, r: 1.6, stroke: stroke(0.4), fill: PAPER }];
  }
}

/** Protective device on a line: a small upright rectangle centred on (cx, cy). */
export function deviceSymbol(cx: number, cy: number): Item {
  return { kind: 'rect', x: cx - 0.9, y: cy - 1.5, w: 1.8, h: 3, stroke: stroke(0.3), fill: PAPER };
}

/** RCD on a line: a ring around it centred on (cx, cy). */
export function rcdSymbol(cx: number, cy: number): Item {
  return { kind: 'circle', cx, cy, r: 1.1, stroke: stroke(0.3) };
}

export function round(v: number): number {
  return Math.round(v * 1000) / 1000;
}
