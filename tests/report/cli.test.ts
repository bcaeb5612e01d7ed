// The report command and check --csv, run as real processes.

import { chmodSync, existsSync, lstatSync, mkdtempSync, readFileSync, readdirSync, symlinkSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { analyse } from '../../engine/index.js';
import { CSV_HEADER } from '../../engine/report/index.js';
import { cli } from '../cli/run.js';
import { demoJob, ROOT } from './helpers.js';

const dir = mkdtempSync(join(tmpdir(), 'lw-cli-report-'));
const demo = join(ROOT, 'assets/demo.lwj');

describe('report command', () => {
  it('writes the PDF and SVG sheets; exit 1 because the demo has a failure and an RCD case', () => {
    const out = join(dir, 'demo.pdf');
    const r = cli('report', demo, '-o', out, '--svg', join(dir, 'svg'));
    expect(r.stderr).toBe('');
    expect(r.status).toBe(1);
    expect(readFileSync(out).subarray(0, 5).toString()).toBe('%PDF-');
    const svgs = readdirSync(join(dir, 'svg')).sort();
    expect(svgs[0]).toBe('sheet-1.svg');
    expect(svgs.length).toBeGreaterThanOrEqual(3);
  });

  it('exits 0 for a job where no verdict fails or relies on an RCD', () => {
    const job = demoJob();
    // Every check counts (results version 2): keep the links whose verdict passes or is unchecked.
    const passing = { ...job, links: job.links.filter((l) => { const c = analyse(job).circuits.find((x) => x.link === l.id); return c?.verdict === 'pass' || c?.verdict === 'unchecked'; }) };
    // Keep the tree whole: drop nodes no remaining link feeds, except the supply.
    const fed = new Set(passing.links.map((l) => l.to));
    passing.nodes = job.nodes.filter((n) => n.kind === 'supply' || fed.has(n.id));
    const file = join(dir, 'passing.lwj');
    writeFileSync(file, JSON.stringify({ ...passing, extra: undefined }));
    const r = cli('report', file, '-o', join(dir, 'passing.pdf'), '--paper', 'A4', '--portrait');
    expect(r.stderr).toBe('');
    expect(r.status).toBe(0);
  });

  it('a bad job: exit 2, problems on stderr, no file written and an existing one left alone', () => {
    const bad = join(dir, 'bad.lwj');
    const job = JSON.parse(readFileSync(demo, 'utf8')) as { links: Array<{ cable: { length: number } }> };
    const first = job.links[0];
    if (first !== undefined) first.cable.length = -5;
    writeFileSync(bad, JSON.stringify(job));
    const fresh = join(dir, 'never.pdf');
    let r = cli('report', bad, '-o', fresh);
    expect(r.status).toBe(2);
    expect(r.stderr).toMatch(/cable\.length/);
    expect(existsSync(fresh)).toBe(false);
    const existing = join(dir, 'existing.pdf');
    writeFileSync(existing, 'keep me');
    r = cli('report', bad, '-o', existing);
    expect(r.status).toBe(2);
    expect(readFileSync(existing, 'utf8')).toBe('keep me');
  });

  it('writing over a PDF keeps the earlier one as .bak, refuses a read-only one and writes through a link', () => {
    const out = join(dir, 'filed.pdf');
    writeFileSync(out, 'the printout filed last month');
    let r = cli('report', demo, '-o', out);
    expect(r.status).toBe(1);
    expect(readFileSync(out).subarray(0, 5).toString()).toBe('%PDF-');
    expect(readFileSync(`${out}.bak`, 'utf8')).toBe('the printout filed last month');
    expect(readdirSync(dir).filter((f) => f.endsWith('.tmp'))).toEqual([]);

    const locked = join(dir, 'locked.pdf');
    writeFileSync(locked, 'signed off');
    chmodSync(locked, 0o444);
    r = cli('report', demo, '-o', locked);
    expect(r.status).toBe(2);
    expect(r.stderr).toMatch(/locked\.pdf is read-only/);
    expect(readFileSync(locked, 'utf8')).toBe('signed off');
    expect(existsSync(`${locked}.bak`)).toBe(false);

    const real = join(dir, 'real.pdf');
    writeFileSync(real, 'old');
    const link = join(dir, 'latest.pdf');
    symlinkSync('real.pdf', link);
    r = cli('report', demo, '-o', link);
    expect(r.status).toBe(1);
    expect(lstatSync(link).isSymbolicLink()).toBe(true);
    expect(readFileSync(real).subarray(0, 5).toString()).toBe('%PDF-');
    expect(readFileSync(`${real}.bak`, 'utf8')).toBe('old');
  });

  it('-o missing, or the output being the job file: exit 2, nothing written', () => {
    let r = cli('report', demo);
    expect(r.status).toBe(2);
    expect(r.stderr).toMatch(/Usage: .*report JOB\.lwj -o OUT\.pdf/);
    const copy = join(dir, 'copy.lwj');
    writeFileSync(copy, readFileSync(demo));
    r = cli('report', copy, '-o', copy);
    expect(r.status).toBe(2);
    expect(readFileSync(copy, 'utf8')).toBe(readFileSync(demo, 'utf8'));
  });
});

describe('check --csv', () => {
  it('prints one header row with units and one row per link; exit code as check', () => {
    const r = cli('check', demo, '--csv');
    expect(r.status).toBe(1);
    const lines = r.stdout.split('\r\n');
    expect(lines[0]).toBe(CSV_HEADER.join(','));
    expect(lines[0]).toContain('length (m)');
    expect(lines[0]).toContain('zs (Ω)');
    expect(lines.filter((l) => l !== '').length).toBe(demoJob().links.length + 1);
  });
});
