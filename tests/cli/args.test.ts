// The command line's option parser and display formatting, in-process.

import { describe, expect, it } from 'vitest';
import { parseArgs, type OptionSpec } from '../../app/cli/args.js';
import { amps, cableMark, ohms, percent, seconds, summaryLine } from '../../app/cli/format.js';

const specs: OptionSpec[] = [
  { name: 'json', summary: 'json' },
  { name: 'output', short: 'o', value: 'FILE', summary: 'out' },
  { name: 'variant', value: 'NAME', choices: ['known', 'unknown'], summary: 'variant' },
];

describe('parseArgs', () => {
  it('separates positionals, flags and valued options in any order', () => {
    const r = parseArgs(['job.lwj', '--json', '-o', 'out.pdf', '--variant=unknown'], specs);
    expect(r).toEqual({
      ok: true,
      args: { positionals: ['job.lwj'], options: { json: true, output: 'out.pdf', variant: 'unknown' }, help: false },
    });
    expect(parseArgs(['-oout.pdf', '--', '--json'], specs)).toEqual({
      ok: true,
      args: { positionals: ['--json'], options: { output: 'out.pdf' }, help: false },
    });
  });

  it('recognises --help and -h', () => {
    expect(parseArgs(['--help'], specs)).toMatchObject({ ok: true, args: { help: true } });
    expect(parseArgs(['-h'], specs)).toMatchObject({ ok: true, args: { help: true } });
  });

  it('refuses unknown options, missing values, values on flags, bad choices and repeats by name', () => {
    expect(parseArgs(['--csv'], specs)).toEqual({ ok: false, message: 'unknown option --csv' });
    expect(parseArgs(['-x'], specs)).toEqual({ ok: false, message: 'unknown option -x' });
    expect(parseArgs(['-o'], specs)).toEqual({ ok: false, message: 'option -o needs a value (FILE)' });
    expect(parseArgs(['--output', '--json'], specs)).toEqual({ ok: false, message: 'option --output needs a value (FILE)' });
    expect(parseArgs(['--json=yes'], specs)).toEqual({ ok: false, message: 'option --json takes no value' });
    expect(parseArgs(['--variant', 'odd'], specs)).toEqual({
      ok: false,
      message: 'option --variant must be one of known, unknown, got "odd"',
    });
    expect(parseArgs(['-o', 'a', '-o', 'b'], specs)).toEqual({ ok: false, message: 'option -o given twice' });
  });
});

describe('display formatting', () => {
  it('writes cables the way the trade does', () => {
    expect(cableMark({ length: 1, material: 'Cu', active: 2.5, earth: 2.5 })).toBe('2.5/2.5 Cu');
    expect(cableMark({ length: 1, material: 'Al', active: 95, earth: 50, parallel: 2 })).toBe('2×95/50 Al');
    expect(cableMark({ length: 1, material: 'Al', active: 95, earth: 50, earthMaterial: 'Cu' })).toBe('95 Al/50 Cu');
  });

  it('rounds for display only, with a dash for no value', () => {
    expect(ohms(1.226666)).toBe('1.227');
    expect(ohms(0.0928571)).toBe('0.0929');
    expect(ohms(null)).toBe('–');
    expect(amps(150)).toBe('150');
    expect(amps(24)).toBe('24');
    expect(amps(285.43)).toBe('285');
    expect(seconds(0.4)).toBe('0.4');
    expect(seconds(5)).toBe('5');
    expect(percent(0.46958)).toBe('47');
    expect(summaryLine({ pass: 12, fail: 1, rcd: 1, unchecked: 2 })).toBe('12 pass, 1 fail, 1 RCD-reliant, 2 unchecked');
  });
});
