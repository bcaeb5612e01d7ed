import { promises as fs } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { problemLines, readJobFile, RefusedFiles, saveJobText, writeFileAtomic } from '../../app/main/job-files.js';

const DEMO = path.resolve('assets/demo.lwj');
let dir: string;

beforeEach(async () => {
  dir = await fs.mkdtemp(path.join(os.tmpdir(), 'loopwright-files-'));
});
afterEach(async () => {
  await fs.rm(dir, { recursive: true, force: true });
});

async function listing(): Promise<string[]> {
  return (await fs.readdir(dir)).sort();
}

describe('reading a job file', () => {
  it('a good job comes back as its exact text', async () => {
    const text = await fs.readFile(DEMO, 'utf8');
    const file = path.join(dir, 'demo.lwj');
    await fs.writeFile(file, text);
    const r = await readJobFile(file, new RefusedFiles());
    expect(r.ok).toBe(true);
    if (r.ok) expect(r.text).toBe(text);
  });

  it('a bad job is refused with every problem, saying where', async () => {
    const job = JSON.parse(await fs.readFile(DEMO, 'utf8')) as { links: Array<{ cable: { length: unknown } }> };
    const first = job.links[0];
    if (!first) throw new Error('demo has no links');
    first.cable.length = -5;
    const file = path.join(dir, 'broken.lwj');
    await fs.writeFile(file, JSON.stringify(job));
    const refused = new RefusedFiles();
    const r = await readJobFile(file, refused);
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.message).toMatch(/broken\.lwj was not opened/);
    expect(r.message).toMatch(/has not been changed/);
    const problem = r.problems.find((p) => p.field === 'cable.length');
    expect(problem?.where).toMatch(/^links\[0\]/);
    expect(problemLines(r.problems)).toMatch(/links\[0\].*cable\.length/);
    expect(refused.has(file)).toBe(true);
  });

  it('a file that is not JSON, or is missing, is refused with a message naming it', async () => {
    const file = path.join(dir, 'notes.lwj');
    await fs.writeFile(file, 'shopping list: milk');
    const r = await readJobFile(file, new RefusedFiles());
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.problems.length).toBeGreaterThan(0);
    const missing = await readJobFile(path.join(dir, 'gone.lwj'), new RefusedFiles());
    expect(missing.ok).toBe(false);
    if (!missing.ok) expect(missing.message).toMatch(/Could not read .*gone\.lwj: the file or its folder does not exist/);
  });

  it('problem lists are capped for a message box', () => {
    const many = Array.from({ length: 30 }, (_, i) => ({ severity: 'error' as const, where: `links[${i}]`, field: 'cable.length', message: 'bad' }));
    const lines = problemLines(many, 20).split('\n');
    expect(lines).toHaveLength(21);
    expect(lines[20]).toBe('… and 10 more');
  });
});

describe('saving', () => {
  it('writes the text, keeps the previous version as a backup and leaves no temporary file behind', async () => {
    const file = path.join(dir, 'job.lwj');
    await fs.writeFile(file, '{"old":true}');
    const r = await saveJobText(file, '{"new":true}\n', new RefusedFiles());
    expect(r).toEqual({ ok: true, path: file });
    expect(await fs.readFile(file, 'utf8')).toBe('{"new":true}\n');
    expect(await fs.readFile(`${file}.bak`, 'utf8')).toBe('{"old":true}');
    expect(await listing()).toEqual(['job.lwj', 'job.lwj.bak']);
  });

  it('never writes over a file that failed to load, even with valid text', async () => {
    const file = path.join(dir, 'from-a-newer-version.lwj');
    const original = '{"format":"loopwright.job","version":99,"job":{}}';
    await fs.writeFile(file, original);
    const refused = new RefusedFiles();
    const loaded = await readJobFile(file, refused);
    expect(loaded.ok).toBe(false);
    const r = await saveJobText(file, await fs.readFile(DEMO, 'utf8'), refused);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.message).toMatch(/could not be loaded earlier, so it will not be written over/);
    expect(await fs.readFile(file, 'utf8')).toBe(original);
  });

  it('the same file may be saved once it has loaded cleanly again', async () => {
    const file = path.join(dir, 'fixed.lwj');
    const refused = new RefusedFiles();
    await fs.writeFile(file, 'not json');
    await readJobFile(file, refused);
    await fs.writeFile(file, await fs.readFile(DEMO, 'utf8'));
    expect((await readJobFile(file, refused)).ok).toBe(true);
    expect((await saveJobText(file, '{"a":1}', refused)).ok).toBe(true);
  });

  it('refuses text that is not a JSON object, leaving the file as it was', async () => {
    const file = path.join(dir, 'job.lwj');
    await fs.writeFile(file, '{"keep":1}');
    for (const text of ['', 'nonsense', '[1,2]', 'null', '"a string"']) {
      const r = await saveJobText(file, text, new RefusedFiles());
      expect(r.ok, text).toBe(false);
    }
    expect(await fs.readFile(file, 'utf8')).toBe('{"keep":1}');
  });

  it('a failed write leaves the target whole and removes the temporary file', async () => {
    // The target is a folder, so the final rename fails after the temporary file was written.
    const target = path.join(dir, 'taken.lwj');
    await fs.mkdir(target);
    await fs.writeFile(path.join(target, 'inside.txt'), 'x');
    const r = await saveJobText(target, '{"a":1}', new RefusedFiles());
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.message).toMatch(/Could not save .*The file on disk is as it was/);
    expect(await listing()).toEqual(['taken.lwj']);
    expect(await fs.readFile(path.join(target, 'inside.txt'), 'utf8')).toBe('x');
  });

  it('a missing folder is reported, and nothing is created', async () => {
    const r = await saveJobText(path.join(dir, 'no-such-folder', 'a.lwj'), '{}', new RefusedFiles());
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.message).toMatch(/does not exist/);
    expect(await listing()).toEqual([]);
  });

  it('keeps the permissions of the file it replaces', async () => {
    const file = path.join(dir, 'shared.lwj');
    await fs.writeFile(file, '{}');
    await fs.chmod(file, 0o600);
    await writeFileAtomic(file, '{"b":2}');
    expect((await fs.stat(file)).mode & 0o777).toBe(0o600);
  });
});
