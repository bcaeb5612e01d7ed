// The desktop print view accepts any name: a link named `Feed one=main` once made Print refuse
// the job, because the check for inline event handlers matched the escaped text of the sheet.
// The check now reads only the markup. Run end to end against the Electron stand-in.
import { promises as fs } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import * as fake from './fake-electron.js';

vi.mock('electron', async () => await import('./fake-electron.js'));

const { app, BrowserWindow, dialog, eventFrom, ipcMain } = fake;
const { inlineSvg, unsafeSheetMarkup } = await import('../../app/main/print-page.js');
const DEMO = path.resolve('assets/demo.lwj');
let tmp: string;
let win: fake.BrowserWindow;

async function invoke(channel: string, w: fake.BrowserWindow, ...args: unknown[]): Promise<unknown> {
  const handler = ipcMain.handlers.get(channel);
  if (!handler) throw new Error(`no handler for ${channel}`);
  return handler(eventFrom(w), ...args);
}

beforeAll(async () => {
  tmp = await fs.mkdtemp(path.join(os.tmpdir(), 'loopwright-print-'));
  app.userData = path.join(tmp, 'user-data');
  app.documents = tmp;
  app.appPath = path.resolve('.');
  await import('../../app/main/main.js');
  app.makeReady();
  for (let i = 0; i < 50 && BrowserWindow.all.length === 0; i++) await new Promise((r) => setTimeout(r, 20));
  const first = BrowserWindow.all[0];
  if (!first) throw new Error('no window was opened at start');
  win = first;
  win.webContents.finishLoad(`file://${path.resolve('dist/renderer/index.html')}`);
});

afterAll(async () => {
  await fs.rm(tmp, { recursive: true, force: true });
});

/** The demo with hostile names on its links and title. */
async function hostileDemo(): Promise<string> {
  const file = JSON.parse(await fs.readFile(DEMO, 'utf8')) as { job: { title: string }; links: Array<{ name?: string }> };
  const names = ['Feed one=main', 'x onclick=alert(1)', '<script>alert(1)</script>', '\u001b[31mred\u0000', '=SUM(A1)', "it's \"quoted\" & <b>"];
  file.links.forEach((l, i) => {
    l.name = names[i % names.length];
  });
  file.job.title = 'Title <svg onload=alert(1)>\u0007';
  return JSON.stringify(file);
}

describe('the print view', () => {
  it('prints a job whose names look like markup or event handlers, escaped, with no control character', async () => {
    dialog.messages.length = 0;
    const windows = BrowserWindow.all.length;
    expect(await invoke('loopwright:print', win, await hostileDemo())).toBe(true);
    expect(dialog.messages).toEqual([]);
    const html = BrowserWindow.all[windows]?.loadedText ?? '';
    expect(html).toContain('Feed one=main');
    expect(html).toContain('&lt;script&gt;');
    expect(html).not.toMatch(/<script/i);
    expect(html).not.toMatch(/[\u0000-\u0009\u000b-\u001f\u007f-\u009f]/);
    expect(html).toMatch(/<title>Title &lt;svg onload=alert\(1\)&gt;<\/title>/);
  });

  it('still refuses markup that would run or load something', () => {
    expect(() => inlineSvg('<svg><script>alert(1)</script></svg>')).toThrow(/<script> element/);
    expect(() => inlineSvg('<svg><rect onload="x()"/></svg>')).toThrow(/inline event handler \(onload\)/);
    expect(() => inlineSvg('<svg><rect x="1" ONCLICK = \'x()\'/></svg>')).toThrow(/event handler/);
    expect(() => inlineSvg('<svg><foreignObject><div/></foreignObject></svg>')).toThrow(/<foreignObject>/);
    expect(() => inlineSvg('<svg><a href="https://example.invalid"><text>x</text></a></svg>')).toThrow(/<a> element/);
    expect(() => inlineSvg('<svg><text style="x">y</text></svg>')).toThrow(/style attribute/);
    expect(() => inlineSvg('<svg><!-- <script> --></svg>')).toThrow(/comment/);
  });

  it('text and attribute values are never read as markup', () => {
    expect(unsafeSheetMarkup('<svg><text x="1">Feed one=main onload=x()</text></svg>')).toBeNull();
    expect(unsafeSheetMarkup('<svg><title>a onclick=b</title><rect fill="#fff" data=" onload=x"/></svg>')).toBeNull();
  });
});
