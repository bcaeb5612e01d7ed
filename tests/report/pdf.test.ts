// The PDF: fonts embedded, every link id, status word and the caution in its text (pdftotext),
// every page renders (pdftoppm), page count and A3 size (pdfinfo), identical bytes for the same job.

import { mkdtempSync, readdirSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { analyse, CAUTION, type Job } from '../../engine/index.js';
import { layoutReport } from '../../engine/report/index.js';
import { fmtOhm, fmtMetre } from '../../engine/report/format.js';
import { jobToPdf } from '../../app/report/pdf.js';
import { generatedJob } from './generate.js';
import { demoJob, tool } from './helpers.js';

const dir = mkdtempSync(join(tmpdir(), 'lw-pdf-'));

describe.each([
  ['demo', demoJob],
  ['generated 201 links', () => generatedJob()],
] as Array<[string, () => Job]>)('jobToPdf: %s', (name, make) => {
  const job = make();
  const file = join(dir, `${name.replace(/\W+/g, '-')}.pdf`);
  let bytes: Uint8Array;
  beforeAll(async () => {
    bytes = await jobToPdf(job);
    writeFileSync(file, bytes);
  }, 120_000);

  it('gives identical bytes for the same job', async () => {
    expect(Buffer.from(await jobToPdf(job)).equals(Buffer.from(bytes))).toBe(true);
  });

  it('has one A3 landscape page per sheet, fonts embedded', () => {
    const info = tool('pdfinfo', [file]);
    expect(info.status).toBe(0);
    const sheets = layoutReport(job, analyse(job));
    expect(info.stdout).toMatch(new RegExp(`Pages:\\s+${sheets.length}\\n`));
    expect(info.stdout).toMatch(/Page size:\s+1190\.5\d? x 841\.8\d? pts/); // A3 = 420 × 297 mm (ISO 216)
    const fonts = tool('pdffonts', [file]);
    expect(fonts.stdout).toMatch(/DejaVuSans\b/);
    expect(fonts.stdout).toMatch(/DejaVuSans-Bold/);
    for (const row of fonts.stdout.split('\n').slice(2).filter((l) => l.trim() !== '')) expect(row).toMatch(/\byes\s+yes\b/);
  });

  it('carries every link id, every status word, the numbers and the caution as text', () => {
    const out = tool('pdftotext', ['-layout', file, '-']);
    expect(out.status).toBe(0);
    const words = new Set(out.stdout.split(/\s+/));
    const results = analyse(job);
    for (const link of job.links) expect(words.has(link.id), link.id).toBe(true);
    for (const c of results.circuits) expect(words.has(c.status.toUpperCase())).toBe(true);
    expect(out.stdout.replace(/\s+/g, ' ')).toContain(CAUTION.replace(/\s+/g, ' '));
    // Each schedule row shows analyse()'s numbers, rounded for display.
    const rows = out.stdout.split('\n');
    for (const c of results.circuits) {
      const row = rows.find((r) => { const w = r.trim().split(/\s+/); return w[0] === c.link && w.includes(c.to) && w.length > 8; });
      expect(row, c.link).toBeDefined();
      const cells = (row ?? '').split(/\s+/);
      if (c.limit !== null) expect(cells).toContain(fmtOhm(c.limit));
      if (c.zs !== null) expect(cells).toContain(fmtOhm(c.zs));
      if (c.maxLength !== null) expect(cells).toContain(fmtMetre(c.maxLength));
    }
  });

  it('renders every page', () => {
    const prefix = join(dir, `${name.replace(/\W+/g, '-')}-page`);
    const r = tool('pdftoppm', ['-png', '-r', '20', file, prefix]);
    expect(r.status).toBe(0);
    const pages = readdirSync(dir).filter((f) => f.startsWith(`${name.replace(/\W+/g, '-')}-page`) && f.endsWith('.png'));
    expect(pages.length).toBe(layoutReport(job, analyse(job)).length);
  });
});

describe('display rounding', () => {
  it('rounds as the schedule prints', () => {
    expect(fmtOhm(0.57602)).toBe('0.576');
    expect(fmtOhm(12.345)).toBe('12.35');
    expect(fmtMetre(68.145)).toBe('68.1');
    expect(fmtMetre(51.0)).toBe('51');
  });
});
