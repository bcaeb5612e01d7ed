// The legend: every symbol and line style the diagram uses, and how to read a link's label; and
// the one-line key that points to it from the diagram sheets without it.

import type { Status } from '../analysis/results.js';
import { arrowHead, deviceSymbol, GREY, line, nodeSymbol, rcdSymbol, statusSymbol, stroke, text } from './draw.js';
import { STATUS_WORD } from './format.js';
import type { Box } from './paper.js';
import { textWidth, wrap } from './text.js';
import type { Item } from './types.js';

const T = 2.2;
const LH = 2.75;
const COL_MIN = 52;

type Glyph = (x: number, y: number) => Item[];

const STATUS_TEXT: Record<Status, string> = {
  pass: 'the loop is within its limit: the device disconnects in time',
  fail: 'the loop exceeds its limit, or the device cannot clear in the required time',
  rcd: 'fails on the loop alone; disconnection relies on the RCD',
  unchecked: 'not checked: no protective device, or no supply reaches it',
};

function entries(): Array<{ glyph: Glyph; label: string; bold?: string }> {
  const status = (s: Status): { glyph: Glyph; label: string; bold: string } => ({
    glyph: (x, y) => statusSymbol(s, x + 3, y, 2.4),
    bold: STATUS_WORD[s],
    label: STATUS_TEXT[s],
  });
  return [
    status('pass'),
    status('fail'),
    status('rcd'),
    status('unchecked'),
    { glyph: (x, y) => nodeSymbol('supply', x + 3, y), label: 'supply (point of supply); Ze or "Ze unknown" beside it' },
    { glyph: (x, y) => nodeSymbol('board', x + 3.5, y).map((i) => (i.kind === 'rect' ? { ...i, x: x, w: 7, y: y - 2, h: 4 } : i)), label: 'switchboard or distribution board' },
    { glyph: (x, y) => nodeSymbol('point', x + 3, y), label: 'point: the far end of a circuit (or an outlet along it)' },
    { glyph: (x, y) => [line(x + 3, y - 2.5, x + 3, y + 2.5, stroke(0.35)), deviceSymbol(x + 3, y)], label: 'protective device at the origin of the link' },
    { glyph: (x, y) => [line(x + 3, y - 2.5, x + 3, y + 2.5, stroke(0.35)), rcdSymbol(x + 3, y)], label: 'RCD (residual-current device) on the link' },
    { glyph: (x, y) => [line(x, y, x + 6, y, stroke(0.35))], label: 'cable (a link)' },
    { glyph: (x, y) => [line(x, y, x + 6, y, stroke(0.9))], label: 'worst fault path: supply to the highest share of its limit' },
    { glyph: (x, y) => [line(x, y, x + 6, y, stroke(0.35, '#000000', [1.2, 0.8]))], label: 'link not checked' },
    { glyph: (x, y) => [line(x, y, x + 4, y, stroke(0.35)), arrowHead(x, y, x + 6, y)], label: 'continues on the sheet named beside the arrow' },
  ];
}

const KEY =
  'Label beside each link, line by line: link id and name; device (mark or label) and RCD; cable active/earth mm² ' +
  'and material, route length; loop impedance against its limit in Ω: Zs (the whole loop, source known) or own ' +
  '(from the protecting device, source unknown, 80 % share of the budget); status and the share of the limit used. ' +
  'Where a load is known, a line above the loop gives the design current Ib and the total voltage drop from the supply ' +
  '(ΔU, % of U0) against its limit; a last line gives the verdict of every check when it says more than the loop ' +
  'status, naming the checks that fail. A board shows its maximum prospective fault current (Ik max); the supply its ' +
  'source and headroom (the largest source impedance for which every circuit passes, and the circuit that sets it).';

/** Legend items filling `box.w`, with its top at `box.y`; returns the items and the height used. */
export function legend(box: Box, notes: string[]): { items: Item[]; height: number } {
  const cols = Math.max(1, Math.floor(box.w / COL_MIN));
  const colW = box.w / cols;
  const items: Item[] = [];
  let y = box.y + 3.2;
  items.push(text(box.x + 1.5, y, 'Legend', 2.6, 'bold'));
  y += 1.8;
  const list = entries();
  for (let r = 0; r < Math.ceil(list.length / cols); r++) {
    let rowLines = 1;
    for (let c = 0; c < cols; c++) {
      const e = list[r * cols + c];
      if (e === undefined) break;
      const x = box.x + 1.5 + c * colW;
      const words = `${e.bold !== undefined ? `${e.bold}: ` : ''}${e.label}`;
      const lines = wrap(words, 'regular', T, colW - 10, 3);
      rowLines = Math.max(rowLines, lines.length);
      const cy = y + LH * 0.5 + 0.9;
      items.push(...e.glyph(x, cy));
      lines.forEach((l, i) => {
        if (i === 0 && e.bold !== undefined && l.startsWith(`${e.bold}:`)) {
          items.push(text(x + 8, y + LH + i * LH, `${e.bold}:`, T, 'bold'));
          items.push(text(x + 8 + textWidth(`${e.bold}: `, 'bold', T), y + LH + i * LH, l.slice(e.bold.length + 2), T));
        } else items.push(text(x + 8, y + LH + i * LH, l, T));
      });
    }
    y += rowLines * LH + 1.6;
  }
  const keyLines = wrap([KEY, ...notes].join(' '), 'regular', T, box.w - 3);
  keyLines.forEach((l, i) => items.push(text(box.x + 1.5, y + LH * (i + 1), l, T, 'regular', 'start', GREY)));
  y += keyLines.length * LH + 1.5;
  const height = y - box.y;
  items.unshift({ kind: 'rect', x: box.x, y: box.y, w: box.w, h: height, stroke: stroke(0.25) });
  return { items, height };
}

/**
 * The one-line key on a diagram sheet without the legend: where the legend is, and how a link's
 * label reads. The shortest wording that fits one line is used.
 */
export function keyLine(box: Box, where: string): { items: Item[]; height: number } {
  const variants = [
    `Key: the legend on ${where} explains every symbol and line style. Label beside each link, line by line: id and name · device, RCD · cable, length · Ib, drop against its limit · loop against its limit (Ω) · status, share of the limit · verdict.`,
    `Key: the legend on ${where} explains every symbol. Link label: id, name · device, RCD · cable, length · Ib, drop · loop vs limit (Ω) · status · verdict.`,
    `Key: see the legend on ${where} for every symbol and the link label.`,
  ];
  const line1 = variants.find((v) => textWidth(v, 'regular', T) <= box.w - 3) ?? variants[variants.length - 1] ?? '';
  const lines = wrap(line1, 'regular', T, box.w - 3);
  const height = lines.length * LH + 1.6;
  const items: Item[] = [{ kind: 'rect', x: box.x, y: box.y, w: box.w, h: height, stroke: stroke(0.25) }];
  lines.forEach((l, i) => items.push(text(box.x + 1.5, box.y + LH * (i + 1) - 0.2, l, T, 'regular', 'start', GREY)));
  return { items, height };
}
