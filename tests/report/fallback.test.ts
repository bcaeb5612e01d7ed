// The tiled drawing: the last resort when the diagram cannot be split board by board (a branch
// wider than the sheet, or a chain taller than one). It must meet the same rules: text of 2 mm or
// more, every link id, continuation marks naming real diagram sheets, no overlapping text.

import { describe, expect, it } from 'vitest';
import { analyse, formatProblem, parseJob, serialiseJob, type Job, type JobNode, type Link } from '../../engine/index.js';
import { layoutReport, type ReportOptions } from '../../engine/report/index.js';
import { expectReadable, texts } from './helpers.js';

/** Invented job: a board feeding one outlet that feeds 30 more (too wide), and a chain of 12 (too tall). */
function branchyJob(): Job {
  const nodes: JobNode[] = [
    { id: 'S1', kind: 'supply', name: 'Point of supply', source: { type: 'impedance', r: 0.1, x: 0.04 }, at: { x: 0, y: 0 } },
    { id: 'MSB', kind: 'board', name: 'Main switchboard', at: { x: 0, y: 170 } },
    { id: 'H0', kind: 'point', name: 'Hall outlet', use: 'socket-outlets', at: { x: 0, y: 340 } },
  ];
  const links: Link[] = [
    { id: 'M1', from: 'S1', to: 'MSB', cable: { length: 10, material: 'Cu', active: 35, earth: 16 } },
    { id: 'H', from: 'MSB', to: 'H0', cable: { length: 8, material: 'Cu', active: 2.5, earth: 2.5 }, device: { type: 'mcb', curve: 'C', rating: 20 } },
  ];
  for (let i = 1; i <= 30; i++) {
    nodes.push({ id: `H${i}`, kind: 'point', name: `Outlet ${i} along the hall`, use: 'socket-outlets', at: { x: (i - 1) * 200, y: 510 } });
    links.push({ id: `HL${i}`, from: 'H0', to: `H${i}`, cable: { length: 3 + i, material: 'Cu', active: 2.5, earth: 2.5 } });
  }
  let parent = 'MSB';
  for (let i = 1; i <= 12; i++) {
    nodes.push({ id: `Y${i}`, kind: 'point', name: `Yard light ${i}`, use: 'lighting', at: { x: -400, y: 170 + i * 170 } });
    links.push({
      id: `YL${i}`, from: parent, to: `Y${i}`, cable: { length: 20, material: 'Cu', active: 1.5, earth: 1.5 },
      ...(i === 1 ? { device: { type: 'mcb' as const, curve: 'B' as const, rating: 10 } } : {}),
    });
    parent = `Y${i}`;
  }
  return {
    format: 'loopwright.job', version: 2,
    job: { title: 'Tiled fallback test job', site: 'Invented', client: 'Test', designer: 'Test', reference: 'T-1', revision: 'A', date: '2026-01-15', notes: '' },
    rules: { basis: 'au-nz' }, nodes, links,
  };
}

const PAPERS: ReportOptions[] = [
  {},
  { paper: 'A3', orientation: 'portrait' },
  { paper: 'A4', orientation: 'landscape' },
  { paper: 'A4', orientation: 'portrait' },
];

describe('the tiled fallback test job', () => {
  it('is a valid job file', () => {
    const loaded = parseJob(serialiseJob(branchyJob()));
    expect(loaded.ok ? [] : loaded.problems.map(formatProblem)).toEqual([]);
  });
});

describe.each(PAPERS)('layoutReport, tiled fallback (%o)', (options) => {
  const job = branchyJob();
  const sheets = layoutReport(job, analyse(job), options);
  const diagram = sheets.filter((s) => s.kind === 'diagram');

  it('falls back to tiles: several sheets, no board-by-board stubs, the split note in the legend', () => {
    expect(diagram.length).toBeGreaterThan(1);
    const all = diagram.flatMap((s) => texts(s).map((t) => t.text));
    expect(all.some((t) => t.startsWith('fed from'))).toBe(false);
    expect(all.join(' ')).toContain(`Split over ${diagram.length} sheets`);
    // The legend on every tile, as the tile area was sized for it.
    for (const s of diagram) expect(texts(s).map((t) => t.text)).toContain('Legend');
  });

  it('keeps text at 2 mm or more inside the frame, and no text overlaps', () => {
    for (const sheet of diagram) {
      expectReadable(sheet);
    }
  });

  it('annotates every link once with its verdict', () => {
    const all = diagram.flatMap((s) => texts(s).map((t) => t.text));
    for (const link of job.links) expect(all.filter((t) => t === link.id), link.id).toHaveLength(1);
    expect(all.filter((t) => /^(PASS|FAIL|RCD-RELIANT|UNCHECKED)$/.test(t))).toHaveLength(job.links.length);
  });

  it('marks every crossing with the diagram sheet it continues on', () => {
    const marks = diagram.flatMap((s) => texts(s).map((t) => t.text)).filter((t) => /sheet \d+/.test(t));
    expect(marks.length).toBeGreaterThan(0);
    expect(marks.some((t) => /continued on sheet \d+|· sheet \d+ [↓↑]/.test(t))).toBe(true);
    expect(marks.some((t) => /from sheet \d+|from \S+ · sheet \d+/.test(t))).toBe(true);
    for (const m of marks) {
      for (const [, n] of m.matchAll(/sheet (\d+)/g)) {
        expect(Number(n), m).toBeGreaterThanOrEqual(1);
        expect(Number(n), m).toBeLessThanOrEqual(diagram.length);
      }
    }
  });
});
