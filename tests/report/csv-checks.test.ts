// The CSV's version 2 columns: every check with its units in the header, and a row of the
// drop fixture as analyse() gives it (6 significant figures).

import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { analyse, parseJob, scheduleCsv } from '../../engine/index.js';
import { CSV_HEADER } from '../../engine/report/index.js';
import { ROOT } from './helpers.js';

const loaded = parseJob(readFileSync(`${ROOT}tests/cli/fixtures/drop-fail.lwj`, 'utf8'));

describe('scheduleCsv, version 2 columns', () => {
  it('names every new column with its unit', () => {
    for (const head of [
      'phases', 'ib (A)', 'cos φ', 'drop (%)', 'total drop (%)', 'drop limit (%)', 'voltage status', 'iz (A)', 'capacity status',
      'fault level (A)', 'breaking status', 'earth min (mm²)', 'withstand status', 'test limit (Ω)', 'measured zs (Ω)',
      'corrected (Ω)', 'measured ratio', 'measured status', 'fixes', 'verdict',
    ]) expect(CSV_HEADER).toContain(head);
    // The version 1 columns keep their places, so spreadsheets built on them still read.
    expect(CSV_HEADER.slice(0, 3)).toEqual(['link', 'name', 'from']);
    expect(CSV_HEADER.indexOf('notes')).toBe(26);
  });

  it('gives a row with the drop, the reading, the fix in words and the verdict', () => {
    expect(loaded.ok).toBe(true);
    if (!loaded.ok) return;
    const results = analyse(loaded.job);
    const lines = scheduleCsv(loaded.job, results).split('\r\n');
    const header = (lines[0] ?? '').split(',');
    const row = lines.find((l) => l.startsWith('C1,'));
    expect(row).toBeDefined();
    const cells = (row ?? '').split(',');
    const cell = (name: string): string => cells[header.indexOf(name)] ?? '?';
    // Worked by hand in tests/cli/checks.test.ts (method-depth.md §3 and §7).
    expect(cell('phases')).toBe('1');
    expect(cell('ib (A)')).toBe('20');
    expect(cell('cos φ')).toBe('1');
    expect(Number(cell('drop (%)'))).toBeCloseTo(6.26087, 4);
    expect(Number(cell('total drop (%)'))).toBeCloseTo(6.56658, 4);
    expect(cell('drop limit (%)')).toBe('5');
    expect(cell('voltage status')).toBe('fail');
    expect(cell('measured zs (Ω)')).toBe('0.8');
    expect(Number(cell('test limit (Ω)'))).toBeCloseTo(1.12879, 4);
    expect(Number(cell('corrected (Ω)'))).toBeCloseTo(1.08671, 4);
    expect(cell('measured status')).toBe('pass');
    expect(cell('fixes')).toMatch(/^cable \d+(\.\d+)?\/\d+(\.\d+)? mm²$/);
    expect(cell('verdict')).toBe('fail');
    expect(cell('status')).toBe('pass');
    const c1 = results.circuits.find((c) => c.link === 'C1');
    expect(cell('fault level (A)')).toBe(c1?.faultLevel === null || c1 === undefined ? '' : String(Number(c1.faultLevel.toPrecision(6))));
  });
});
