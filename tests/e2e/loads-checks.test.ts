// End to end in headless Chromium at 1280 × 800: a version 2 job opened through the file input,
// its voltage-drop failure flagged on the sheet and in the schedule, each column set of the
// schedule without sideways scrolling, labels readable and clear of the parts at every zoom, and
// a load current edited in the details panel (and undone).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { Page } from 'playwright-core';
import { analyse, serialiseJob } from '../../engine/index.js';
import { startApp, stopApp, type App } from './harness.js';
import { findAndSelect, leaveFields, typeField } from './helpers.js';
import { loadsJob } from '../app/panels/fixture.js';

let app: App;
let dir: string;
beforeAll(async () => {
  app = await startApp();
  dir = mkdtempSync(join(tmpdir(), 'lw-loads-'));
});
afterAll(async () => {
  await stopApp();
});

async function openLoadsJob(page: Page): Promise<void> {
  const job = loadsJob();
  job.job.title = 'Loads end-to-end';
  const file = join(dir, 'loads.lwj');
  writeFileSync(file, serialiseJob(job));
  await page.setInputFiles('input[data-open-job]', file);
  await page.waitForSelector('[data-link-id="C2"][data-verdict]');
}

const verdictOf = (page: Page, id: string) => page.getAttribute(`[data-link-id="${id}"]`, 'data-verdict');

/** Every drawn link label against every drawn node: the boxes on screen that overlap. */
async function labelsOverParts(page: Page): Promise<string[]> {
  return page.evaluate(() => {
    const boxes = (sel: string) => [...document.querySelectorAll<HTMLElement>(sel)].map((e) => ({ e, r: e.getBoundingClientRect() }));
    const nodes = boxes('[data-node-id]');
    const out: string[] = [];
    for (const l of boxes('[data-link-label]')) {
      for (const n of nodes) {
        const overlap = l.r.left < n.r.right - 1 && n.r.left < l.r.right - 1 && l.r.top < n.r.bottom - 1 && n.r.top < l.r.bottom - 1;
        if (overlap) out.push(`${l.e.getAttribute('data-link-label')} over ${n.e.getAttribute('data-node-id')}`);
      }
    }
    return out;
  });
}

describe('loads, drops and the verdict in the browser', () => {
  it('flags the voltage-drop failure on the sheet and in the schedule, and a load edit clears it', async () => {
    const page = await app.newPage({ viewport: { width: 1280, height: 800 } });
    await openLoadsJob(page);
    const expected = analyse(loadsJob());
    const c2 = expected.circuits.find((c) => c.link === 'C2')!;
    expect(c2.voltageStatus).toBe('fail');

    // The sheet: the loop status stays pass, the verdict fails and the label names the check.
    expect(await page.getAttribute('[data-link-id="C2"]', 'data-status')).toBe(c2.status);
    expect(await verdictOf(page, 'C2')).toBe('fail');
    const label = page.locator('[data-link-label="C2"]');
    expect(await label.getAttribute('class')).toContain('lw-status--fail');
    expect(await label.locator('[data-label-line="verdict"]').textContent()).toMatch(/✗ FAIL: (voltage drop|drop)/);
    for (const c of expected.circuits) expect(await verdictOf(page, c.link), c.link).toBe(c.verdict);

    // The schedule: the loads set shows the drop failing, and the verdict filter finds it.
    await page.click('[data-column-set="loads"]');
    const vStatus = page.locator('[data-schedule-row="C2"] td[data-col="vStatus"]');
    expect(await vStatus.textContent()).toMatch(/✗\s*FAIL/);
    await page.click('[data-verdict-filter="fail"]');
    const shown = await page.$$eval('[data-schedule-row]', (rows) => rows.map((r) => r.getAttribute('data-schedule-row')));
    expect(shown.sort()).toEqual(expected.circuits.filter((c) => c.verdict === 'fail').map((c) => c.link).sort());
    await page.click('[data-verdict-filter="all"]');

    // A smaller load on P2 brings C2 within its limit; undo brings the failure back.
    await findAndSelect(page, 'P2');
    await typeField(page, 'current', '5');
    await expect.poll(() => verdictOf(page, 'C2')).toBe('pass');
    expect(await page.locator('[data-schedule-row="C2"] td[data-col="vStatus"]').textContent()).toMatch(/✓\s*pass/);
    await expect.poll(() => label.locator('[data-label-line="verdict"]').textContent()).toMatch(/✓ pass/);
    await leaveFields(page);
    await page.keyboard.press('Control+z');
    await expect.poll(() => verdictOf(page, 'C2')).toBe('fail');
    expect(await page.inputValue('.lw-right [data-field="current"]')).toBe('20');
  });

  it('shows every column set but "all" without sideways scrolling at 1280 × 800', async () => {
    const page = await app.newPage({ viewport: { width: 1280, height: 800 } });
    await openLoadsJob(page);
    for (const set of ['loop', 'loads', 'faults', 'testing']) {
      await page.click(`[data-column-set="${set}"]`);
      const { scroll, client } = await page.locator('.lwp-schedule-body').evaluate((el) => ({ scroll: el.scrollWidth, client: el.clientWidth }));
      expect(scroll, set).toBeLessThanOrEqual(client + 1);
    }
    await page.click('[data-column-set="all"]');
    // In the wide set the pinned columns sit side by side at the right edge, none over another.
    const pinned = await page.$$eval('thead th.lwp-sticky-ratio, thead th.lwp-sticky-status, thead th.lwp-sticky-verdict',
      (ths) => ths.map((th) => { const r = th.getBoundingClientRect(); return { left: r.left, right: r.right }; }));
    expect(pinned).toHaveLength(3);
    for (let i = 1; i < pinned.length; i++) expect(pinned[i]!.left).toBeGreaterThanOrEqual(pinned[i - 1]!.right - 1);
  });

  it('keeps labels readable and off the parts when zoomed out, and gives every line zoomed in', async () => {
    const page = await app.newPage({ viewport: { width: 1280, height: 800 } });
    await openLoadsJob(page);
    const sizes = async () => page.$$eval('[data-link-label]', (els) => els.map((e) => ({
      id: e.getAttribute('data-link-label')!,
      lines: Number(e.getAttribute('data-label-lines')),
      // Type size on screen: the label's own size times the zoom of the viewport around it.
      px: parseFloat(getComputedStyle(e).fontSize) * (e.closest('.react-flow__viewport') ? new DOMMatrix(getComputedStyle(e.closest('.react-flow__viewport')!).transform).a : 1),
    })));
    for (let i = 0; i < 6; i++) await page.click('[data-zoom="out"]');
    await page.waitForTimeout(400);
    const out = await sizes();
    for (const s of out) expect(s.px, s.id).toBeGreaterThanOrEqual(8.9);
    expect(await labelsOverParts(page)).toEqual([]);
    // Up to the largest zoom, whatever zoom the first view opened at.
    for (let i = 0; i < 16; i++) await page.click('[data-zoom="in"]');
    // The zoom animates: wait until the labels have settled at the new zoom (up to 10 s).
    await page.waitForFunction(() => document.querySelector('[data-link-label="C2"]')?.getAttribute('data-label-lines') === '5', null, { timeout: 10_000 }).catch(() => undefined);
    const zoomedIn = await sizes();
    // Every link is drawn on a job this small, in view or not.
    const c2 = zoomedIn.find((s) => s.id === 'C2')!;
    expect(c2.lines).toBeGreaterThan(out.find((s) => s.id === 'C2')!.lines);
    expect(c2.lines).toBe(5); // device, cable, loop result, load and drop, verdict
    expect(await labelsOverParts(page)).toEqual([]);
  });
});
