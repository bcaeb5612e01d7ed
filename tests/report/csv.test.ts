import { describe, expect, it } from 'vitest';
import { analyse } from '../../engine/index.js';
import { scheduleCsv } from '../../engine/report/index.js';
import { csvField } from '../../engine/report/csv.js';
import { demoJob } from './helpers.js';

describe('scheduleCsv', () => {
  it('quotes as RFC 4180 says', () => {
    expect(csvField('plain')).toBe('plain');
    expect(csvField('a, b')).toBe('"a, b"');
    expect(csvField('say "hi"')).toBe('"say ""hi"""');
    expect(csvField('two\nlines')).toBe('"two\nlines"');
  });

  it('gives analyse() values to 6 significant figures, in file order', () => {
    const job = demoJob();
    job.links[1] = { ...job.links[1]!, name: 'Submain, "north"' };
    const results = analyse(job);
    const rows = scheduleCsv(job, results).split('\r\n').filter((l) => l !== '');
    expect(rows.length).toBe(job.links.length + 1);
    expect(rows[2]).toContain('"Submain, ""north"""');
    const header = rows[0]!.split(',');
    const c = results.circuits.find((x) => x.limit !== null)!;
    const row = rows[results.circuits.indexOf(c) + 1]!;
    expect(row.startsWith(`${c.link},`)).toBe(true);
    expect(row).toContain(String(Number(c.limit!.toPrecision(6))));
    expect(header).toContain('limit (Ω)');
  });
});
