// `check` run as a real process: exit statuses, the JSON document, the readable table,
// and bad input refused with a located message, the file left untouched.

import { copyFileSync, mkdtempSync, readFileSync, rmSync, statSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { analyse, CAUTION, parseJob } from '../../engine/index.js';
import { cli, FIXTURES, looksLikeStackTrace } from './run.js';

const fixture = (name: string): string => join(FIXTURES, name);
const scratch = mkdtempSync(join(tmpdir(), 'loopwright-cli-'));
afterAll(() => rmSync(scratch, { recursive: true, force: true }));

describe('check on a passing job', () => {
  it('prints the table with the worst path, summary and caution, and exits 0', () => {
    const run = cli('check', fixture('pass.lwj'));
    expect(run.stderr).toBe('');
    expect(run.status).toBe(0);
    const out = run.stdout;
    // Column heads carry their units.
    for (const head of ['link', 'device', 'length m', 'own Ω', 'upstream Ω', 'limit Ω', 'Ia A', 't_req s', 'ratio %', 'max length m', 'status']) {
      expect(out).toContain(head);
    }
    expect(out).toMatch(/^C1 .*Kitchen power.*final.*MSB→P1.*C20.*2\.5\/2\.5 Cu.*32\.0.*0\.576.*0\.0929.*1\.227.*150.*0\.4.*47.*68\.1.*pass$/m);
    expect(out).toMatch(/^M1 .*mains.*S1→MSB.*none.*16\/6 Cu.*unchecked$/m);
    expect(out).toContain('Worst fault path: S1 → M1 → MSB → C1 → P1 (ratio 47 %)');
    expect(out).toContain('1 pass, 0 fail, 0 RCD-reliant, 1 unchecked');
    expect(out).toContain(CAUTION);
  });

  it('with --json prints only the results document, equal to analyse(parseJob(text))', () => {
    const text = readFileSync(fixture('pass.lwj'), 'utf8');
    const loaded = parseJob(text);
    expect(loaded.ok).toBe(true);
    if (!loaded.ok) return;
    const run = cli('check', fixture('pass.lwj'), '--json');
    expect(run.status).toBe(0);
    expect(run.stderr).toBe('');
    const printed: unknown = JSON.parse(run.stdout);
    expect(printed).toEqual(JSON.parse(JSON.stringify(analyse(loaded.job))));
    // Results version 2: the new fields reach standard output (job-format.md, results document, version 2).
    const doc = printed as { version: number; supplies: unknown[]; summary: Record<string, unknown>; circuits: Array<Record<string, unknown>> };
    expect(doc.version).toBe(2);
    expect(Array.isArray(doc.supplies)).toBe(true);
    expect(Object.keys(doc.summary)).toEqual(expect.arrayContaining(['verdict', 'checks']));
    for (const c of doc.circuits) {
      expect(Object.keys(c)).toEqual(expect.arrayContaining([
        'phases', 'designCurrent', 'powerFactor', 'voltageDrop', 'voltageDropTotal', 'voltageDropLimit', 'voltageStatus',
        'capacity', 'capacityStatus', 'faultLevel', 'breakingStatus', 'earthMinArea', 'withstandStatus', 'testLimit',
        'measured', 'fixes', 'verdict',
      ]));
    }
    // The same job is the example in /work/shared/job-format.md (results document, version 1);
    // values worked by hand from method.md: own = 0.0225·32·(1/2.5 + 1/2.5) with X = 2·0.08 mΩ·32,
    // limit = 0.8·230/(7.5·20), Lmax = limit / |z per metre|.
    const c1 = (printed as { circuits: Array<Record<string, unknown>> }).circuits.find((c) => c.link === 'C1');
    expect(c1?.status).toBe('pass');
    expect(c1?.own as number).toBeCloseTo(0.57602, 4);
    expect(c1?.upstream as number).toBeCloseTo(0.092857, 5);
    expect(c1?.limit as number).toBeCloseTo(1.22667, 4);
    expect(c1?.ratio as number).toBeCloseTo(0.46958, 4);
    expect(c1?.maxLength as number).toBeCloseTo(68.145, 2);
  });
});

describe('exit status follows the findings', () => {
  it('exits 1 when a circuit without an RCD fails', () => {
    const run = cli('check', fixture('fail.lwj'), '--json');
    expect(run.status).toBe(1);
    const results = JSON.parse(run.stdout) as { summary: Record<string, unknown> };
    expect(results.summary).toMatchObject({ pass: 0, fail: 1, rcd: 0, unchecked: 1 });
    // A failing loop is a failing verdict (job-format.md, results document version 2).
    expect(results.summary.verdict).toMatchObject({ fail: 1 });
  });

  it('exits 1 when a failing circuit only relies on its RCD, and says so in words', () => {
    const run = cli('check', fixture('rcd.lwj'));
    expect(run.status).toBe(1);
    expect(run.stdout).toMatch(/^C1 .*C20 \+RCD.*RCD-reliant$/m);
    expect(run.stdout).toContain('0 pass, 0 fail, 1 RCD-reliant, 1 unchecked');
  });

  it('reports loading warnings on stderr without changing the exit status', () => {
    const run = cli('check', fixture('orphan-warning.lwj'));
    expect(run.status).toBe(0);
    expect(run.stderr).toMatch(/warning: .*DB9/);
    expect(looksLikeStackTrace(run.stderr)).toBe(false);
  });
});

describe('a job that cannot be read', () => {
  it('exits 2 with every problem located on stderr, nothing on stdout, the file untouched', () => {
    const copy = join(scratch, 'bad.lwj');
    copyFileSync(fixture('bad.lwj'), copy);
    const before = readFileSync(copy);
    const mtime = statSync(copy).mtimeMs;

    for (const args of [[], ['--json']]) {
      const run = cli('check', copy, ...args);
      expect(run.status).toBe(2);
      expect(run.stdout).toBe('');
      expect(run.stderr).toContain('links[2] (C4): cable.length');
      expect(run.stderr).toContain('-5');
      expect(run.stderr).toMatch(/links\[3\] \(C5\): .*P9/);
      expect(looksLikeStackTrace(run.stderr)).toBe(false);
    }
    expect(readFileSync(copy).equals(before)).toBe(true);
    expect(statSync(copy).mtimeMs).toBe(mtime);
  });

  it('refuses a file that is not JSON in one located message', () => {
    const run = cli('check', fixture('not-json.lwj'));
    expect(run.status).toBe(2);
    expect(run.stdout).toBe('');
    expect(run.stderr).toContain('not-json.lwj');
    expect(run.stderr.toLowerCase()).toContain('json');
    expect(looksLikeStackTrace(run.stderr)).toBe(false);
  });

  it('says in one line that a file is missing, or is a directory', () => {
    const missing = cli('check', join(scratch, 'no-such-job.lwj'));
    expect(missing.status).toBe(2);
    expect(missing.stdout).toBe('');
    expect(missing.stderr.trim().split('\n')).toHaveLength(1);
    expect(missing.stderr).toContain('no-such-job.lwj: no such file');

    const folder = cli('check', scratch);
    expect(folder.status).toBe(2);
    expect(folder.stdout).toBe('');
    expect(folder.stderr).toContain('directory');
    expect(looksLikeStackTrace(missing.stderr + folder.stderr)).toBe(false);
  });
});
