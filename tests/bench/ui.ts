// The browser benchmark (part of `npm run bench`): the renderer built into a folder of its own,
// served locally, driven in headless Chromium on a generated 2,000-circuit job (invented data).
// Reports how long opening, selecting and centring, a length edit and undo take until their
// outcome is on screen, and the main thread's work in each frame while dragging a node (the
// median frame judged, the frame gaps beside it); flags anything over target.
// A benchmark, never a test: nothing here runs under vitest.
//
//   LOOPWRIGHT_BENCH_DIST=dir   reuse a renderer already built into dir (skips the build)
//   LOOPWRIGHT_BENCH_SIZE=n     circuits in the generated job (default 2000)
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import type { Server } from 'node:http';
import { chromium, type CDPSession, type Page } from 'playwright-core';
import { serialiseJob } from '../../engine/index.js';
import { CHROMIUM_ARGS, chromiumPath } from '../e2e/harness.js';
import { generateJob } from './generate.js';
import { workPerFrame, type TraceEvent } from './frames.js';
import { clickScript, measureScript, openScript, START_FRAME_LOG, STOP_FRAME_LOG, typeScript, type Timing } from './ui-page.js';

const root = resolve(fileURLToPath(new URL('../..', import.meta.url)));

/** Targets (issue 12) on this machine kind (2 cores, headless Chromium, software rendering):
 *  the job interactive within 2 s of opening, a typed length changing the circuit's status
 *  within 100 ms, a drag's median frame under 16 ms of main-thread work. Selecting and undo: 300 ms (ours). */
export const UI_TARGETS = { open: 2000, select: 300, edit: 100, undo: 300, dragFrameWork: 16 };

async function buildRenderer(): Promise<{ dir: string; cleanup(): void }> {
  const given = process.env.LOOPWRIGHT_BENCH_DIST;
  if (given) return { dir: resolve(given), cleanup: () => undefined };
  const dir = mkdtempSync(join(tmpdir(), 'loopwright-bench-'));
  const { build } = await import('vite');
  await build({ configFile: join(root, 'vite.config.ts'), logLevel: 'warn', build: { outDir: dir, emptyOutDir: true } });
  return { dir, cleanup: () => rmSync(dir, { recursive: true, force: true }) };
}

function line(label: string, t: Timing, target: number | null): boolean {
  const over = target !== null && t.ms > target;
  const note = over ? `  over target (${target} ms)` : '';
  console.log(`${label.padEnd(44)} ${t.ms.toFixed(0).padStart(8)} ms   settled ${t.settledMs.toFixed(0).padStart(6)} ms, worst frame ${t.worstFrameMs.toFixed(0)} ms${note}`);
  return over;
}

async function measure(page: Page, action: string, until: string): Promise<Timing> {
  return (await page.evaluate(measureScript(action, until))) as Timing;
}

function attr(page: Page, selector: string, name: string): Promise<string | null> {
  return page.evaluate(`document.querySelector(${JSON.stringify(selector)})?.getAttribute(${JSON.stringify(name)}) ?? null`) as Promise<string | null>;
}

/** The gaps between frames drawn during a drag, and the main thread's work in each frame. */
interface DragResult { gaps: number[]; work: number[] }

async function drag(page: Page): Promise<DragResult | null> {
  const box = await page.evaluate(`(() => {
    const sheet = document.querySelector('[data-sheet]').getBoundingClientRect();
    const nodes = [...document.querySelectorAll('.react-flow__node[data-id^="P"]')].map((n) => n.getBoundingClientRect())
      .filter((r) => r.top > sheet.top + 40 && r.bottom < sheet.bottom - 120 && r.left > sheet.left + 40 && r.right < sheet.right - 200);
    const r = nodes[0];
    return r ? { x: r.left + r.width / 2, y: r.top + r.height / 2 } : null;
  })()`) as { x: number; y: number } | null;
  if (!box) return null;
  const cdp: CDPSession = await page.context().newCDPSession(page);
  const events: TraceEvent[] = [];
  cdp.on('Tracing.dataCollected', (d) => { events.push(...(d.value as unknown as TraceEvent[])); });
  const complete = new Promise<void>((ok) => cdp.once('Tracing.tracingComplete', () => ok()));
  await page.mouse.move(box.x, box.y);
  await page.mouse.down();
  await page.evaluate(START_FRAME_LOG);
  await cdp.send('Tracing.start', { categories: 'devtools.timeline,toplevel', transferMode: 'ReportEvents' });
  for (let i = 1; i <= 40; i++) await page.mouse.move(box.x + i * 3, box.y + i * 2);
  await cdp.send('Tracing.end');
  await complete;
  await page.mouse.up();
  const gaps = (await page.evaluate(STOP_FRAME_LOG)) as number[];
  await cdp.detach();
  return { gaps, work: workPerFrame(events) };
}

/** Runs the benchmark; true when something was over target. */
export async function runUiBench(size = Number(process.env.LOOPWRIGHT_BENCH_SIZE ?? 2000)): Promise<boolean> {
  let executablePath: string;
  try {
    executablePath = chromiumPath();
  } catch {
    console.log('browser benchmark skipped: no Chromium (set CHROMIUM_PATH or apt-get install -y chromium)');
    return false;
  }
  const built = await buildRenderer();
  const web = (await import(join(root, 'scripts/web.mjs'))) as { serve(dir: string, port: number): Promise<Server> };
  const server = await web.serve(built.dir, 0);
  const address = server.address();
  const url = `http://127.0.0.1:${typeof address === 'object' && address ? address.port : 0}/`;
  const browser = await chromium.launch({ executablePath, headless: true, args: CHROMIUM_ARGS });
  let over = false;
  try {
    const page = await browser.newPage({ viewport: { width: 1600, height: 1000 } });
    page.on('pageerror', (e) => console.error(`[page error] ${e.message}`));
    await page.goto(url);
    await page.waitForSelector('[data-node-id]', { timeout: 30_000 });
    const job = generateJob(size);
    const name = `bench-${size}.lwj`;
    console.log(`\nbrowser: ${size} circuits, ${job.nodes.length} nodes, ${job.links.length} links`);

    const opened = await measure(page, openScript(serialiseJob(job), name),
      `document.querySelector('[data-doc-title]')?.textContent.includes(${JSON.stringify(name)}) && document.querySelector('[data-schedule-row] .lwp-sticky-status .lwp-status, [data-schedule-row]') && document.querySelector('[data-link-id][data-status]:not([data-status="unchecked"])')`);
    over = line('open', opened, UI_TARGETS.open) || over;

    // Rows further down the schedule: their links lie elsewhere on the sheet.
    const rows = (await page.evaluate(`[...document.querySelectorAll('[data-schedule-row]')].map((r) => r.getAttribute('data-schedule-row'))`)) as string[];
    const picks = [rows[3], rows[12], rows[20]].filter((id): id is string => !!id);
    for (const id of picks) {
      const t = await measure(page, clickScript(`[data-schedule-row="${id}"]`),
        `document.querySelector('[data-schedule-row="${id}"][aria-selected="true"]') && document.querySelector('[data-link-label="${id}"]')`);
      over = line(`schedule row click: select + centre ${id}`, t, UI_TARGETS.select) || over;
    }

    // A passing final subcircuit in view, without an RCD (a lighting circuit of the generated
    // job): 400 m of its cable makes its loop fail.
    const other = (await page.evaluate(`[...document.querySelectorAll('[data-link-label]')].map((l) => l.getAttribute('data-link-label'))
      .find((id) => /^C\\d+$/.test(id) && Number(id.slice(1)) % 5 === 1 && document.querySelector('[data-link-id="' + id + '"]')?.getAttribute('data-status') === 'pass') ?? null`)) as string | null;
    if (other) {
      const t = await measure(page, clickScript(`[data-link-label="${other}"]`), `document.querySelector('[data-link-label="${other}"].is-selected')`);
      over = line(`link label click: select ${other}`, t, UI_TARGETS.select) || over;
    }

    const target = other ?? picks.at(-1)!;
    const before = await attr(page, `[data-link-id="${target}"]`, 'data-status');
    // A person scrolls the details panel to the field and clicks into it before typing: that is
    // timed on its own line (until the panel is quiet again), and the typing and Enter from there.
    const field = '.lw-right [data-field="cable.length"]';
    const focused = await measure(page, `const el = document.querySelector(${JSON.stringify(field)});
      if (!el) throw new Error('no length field'); el.scrollIntoView({ block: 'center' }); el.focus();`,
      `document.activeElement === document.querySelector(${JSON.stringify(field)})`);
    over = line('scroll to the length field and click into it', focused, UI_TARGETS.select) || over;
    const edited = await measure(page, typeScript(field, '400'),
      `document.querySelector('[data-link-id="${target}"]')?.getAttribute('data-status') !== ${JSON.stringify(before)} && document.querySelector('[data-link-label="${target}"]')?.title.includes('400 m')`);
    const after = await attr(page, `[data-link-id="${target}"]`, 'data-status');
    over = line(`type a length into ${target} (${before} → ${after})`, edited, UI_TARGETS.edit) || over;

    const undone = await measure(page, `document.activeElement?.blur(); ${clickScript('[data-command="edit.undo"]')}`,
      `document.querySelector('[data-link-id="${target}"]')?.getAttribute('data-status') === ${JSON.stringify(before)} && !document.querySelector('[data-link-label="${target}"]')?.title.includes('400 m')`);
    over = line(`undo (→ ${before})`, undone, UI_TARGETS.undo) || over;

    // Headless Chromium paces animation frames to a 60 Hz display: even an idle page shows a
    // median gap of 16.7 ms, so the gaps alone cannot show a frame under 16 ms. The target is
    // judged on the median frame's main-thread work during the drag (from Chromium's trace: the
    // tasks run between one animation frame and the next); the gaps are printed beside it.
    const dragged = await drag(page);
    if (dragged && dragged.work.length > 0) {
      const pick = (list: number[], q: number) => list[Math.min(list.length - 1, Math.floor(list.length * q))]!;
      const work = [...dragged.work].sort((a, b) => a - b);
      const gaps = [...dragged.gaps].sort((a, b) => a - b);
      const median = pick(work, 0.5);
      const mean = work.reduce((a, b) => a + b, 0) / work.length;
      const flag = median >= UI_TARGETS.dragFrameWork ? `  over target (< ${UI_TARGETS.dragFrameWork} ms of work a frame)` : '';
      console.log(`${'drag a point (40 moves): median frame, work'.padEnd(44)} ${median.toFixed(1).padStart(8)} ms   mean ${mean.toFixed(1)} ms, p95 ${pick(work, 0.95).toFixed(1)} ms over ${work.length} frames${flag}`);
      if (gaps.length > 0) console.log(`${'drag a point: frame gaps (60 Hz paced)'.padEnd(44)} median ${pick(gaps, 0.5).toFixed(1)} ms, p95 ${pick(gaps, 0.95).toFixed(0)} ms, worst ${gaps.at(-1)!.toFixed(0)} ms`);
      over = over || median >= UI_TARGETS.dragFrameWork;
    } else console.log('drag: no point in view to drag');
  } finally {
    await browser.close();
    await new Promise<void>((ok) => server.close(() => ok()));
    built.cleanup();
  }
  return over;
}

const isMain = process.argv[1] && resolve(process.argv[1]) === fileURLToPath(import.meta.url);
if (isMain) process.exit((await runUiBench()) ? 1 : 0);
