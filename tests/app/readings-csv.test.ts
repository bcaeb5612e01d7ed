// The readings file parser (app/renderer/io/readings-csv.ts): what it accepts, and every
// refusal naming its line and column. Readings here are invented data for the tests.
import { describe, expect, it } from 'vitest';
import { normaliseHeader, parseReadingsCsv, readingsEdit } from '../../app/renderer/io/readings-csv.js';
import { applyEdit } from '../../app/renderer/store/edits.js';
import { smallJob } from './fixture.js';

const job = smallJob(); // links M1, C1, C2; nodes S1, MSB, P1, P2

function problems(text: string): string[] {
  const parsed = parseReadingsCsv(text, job);
  if (parsed.ok) throw new Error(`expected a refusal, got ${JSON.stringify(parsed.rows)}`);
  return parsed.problems;
}

describe('readings CSV: accepted files', () => {
  it('reads every column, in file order', () => {
    const parsed = parseReadingsCsv(
      'link id,Zs,temperature,date,instrument\nC1,0.62,14,2026-12-02,Meter A\nC2,1.1,,,\n',
      job,
    );
    expect(parsed).toEqual({
      ok: true,
      ignored: [],
      rows: [
        { link: 'C1', line: 2, reading: { zs: 0.62, temperature: 14, date: '2026-12-02', instrument: 'Meter A' } },
        { link: 'C2', line: 3, reading: { zs: 1.1 } },
      ],
    });
  });

  it('matches header names whatever their case, order, spacing or unit, and ignores other columns', () => {
    const parsed = parseReadingsCsv('Instrument;ZS (Ω);Circuit;TEMP [°C];Notes\r\n"Meter; B";0,85;C2;-5;cold day\r\n', job);
    expect(parsed.ok).toBe(true);
    if (!parsed.ok) return;
    // Semicolons from the header row, so a decimal comma is read as a point.
    expect(parsed.rows).toEqual([{ link: 'C2', line: 2, reading: { zs: 0.85, temperature: -5, instrument: 'Meter; B' } }]);
    expect(parsed.ignored).toEqual(['Notes']);
    expect(normaliseHeader('\uFEFFLink_ID')).toBe('link id');
  });

  it('skips blank lines, reads quoted values with quotes and line breaks, and counts lines from the header', () => {
    const parsed = parseReadingsCsv('link,zs,instrument\n\n"C1",0.5,"Meter ""X""\nserial 7"\n\nC2,1.2,\n', job);
    expect(parsed.ok).toBe(true);
    if (!parsed.ok) return;
    expect(parsed.rows[0]!.reading.instrument).toBe('Meter "X"\nserial 7');
    expect(parsed.rows.map((r) => [r.link, r.line])).toEqual([['C1', 3], ['C2', 6]]);
  });

  it('accepts the temperature range end to end: −30 and 60 °C', () => {
    // job-format.md, version 2: measured.temperature from −30 to 60 °C.
    const parsed = parseReadingsCsv('link,zs,temperature\nC1,0.5,-30\nC2,0.7,60\n', job);
    expect(parsed.ok && parsed.rows.map((r) => r.reading.temperature)).toEqual([-30, 60]);
  });

  it('makes one batch edit that replaces each named link’s reading and leaves the others', () => {
    const parsed = parseReadingsCsv('link,zs\nC2,0.9\n', job);
    if (!parsed.ok) throw new Error('refused');
    const before = { ...job, links: job.links.map((l) => (l.id === 'C1' ? { ...l, measured: { zs: 0.4 } } : l)) };
    const edit = readingsEdit(parsed.rows);
    expect(edit.op).toBe('batch');
    const after = applyEdit(before, edit);
    expect(after.links.find((l) => l.id === 'C2')!.measured).toEqual({ zs: 0.9 });
    expect(after.links.find((l) => l.id === 'C1')!.measured).toEqual({ zs: 0.4 });
  });
});

describe('readings CSV: refusals name the line and column', () => {
  it('refuses an unknown link id, naming a node id for what it is', () => {
    expect(problems('link,zs\nC1,0.5\nC9,0.7\nS1,0.2\n')).toEqual([
      'line 3, column 1 (link id): there is no link "C9" in this job',
      'line 4, column 1 (link id): there is no link "S1" in this job (S1 is a supply: enter its measured Ze in the testing view or the details panel)',
    ]);
  });

  it('refuses a Zs that is not a number greater than 0', () => {
    expect(problems('zs,link\nabc,C1\n0,C2\n')).toEqual([
      'line 2, column 1 (Zs): Zs must be a number greater than 0 (Ω), got "abc"',
      'line 3, column 1 (Zs): Zs must be a number greater than 0 (Ω), got "0"',
    ]);
    expect(problems('link,zs\nC1,-0.4\n')).toEqual(['line 2, column 2 (Zs): Zs must be a number greater than 0 (Ω), got "-0.4"']);
    expect(problems('link,zs\nC1,\n')).toEqual(['line 2, column 2 (Zs): Zs is empty; it must be a number greater than 0 (Ω)']);
    // With commas between values a decimal comma would be two values: "0,5" is not read as 0.5.
    expect(problems('link,zs\nC1,"0,5"\n')[0]).toBe('line 2, column 2 (Zs): Zs must be a number greater than 0 (Ω), got "0,5"');
  });

  it('refuses a temperature outside −30 to 60 °C, or not a number', () => {
    expect(problems('link,zs,temperature\nC1,0.5,61\nC2,0.5,-30.5\nM1,0.1,warm\n')).toEqual([
      'line 2, column 3 (temperature): the temperature must be from -30 to 60 °C, got "61"',
      'line 3, column 3 (temperature): the temperature must be from -30 to 60 °C, got "-30.5"',
      'line 4, column 3 (temperature): the temperature must be a number of °C, got "warm"',
    ]);
  });

  it('refuses a second reading for the same link, naming the first line', () => {
    expect(problems('link,zs\nC1,0.5\nC2,0.6\nC1,0.7\n')).toEqual([
      'line 4, column 1 (link id): C1 has a reading already on line 2; give one reading per link',
    ]);
  });

  it('refuses a header without the link id or Zs column, and a column named twice', () => {
    expect(problems('circuit,temperature\nC1,20\n')).toEqual([
      'line 1: no Zs column; name one of: zs, measured zs, zs measured, reading',
    ]);
    expect(problems('Zs\n0.5\n')[0]).toMatch(/^line 1: no link id column; name one of: link, link id/);
    expect(problems('link,zs,Zs (ohm)\nC1,0.5,0.6\n')).toEqual([
      'line 1, column 3: a second Zs column ("Zs (ohm)"; the first is column 2)',
    ]);
  });

  it('refuses a row with more values than the header has columns, and an unclosed quote', () => {
    expect(problems('link,zs\nC1,0.5,extra\n')).toEqual(['line 2, column 3: 3 values but the header has 2 columns']);
    expect(problems('link,zs,instrument\nC1,0.5,"Meter\nC2,0.6,\n')).toEqual([
      'line 2: a quoted value is not closed (a " is missing)',
    ]);
  });

  it('refuses an empty file and a file with no readings', () => {
    expect(problems('')[0]).toMatch(/^the file is empty/);
    expect(problems('link,zs\n\n')).toEqual(['the file has a header row but no readings below it (line 2 onwards)']);
  });

  it('lists every problem of a file, not only the first, and returns no rows at all', () => {
    const parsed = parseReadingsCsv('link,zs,temperature\nC1,0.5,20\nC2,x,99\nC7,0.5,20\n', job);
    expect(parsed.ok).toBe(false);
    expect(parsed).not.toHaveProperty('rows');
    if (parsed.ok) return;
    expect(parsed.problems.map((p) => p.slice(0, p.indexOf(':')))).toEqual([
      'line 3, column 2 (Zs)',
      'line 3, column 3 (temperature)',
      'line 4, column 1 (link id)',
    ]);
  });
});
