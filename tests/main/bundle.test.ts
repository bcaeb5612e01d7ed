// The main process as it ships: the esbuild CommonJS bundle (scripts/build.mjs), loaded in Node
// with the Electron stand-in. Catches what only the bundle can get wrong: a module that does not
// survive CommonJS, pdfkit and the fonts found at run time, the preload requiring only electron.
import { promises as fs } from 'node:fs';
import Module, { createRequire } from 'node:module';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import * as fake from './fake-electron.js';

const repo = path.resolve('.');
let out: string;
let tmp: string;

beforeAll(async () => {
  // Inside the repository (tmp/ is ignored by git) so the bundle finds node_modules as it would.
  await fs.mkdir(path.join(repo, 'tmp'), { recursive: true });
  out = await fs.mkdtemp(path.join(repo, 'tmp', 'bundle-'));
  tmp = await fs.mkdtemp(path.join(os.tmpdir(), 'loopwright-bundle-'));
  const { buildShell } = (await import(path.join(repo, 'scripts/build.mjs'))) as { buildShell(outRoot: string): Promise<void> };
  await buildShell(out);
});

afterAll(async () => {
  await fs.rm(out, { recursive: true, force: true });
  await fs.rm(tmp, { recursive: true, force: true });
});

describe('the built main process', () => {
  it('the preload bundle requires nothing but electron', async () => {
    const text = await fs.readFile(path.join(out, 'preload/preload.cjs'), 'utf8');
    const required = [...text.matchAll(/require\("([^"]+)"\)/g)].map((m) => m[1]);
    expect([...new Set(required)]).toEqual(['electron']);
  });

  it('starts, opens the demo and exports a PDF from inside the bundle', async () => {
    fake.app.userData = path.join(tmp, 'user-data');
    fake.app.documents = tmp;
    fake.app.appPath = repo;
    const load = (Module as unknown as { _load: (request: string, ...rest: unknown[]) => unknown })._load;
    (Module as unknown as { _load: typeof load })._load = (request, ...rest) => (request === 'electron' ? fake : load(request, ...rest));
    try {
      createRequire(import.meta.url)(path.join(out, 'main/main.cjs'));
      fake.app.makeReady();
      for (let i = 0; i < 100 && fake.BrowserWindow.all.length === 0; i++) await new Promise((r) => setTimeout(r, 20));
      const win = fake.BrowserWindow.all[0];
      if (!win) throw new Error('the bundle opened no window');
      win.webContents.finishLoad(`file://${path.join(repo, 'dist/renderer/index.html')}`);
      expect(win.webContents.sent.find((s) => s.channel === 'loopwright:open-file')?.args[0]).toMatchObject({ path: null });
      const target = path.join(tmp, 'bundle.pdf');
      fake.dialog.saveAnswers.push({ canceled: false, filePath: target });
      const handler = fake.ipcMain.handlers.get('loopwright:export-pdf');
      const demo = await fs.readFile(path.join(repo, 'assets/demo.lwj'), 'utf8');
      expect(await handler?.(fake.eventFrom(win), demo)).toEqual({ path: target, name: 'bundle.pdf' });
      expect((await fs.readFile(target)).subarray(0, 5).toString('latin1')).toBe('%PDF-');
    } finally {
      (Module as unknown as { _load: typeof load })._load = load;
    }
  });
});
