// Paper sizes and the areas of a sheet: border, drawing area, title block.

import type { ReportOptions } from './types.js';

export interface Paper {
  widthMm: number;
  heightMm: number;
  name: string;
}

const ISO: Record<'A3' | 'A4', [number, number]> = { A3: [420, 297], A4: [297, 210] }; // ISO 216

export function paperFor(options: ReportOptions = {}): Paper {
  const size = options.paper ?? 'A3';
  const [long, short] = ISO[size];
  const portrait = options.orientation === 'portrait';
  return {
    widthMm: portrait ? short : long,
    heightMm: portrait ? long : short,
    name: `${size} ${portrait ? 'portrait' : 'landscape'}`,
  };
}

export interface Box {
  x: number;
  y: number;
  w: number;
  h: number;
}

/** Border margin: 10 mm all round (20 mm at the binding edge would waste an A4 sheet). */
export const MARGIN = 10;
/** Height of the title block along the foot of every sheet. */
export const TITLE_BLOCK_H = 30;

/** The frame inside the border. */
export function frameBox(paper: Paper): Box {
  return { x: MARGIN, y: MARGIN, w: paper.widthMm - 2 * MARGIN, h: paper.heightMm - 2 * MARGIN };
}

/** The area above the title block, inset by 4 mm, that a sheet's content may fill. */
export function contentBox(paper: Paper): Box {
  const f = frameBox(paper);
  return { x: f.x + 4, y: f.y + 4, w: f.w - 8, h: f.h - TITLE_BLOCK_H - 8 };
}
