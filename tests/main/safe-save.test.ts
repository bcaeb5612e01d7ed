// Saving that cannot lose work (app/main/safe-files.ts through job-files.ts): the previous
// version kept as a backup, a read-only file refused, a symbolic link written through, a save
// killed mid-write leaving the old file whole and its leftovers cleaned, reading bounded.
import { spawn, spawnSync } from 'node:child_process';
import { promises as fs } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { readJobFile, RefusedFiles, saveJobText, writeFileAtomic } from '../../app/main/job-files.js';
import { readBounded, removeLeftovers, writeFileSafely, writeFilesSafely } from '../../app/main/safe-files.js';

const SAFE_FILES = fileURLToPath(new URL('../../app/main/safe-files.ts', import.meta.url));
const DEMO = path.resolve('assets/demo.lwj');
let dir: string;

beforeEach(async () => {
  dir = await fs.mkdtemp(path.join(os.tmpdir(), 'loopwright-safe-'));
});
afterEach(async () => {
  await fs.chmod(dir, 0o755).catch(() => undefined);
  await fs.rm(dir, { recursive: true, force: true });
});

const listing = async (d = dir): Promise<string[]> => (await fs.readdir(d)).sort();

/** A process id that no longer runs: a child that has exited. */
function deadPid(): number {
  const child = spawnSync(process.execPath, ['-e', 'process.stdout.write(String(process.pid))'], { encoding: 'utf8' });
  return Number(child.stdout);
}

describe('backup', () => {
  it('a first save makes no backup; each later save keeps the version it replaces', async () => {
    const file = path.join(dir, 'job.lwj');
    const refused = new RefusedFiles();
    expect((await saveJobText(file, '{"n":1}', refused)).ok).toBe(true);
    expect(await listing()).toEqual(['job.lwj']);
    expect((await saveJobText(file, '{"n":2}', refused)).ok).toBe(true);
    expect(await fs.readFile(`${file}.bak`, 'utf8')).toBe('{"n":1}');
    expect((await saveJobText(file, '{"n":3}', refused)).ok).toBe(true);
    expect(await fs.readFile(file, 'utf8')).toBe('{"n":3}');
    expect(await fs.readFile(`${file}.bak`, 'utf8')).toBe('{"n":2}');
    expect(await listing()).toEqual(['job.lwj', 'job.lwj.bak']);
  });

  it('the backup is a file of its own: the next save does not change it through a shared link', async () => {
    const file = path.join(dir, 'job.lwj');
    await fs.writeFile(file, '{"n":1}');
    await writeFileSafely(file, '{"n":2}', { backup: true });
    await writeFileSafely(file, '{"n":3}'); // no backup asked: the old backup stays as it was
    expect(await fs.readFile(`${file}.bak`, 'utf8')).toBe('{"n":1}');
  });
});

describe('a read-only file', () => {
  it('is refused, left as it was, and nothing is left beside it', async () => {
    const file = path.join(dir, 'issued.lwj');
    await fs.writeFile(file, '{"issued":true}');
    await fs.chmod(file, 0o444);
    const r = await saveJobText(file, '{"changed":true}', new RefusedFiles());
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.message).toMatch(/issued\.lwj is read-only, so it was not written over; save under another name/);
    expect(await fs.readFile(file, 'utf8')).toBe('{"issued":true}');
    expect((await fs.stat(file)).mode & 0o777).toBe(0o444);
    expect(await listing()).toEqual(['issued.lwj']);
  });

  it('an exported PDF over a read-only file is refused the same way', async () => {
    const file = path.join(dir, 'printout.pdf');
    await fs.writeFile(file, 'old');
    await fs.chmod(file, 0o400);
    await expect(writeFileAtomic(file, new Uint8Array([1, 2, 3]))).rejects.toThrow(/read-only/);
    expect(await fs.readFile(file, 'utf8')).toBe('old');
  });
});

describe('a symbolic link', () => {
  it('is written through to its target, and stays a link', async () => {
    const real = path.join(dir, 'projects');
    await fs.mkdir(real);
    const target = path.join(real, 'job.lwj');
    await fs.writeFile(target, '{"v":1}');
    const link = path.join(dir, 'shortcut.lwj');
    await fs.symlink(path.relative(dir, target), link);
    const r = await saveJobText(link, '{"v":2}', new RefusedFiles());
    expect(r).toEqual({ ok: true, path: link });
    expect((await fs.lstat(link)).isSymbolicLink()).toBe(true);
    expect(await fs.readFile(target, 'utf8')).toBe('{"v":2}');
    // The backup and any temporary file sit beside the real file, not beside the link.
    expect(await listing(real)).toEqual(['job.lwj', 'job.lwj.bak']);
    expect(await listing()).toEqual(['projects', 'shortcut.lwj']);
  });

  it('a link to a file not yet there creates that file', async () => {
    const link = path.join(dir, 'new.lwj');
    await fs.symlink('later.lwj', link);
    await writeFileSafely(link, '{}');
    expect(await fs.readFile(path.join(dir, 'later.lwj'), 'utf8')).toBe('{}');
    expect((await fs.lstat(link)).isSymbolicLink()).toBe(true);
  });

  it('a loop of links is refused', async () => {
    await fs.symlink('b.lwj', path.join(dir, 'a.lwj'));
    await fs.symlink('a.lwj', path.join(dir, 'b.lwj'));
    await expect(writeFileSafely(path.join(dir, 'a.lwj'), '{}')).rejects.toThrow(/symbolic links/);
  });
});

describe('a save cut short', () => {
  it('a process killed while saving leaves the old file whole (or the new one), and the next save removes what it left', async () => {
    const file = path.join(dir, 'job.lwj');
    const old = JSON.stringify({ version: 'old', pad: 'o'.repeat(4_000_000) });
    await fs.writeFile(file, old);
    // A separate process saves a large new version over and over; it is killed with SIGKILL (as a
    // power cut or a crash would stop it) at some point in its writing, wherever that falls.
    const script = `
      const { writeFileSafely } = await import(${JSON.stringify(SAFE_FILES)});
      const data = JSON.stringify({ version: 'new', pad: 'n'.repeat(4_000_000) });
      process.stdout.write('ready\\n');
      for (;;) await writeFileSafely(${JSON.stringify(file)}, data, { backup: true });
    `;
    // Node itself with tsx's loader (not the tsx command, whose own child would outlive the kill).
    const child = spawn(process.execPath, ['--import', 'tsx', '--input-type=module', '-e', script], { stdio: ['ignore', 'pipe', 'inherit'] });
    await new Promise<void>((resolve) => child.stdout.once('data', () => resolve()));
    await new Promise((r) => setTimeout(r, 150));
    child.kill('SIGKILL');
    await new Promise((r) => child.on('exit', r));

    const text = await fs.readFile(file, 'utf8');
    const version = (JSON.parse(text) as { version: string }).version;
    expect(['old', 'new']).toContain(version);
    expect(text.length).toBe(version === 'old' ? old.length : JSON.stringify({ version: 'new', pad: 'n'.repeat(4_000_000) }).length);

    // Whatever temporary file the killed save left is removed by the next one.
    await writeFileSafely(file, '{"after":true}', { backup: true });
    expect((await listing()).filter((n) => n.endsWith('.tmp'))).toEqual([]);
    expect(await fs.readFile(file, 'utf8')).toBe('{"after":true}');
  });

  it('leftovers of a crashed process are removed on open and save; those of a running one are kept', async () => {
    const file = path.join(dir, 'job.lwj');
    await fs.writeFile(file, await fs.readFile(DEMO, 'utf8'));
    const dead = deadPid();
    const crashed = `.job.lwj.${dead}.0123456789ab.tmp`;
    const older = `.job.lwj.${dead}.tmp`; // the command line's earlier naming
    const running = `.job.lwj.${process.ppid}.0123456789ab.tmp`;
    const other = `.other.lwj.${dead}.0123456789ab.tmp`;
    for (const name of [crashed, older, running, other]) await fs.writeFile(path.join(dir, name), 'partial');
    expect((await readJobFile(file, new RefusedFiles())).ok).toBe(true);
    expect(await listing()).toEqual([running, other, 'job.lwj'].sort());
    expect(await removeLeftovers(path.join(dir, 'other.lwj'))).toEqual([other]);
  });

  it('a set of files (the printout\'s sheets) is written whole, leftovers of the set removed once, others kept', async () => {
    const dead = deadPid();
    // Names holding dots and digits, as the sheets' do: the leftover is told by its whole name.
    const stale = [`.sheet-2.svg.${dead}.0123456789ab.tmp`, `.sheet-2.svg.${dead}.0123456789ab.bak.tmp`, `.sheet-10.svg.${dead}.tmp`];
    const kept = [`.sheet-3.svg.${dead}.0123456789ab.tmp`, `.sheet-2.svg.${process.ppid}.0123456789ab.tmp`, '.sheet-2.svg.tmp', 'notes.txt'];
    for (const name of [...stale, ...kept]) await fs.writeFile(path.join(dir, name), 'partial');
    const files = [1, 2, 10].map((n) => ({ path: path.join(dir, `sheet-${n}.svg`), data: `<svg>${n}</svg>` }));
    await writeFilesSafely(files);
    for (const f of files) expect(await fs.readFile(f.path, 'utf8')).toBe(f.data);
    expect(await listing()).toEqual([...kept, 'sheet-1.svg', 'sheet-10.svg', 'sheet-2.svg'].sort());
  });

  it('a set stops at a read-only file: those before it written, it and those after it as they were', async () => {
    const names = ['a.svg', 'b.svg', 'c.svg'].map((n) => path.join(dir, n));
    await fs.writeFile(names[1]!, 'old b');
    await fs.chmod(names[1]!, 0o444);
    await expect(writeFilesSafely(names.map((p) => ({ path: p, data: 'new' })))).rejects.toThrow(/read-only/);
    expect(await fs.readFile(names[0]!, 'utf8')).toBe('new');
    expect(await fs.readFile(names[1]!, 'utf8')).toBe('old b');
    expect(await listing()).toEqual(['a.svg', 'b.svg']);
  });

  it('a write that fails part-way leaves the target whole and no temporary file', async () => {
    const file = path.join(dir, 'job.lwj');
    await fs.writeFile(file, '{"keep":1}');
    // Data that cannot be written: the write throws after the temporary file was opened.
    await expect(writeFileSafely(file, 42 as unknown as string)).rejects.toThrow();
    expect(await fs.readFile(file, 'utf8')).toBe('{"keep":1}');
    expect(await listing()).toEqual(['job.lwj']);
  });

  it('a device or a pipe is never replaced by a file', async () => {
    const fifo = path.join(dir, 'pipe.lwj');
    expect(spawnSync('mkfifo', [fifo]).status).toBe(0);
    await expect(writeFileSafely(fifo, '{}')).rejects.toThrow(/not a plain file/);
    expect((await fs.lstat(fifo)).isFIFO()).toBe(true);
  });
});

describe('reading', () => {
  it('reads at most the limit from a device, and says a plain file is too big without reading it', async () => {
    expect(await readBounded('/dev/zero', 1000)).toEqual({ ok: false, tooBig: true, limit: 1000 });
    const file = path.join(dir, 'big.lwj');
    await fs.writeFile(file, 'x'.repeat(2000));
    expect((await readBounded(file, 1000)).ok).toBe(false);
    const read = await readBounded(file, 2000);
    expect(read.ok && read.bytes.length).toBe(2000);
  });

  it('opening /dev/zero in the app is refused with the limit, and it is never saved over', async () => {
    const refused = new RefusedFiles();
    const r = await readJobFile('/dev/zero', refused);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.message).toMatch(/zero was not opened: it is larger than 50 MB, the limit for a job file/);
    expect(refused.has('/dev/zero')).toBe(true);
  });
});
