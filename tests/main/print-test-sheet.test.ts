// File > Print Test Sheets in the desktop app: the main process checks the job again and prints
// the test sheets alone, the same sheets `report --test-sheet` writes (engine/report's
// layoutReport with testSheet: 'only'), from a hidden window with scripts off. Run against the
// Electron stand-in (tests/main/fake-electron.ts).
import { promises as fs } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import * as fake from './fake-electron.js';

vi.mock('electron', async () => await import('./fake-electron.js'));

const { app, BrowserWindow, dialog, eventFrom, ipcMain } = fake;
const { analyse, CAUTION, layoutReport, parseJob, sheetToSvg } = await import('../../engine/index.js');
const { fmtOhm, STATUS_WORD } = await import('../../engine/report/format.js');
const { inlineSvg } = await import('../../app/main/print-page.js');
const DEMO = path.resolve('assets/demo.lwj');
let tmp: string;
let win: fake.BrowserWindow;
let demoText: string;

async function invoke(channel: string, w: fake.BrowserWindow, ...args: unknown[]): Promise<unknown> {
  const handler = ipcMain.handlers.get(channel);
  if (!handler) throw new Error(`no handler for ${channel}`);
  return handler(eventFrom(w), ...args);
}

beforeAll(async () => {
  tmp = await fs.mkdtemp(path.join(os.tmpdir(), 'loopwright-print-tests-'));
  app.userData = path.join(tmp, 'user-data');
  app.documents = tmp;
  app.appPath = path.resolve('.');
  demoText = await fs.readFile(DEMO, 'utf8');
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

function unescape(s: string): string {
  return s.replace(/&lt;/g, '<').replace(/&gt;/g, '>').replace(/&quot;/g, '"').replace(/&apos;/g, "'").replace(/&amp;/g, '&');
}

interface PrintedText { y: string; bold: boolean; text: string }

/** Each inline sheet of a print page, with its texts in drawing order. */
function printedSheets(html: string): Array<{ svg: string; title: string; texts: PrintedText[] }> {
  return [...html.matchAll(/<svg [\s\S]*?<\/svg>/g)].map((m) => ({
    svg: m[0],
    title: unescape(/<title>([^<]*)<\/title>/.exec(m[0])?.[1] ?? ''),
    texts: [...m[0].matchAll(/<text x="[^"]*" y="([^"]*)"([^>]*)>([^<]*)<\/text>/g)].map((t) => ({
      y: t[1] ?? '', bold: /font-weight="bold"/.test(t[2] ?? ''), text: unescape(t[3] ?? ''),
    })),
  }));
}

/** The cells of a circuit's row: the texts on the line of its bold link id, left to right. */
function rowOf(sheets: ReturnType<typeof printedSheets>, link: string): string[] | undefined {
  for (const s of sheets) {
    const id = s.texts.find((t) => t.bold && t.text === link);
    if (id) return s.texts.filter((t) => t.y === id.y).map((t) => t.text);
  }
  return undefined;
}

/** Prints `text`'s test sheets; the print window it used. */
async function printTests(text: string, ...paper: unknown[]): Promise<fake.BrowserWindow> {
  dialog.messages.length = 0;
  const windows = BrowserWindow.all.length;
  expect(await invoke('loopwright:print-test-sheets', win, text, ...paper)).toBe(true);
  expect(dialog.messages).toEqual([]);
  const printer = BrowserWindow.all[windows];
  if (!printer) throw new Error('no print window');
  return printer;
}

function demo(): import('../../engine/index.js').Job {
  const loaded = parseJob(demoText);
  if (!loaded.ok) throw new Error('the demo does not load');
  return loaded.job;
}

/** The demo with every reading taken out. */
function demoWithoutReadings(): string {
  const file = JSON.parse(demoText) as { nodes: Array<{ measured?: unknown }>; links: Array<{ measured?: unknown }> };
  for (const l of file.links) delete l.measured;
  for (const n of file.nodes) delete n.measured;
  return JSON.stringify(file);
}

describe('Print Test Sheets (desktop)', () => {
  it('prints the sheets report --test-sheet writes, and nothing else, from a hidden window with scripts off', async () => {
    const printer = await printTests(demoText);
    expect(printer.options.show).toBe(false);
    expect(printer.options.webPreferences).toMatchObject({ javascript: false, sandbox: true, contextIsolation: true, nodeIntegration: false });
    expect(printer.isDestroyed()).toBe(true);
    const html = printer.loadedText ?? '';
    expect(html).not.toMatch(/<script/i);
    const job = demo();
    const expected = layoutReport(job, analyse(job), { testSheet: 'only' });
    expect(expected.length).toBeGreaterThan(0);
    expect(expected.every((s) => s.kind === 'test')).toBe(true);
    const printed = printedSheets(html);
    expect(printed.map((p) => p.svg)).toEqual(expected.map((s) => inlineSvg(sheetToSvg(s))));
    expect(printed.every((p) => p.title.startsWith('Test sheet: '))).toBe(true);
    expect(html).toContain(`<title>Test sheets: ${job.job.title}</title>`);
    // A3 landscape, as the command line: 297 × 420 mm (ISO 216), in microns.
    expect(printer.webContents.printed[0]).toMatchObject({ silent: false, landscape: true, pageSize: { width: 297000, height: 420000 } });
  });

  it('with readings: every circuit\'s test limit as printed, the readings and their results, the method and the caution on every sheet', async () => {
    const printer = await printTests(demoText);
    const sheets = printedSheets(printer.loadedText ?? '');
    const results = analyse(demo());
    const withReading = results.circuits.filter((c) => c.measured !== null);
    expect(withReading.map((c) => c.link).sort()).toEqual(['C01', 'K04', 'W03']);
    for (const c of results.circuits) {
      const row = rowOf(sheets, c.link);
      expect(row, c.link).toBeDefined();
      expect(row).toContain(c.testLimit === null ? '—' : fmtOhm(c.testLimit));
      if (c.measured !== null) {
        expect(row, c.link).toContain(fmtOhm(c.measured.zs));
        expect(row, c.link).toContain(fmtOhm(c.measured.corrected));
        expect(row, c.link).toContain(STATUS_WORD[c.measured.status]);
      }
    }
    // The demo's K04 passes by design, but its reading fails (assets/demo.lwj notes).
    const k04 = results.circuits.find((c) => c.link === 'K04');
    expect(k04?.measured?.status).toBe('fail');
    expect(rowOf(sheets, 'K04')).toContain(STATUS_WORD.fail);
    expect(rowOf(sheets, 'K04')).toContain('2026-11-21');
    for (const s of sheets) {
      const words = s.texts.map((t) => t.text).join(' ').replace(/\s+/g, ' ');
      expect(words, s.title).toContain(CAUTION.replace(/\s+/g, ' '));
      expect(words, s.title).toContain('Method of correction: ');
    }
  });

  it('without readings: blank columns for the reading, its temperature, date, instrument and result', async () => {
    const text = demoWithoutReadings();
    const printer = await printTests(text);
    const sheets = printedSheets(printer.loadedText ?? '');
    const heads = sheets.flatMap((s) => s.texts.filter((t) => t.bold).map((t) => t.text));
    for (const head of ['Zs measured (Ω)', 'Temp. (°C)', 'Date', 'Instrument', 'Result']) expect(heads).toContain(head);
    const loaded = parseJob(text);
    if (!loaded.ok) throw new Error('the demo without readings does not load');
    const results = analyse(loaded.job);
    expect(results.circuits.some((c) => c.testLimit !== null)).toBe(true);
    for (const c of results.circuits) {
      const row = rowOf(sheets, c.link) ?? [];
      // Link, circuit, to, device, cable, test limit, its temperature; then seven cells left blank.
      expect(row, c.link).toHaveLength(14);
      expect(row.slice(7), c.link).toEqual(['', '', '', '', '', '', '']);
      if (c.testLimit !== null) expect(row[5], c.link).toBe(fmtOhm(c.testLimit));
      if (c.testLimit !== null) expect(row[6], c.link).toBe('20'); // no reading: stated at 20 °C
    }
    for (const s of sheets) expect(s.texts.map((t) => t.text).join(' ').replace(/\s+/g, ' ')).toContain(CAUTION.replace(/\s+/g, ' '));
  });

  it('on the paper asked for', async () => {
    const printer = await printTests(demoText, { size: 'A4', orientation: 'portrait' });
    // A4 portrait: 210 × 297 mm (ISO 216).
    expect(printer.webContents.printed[0]).toMatchObject({ landscape: false, pageSize: { width: 210000, height: 297000 } });
  });

  it('refuses a job with problems, saying where, and prints nothing', async () => {
    dialog.messages.length = 0;
    const windows = BrowserWindow.all.length;
    expect(await invoke('loopwright:print-test-sheets', win, demoText.replace(/"length": [0-9.]+/, '"length": -1'))).toBe(false);
    expect(String(dialog.messages[0]?.message)).toMatch(/cannot be printed/);
    expect(String(dialog.messages[0]?.detail)).toMatch(/length/);
    expect(BrowserWindow.all.length).toBe(windows);
  });

  it('says so when the job has no circuit to test', async () => {
    dialog.messages.length = 0;
    const windows = BrowserWindow.all.length;
    const file = JSON.parse(demoText) as { nodes: Array<{ kind: string }>; links: unknown[] };
    file.links = [];
    file.nodes = file.nodes.filter((n) => n.kind === 'supply');
    expect(await invoke('loopwright:print-test-sheets', win, JSON.stringify(file))).toBe(false);
    expect(String(dialog.messages[0]?.message)).toBe('There are no test sheets to print.');
    expect(BrowserWindow.all.length).toBe(windows);
  });

  it('refuses arguments that are not a job text and a paper', async () => {
    await expect(invoke('loopwright:print-test-sheets', win, 5)).rejects.toThrow(/printTestSheets: job text/);
    await expect(invoke('loopwright:print-test-sheets', win, demoText, { size: 'A5', orientation: 'portrait' })).rejects.toThrow(/printTestSheets/);
  });
});
