// The PDF's page content as written: every path is begun after its pen is set and ended by a
// painting operator before any graphics state changes (ISO 32000-1 §8.2, figure 9: no general
// graphics state operator inside a path object), every text object names its font and places
// its text, and the numbers carry at most three decimals (0.001 mm on the sheet).

import { inflateSync } from 'node:zlib';
import { beforeAll, describe, expect, it } from 'vitest';
import { jobToPdf } from '../../app/report/pdf.js';
import { demoJob } from './helpers.js';

/** The decompressed page content streams of a PDF (pdfkit writes each as a FlateDecode stream). */
function contentStreams(pdf: Buffer): string[] {
  const text = pdf.toString('latin1');
  const out: string[] = [];
  const re = /stream\r?\n/g;
  let m: RegExpExecArray | null;
  while ((m = re.exec(text)) !== null) {
    const start = m.index + m[0].length;
    const end = text.indexOf('endstream', start);
    let body: string;
    try {
      body = inflateSync(pdf.subarray(start, end)).toString('latin1');
    } catch {
      continue;
    }
    // Page content: it has painting or text operators (fonts and images do not read so).
    if (/\bBT\b/.test(body) && /\bre\b/.test(body)) out.push(body);
    re.lastIndex = end;
  }
  return out;
}

const PATH = new Set(['m', 'l', 'c', 'v', 'y', 're', 'h']);
const PAINT = new Set(['S', 's', 'f', 'F', 'f*', 'B', 'B*', 'b', 'b*', 'n']);
const STATE = new Set(['w', 'J', 'j', 'M', 'd', 'ri', 'i', 'gs', 'RG', 'rg', 'G', 'g', 'K', 'k', 'CS', 'cs', 'SC', 'SCN', 'sc', 'scn', 'q', 'Q', 'cm']);

describe('PDF page content', () => {
  let pages: string[];
  beforeAll(async () => {
    pages = contentStreams(Buffer.from(await jobToPdf(demoJob())));
  }, 60_000);

  it('has a content stream per page', () => {
    expect(pages.length).toBeGreaterThanOrEqual(3);
  });

  it('never changes the graphics state inside a path', () => {
    for (const page of pages) {
      // Hex glyph strings and TJ arrays hold no operators; drop them before splitting.
      const tokens = page.replace(/<[0-9a-fA-F]*>/g, ' ').replace(/\[[^\]]*\]/g, ' ').split(/\s+/);
      let inPath = false;
      const wrong: string[] = [];
      for (const t of tokens) {
        if (PATH.has(t)) inPath = true;
        else if (PAINT.has(t)) inPath = false;
        else if (inPath && STATE.has(t)) wrong.push(t);
      }
      expect(wrong).toEqual([]);
      expect(inPath).toBe(false);
    }
  });

  it('writes each text as one text object with its font, size and place', () => {
    for (const page of pages) {
      const objects = page.split('BT\n').slice(1);
      expect(objects.length).toBeGreaterThan(10);
      for (const o of objects) {
        const body = o.slice(0, o.indexOf('ET'));
        expect(body).toMatch(/^\/F\d+ [0-9.]+ Tf\n1 0 0 -1 -?[0-9.]+ -?[0-9.]+ Tm\n\[<[0-9a-f]+>/);
      }
    }
  });

  it('writes numbers to at most three decimals, colours as RGB operators', () => {
    for (const page of pages) {
      const numbers = page.replace(/<[0-9a-fA-F]*>/g, ' ').match(/-?\d+\.\d+/g) ?? [];
      // The page's own transforms (points per mm, the page height) keep pdfkit's six decimals.
      const long = numbers.filter((n) => /\.\d{4,}$/.test(n) && n !== '2.834646' && !/^841\.88|^1190\.55|^595\.27/.test(n));
      expect(long).toEqual([]);
      expect(page).not.toMatch(/\bSCN\b|\bscn\b/);
    }
    // The diagram's pass colour (#1a7f37) as its three components.
    expect(pages.some((page) => /0\.102 0\.498 0\.216 (rg|RG)/.test(page))).toBe(true);
  });
});
