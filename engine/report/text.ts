// Measuring, wrapping and truncating text without a DOM, from DejaVu Sans advance widths.

import { DEJAVU_SANS, DEJAVU_SANS_BOLD, type FontMetricsTable } from './font-metrics.js';
import type { FontWeight } from './types.js';

function toMap(table: FontMetricsTable): Map<number, number> {
  const map = new Map<number, number>();
  for (const [start, widths] of table.runs) widths.forEach((w, i) => map.set(start + i, w));
  return map;
}

const WIDTHS: Record<FontWeight, Map<number, number>> = {
  regular: toMap(DEJAVU_SANS),
  bold: toMap(DEJAVU_SANS_BOLD),
};
/** Width assumed for a character outside the table (thousandths of an em): on the wide side. */
const FALLBACK = 800;
/** Headroom for kerning and renderer differences. */
const SAFETY = 1.02;

/** Width of `text` set at `size` mm, in mm. */
export function textWidth(text: string, font: FontWeight, size: number): number {
  const table = WIDTHS[font];
  let units = 0;
  for (const ch of text) units += table.get(ch.codePointAt(0) ?? 0) ?? FALLBACK;
  return (units / 1000) * size * SAFETY;
}

/** `text`, cut with an ellipsis so that it fits `width` mm. */
export function truncate(text: string, font: FontWeight, size: number, width: number): string {
  if (textWidth(text, font, size) <= width) return text;
  const chars = [...text];
  let lo = 0;
  let hi = chars.length;
  while (lo < hi) {
    const mid = Math.ceil((lo + hi) / 2);
    if (textWidth(`${chars.slice(0, mid).join('').trimEnd()}…`, font, size) <= width) lo = mid;
    else hi = mid - 1;
  }
  return lo === 0 ? '' : `${chars.slice(0, lo).join('').trimEnd()}…`;
}

/** Break a word that alone is wider than `width` into pieces that fit. */
function breakWord(word: string, font: FontWeight, size: number, width: number): string[] {
  const pieces: string[] = [];
  let current = '';
  for (const ch of word) {
    if (current !== '' && textWidth(current + ch, font, size) > width) {
      pieces.push(current);
      current = ch;
    } else current += ch;
  }
  if (current !== '') pieces.push(current);
  return pieces;
}

/**
 * Wrap `text` into lines no wider than `width` mm (breaking at spaces, and inside a word only
 * when it cannot fit a line alone). With `maxLines`, the last line is truncated with an ellipsis.
 */
export function wrap(text: string, font: FontWeight, size: number, width: number, maxLines = Infinity): string[] {
  const lines: string[] = [];
  for (const paragraph of text.split('\n')) {
    let line = '';
    for (const raw of paragraph.split(/\s+/).filter((w) => w !== '')) {
      const words = textWidth(raw, font, size) > width ? breakWord(raw, font, size, width) : [raw];
      for (const word of words) {
        const candidate = line === '' ? word : `${line} ${word}`;
        if (line !== '' && textWidth(candidate, font, size) > width) {
          lines.push(line);
          line = word;
        } else line = candidate;
      }
    }
    lines.push(line);
  }
  if (lines.length > maxLines) {
    const kept = lines.slice(0, maxLines);
    const last = `${lines.slice(maxLines - 1).join(' ')}`;
    const cut = truncate(last, font, size, width);
    kept[maxLines - 1] = cut.endsWith('…') ? cut : truncate(`${cut}…`, font, size, width);
    if (!kept[maxLines - 1]?.endsWith('…')) kept[maxLines - 1] = truncate(`${cut} …`, font, size, width);
    return kept;
  }
  return lines;
}
