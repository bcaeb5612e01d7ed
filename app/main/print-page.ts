// The page File > Print sends to the printer: every sheet of the printout (engine/report's
// layoutReport, the same sheets as the PDF and the command line's SVGs) inline, one per page.
// Pure, so its shape is unit-tested. No script: the print window runs with JavaScript off.

import { plainText } from '../../engine/index.js';

export const PRINT_CSS_FILE = 'print.css';
export const FONT_FILES = { regular: 'DejaVuSans.ttf', bold: 'DejaVuSans-Bold.ttf' } as const;

export interface PrintSheet {
  svg: string;
  widthMm: number;
  heightMm: number;
  title: string;
}

function escapeHtml(s: string): string {
  return plainText(s).replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;');
}

/** The elements a printout sheet may hold: shapes and text, nothing that runs, loads or embeds. */
const SHEET_ELEMENTS = new Set(['svg', 'title', 'desc', 'g', 'rect', 'line', 'circle', 'ellipse', 'polyline', 'polygon', 'path', 'text', 'tspan']);

/** Why `svg` may not be printed, or null. Looks at the markup only: a sheet's texts are escaped
 *  (no `<` in them), so words such as a link named `Feed one=main` are never taken for markup. */
export function unsafeSheetMarkup(svg: string): string | null {
  if (/<[!?]/.test(svg)) return 'a comment, CDATA section or processing instruction';
  for (const m of svg.matchAll(/<[^>]*>?/g)) {
    const tag = m[0];
    if (!tag.endsWith('>')) return 'an unclosed tag';
    const name = /^<\/?([A-Za-z][\w:.-]*)/.exec(tag)?.[1];
    if (name === undefined) return `a malformed tag ${JSON.stringify(tag.slice(0, 40))}`;
    if (!SHEET_ELEMENTS.has(name)) return `a <${name}> element`;
    // The attributes, their quoted values blanked so that nothing inside a value counts.
    const attributes = tag.replace(/"[^"]*"|'[^']*'/g, '""');
    const handler = /\s(on[a-z]+)\s*=/i.exec(attributes);
    if (handler) return `an inline event handler (${handler[1]})`;
    if (/\s(?:xlink:)?href\s*=/i.test(attributes)) return 'a link (href)';
    if (/\sstyle\s*=/i.test(attributes)) return 'a style attribute';
  }
  return null;
}

/** An SVG document made fit to sit inside HTML: no XML declaration, sized to its sheet. */
export function inlineSvg(svg: string): string {
  const body = svg.replace(/^\s*<\?xml[^>]*\?>\s*/, '').trim();
  if (!body.startsWith('<svg')) throw new Error('a printout sheet is not an SVG document');
  const unsafe = unsafeSheetMarkup(body);
  if (unsafe !== null) throw new Error(`a printout sheet contains ${unsafe}, which is never printed (no script or HTML in a printout)`);
  return body;
}

/** The style sheet: page size from the sheets (they are all one paper), no margins, fonts embedded. */
export function printCss(widthMm: number, heightMm: number): string {
  return [
    `@font-face { font-family: 'DejaVu Sans'; src: url('${FONT_FILES.regular}'); font-weight: normal; }`,
    `@font-face { font-family: 'DejaVu Sans'; src: url('${FONT_FILES.bold}'); font-weight: bold; }`,
    `@page { size: ${widthMm}mm ${heightMm}mm; margin: 0; }`,
    'html, body { margin: 0; padding: 0; background: #ffffff; }',
    `.sheet { width: ${widthMm}mm; height: ${heightMm}mm; overflow: hidden; break-after: page; page-break-after: always; }`,
    '.sheet:last-child { break-after: auto; page-break-after: auto; }',
    '.sheet > svg { display: block; width: 100%; height: 100%; }',
    '',
  ].join('\n');
}

export function printHtml(sheets: readonly PrintSheet[], documentTitle: string, csp: string): string {
  if (sheets.length === 0) throw new Error('the printout has no sheets');
  const pages = sheets.map((s, i) => `<div class="sheet" aria-label="Sheet ${i + 1} of ${sheets.length}: ${escapeHtml(s.title)}">\n${inlineSvg(s.svg)}\n</div>`);
  return [
    '<!doctype html>',
    '<html lang="en">',
    '<head>',
    '<meta charset="utf-8">',
    `<meta http-equiv="Content-Security-Policy" content="${escapeHtml(csp)}">`,
    `<title>${escapeHtml(documentTitle)}</title>`,
    `<link rel="stylesheet" href="${PRINT_CSS_FILE}">`,
    '</head>',
    '<body>',
    ...pages,
    '</body>',
    '</html>',
    '',
  ].join('\n');
}

/** Electron's print page size, in microns, for a sheet in millimetres (portrait-wise, with the
 *  orientation given separately as Electron expects). */
export function printPageSize(widthMm: number, heightMm: number): { pageSize: { width: number; height: number }; landscape: boolean } {
  const landscape = widthMm > heightMm;
  const short = Math.round(Math.min(widthMm, heightMm) * 1000);
  const long = Math.round(Math.max(widthMm, heightMm) * 1000);
  return { pageSize: { width: short, height: long }, landscape };
}
