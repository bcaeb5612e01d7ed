// The border and title block every sheet carries: title, site, client, designer, reference,
// revision, date, basis, "sheet n of m", and the caution in short.

import type { JobDetails } from '../model/types.js';
import { GREY, INK, stroke, text } from './draw.js';
import { frameBox, TITLE_BLOCK_H, type Box, type Paper } from './paper.js';
import { textWidth, truncate, wrap } from './text.js';
import type { Item } from './types.js';

/** The caution in short, on every sheet; the assumptions sheet prints it in full. */
export const CAUTION_SHORT =
  'CAUTION: design aid only. Results do not replace inspection and testing of the installation; ' +
  'local wiring rules and licensed practice govern. See the assumptions sheet for the full caution.';

export interface TitleInfo {
  details: JobDetails;
  /** e.g. `au-nz (AS/NZS 3000:2018)`. */
  basis: string;
  /** What this sheet shows. */
  sheetTitle: string;
  sheet: number;
  sheets: number;
  /** The short caution, when the sheet words it otherwise (a test sheet prints the full caution itself). */
  caution?: string;
}

/** The short caution of a sheet that prints the full caution itself. */
export const CAUTION_SHORT_HERE =
  'CAUTION: design aid only. Results do not replace inspection and testing of the installation; ' +
  'local wiring rules and licensed practice govern. The full caution is on this sheet.';

const CAPTION = 2;
const VALUE = 2.6;

function cell(box: Box, caption: string, value: string, opts: { size?: number; bold?: boolean; lines?: number } = {}): Item[] {
  const size = opts.size ?? VALUE;
  const items: Item[] = [{ kind: 'rect', x: box.x, y: box.y, w: box.w, h: box.h, stroke: stroke(0.25) }];
  items.push(text(box.x + 1.5, box.y + 2.6, caption, CAPTION, 'regular', 'start', GREY));
  const width = box.w - 3;
  const font = opts.bold === true ? 'bold' : 'regular';
  const lines = wrap(value === '' ? '—' : value, font, size, width, opts.lines ?? 1);
  lines.forEach((l, i) => items.push(text(box.x + 1.5, box.y + 3.2 + size * (1 + i * 1.2), l, size, font)));
  return items;
}

/** Border, frame and title block for one sheet. */
export function titleBlock(paper: Paper, info: TitleInfo): Item[] {
  const f = frameBox(paper);
  const items: Item[] = [
    { kind: 'rect', x: f.x, y: f.y, w: f.w, h: f.h, stroke: stroke(0.5, INK) },
  ];
  const top = f.y + f.h - TITLE_BLOCK_H;
  const d = info.details;
  const r1 = 13;
  const r2 = 9;
  const r3 = TITLE_BLOCK_H - r1 - r2;
  const half = f.w * 0.5;
  const quarter = f.w * 0.25;

  // Row 1: title (and what this sheet shows), site, client.
  const titleBox = { x: f.x, y: top, w: half, h: r1 };
  items.push({ kind: 'rect', x: titleBox.x, y: titleBox.y, w: titleBox.w, h: titleBox.h, stroke: stroke(0.25) });
  items.push(text(f.x + 1.5, top + 2.6, 'Title', CAPTION, 'regular', 'start', GREY));
  // The title whole: smaller where it is long, on two lines where even that does not fit.
  const title = d.title === '' ? 'Untitled job' : d.title;
  const size = [4, 3.4, 2.8].find((z) => textWidth(title, 'bold', z) <= half - 3);
  if (size !== undefined) items.push(text(f.x + 1.5, top + 7, title, size, 'bold'));
  else wrap(title, 'bold', 2.6, half - 3, 2).forEach((l, i) => items.push(text(f.x + 1.5, top + 5.4 + i * 2.9, l, 2.6, 'bold')));
  items.push(text(f.x + 1.5, top + 11.4, truncate(info.sheetTitle, 'regular', 2.4, half - 3), 2.4));
  items.push(...cell({ x: f.x + half, y: top, w: quarter, h: r1 }, 'Site', d.site, { lines: 2 }));
  items.push(...cell({ x: f.x + half + quarter, y: top, w: f.w - half - quarter, h: r1 }, 'Client', d.client, { lines: 2 }));

  // Row 2: designer, reference, revision, date, basis, sheet n of m.
  const fields: Array<[string, string, number, boolean]> = [
    ['Designer', d.designer, 0.22, false],
    ['Reference', d.reference, 0.16, true],
    ['Revision', d.revision, 0.1, true],
    ['Date', d.date, 0.14, false],
    ['Basis', info.basis, 0.24, false],
    ['Sheet', `${info.sheet} of ${info.sheets}`, 0.14, true],
  ];
  let x = f.x;
  fields.forEach(([caption, value, share, bold], i) => {
    const w = i === fields.length - 1 ? f.x + f.w - x : f.w * share;
    items.push(...cell({ x, y: top + r1, w, h: r2 }, caption, value, { bold }));
    x += w;
  });

  // Row 3: the caution in short.
  const row3 = top + r1 + r2;
  items.push({ kind: 'rect', x: f.x, y: row3, w: f.w, h: r3, stroke: stroke(0.25) });
  const caution = wrap(info.caution ?? CAUTION_SHORT, 'bold', 2, f.w - 3, 2);
  caution.forEach((l, i) => items.push(text(f.x + 1.5, row3 + 3 + i * 2.5, l, 2, 'bold')));
  return items;
}
