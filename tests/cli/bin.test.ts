// The installed command, `loopwright` (package.json "bin": bin/loopwright.mjs), running the
// esbuild bundle of the command line. The bundle is built here (scripts/build.mjs buildCli) into
// a package-shaped folder under tmp/ (ignored by git) with a copy of the bin script, so the test
// neither needs `npm run build:cli` to have run nor touches dist/. Inside the repository, the
// bundle finds pdfkit, the fonts and the demo jobs as it does from dist/cli/.
// No timings here: the start-up time is measured by tests/bench/cli-start.ts.

import { spawnSync } from 'node:child_process';
import { copyFileSync, existsSync, mkdirSync, mkdtempSync, readFileSync, rmSync, symlinkSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { analyse, parseJob } from '../../engine/index.js';
import { cli, FIXTURES, looksLikeStackTrace, ROOT, type Run } from './run.js';

interface Metafile {
  outputs: Record<string, { imports: Array<{ path: string; kind: string; external?: boolean }>; entryPoint?: string }>;
}
type BuildCli = (outDir: string) => Promise<{ outDir: string; metafile: Metafile }>;

const DEMO = join(ROOT, 'assets/demo.lwj');
const DEMO_UNKNOWN = join(ROOT, 'assets/demo-unknown-source.lwj');

let pkg: string;
let outside: string;
let metafile: Metafile;
let buildCli: BuildCli;

/** A folder shaped like the package: bin/loopwright.mjs (a copy of the real one), dist/cli/ optional. */
function packageFolder(parent: string, name: string): string {
  const dir = join(parent, name);
  mkdirSync(join(dir, 'bin'), { recursive: true });
  copyFileSync(join(ROOT, 'bin/loopwright.mjs'), join(dir, 'bin/loopwright.mjs'));
  return dir;
}

function run(folder: string, args: string[], nodeArgs: string[] = []): Run {
  const result = spawnSync(process.execPath, [...nodeArgs, join(folder, 'bin/loopwright.mjs'), ...args], {
    cwd: ROOT,
    encoding: 'utf8',
    env: { ...process.env, NO_COLOR: '1', FORCE_COLOR: '0' },
    timeout: 60_000,
  });
  if (result.error !== undefined) throw result.error;
  return { status: result.status, stdout: result.stdout, stderr: result.stderr };
}

const loopwright = (...args: string[]): Run => run(pkg, args);

beforeAll(async () => {
  mkdirSync(join(ROOT, 'tmp'), { recursive: true });
  const scratch = mkdtempSync(join(ROOT, 'tmp', 'bin-'));
  pkg = packageFolder(scratch, 'pkg');
  outside = mkdtempSync(join(tmpdir(), 'loopwright-bin-'));
  ({ buildCli } = (await import(pathToFileURL(join(ROOT, 'scripts/build.mjs')).href)) as { buildCli: BuildCli });
  ({ metafile } = await buildCli(join(pkg, 'dist/cli')));
});

afterAll(() => {
  if (pkg !== undefined) rmSync(join(pkg, '..'), { recursive: true, force: true });
  if (outside !== undefined) rmSync(outside, { recursive: true, force: true });
});

describe('the bundle', () => {
  it('is one entry file with its chunks, and nothing it loads at start reaches pdfkit', () => {
    expect(existsSync(join(pkg, 'dist/cli/loopwright.mjs'))).toBe(true);
    const outputs = metafile.outputs;
    const entry = Object.keys(outputs).find((k) => k.endsWith('/loopwright.mjs'));
    expect(entry).toBeDefined();
    // Every module reached from the entry through static imports is loaded at start.
    const seen = new Set<string>();
    const external = new Set<string>();
    const walk = (file: string, kinds: readonly string[]): void => {
      if (seen.has(file)) return;
      seen.add(file);
      for (const i of outputs[file]?.imports ?? []) {
        if (!kinds.includes(i.kind)) continue;
        if (i.external === true) external.add(i.path);
        else walk(i.path, kinds);
      }
    };
    walk(entry!, ['import-statement']);
    expect([...external].filter((p) => !p.startsWith('node:'))).toEqual([]);
    // ...while the report's dynamic import still reaches it, external (it reads its own data files).
    seen.clear();
    external.clear();
    walk(entry!, ['import-statement', 'dynamic-import']);
    expect([...external]).toContain('pdfkit');
  });

  it('does not load pdfkit when checking a job (the modules resolved while it runs)', () => {
    const hooks = join(pkg, 'resolve-hook.mjs');
    writeFileSync(
      hooks,
      "export async function resolve(specifier, context, next) {\n" +
        "  const found = await next(specifier, context);\n" +
        "  if (!found.url.startsWith('node:')) process.stderr.write(`resolved ${found.url}\\n`);\n" +
        "  return found;\n}\n",
    );
    const register = join(pkg, 'register-hook.mjs');
    writeFileSync(register, "import { register } from 'node:module';\nregister('./resolve-hook.mjs', import.meta.url);\n");
    const checked = run(pkg, ['check', DEMO], ['--import', pathToFileURL(register).href]);
    expect(checked.status).toBe(1);
    const resolved = checked.stderr.split('\n').filter((l) => l.startsWith('resolved '));
    expect(resolved.some((l) => l.includes('/dist/cli/loopwright.mjs'))).toBe(true);
    expect(resolved.filter((l) => l.includes('/node_modules/'))).toEqual([]);
  });
});

describe('loopwright, the installed command', () => {
  it('--help prints the general help, as `npm run cli -- --help` does but naming itself, and exits 0', () => {
    const help = loopwright('--help');
    expect(help.status).toBe(0);
    expect(help.stderr).toBe('');
    expect(help.stdout).toMatch(/^Loopwright command line/);
    for (const command of ['check', 'demo', 'report']) expect(help.stdout).toContain(`\n  ${command} `);
    expect(help.stdout).toContain('Usage: loopwright COMMAND [ARGUMENTS] [OPTIONS]');
    expect(help.stdout).toContain('Run `loopwright COMMAND --help`');
    expect(help.stdout).not.toContain('npm run');
    const fromSource = cli('--help');
    expect(fromSource.stdout).toContain('Usage: npm run --silent cli -- COMMAND');
    expect(help.stdout).toBe(fromSource.stdout.replaceAll('npm run --silent cli --', 'loopwright'));
    // The usage line of a misused command names the command that was run.
    const misused = loopwright('check');
    expect(misused.status).toBe(2);
    expect(misused.stderr).toContain('Usage: loopwright check');
  });

  it('check --json prints the same results document as the source and as analyse in-process', () => {
    const bundled = loopwright('check', DEMO, '--json');
    // The demo has one circuit that fails and one that relies on an RCD: exit status 1.
    expect(bundled.status).toBe(1);
    expect(bundled.stderr).toBe('');
    const loaded = parseJob(readFileSync(DEMO, 'utf8'));
    if (!loaded.ok) throw new Error('the demo job does not load');
    expect(JSON.parse(bundled.stdout)).toEqual(JSON.parse(JSON.stringify(analyse(loaded.job))));
    const fromSource = cli('check', DEMO, '--json');
    expect(fromSource.status).toBe(1);
    expect(bundled.stdout).toBe(fromSource.stdout);
  });

  it('exits 0 when every checked circuit passes, 2 for bad usage and unreadable jobs, never with a stack', () => {
    const pass = loopwright('check', join(FIXTURES, 'pass.lwj'));
    expect(pass.status).toBe(0);
    expect(pass.stdout).toContain('1 pass, 0 fail');

    const unknown = loopwright('frobnicate');
    expect(unknown.status).toBe(2);
    expect(unknown.stdout).toBe('');
    expect(unknown.stderr).toContain('unknown command "frobnicate"');

    const missing = loopwright('check', join(outside, 'no-such-job.lwj'));
    expect(missing.status).toBe(2);
    expect(missing.stdout).toBe('');
    expect(missing.stderr).toContain('no-such-job.lwj');

    const bad = loopwright('check', join(FIXTURES, 'bad.lwj'));
    expect(bad.status).toBe(2);
    expect(bad.stdout).toBe('');
    for (const r of [unknown, missing, bad]) expect(looksLikeStackTrace(r.stderr)).toBe(false);
  });

  it('demo prints both demo jobs from the assets folder, found from inside the bundle', () => {
    const known = loopwright('demo');
    expect(known.status).toBe(0);
    expect(known.stdout).toBe(readFileSync(DEMO, 'utf8'));
    const unknownSource = loopwright('demo', '--variant', 'unknown');
    expect(unknownSource.status).toBe(0);
    expect(unknownSource.stdout).toBe(readFileSync(DEMO_UNKNOWN, 'utf8'));
  });

  it('report writes the PDF from the bundle (pdfkit and the fonts found at run time)', () => {
    const pdf = join(outside, 'demo.pdf');
    const printed = loopwright('report', DEMO, '-o', pdf);
    expect(printed.stderr).toBe('');
    expect(printed.status).toBe(1);
    expect(readFileSync(pdf).subarray(0, 5).toString('latin1')).toBe('%PDF-');
  });
});

describe('a missing bundle', () => {
  it('is rebuilt by the bin script when the build script and esbuild are at hand', async () => {
    // A package folder whose sources are the repository's (esbuild follows the links to them).
    const folder = packageFolder(join(pkg, '..'), 'rebuild');
    mkdirSync(join(folder, 'scripts'));
    copyFileSync(join(ROOT, 'scripts/build.mjs'), join(folder, 'scripts/build.mjs'));
    symlinkSync(join(ROOT, 'app'), join(folder, 'app'), 'dir');
    expect(existsSync(join(folder, 'dist'))).toBe(false);
    const rebuilt = run(folder, ['demo']);
    expect(rebuilt.status).toBe(0);
    expect(rebuilt.stdout).toBe(readFileSync(DEMO, 'utf8'));
    expect(rebuilt.stderr).toMatch(/^loopwright: rebuilt the missing command-line bundle in .*\n$/);
    expect(existsSync(join(folder, 'dist/cli/loopwright.mjs'))).toBe(true);
  });

  it('otherwise gets one line saying how to build it, exit status 2', () => {
    // Outside the repository: no build script beside it, no esbuild to find.
    const folder = packageFolder(outside, 'lone');
    const bare = run(folder, ['--help']);
    expect(bare.status).toBe(2);
    expect(bare.stdout).toBe('');
    expect(bare.stderr).toMatch(/^loopwright: the command-line bundle .* is missing \(no build script here\); build it with `npm run build:cli` in .*\n$/);

    mkdirSync(join(folder, 'scripts'));
    copyFileSync(join(ROOT, 'scripts/build.mjs'), join(folder, 'scripts/build.mjs'));
    const noEsbuild = run(folder, ['--help']);
    expect(noEsbuild.status).toBe(2);
    expect(noEsbuild.stderr).toMatch(/^loopwright: the command-line bundle .* is missing \(rebuilding failed: .*esbuild.*\); build it with `npm run build:cli`.*\n$/);
    for (const r of [bare, noEsbuild]) expect(looksLikeStackTrace(r.stderr)).toBe(false);
  });
});
