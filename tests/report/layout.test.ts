// The printout as display lists: every sheet readable (no text under 2 mm, no overlapping
// text), inside the paper, titled "sheet n of m", every link present with its verdict.

import { describe, expect, it } from 'vitest';
import { analyse, CAUTION, type Job } from '../../engine/index.js';
import { layoutReport, sheetToSvg, type ReportOptions, type Sheet } from '../../engine/report/index.js';
import { demoJob, expectReadable, texts } from './helpers.js';
import { generatedJob } from './generate.js';
import { generateJob } from '../bench/generate.js';

const PAPERS: ReportOptions[] = [
  {},
  { paper: 'A3', orientation: 'portrait' },
  { paper: 'A4', orientation: 'landscape' },
  { paper: 'A4', orientation: 'portrait' },
];

function allText(sheets: Sheet[]): string {
  return sheets.flatMap((s) => texts(s).map((t) => t.text)).join('\n');
}

const jobs: Array<[string, () => Job]> = [
  ['demo', demoJob],
  ['generated, drawn', () => generatedJob()],
  ['generated, arranged automatically, unknown source', () => generatedJob({ drawn: false, unknownSource: true })],
];

describe.each(jobs)('layoutReport: %s', (_name, make) => {
  const job = make();
  const results = analyse(job);
  // Laid out once per paper and shared by the tests below.
  const laid = new Map<string, Sheet[]>();
  const sheetsFor = (options: ReportOptions = {}): Sheet[] => {
    const key = JSON.stringify(options);
    const hit = laid.get(key) ?? layoutReport(job, results, options);
    laid.set(key, hit);
    return hit;
  };

  it.each(PAPERS)('keeps every text at 2 mm or more, inside the frame, without overlaps (%o)', (options) => {
    const sheets = sheetsFor(options);
    for (const sheet of sheets) {
      expectReadable(sheet);
    }
  });

  it('puts every link id, its status word and "sheet n of m" on the sheets', () => {
    const sheets = sheetsFor();
    const diagram = allText(sheets.filter((s) => s.kind === 'diagram'));
    const schedule = allText(sheets.filter((s) => s.kind === 'schedule'));
    for (const link of job.links) {
      expect(diagram.split('\n')).toContain(link.id);
      expect(schedule.split('\n')).toContain(link.id);
    }
    const words = new Set(results.circuits.map((c) => c.status.toUpperCase()));
    for (const w of words) expect(schedule.split('\n')).toContain(w);
    sheets.forEach((s, i) => expect(texts(s).map((t) => t.text)).toContain(`${i + 1} of ${sheets.length}`));
    expect(sheets.map((s) => s.kind)).toEqual([...sheets.map((s) => s.kind)].sort((a, b) => ['diagram', 'schedule', 'assumptions'].indexOf(a) - ['diagram', 'schedule', 'assumptions'].indexOf(b)));
    // The caution in full on the assumptions sheet (wrapped: compare with the spaces closed up).
    const assumptions = allText(sheets.filter((s) => s.kind === 'assumptions')).replace(/\s+/g, ' ');
    expect(assumptions).toContain(CAUTION.replace(/\s+/g, ' '));
  });

  it('marks the worst fault path', () => {
    const sheets = sheetsFor();
    if (results.worst !== null) expect(allText(sheets)).toContain('worst fault path');
  });

  it('is deterministic, and its SVG names the font', () => {
    const a = sheetsFor().map(sheetToSvg);
    const b = layoutReport(job, analyse(job)).map(sheetToSvg);
    expect(a).toEqual(b);
    expect(a[0]).toContain("font-family=\"'DejaVu Sans'");
    expect(a[0]).toMatch(/^<\?xml[^]*<svg [^]*<\/svg>\n$/);
  });
});

describe('layoutReport: paper', () => {
  it('uses A3 landscape by default and the asked-for size otherwise', () => {
    const job = demoJob();
    const r = analyse(job);
    expect(layoutReport(job, r)[0]).toMatchObject({ widthMm: 420, heightMm: 297 }); // ISO 216
    expect(layoutReport(job, r, { paper: 'A4', orientation: 'portrait' })[0]).toMatchObject({ widthMm: 210, heightMm: 297 });
  });

  it.each(PAPERS)('splits a large drawing board by board, the supply first, every stub naming its sheet (%o)', (options) => {
    for (const job of [generatedJob(), demoJob()]) {
      const sheets = layoutReport(job, analyse(job), options);
      const diagram = sheets.filter((s) => s.kind === 'diagram');
      // The demo fits one A3 portrait sheet drawn board by board; the generated job never does.
      if (job.nodes.length > 100) expect(diagram.length).toBeGreaterThan(1);
      // Reading order: the supply's sheet comes first.
      expect(texts(diagram[0]!).map((t) => t.text)).toContain('S1');
      // Each board drawn as a stub says where it continues, and that sheet is headed by its feed.
      const boards = job.nodes.filter((n) => n.kind === 'board').map((n) => n.id);
      diagram.forEach((sheet, i) => {
        const list = texts(sheet);
        list.forEach((t, k) => {
          const m = /^cont\. on sheet (\d+)$/.exec(t.text);
          if (m === null) return;
          const id = [...list.slice(0, k)].reverse().find((x) => boards.includes(x.text))?.text;
          expect(id, `stub before "${t.text}" on sheet ${i + 1}`).toBeDefined();
          const target = sheets[Number(m[1]) - 1]!;
          expect(target.kind).toBe('diagram');
          expect(texts(target).some((x) => x.text.startsWith('fed from') && texts(target).some((y) => y.text === id))).toBe(true);
        });
      });
      expect(allText(diagram)).toMatch(diagram.length > 1 ? /cont\. on sheet \d+/ : /cont\. (below|to the right)/);
      expect(allText(diagram)).toMatch(/fed from MSB/);
    }
  });

  it.each(PAPERS)('prints the full legend once, the other diagram sheets pointing to it in one line (%o)', (options) => {
    for (const job of [generatedJob(), demoJob()]) {
      const sheets = layoutReport(job, analyse(job), options);
      const withLegend = sheets.flatMap((s, i) => (texts(s).some((t) => t.text === 'Legend') ? [i + 1] : []));
      expect(withLegend).toHaveLength(1);
      const n = withLegend[0]!;
      sheets.forEach((s, i) => {
        if (s.kind !== 'diagram' || i + 1 === n) return;
        const keys = texts(s).filter((t) => t.text.startsWith('Key:'));
        expect(keys).toHaveLength(1);
        expect(keys[0]!.text).toContain(`legend on sheet ${n}`);
      });
      // Every symbol's explanation is in that legend.
      const legendText = texts(sheets[n - 1]!).map((t) => t.text).join(' ');
      for (const word of ['PASS:', 'FAIL:', 'RCD-RELIANT:', 'UNCHECKED:', 'worst fault path', 'link not checked', 'continues on the sheet']) {
        expect(legendText).toContain(word);
      }
    }
  });

  it('gives the demo on A4 landscape two full diagram sheets, the last not left with one board', () => {
    for (const options of PAPERS) {
      const job = demoJob();
      const diagram = layoutReport(job, analyse(job), options).filter((s) => s.kind === 'diagram');
      if (options.paper === 'A4' && options.orientation === 'landscape') {
        expect(diagram).toHaveLength(2); // was 5 with the legend on every sheet
        const first = texts(diagram[0]!).map((t) => t.text);
        for (const id of ['S1', 'M1', 'MSB', 'C01', 'C03b', 'C05', 'SM1', 'SM2']) expect(first).toContain(id);
      }
      // Balanced: with more than one sheet, the last holds more than one board's part.
      if (diagram.length > 1) expect(diagram[diagram.length - 1]!.title.split('; ').length, JSON.stringify(options)).toBeGreaterThan(1);
    }
  });

  it.each(PAPERS)('gives a long board name a second line beside its symbol before cutting it (%o)', (options) => {
    const job = demoJob();
    const diagram = layoutReport(job, analyse(job), options).filter((s) => s.kind === 'diagram');
    const names = job.nodes.filter((n) => n.kind !== 'point').map((n) => n.name ?? '');
    expect(names).toContain('DB-C chandlery and showroom');
    for (const sheet of diagram) {
      const cut = texts(sheet).filter((t) => t.text.endsWith('…')).map((t) => t.text.slice(0, -1));
      // No node name of the demo is cut: each fits its two or three lines.
      for (const c of cut) expect(names.some((n) => c !== '' && n.includes(c)), `"${c}…" on ${sheet.title}`).toBe(false);
    }
    const all = allText(diagram).split('\n');
    expect(all).toContain('DB-C chandlery');
    expect(all).toContain('and showroom');
  });

  it('packs the 200-circuit generated job onto few, well-filled diagram sheets', () => {
    const job = generateJob(200);
    const diagram = layoutReport(job, analyse(job)).filter((s) => s.kind === 'diagram');
    // 200 circuits at 25 to 28 per sheet on A3 landscape, plus the supply and main switchboard.
    expect(diagram.length).toBeLessThanOrEqual(9);
    for (const link of job.links) expect(allText(diagram).split('\n')).toContain(link.id);
  });

  it('lays out a job without nodes', () => {
    const job = demoJob();
    const empty: Job = { ...job, nodes: [], links: [] };
    const sheets = layoutReport(empty, analyse(empty));
    expect(allText(sheets)).toContain('The job has no nodes to draw.');
  });
});
