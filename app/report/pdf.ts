// jobToPdf: the printout as PDF bytes. analyse + layoutReport (the same sheets the SVG and the
// app's print use), each sheet drawn with pdfkit, fonts embedded. Deterministic: the dates
// and the document ID derive from the job, so the same job gives the same bytes.

import PDFDocument from 'pdfkit';
import { analyse, plainText, type Job } from '../../engine/index.js';
import { layoutReport, type Item, type ReportOptions, type Sheet, type Stroke } from '../../engine/report/index.js';
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
  dash: string | null;
  fill: string | null;
}

function freshPen(): Pen {
  return { width: null, stroke: null, dash: null, fill: null };
}

function applyStroke(doc: PDFKit.PDFDocument, pen: Pen, s: Stroke): void {
  if (pen.width !== s.width) {
    doc.lineWidth(s.width);
    pen.width = s.width;
  }
  if (pen.stroke !== s.color) {
    doc.strokeColor(s.color);
    pen.stroke = s.color;
  }
  const dash = s.dash === undefined ? '' : `${s.dash[0]} ${s.dash[1]}`;
  if (pen.dash !== dash) {
    if (s.dash !== undefined) doc.dash(s.dash[0], { space: s.dash[1] });
    else doc.undash();
    pen.dash = dash;
  }
}

function setFill(doc: PDFKit.PDFDocument, pen: Pen, color: string): void {
  if (pen.fill === color) return;
  doc.fillColor(color);
  pen.fill = color;
}

function paint(doc: PDFKit.PDFDocument, pen: Pen, stroke: Stroke | undefined, fill: string | undefined): void {
  if (stroke !== undefined) applyStroke(doc, pen, stroke);
  if (fill !== undefined) setFill(doc, pen, fill);
  if (fill !== undefined && stroke !== undefined) doc.fillAndStroke();
  else if (fill !== undefined) doc.fill();
  else if (stroke !== undefined) doc.stroke();
}

/** Most texts a printout writes recur (heads, keys, title blocks, the same figures): an
 *  embedded font's encoding of a text (glyph ids, positions) is remembered, up to this many texts
 *  a font, so it is shaped once. Its glyphs are in the subset from the first time. */
const ENCODINGS_KEPT = 50_000;
const remembering = new WeakSet<object>();

type Encoder = { encode(text: string, features?: unknown): [string[], unknown[]] };

function rememberEncodings(doc: PDFKit.PDFDocument): void {
  const font = (doc as unknown as { _font?: Encoder })._font;
  if (font === undefined || typeof font.encode !== 'function' || remembering.has(font)) return;
  remembering.add(font);
  const encode = font.encode.bind(font);
  const kept = new Map<string, [string[], unknown[]]>();
  font.encode = (text, features) => {
    if (features !== undefined) return encode(text, features);
    const known = kept.get(text);
    if (known !== undefined) return known;
    const made = encode(text);
    if (kept.size >= ENCODINGS_KEPT) kept.clear();
    kept.set(text, made);
    return made;
  };
}

function drawItem(doc: PDFKit.PDFDocument, pen: Pen, item: Item): void {
  switch (item.kind) {
    case 'line':
      applyStroke(doc, pen, item.stroke);
      doc.moveTo(item.x1, item.y1).lineTo(item.x2, item.y2).stroke();
      return;
    case 'rect':
      doc.rect(item.x, item.y, item.w, item.h);
      paint(doc, pen, item.stroke, item.fill);
      return;
    case 'circle':
      doc.circle(item.cx, item.cy, item.r);
      paint(doc, pen, item.stroke, item.fill);
      return;
    case 'polyline': {
      const [first, ...rest] = item.points;
      if (first === undefined) return;
      doc.moveTo(first[0], first[1]);
      for (const [x, y] of rest) doc.lineTo(x, y);
      if (item.closed === true) doc.closePath();
      paint(doc, pen, item.stroke, item.fill);
      return;
    }
    case 'text': {
      const shown = plainText(item.text); // no control characters in the PDF (sanitise.ts)
      if (shown === '') return;
      doc.font(item.font === 'bold' ? 'LW-Bold' : 'LW-Regular').fontSize(item.size);
      rememberEncodings(doc);
      setFill(doc, pen, item.color ?? '#000000');
      const width = item.anchor === 'start' ? 0 : doc.widthOfString(shown);
      const x = item.anchor === 'start' ? item.x : item.anchor === 'middle' ? item.x - width / 2 : item.x - width;
      // One line placed at a point: pdfkit's own one-line writer, given the width measured above,
      // writes exactly what text() writes without shaping the text twice more (text() measures
      // it again to wrap and to advance its cursor). text() where that writer is not there.
      const fragment = (doc as unknown as { _fragment?: (text: string, x: number, y: number, options: object) => void })._fragment;
      if (typeof fragment === 'function') fragment.call(doc, shown, x, item.y, { baseline: 'alphabetic', textWidth: width, wordCount: 1 });
      else doc.text(shown, x, item.y, { lineBreak: false, baseline: 'alphabetic' });
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
    for (const item of sheet.items) drawItem(doc, pen, item);
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
