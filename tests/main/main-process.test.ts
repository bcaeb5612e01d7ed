// The main process run end to end against a stand-in for Electron (tests/main/fake-electron.ts):
// start-up opens the demo untitled, IPC from anything but our page is refused, save and open go
// through the file rules, the menu comes from the renderer's commands, and closing with unsaved
// changes asks first.
import { promises as fs } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import * as fake from './fake-electron.js';

vi.mock('electron', async () => await import('./fake-electron.js'));

const { app, BrowserWindow, dialog, eventFrom, ipcMain, Menu } = fake;
const DEMO = path.resolve('assets/demo.lwj');
let tmp: string;
let demoText: string;
let win: fake.BrowserWindow;

const indexUrl = (): string => `file://${path.resolve('dist/renderer/index.html')}`;

async function invoke(channel: string, w: fake.BrowserWindow, ...args: unknown[]): Promise<unknown> {
  const handler = ipcMain.handlers.get(channel);
  if (!handler) throw new Error(`no handler for ${channel}`);
  return handler(eventFrom(w), ...args);
}
function send(channel: string, w: fake.BrowserWindow, ...args: unknown[]): void {
  const listener = ipcMain.listeners.get(channel);
  if (!listener) throw new Error(`no listener for ${channel}`);
  listener(eventFrom(w), ...args);
}
const settle = (): Promise<void> => new Promise((r) => setTimeout(r, 20));

beforeAll(async () => {
  tmp = await fs.mkdtemp(path.join(os.tmpdir(), 'loopwright-main-'));
  app.userData = path.join(tmp, 'user-data');
  app.documents = tmp;
  app.appPath = path.resolve('.');
  demoText = await fs.readFile(DEMO, 'utf8');
  await import('../../app/main/main.js');
  app.makeReady();
  for (let i = 0; i < 50 && BrowserWindow.all.length === 0; i++) await settle();
  const first = BrowserWindow.all[0];
  if (!first) throw new Error('no window was opened at start');
  win = first;
  win.webContents.finishLoad(indexUrl());
  win.focus();
  app.emit('browser-window-focus');
});

afterAll(async () => {
  await fs.rm(tmp, { recursive: true, force: true });
});

describe('start-up', () => {
  it('opens one locked-down window on our page', () => {
    expect(BrowserWindow.all).toHaveLength(1);
    expect(win.loaded).toBe(indexUrl());
    expect(win.options.webPreferences).toMatchObject({ contextIsolation: true, sandbox: true, nodeIntegration: false, webSecurity: true });
    expect(win.webContents.openHandler?.({ url: 'https://example.com' })).toEqual({ action: 'deny' });
  });

  it('hands the demo job to the page, untitled so the demo is never saved over', () => {
    const opened = win.webContents.sent.filter((s) => s.channel === 'loopwright:open-file');
    expect(opened).toHaveLength(1);
    expect(opened[0]?.args[0]).toEqual({ path: null, name: 'Demo (untitled)', text: demoText });
    expect(win.title).toBe('Demo (untitled) — Loopwright');
  });

  it('grants the page no permissions', () => {
    let granted: unknown = 'unset';
    fake.session.defaultSession.permissionHandler?.(null, 'media', (v: unknown) => (granted = v));
    expect(granted).toBe(false);
  });

  it('sends the strict CSP with our pages', () => {
    let answer: unknown = null;
    fake.session.defaultSession.headerHook?.({ url: indexUrl(), responseHeaders: { 'content-security-policy': ['default-src *'] } }, (r) => (answer = r));
    const headers = (answer as { responseHeaders: Record<string, string[]> }).responseHeaders;
    expect(headers['content-security-policy']).toBeUndefined();
    expect(headers['Content-Security-Policy']?.[0]).toMatch(/^default-src 'self'/);
  });
});

describe('IPC from a page that is not ours', () => {
  it('is refused when the window has navigated away', async () => {
    win.webContents.url = 'https://evil.example/';
    try {
      await expect(invoke('loopwright:open-job', win)).rejects.toThrow(/not ours/);
      await expect(invoke('loopwright:save-job', win, '{}', null, true)).rejects.toThrow(/not ours/);
    } finally {
      win.webContents.url = indexUrl();
    }
  });

  it('is refused from a sub-frame and from a window that is not a job window', async () => {
    const handler = ipcMain.handlers.get('loopwright:open-job');
    if (!handler) throw new Error('no open handler');
    await expect(Promise.resolve(handler({ sender: win.webContents, senderFrame: { url: indexUrl(), parent: {} }}))).rejects.toThrow(/sub-frame/);
    const stranger = new fake.FakeWebContents();
    stranger.url = indexUrl();
    await expect(Promise.resolve(handler({ sender: stranger, senderFrame: stranger.mainFrame }))).rejects.toThrow(/not a Loopwright window/);
  });

  it('bad arguments are refused before anything happens', async () => {
    await expect(invoke('loopwright:save-job', win, 42, null, true)).rejects.toThrow(/job text must be a string/);
    await expect(invoke('loopwright:save-job', win, '{}', '/etc/cron.d/x.lwj', false)).rejects.toThrow(/not the file this window has open/);
    await expect(invoke('loopwright:open-job', win, '/etc/passwd')).rejects.toThrow(/expected 0/);
    await expect(invoke('loopwright:export-pdf', win, '{}', { size: 'A0', orientation: 'portrait' })).rejects.toThrow(/paper.size/);
  });
});

describe('saving and opening', () => {
  it('Save of the untitled demo asks where, writes there and remembers the file', async () => {
    const target = path.join(tmp, 'yard');
    dialog.saveAnswers.push({ canceled: false, filePath: target });
    const saved = await invoke('loopwright:save-job', win, demoText, null, false);
    expect(saved).toEqual({ path: `${target}.lwj`, name: 'yard.lwj' });
    expect(await fs.readFile(`${target}.lwj`, 'utf8')).toBe(demoText);
    expect(await fs.readFile(DEMO, 'utf8')).toBe(demoText);
    expect(win.title).toBe('yard.lwj — Loopwright');
    expect(app.recentDocuments).toContain(`${target}.lwj`);
    const again = await invoke('loopwright:save-job', win, demoText.replace('"revision": "A"', '"revision": "B"'), `${target}.lwj`, false);
    expect(again).toEqual({ path: `${target}.lwj`, name: 'yard.lwj' });
    expect(await fs.readFile(`${target}.lwj`, 'utf8')).toContain('"revision": "B"');
  });

  it('Open of a bad file shows its problems, opens nothing, and Save As will not write over it', async () => {
    const bad = path.join(tmp, 'bad.lwj');
    const badText = demoText.replace(/"length": [0-9.]+/, '"length": -5');
    expect(badText).not.toBe(demoText);
    await fs.writeFile(bad, badText);
    const windows = BrowserWindow.all.length;
    dialog.openAnswers.push({ canceled: false, filePaths: [bad] });
    dialog.messages.length = 0;
    expect(await invoke('loopwright:open-job', win)).toBeNull();
    expect(BrowserWindow.all).toHaveLength(windows);
    expect(String(dialog.messages[0]?.message)).toMatch(/bad\.lwj was not opened/);
    expect(String(dialog.messages[0]?.detail)).toMatch(/cable\.length/);
    dialog.saveAnswers.push({ canceled: false, filePath: bad });
    dialog.messages.length = 0;
    expect(await invoke('loopwright:save-job', win, demoText, path.join(tmp, 'yard.lwj'), true)).toBeNull();
    expect(String(dialog.messages[0]?.detail)).toMatch(/will not be written over/);
    expect(await fs.readFile(bad, 'utf8')).toBe(badText);
  });

  it('Open of a good file from a window that has a file of its own opens a new window', async () => {
    const other = path.join(tmp, 'other.lwj');
    await fs.writeFile(other, demoText);
    dialog.openAnswers.push({ canceled: false, filePaths: [other] });
    expect(await invoke('loopwright:open-job', win)).toBeNull();
    const newest = BrowserWindow.all[BrowserWindow.all.length - 1];
    expect(newest).not.toBe(win);
    newest?.webContents.finishLoad(indexUrl());
    expect(newest?.webContents.sent.find((s) => s.channel === 'loopwright:open-file')?.args[0]).toEqual({ path: other, name: 'other.lwj', text: demoText });
    newest?.destroy();
  });
});

describe('the menu', () => {
  const commands = [
    { id: 'file.open', label: 'Open…', accelerator: 'CmdOrCtrl+O', enabled: true, menu: 'file' },
    { id: 'edit.undo', label: 'Undo', accelerator: 'CmdOrCtrl+Z', enabled: false, menu: 'edit' },
    { id: 'view.fit', label: 'Zoom to Fit', accelerator: 'Shift+1', enabled: true, menu: 'view' },
  ];
  type Item = { id?: string; label?: string; role?: string; enabled?: boolean; submenu?: Item[]; click?: (i: unknown, w: unknown) => void };
  const flat = (items: Item[]): Item[] => items.flatMap((i) => [i, ...flat(i.submenu ?? [])]);

  it('is built from the commands the page sends, and a click sends the id back on `command`', () => {
    send('loopwright:set-menu', win, commands);
    const items = flat((Menu.current ?? []) as Item[]);
    const fit = items.find((i) => i.id === 'command:view.fit');
    expect(fit?.label).toBe('Zoom to Fit');
    expect(items.find((i) => i.id === 'command:edit.undo')?.enabled).toBe(false);
    expect(items.some((i) => i.role === 'undo')).toBe(false); // the page's Undo has the shortcut
    expect(items.some((i) => i.role === 'copy')).toBe(true); // text fields keep copy
    win.webContents.sent.length = 0;
    fit?.click?.(null, win);
    expect(win.webContents.sent).toEqual([{ channel: 'command', args: ['view.fit'] }]);
  });

  it('ignores a bad command list and keeps the last good one', () => {
    send('loopwright:set-menu', win, [{ ...commands[0], id: 'file.open', accelerator: 'Hyper+O' }]);
    const items = flat((Menu.current ?? []) as Item[]);
    expect(items.some((i) => i.id === 'command:view.fit')).toBe(true);
  });

  it('lists recent files in Open Recent', () => {
    const items = flat((Menu.current ?? []) as Item[]);
    const recent = items.find((i) => i.id === 'main:recent');
    expect(recent?.submenu?.some((i) => i.label?.includes('yard.lwj'))).toBe(true);
  });
});

describe('printout', () => {
  it('Export PDF writes the printout where the user chooses', async () => {
    const target = path.join(tmp, 'yard-printout');
    dialog.saveAnswers.push({ canceled: false, filePath: target });
    const saved = await invoke('loopwright:export-pdf', win, demoText, { size: 'A4', orientation: 'landscape' });
    expect(saved).toEqual({ path: `${target}.pdf`, name: 'yard-printout.pdf' });
    const bytes = await fs.readFile(`${target}.pdf`);
    expect(bytes.subarray(0, 5).toString('latin1')).toBe('%PDF-');
    // A4 landscape is 842 × 595 pt (ISO 216: 297 × 210 mm).
    expect(bytes.toString('latin1')).toMatch(/\/MediaBox \[0 0 841\.8[0-9]* 595\.2[0-9]*\]/);
    // Exported again over it: the earlier printout is kept beside it.
    dialog.saveAnswers.push({ canceled: false, filePath: `${target}.pdf` });
    expect(await invoke('loopwright:export-pdf', win, demoText, { size: 'A4', orientation: 'landscape' })).toEqual(saved);
    expect(await fs.readFile(`${target}.pdf.bak`)).toEqual(bytes);
  });

  it('Export PDF of a job with problems says so and writes nothing', async () => {
    dialog.messages.length = 0;
    const before = await fs.readdir(tmp);
    expect(await invoke('loopwright:export-pdf', win, demoText.replace(/"length": [0-9.]+/, '"length": -1'))).toBeNull();
    expect(String(dialog.messages[0]?.message)).toMatch(/cannot be exported/);
    expect(await fs.readdir(tmp)).toEqual(before);
  });

  it('Print sends every sheet, as SVG, to the printer from a hidden window with scripts off', async () => {
    const windows = BrowserWindow.all.length;
    expect(await invoke('loopwright:print', win, demoText)).toBe(true);
    const printer = BrowserWindow.all[windows];
    if (!printer) throw new Error('no print window');
    expect(printer.options.show).toBe(false);
    expect(printer.options.webPreferences).toMatchObject({ javascript: false, sandbox: true, contextIsolation: true, nodeIntegration: false });
    expect(printer.isDestroyed()).toBe(true);
    const html = printer.loadedText ?? '';
    const { analyse, parseJob } = await import('../../engine/index.js');
    const { layoutReport } = await import('../../engine/report/index.js');
    const loaded = parseJob(demoText);
    if (!loaded.ok) throw new Error('demo does not load');
    const sheets = layoutReport(loaded.job, analyse(loaded.job));
    expect(html.match(/<svg /g)?.length).toBe(sheets.length);
    expect(html).not.toMatch(/<script/i);
    expect(printer.webContents.printed[0]).toMatchObject({ silent: false, landscape: true, pageSize: { width: 297000, height: 420000 } });
  });
});

describe('closing', () => {
  function answerClose(reply: { dirty: boolean; text: string } | null): void {
    const request = win.webContents.sent.find((s) => s.channel === 'loopwright:close-request');
    if (!request) throw new Error('the page was not asked');
    send('loopwright:close-reply', win, request.args[0], reply);
  }

  it('with unsaved changes asks, and Cancel keeps the window', async () => {
    win.webContents.sent.length = 0;
    dialog.messages.length = 0;
    dialog.messageAnswers.push(2); // Cancel
    win.close();
    answerClose({ dirty: true, text: demoText });
    await settle();
    expect(dialog.messages[0]?.buttons).toEqual(['Save', "Don't Save", 'Cancel']);
    expect(win.isDestroyed()).toBe(false);
  });

  it('a reply with a token that was never issued is ignored', async () => {
    win.webContents.sent.length = 0;
    dialog.messageAnswers.push(2);
    win.close();
    send('loopwright:close-reply', win, 'not-a-real-token', { dirty: false, text: '' });
    await settle();
    expect(win.isDestroyed()).toBe(false);
    answerClose({ dirty: true, text: demoText });
    await settle();
    expect(win.isDestroyed()).toBe(false);
  });

  it('Save saves to the window\'s file and then closes', async () => {
    win.webContents.sent.length = 0;
    dialog.messageAnswers.push(0); // Save
    win.close();
    answerClose({ dirty: true, text: demoText.replace('"revision": "A"', '"revision": "C"') });
    for (let i = 0; i < 20 && !win.isDestroyed(); i++) await settle();
    expect(win.isDestroyed()).toBe(true);
    expect(await fs.readFile(path.join(tmp, 'yard.lwj'), 'utf8')).toContain('"revision": "C"');
  });
});
