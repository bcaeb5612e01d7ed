// Print Test Sheets from the renderer: in the browser a print view of the test sheets alone (the
// sheets `report --test-sheet` writes, through engine/report's layoutReport with testSheet:
// 'only'), then the browser's print dialog; in the desktop app the job text goes to the main
// process (tests/main/print-test-sheet.test.ts prints it there).
import { readFileSync } from 'node:fs';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { analyse, CAUTION, layoutReport, parseJob, serialiseJob, sheetToSvg, type Job } from '../../engine/index.js';
import { fmtOhm, STATUS_WORD } from '../../engine/report/format.js';
import { buildPrintView, printSheets } from '../../app/renderer/io/print.js';
import { COMMANDS } from '../../app/renderer/commands/registry.js';
import { runCommand } from '../../app/renderer/commands/context.js';
import { useEditor } from '../../app/renderer/store/index.js';

const DEMO = readFileSync('assets/demo.lwj', 'utf8');
const s = () => useEditor.getState();

function load(text: string): Job {
  const loaded = parseJob(text);
  if (!loaded.ok) throw new Error('the job does not load');
  return loaded.job;
}

function withoutReadings(): Job {
  const file = JSON.parse(DEMO) as { nodes: Array<{ measured?: unknown }>; links: Array<{ measured?: unknown }> };
  for (const l of file.links) delete l.measured;
  for (const n of file.nodes) delete n.measured;
  return load(JSON.stringify(file));
}

let blobs: Map<string, Blob>;
let revoked: string[];
const realCreate = URL.createObjectURL;
const realRevoke = URL.revokeObjectURL;

beforeEach(() => {
  blobs = new Map();
  revoked = [];
  // jsdom has no object URLs: each one made is kept with its blob.
  URL.createObjectURL = (blob: Blob) => {
    const url = `blob:sheet-${blobs.size + 1}`;
    blobs.set(url, blob);
    return url;
  };
  URL.revokeObjectURL = (url: string) => void revoked.push(url);
});

afterEach(() => {
  URL.createObjectURL = realCreate;
  URL.revokeObjectURL = realRevoke;
  delete (window as unknown as { loopwright?: unknown }).loopwright;
  vi.restoreAllMocks();
  document.body.querySelectorAll('[data-print-view]').forEach((v) => v.remove());
});

function blobText(blob: Blob): Promise<string> {
  return new Promise((ok, fail) => {
    const reader = new FileReader();
    reader.onload = () => ok(String(reader.result));
    reader.onerror = () => fail(reader.error);
    reader.readAsText(blob);
  });
}

/** Builds the print view of the test sheets, as loaded images (jsdom loads none by itself). */
async function testSheetView(): Promise<{ view: HTMLElement; svgs: string[]; cleanUp: () => void }> {
  const pending = buildPrintView('test-sheets');
  const view = document.querySelector<HTMLElement>('[data-print-view]');
  if (!view) throw new Error('no print view');
  for (const img of view.querySelectorAll('img')) img.dispatchEvent(new Event('load'));
  const cleanUp = await pending;
  const svgs = await Promise.all([...view.querySelectorAll('img')].map((img) => blobText(blobs.get(img.getAttribute('src') ?? '') ?? new Blob())));
  return { view, svgs, cleanUp };
}

function unescape(t: string): string {
  return t.replace(/&lt;/g, '<').replace(/&gt;/g, '>').replace(/&quot;/g, '"').replace(/&apos;/g, "'").replace(/&amp;/g, '&');
}

/** A sheet's texts: line (y), bold or not, words. */
function texts(svg: string): Array<{ y: string; bold: boolean; text: string }> {
  return [...svg.matchAll(/<text x="[^"]*" y="([^"]*)"([^>]*)>([^<]*)<\/text>/g)].map((m) => ({
    y: m[1] ?? '', bold: /font-weight="bold"/.test(m[2] ?? ''), text: unescape(m[3] ?? ''),
  }));
}

/** The cells on the line of a circuit's bold link id, in drawing order (left to right). */
function row(svgs: string[], link: string): string[] | undefined {
  for (const svg of svgs) {
    const all = texts(svg);
    const id = all.find((t) => t.bold && t.text === link);
    if (id) return all.filter((t) => t.y === id.y).map((t) => t.text);
  }
  return undefined;
}

const closed = (svg: string): string => texts(svg).map((t) => t.text).join(' ').replace(/\s+/g, ' ');

describe('the browser\'s print view of the test sheets', () => {
  it('holds exactly the test sheets of the job, as report --test-sheet lays them out, and is taken down after', async () => {
    const job = load(DEMO);
    s().loadJob(job, { name: 'demo.lwj' });
    const expected = layoutReport(job, analyse(job), { paper: 'A3', orientation: 'landscape', testSheet: 'only' });
    expect(expected.length).toBeGreaterThan(0);
    expect(printSheets('test-sheets').map((x) => x.title)).toEqual(expected.map((x) => x.title));
    const { view, svgs, cleanUp } = await testSheetView();
    expect(view.getAttribute('data-print-view')).toBe('test-sheets');
    const imgs = [...view.querySelectorAll('img')];
    expect(imgs.map((i) => i.alt)).toEqual(expected.map((x) => x.title));
    expect(imgs.every((i) => i.getAttribute('data-sheet-kind') === 'test')).toBe(true);
    expect(svgs).toEqual(expected.map((x) => sheetToSvg(x)));
    cleanUp();
    expect(document.querySelector('[data-print-view]')).toBeNull();
    expect(revoked.sort()).toEqual([...blobs.keys()].sort());
  });

  it('with readings: every circuit\'s test limit as printed, each reading with its result, and the caution on every sheet', async () => {
    const job = load(DEMO);
    s().loadJob(job, { name: 'demo.lwj' });
    const { svgs, cleanUp } = await testSheetView();
    const results = analyse(job);
    expect(results.circuits.filter((c) => c.measured !== null).length).toBeGreaterThan(0);
    for (const c of results.circuits) {
      const cells = row(svgs, c.link);
      expect(cells, c.link).toBeDefined();
      expect(cells?.[5], c.link).toBe(c.testLimit === null ? '—' : fmtOhm(c.testLimit));
      if (c.measured !== null) {
        expect(cells, c.link).toContain(fmtOhm(c.measured.zs));
        expect(cells?.at(-1), c.link).toBe(STATUS_WORD[c.measured.status]);
      }
    }
    for (const svg of svgs) expect(closed(svg)).toContain(CAUTION.replace(/\s+/g, ' '));
    cleanUp();
  });

  it('without readings: the reading columns left blank to be filled in on site', async () => {
    const job = withoutReadings();
    s().loadJob(job, { name: 'demo.lwj' });
    const { svgs, cleanUp } = await testSheetView();
    const results = analyse(job);
    expect(results.circuits.every((c) => c.measured === null)).toBe(true);
    for (const c of results.circuits) {
      const cells = row(svgs, c.link) ?? [];
      expect(cells, c.link).toHaveLength(14);
      if (c.testLimit !== null) expect(cells[5], c.link).toBe(fmtOhm(c.testLimit));
      expect(cells.slice(7), c.link).toEqual(['', '', '', '', '', '', '']);
    }
    for (const svg of svgs) expect(closed(svg)).toContain(CAUTION.replace(/\s+/g, ' '));
    cleanUp();
  });
});

describe('the Print Test Sheets command', () => {
  it('sits beside Print in the File group and on the toolbar', () => {
    const ids = COMMANDS.map((c) => c.id);
    const command = COMMANDS.find((c) => c.id === 'file.printTestSheets');
    expect(command).toMatchObject({ group: 'file', label: 'Print Test Sheets…' });
    expect(command?.toolbar).toBeTruthy();
    expect(ids.indexOf('file.printTestSheets')).toBe(ids.indexOf('file.print') + 1);
  });

  it('in the browser, opens the print dialog over the test sheets and removes them afterwards', async () => {
    s().loadJob(load(DEMO), { name: 'demo.lwj' });
    const seen: Array<{ kind: string | null; titles: string[]; printing: boolean }> = [];
    // jsdom loads no images: each sheet is reported loaded as soon as it is added.
    const observer = new MutationObserver(() => {
      for (const img of document.querySelectorAll('[data-print-view] img')) img.dispatchEvent(new Event('load'));
    });
    observer.observe(document.body, { childList: true, subtree: true });
    const printed = new Promise<void>((done) => {
      vi.spyOn(window, 'print').mockImplementation(() => {
        const view = document.querySelector('[data-print-view]');
        seen.push({
          kind: view?.getAttribute('data-print-view') ?? null,
          titles: [...document.querySelectorAll<HTMLImageElement>('[data-print-view] img')].map((i) => i.alt),
          printing: document.body.classList.contains('lw-printing'),
        });
        done();
      });
    });
    expect(runCommand('file.printTestSheets')).toBe(true);
    await printed;
    observer.disconnect();
    expect(seen).toHaveLength(1);
    expect(seen[0]?.kind).toBe('test-sheets');
    expect(seen[0]?.printing).toBe(true);
    expect(seen[0]?.titles.length).toBeGreaterThan(0);
    expect(seen[0]?.titles.every((t) => t.startsWith('Test sheet: '))).toBe(true);
    await vi.waitFor(() => expect(document.querySelector('[data-print-view]')).toBeNull());
    expect(document.body.classList.contains('lw-printing')).toBe(false);
  });

  it('in the desktop app, sends the job text to the main process and builds no print view', async () => {
    const job = load(DEMO);
    s().loadJob(job, { name: 'demo.lwj' });
    const printTestSheets = vi.fn(async () => true);
    const print = vi.spyOn(window, 'print').mockImplementation(() => undefined);
    (window as unknown as { loopwright: unknown }).loopwright = { printTestSheets };
    const { printTestSheets: run } = await import('../../app/renderer/io/print.js');
    await run();
    expect(printTestSheets).toHaveBeenCalledTimes(1);
    expect(printTestSheets).toHaveBeenCalledWith(serialiseJob(s().job));
    expect(print).not.toHaveBeenCalled();
    expect(document.querySelector('[data-print-view]')).toBeNull();
  });

  it('says there is nothing to print for a job with no circuit, and prints nothing', async () => {
    const file = JSON.parse(DEMO) as { nodes: Array<{ kind: string }>; links: unknown[] };
    file.links = [];
    file.nodes = file.nodes.filter((n) => n.kind === 'supply');
    s().loadJob(load(JSON.stringify(file)), { name: 'empty.lwj' });
    const print = vi.spyOn(window, 'print').mockImplementation(() => undefined);
    const { printTestSheets: run } = await import('../../app/renderer/io/print.js');
    await run();
    expect(print).not.toHaveBeenCalled();
    expect(s().message?.text).toMatch(/No test sheets to print: the job has no circuit yet/);
  });
});
