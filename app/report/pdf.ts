// jobToPdf: the printout as PDF bytes. analyse + layoutReport (the same sheets the SVG and the
// app's print use), each sheet drawn with pdfkit, fonts embedded. Deterministic: the dates
// and the document ID derive from the job, so the same job gives the same bytes.

import PDFDocument from 'pdfkit';
import { analyse, plainText, type Job } from '../../engine/index.js';
import { layoutReport, type Item, type ReportOptions, type Sheet, type Stroke, type TextItem } from '../../engine/report/index.js';
import { loadReportFonts, type ReportFonts } from './fonts.js';

const PT_PER_MM = 72 / 25.4;

export interface PdfOptions extends ReportOptions {
  /** Fonts to embed; read from the dejavu-fonts-ttf package when absent. */
  fonts?: ReportFonts;
}

/** The job's date (YYYY-MM-DD) at 00:00 UTC, else 2000-01-01: never the clock. */
export function documentDate(job: Job): Date {
  const m = /^(\d{4})-(\d{2})-(\d{2})$/.exec(job.job.date.trim());
  if (m !== null) {
    const d = new Date(Date.UTC(Number(m[1]), Number(m[2]) - 1, Number(m[3])));
    if (!Number.isNaN(d.getTime()) && d.getUTCFullYear() >= 1900) return d;
  }
  return new Date(Date.UTC(2000, 0, 1));
}

/** The graphics state last written on the current page, so an operator that would set what is
 *  already set is not written again (a large printout has millions of items). */
interface Pen {
  width: number | null;
  stroke: string | null;
  /** The dash operator last written. */
  dash: string | null;
  fill: string | null;
}

function freshPen(): Pen {
  return { width: null, stroke: null, dash: null, fill: null };
}

/**
 * A coordinate or length in a content operator: to 0.001 mm (the sheets are in millimetres),
 * finer than any printer or screen shows. pdfkit writes six decimals; a printout of thousands
 * of sheets is a third smaller this way, and quicker to write and to compress.
 */
function num(v: number): string {
  return String(Math.round(v * 1000) / 1000);
}

/** `#rrggbb` as the three components of an RGB colour operator (three decimals give back each
 *  of the 256 steps exactly), remembered per colour; null for any other form. */
const COMPONENTS = new Map<string, string | null>();
function rgbOf(color: string): string | null {
  let known = COMPONENTS.get(color);
  if (known !== undefined) return known;
  const m = /^#([0-9a-fA-F]{2})([0-9a-fA-F]{2})([0-9a-fA-F]{2})$/.exec(color);
  known = m === null ? null : [m[1]!, m[2]!, m[3]!].map((h) => String(Math.round((parseInt(h, 16) / 255) * 1000) / 1000)).join(' ');
  COMPONENTS.set(color, known);
  return known;
}

/** The stroke's width, colour and dash, where they differ from the pen: before a path is begun
 *  (no state operator may stand inside a path). */
function applyStroke(doc: PDFKit.PDFDocument, pen: Pen, s: Stroke): void {
  if (pen.width !== s.width) {
    doc.addContent(`${num(s.width)} w`);
    pen.width = s.width;
  }
  if (pen.stroke !== s.color) {
    const rgb = rgbOf(s.color);
    if (rgb !== null) doc.addContent(`${rgb} RG`);
    else doc.strokeColor(s.color);
    pen.stroke = s.color;
  }
  const dash = s.dash === undefined ? '[] 0 d' : `[${num(s.dash[0])} ${num(s.dash[1])}] 0 d`;
  if (pen.dash !== dash) {
    doc.addContent(dash);
    pen.dash = dash;
  }
}

function setFill(doc: PDFKit.PDFDocument, pen: Pen, color: string): void {
  if (pen.fill === color) return;
  const rgb = rgbOf(color);
  if (rgb !== null) doc.addContent(`${rgb} rg`);
  else doc.fillColor(color);
  pen.fill = color;
}

/** Sets the pen for a path that is then stroked, filled or both: the painting operator. */
function paintOp(doc: PDFKit.PDFDocument, pen: Pen, stroke: Stroke | undefined, fill: string | undefined): string {
  if (stroke !== undefined) applyStroke(doc, pen, stroke);
  if (fill !== undefined) setFill(doc, pen, fill);
  return fill !== undefined && stroke !== undefined ? 'B' : fill !== undefined ? 'f' : stroke !== undefined ? 'S' : 'n';
}

/** Most texts a printout writes recur (heads, keys, title blocks, the same figures): an
 *  embedded font's encoding of a text (glyph ids, positions) is remembered, up to this many texts
 *  a font, so it is shaped once. Its glyphs are in the subset from the first time. */
const ENCODINGS_KEPT = 50_000;

/** What of pdfkit's embedded font the text writer uses. */
interface GlyphPosition {
  xAdvance: number;
  yAdvance: number;
  xOffset: number;
  yOffset: number;
  advanceWidth: number;
}
interface EmbeddedFont {
  id: string;
  ref(): unknown;
  encode(text: string, features?: unknown): [string[], GlyphPosition[]];
}

/** The two faces of a document, opened once, each with its encodings remembered. */
class Faces {
  private readonly fonts = new Map<string, EmbeddedFont>();
  constructor(private readonly doc: PDFKit.PDFDocument) {}

  get(name: 'LW-Regular' | 'LW-Bold'): EmbeddedFont {
    let font = this.fonts.get(name);
    if (font === undefined) {
      this.doc.font(name);
      font = (this.doc as unknown as { _font: EmbeddedFont })._font;
      const encode = font.encode.bind(font);
      const kept = new Map<string, [string[], GlyphPosition[]]>();
      font.encode = (text: string) => {
        const known = kept.get(text);
        if (known !== undefined) return known;
        const made = encode(text);
        if (kept.size >= ENCODINGS_KEPT) kept.clear();
        kept.set(text, made);
        return made;
      };
      this.fonts.set(name, font);
    }
    return font;
  }
}

/**
 * One line of text with its baseline at (x, y), as one text object. Glyph runs and kerning as
 * pdfkit's own one-line writer places them (its font's shaping, each glyph's advance, a TJ
 * adjustment where the shaped advance differs), written directly: the text matrix flips the
 * y-down sheet back to upright glyphs, so no save, transform and restore is needed per text.
 */
function writeText(doc: PDFKit.PDFDocument, faces: Faces, item: TextItem, shown: string): void {
  const font = faces.get(item.font === 'bold' ? 'LW-Bold' : 'LW-Regular');
  const page = (doc as unknown as { page: { fonts: Record<string, unknown> } }).page;
  if (page.fonts[font.id] === undefined) page.fonts[font.id] = font.ref();
  const [encoded, positions] = font.encode(shown);
  const scale = item.size / 1000;
  let width = 0;
  for (const p of positions) width += p.xAdvance;
  width *= scale;
  let x = item.anchor === 'start' ? item.x : item.anchor === 'middle' ? item.x - width / 2 : item.x - width;
  const y = item.y;
  const out: string[] = ['BT', `/${font.id} ${num(item.size)} Tf`, `1 0 0 -1 ${num(x)} ${num(y)} Tm`];
  const commands: string[] = [];
  let last = 0;
  const segment = (cur: number): void => {
    if (last < cur) {
      const p = positions[cur - 1]!;
      commands.push(`<${encoded.slice(last, cur).join('')}> ${num(p.advanceWidth - p.xAdvance)}`);
    }
    last = cur;
  };
  const flush = (cur: number): void => {
    segment(cur);
    if (commands.length > 0) {
      out.push(`[${commands.join(' ')}] TJ`);
      commands.length = 0;
    }
  };
  let offset = false;
  let i = 0;
  for (; i < positions.length; i++) {
    const p = positions[i]!;
    if (p.xOffset !== 0 || p.yOffset !== 0) {
      // A glyph placed off its pen position (a mark): a text matrix of its own.
      flush(i);
      out.push(`1 0 0 -1 ${num(x + p.xOffset * scale)} ${num(y - p.yOffset * scale)} Tm`);
      flush(i + 1);
      offset = true;
    } else {
      if (offset) {
        out.push(`1 0 0 -1 ${num(x)} ${num(y)} Tm`);
        offset = false;
      }
      if (p.xAdvance !== p.advanceWidth) segment(i + 1);
    }
    x += p.xAdvance * scale;
  }
  flush(i);
  out.push('ET');
  doc.addContent(out.join('\n'));
}

/** Four Bézier quarters approximating a circle (the usual constant 4(√2 − 1)/3 for the control
 *  points; common practice, the same curves pdfkit draws). */
const KAPPA = (4 * (Math.SQRT2 - 1)) / 3;
function circlePath(cx: number, cy: number, r: number): string {
  const o = r * KAPPA;
  const [x0, x1, y0, y1] = [cx - r, cx + r, cy - r, cy + r];
  return [
    `${num(x0)} ${num(cy)} m`,
    `${num(x0)} ${num(cy - o)} ${num(cx - o)} ${num(y0)} ${num(cx)} ${num(y0)} c`,
    `${num(cx + o)} ${num(y0)} ${num(x1)} ${num(cy - o)} ${num(x1)} ${num(cy)} c`,
    `${num(x1)} ${num(cy + o)} ${num(cx + o)} ${num(y1)} ${num(cx)} ${num(y1)} c`,
    `${num(cx - o)} ${num(y1)} ${num(x0)} ${num(cy + o)} ${num(x0)} ${num(cy)} c h`,
  ].join(' ');
}

function drawItem(doc: PDFKit.PDFDocument, faces: Faces, pen: Pen, item: Item): void {
  switch (item.kind) {
    case 'line':
      applyStroke(doc, pen, item.stroke);
      doc.addContent(`${num(item.x1)} ${num(item.y1)} m ${num(item.x2)} ${num(item.y2)} l S`);
      return;
    case 'rect': {
      const op = paintOp(doc, pen, item.stroke, item.fill);
      doc.addContent(`${num(item.x)} ${num(item.y)} ${num(item.w)} ${num(item.h)} re ${op}`);
      return;
    }
    case 'circle': {
      const op = paintOp(doc, pen, item.stroke, item.fill);
      doc.addContent(`${circlePath(item.cx, item.cy, item.r)} ${op}`);
      return;
    }
    case 'polyline': {
      const [first, ...rest] = item.points;
      if (first === undefined) return;
      const op = paintOp(doc, pen, item.stroke, item.fill);
      const path = [`${num(first[0])} ${num(first[1])} m`];
      for (const [x, y] of rest) path.push(`${num(x)} ${num(y)} l`);
      if (item.closed === true) path.push('h');
      path.push(op);
      doc.addContent(path.join(' '));
      return;
    }
    case 'text': {
      const shown = plainText(item.text); // one line, no control characters in the PDF (sanitise.ts)
      if (shown === '') return;
      setFill(doc, pen, item.color ?? '#000000');
      writeText(doc, faces, item, shown);
      return;
    }
  }
}

/**
 * pdfkit turns every operator it writes into a page (a line width, a move, a glyph run) into a
 * buffer of its own; a printout of thousands of sheets writes millions. Here the operators are
 * kept as text and handed over a page at a time, joined by the same line ends, so the content
 * and the file are byte for byte what they were. Anything that is not text, a new page and the
 * end of the document hand over what is kept first.
 */
function batchContent(doc: PDFKit.PDFDocument): void {
  const write = doc.addContent.bind(doc);
  const addPage = doc.addPage.bind(doc);
  const end = doc.end.bind(doc);
  let kept: string[] = [];
  const flush = (): void => {
    if (kept.length === 0) return;
    // As bytes: pdfkit turns text into bytes a character at a time (each code's low byte, and a
    // line end after); Buffer's latin1 encoding gives the same bytes natively.
    const bytes = Buffer.from(`${kept.join('\n')}\n`, 'latin1');
    kept = [];
    write(bytes as unknown as string);
  };
  doc.addContent = (data: unknown) => {
    if (typeof data === 'string') kept.push(data);
    else {
      flush();
      write(data as string);
    }
    return doc;
  };
  doc.addPage = (options?: PDFKit.PDFDocumentOptions) => {
    flush();
    return addPage(options);
  };
  doc.end = () => {
    flush();
    end();
  };
}

/** Render ready-made sheets to PDF bytes. */
export function sheetsToPdf(sheets: Sheet[], meta: { title: string; subject: string; date: Date }, fonts: ReportFonts = loadReportFonts()): Promise<Uint8Array> {
  const doc = new PDFDocument({
    autoFirstPage: false,
    compress: true,
    // No default font: a default opened from the same bytes as LW-Regular made pdfkit re-parse
    // the font on every switch to LW-Regular (its cache is keyed by the first name it saw).
    font: null as unknown as string,
    info: {
      Title: plainText(meta.title),
      Subject: plainText(meta.subject),
      Creator: 'Loopwright',
      Producer: 'Loopwright',
      CreationDate: meta.date,
      ModDate: meta.date,
    },
  });
  batchContent(doc);
  doc.registerFont('LW-Regular', Buffer.from(fonts.regular));
  doc.registerFont('LW-Bold', Buffer.from(fonts.bold));
  const faces = new Faces(doc);
  const chunks: Buffer[] = [];
  const done = new Promise<Uint8Array>((resolve, reject) => {
    doc.on('data', (c: Buffer) => chunks.push(c));
    doc.on('end', () => resolve(new Uint8Array(Buffer.concat(chunks))));
    doc.on('error', reject);
  });
  for (const sheet of sheets) {
    doc.addPage({ size: [sheet.widthMm * PT_PER_MM, sheet.heightMm * PT_PER_MM], margin: 0 });
    doc.save();
    doc.scale(PT_PER_MM);
    // Every line on the sheets has round caps and joins: set once a page.
    doc.lineCap('round').lineJoin('round');
    const pen = freshPen();
    for (const item of sheet.items) drawItem(doc, faces, pen, item);
    doc.restore();
  }
  doc.end();
  return done;
}

/** The whole printout of a job as PDF bytes. */
export function jobToPdf(job: Job, options: PdfOptions = {}): Promise<Uint8Array> {
  const results = analyse(job);
  const sheets = layoutReport(job, results, options);
  const title = job.job.title === '' ? 'Loopwright job' : job.job.title;
  const subject = `Fault-loop check${job.job.reference !== '' ? `, ${job.job.reference}` : ''}${job.job.revision !== '' ? ` rev ${job.job.revision}` : ''}`;
  return sheetsToPdf(sheets, { title, subject, date: documentDate(job) }, options.fonts);
}
