// sheetToSvg: one sheet as a standalone SVG document, sized in millimetres. Pure and
// deterministic: numbers are written to 3 decimals, items in display-list order.

import type { Item, Sheet, Stroke } from './types.js';
import { FONT_FAMILY } from './types.js';
import { xmlText } from './sanitise.js';

function n(v: number): string {
  const r = Math.round(v * 1000) / 1000;
  return Object.is(r, -0) ? '0' : String(r);
}

/** Escaped, with what XML 1.0 forbids and every control character dropped (sanitise.ts). */
function esc(s: string): string {
  return xmlText(s);
}

function paint(stroke: Stroke | undefined, fill: string | undefined): string {
  let out = ` fill="${fill ?? 'none'}"`;
  if (stroke !== undefined) {
    out += ` stroke="${stroke.color}" stroke-width="${n(stroke.width)}"`;
    if (stroke.dash !== undefined) out += ` stroke-dasharray="${n(stroke.dash[0])} ${n(stroke.dash[1])}"`;
  }
  return out;
}

function item(i: Item): string {
  switch (i.kind) {
    case 'line':
      return `<line x1="${n(i.x1)}" y1="${n(i.y1)}" x2="${n(i.x2)}" y2="${n(i.y2)}"${paint(i.stroke, undefined)} stroke-linecap="round"/>`;
    case 'rect':
      return `<rect x="${n(i.x)}" y="${n(i.y)}" width="${n(i.w)}" height="${n(i.h)}"${paint(i.stroke, i.fill)}/>`;
    case 'circle':
      return `<circle cx="${n(i.cx)}" cy="${n(i.cy)}" r="${n(i.r)}"${paint(i.stroke, i.fill)}/>`;
    case 'polyline': {
      const pts = i.points.map(([x, y]) => `${n(x)},${n(y)}`).join(' ');
      return `<${i.closed === true ? 'polygon' : 'polyline'} points="${pts}"${paint(i.stroke, i.fill)} stroke-linejoin="round"/>`;
    }
    case 'text': {
      const anchor = i.anchor === 'start' ? '' : ` text-anchor="${i.anchor}"`;
      const weight = i.font === 'bold' ? ' font-weight="bold"' : '';
      const color = i.color !== undefined ? ` fill="${i.color}"` : '';
      return `<text x="${n(i.x)}" y="${n(i.y)}" font-size="${n(i.size)}"${weight}${anchor}${color} xml:space="preserve">${esc(i.text)}</text>`;
    }
  }
}

export function sheetToSvg(sheet: Sheet): string {
  const w = n(sheet.widthMm);
  const h = n(sheet.heightMm);
  return [
    '<?xml version="1.0" encoding="UTF-8"?>',
    `<svg xmlns="http://www.w3.org/2000/svg" width="${w}mm" height="${h}mm" viewBox="0 0 ${w} ${h}" font-family="'${FONT_FAMILY}', sans-serif">`,
    `<title>${esc(sheet.title)}</title>`,
    `<rect x="0" y="0" width="${w}" height="${h}" fill="#ffffff"/>`,
    ...sheet.items.map(item),
    '</svg>',
    '',
  ].join('\n');
}
