// Usage of the command line as a real process: help, bad usage, and the demo command.

import { describe, expect, it } from 'vitest';
import { COMMANDS } from '../../app/cli/commands/index.js';
import { parseJob } from '../../engine/index.js';
import { cli, looksLikeStackTrace } from './run.js';

describe('help', () => {
  it('describes every command and every option', () => {
    const run = cli('--help');
    expect(run.status).toBe(0);
    for (const [name, command] of Object.entries(COMMANDS)) {
      expect(run.stdout).toContain(command.usage);
      expect(run.stdout).toContain(`Options of ${name}:`);
      for (const option of command.options) expect(run.stdout).toContain(`--${option.name}`);
    }
    expect(run.stdout).toContain('help [COMMAND]');
  });

  it('describes one command with COMMAND --help', () => {
    const run = cli('check', '--help');
    expect(run.status).toBe(0);
    const check = COMMANDS.check;
    expect(check).toBeDefined();
    expect(run.stdout).toContain(`Usage: npm run --silent cli -- ${check?.usage ?? '?'}`);
    expect(run.stdout).toMatch(/check JOB\.lwj \[--json/);
    for (const option of check?.options ?? []) expect(run.stdout).toContain(`--${option.name}`);
    expect(run.stdout).toContain('Exit status');
  });
});

describe('bad usage exits 2 with a message and no stack trace', () => {
  it('names an unknown option', () => {
    const run = cli('check', 'whatever.lwj', '--frobnicate');
    expect(run.status).toBe(2);
    expect(run.stdout).toBe('');
    expect(run.stderr).toContain('unknown option --frobnicate');
    expect(looksLikeStackTrace(run.stderr)).toBe(false);
  });

  it('names an unknown command and a missing argument', () => {
    const unknown = cli('chek');
    expect(unknown.status).toBe(2);
    expect(unknown.stderr).toContain('unknown command "chek"');
    const missing = cli('check');
    expect(missing.status).toBe(2);
    expect(missing.stderr).toContain('missing argument');
    expect(looksLikeStackTrace(unknown.stderr + missing.stderr)).toBe(false);
  });
});

describe('demo', () => {
  it('prints a job file that loads without problems, in both variants', () => {
    const known = cli('demo');
    expect(known.status).toBe(0);
    const a = parseJob(known.stdout);
    expect(a.ok && a.warnings).toEqual([]);
    if (a.ok) expect(a.job.nodes.find((n) => n.kind === 'supply' && n.source.type !== 'unknown')).toBeDefined();

    const unknown = cli('demo', '--variant', 'unknown');
    expect(unknown.status).toBe(0);
    const b = parseJob(unknown.stdout);
    expect(b.ok && b.warnings).toEqual([]);
    if (b.ok) expect(b.job.nodes.filter((n) => n.kind === 'supply').every((n) => n.kind === 'supply' && n.source.type === 'unknown')).toBe(true);
  });

  it('refuses a variant it does not have', () => {
    const run = cli('demo', '--variant', 'sideways');
    expect(run.status).toBe(2);
    expect(run.stdout).toBe('');
    expect(run.stderr).toContain('--variant must be one of known, unknown');
  });
});
