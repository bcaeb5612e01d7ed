// End to end in headless Chromium against the browser build: a failing circuit of the demo
// fixed with one click (details panel and schedule menu), and readings imported from a CSV file
// and typed in the testing view. The readings are invented test data.
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { analyse, parseJob, type CircuitResult, type Job } from '../../engine/index.js';
import { startApp, stopApp, type App } from './harness.js';

let app: App;
let failing: CircuitResult;
let demo: Job;

/** What the testing view shows in a link's Zs cell for the demo as it opens. */
function demoZs(id: string): string {
  const zs = demo.links.find((l) => l.id === id)?.measured?.zs;
  return zs === undefined ? '' : String(zs);
}

beforeAll(async () => {
  const loaded = parseJob(readFileSync(fileURLToPath(new URL('../../assets/demo.lwj', import.meta.url)), 'utf8'));
  if (!loaded.ok) throw new Error('the demo job does not load');
  demo = loaded.job;
  const found = analyse(loaded.job).circuits.find((c) => c.status === 'fail' && c.fixes.some((f) => f.kind === 'size'));
  if (!found) throw new Error('the demo has no failing circuit with a size fix');
  failing = found;
  app = await startApp();
});
afterAll(async () => {
  await stopApp();
});

/** The status badge of a circuit in the details panel's results. */
async function resultStatus(page: Page, id: string): Promise<string | null> {
  return page.locator(`[data-results="${id}"] [data-status-badge]`).first().getAttribute('data-status-badge');
}

async function selectRow(page: Page, id: string): Promise<void> {
  await page.click(`[data-panel="schedule"] [data-schedule-row="${id}"] .lwp-cell-id`);
  await page.waitForSelector(`[data-details-link="${id}"]`);
}

describe('one-click fixes', () => {
  it('fixes a failing demo circuit with one click in the details panel, and Undo puts it back', async () => {
    const page = await app.newPage();
    const id = failing.link;
    await selectRow(page, id);
    expect(await resultStatus(page, id)).toBe('fail');
    const size = failing.fixes.find((f) => f.kind === 'size') as Extract<CircuitResult['fixes'][number], { kind: 'size' }>;
    const button = page.locator(`[data-fixes="${id}"] [data-fix="size"]`);
    expect(await button.textContent()).toContain(`${size.active}/${size.earth} mm²`);
    await button.click();
    await page.waitForFunction((link) => document.querySelector(`[data-results="${link}"] [data-status-badge]`)?.getAttribute('data-status-badge') === 'pass', id);
    expect(await page.locator(`[data-details-link="${id}"] [data-field="cable.active"]`).inputValue()).toBe(String(size.active));
    expect(await page.locator('[data-panel="schedule"] [data-schedule-row="' + id + '"] [data-status-badge]').first().getAttribute('data-status-badge')).toBe('pass');
    expect(await page.locator('body').textContent()).toContain(`${id} is now ✓ pass`);

    await page.click('[data-command="edit.undo"]');
    await page.waitForFunction((link) => document.querySelector(`[data-results="${link}"] [data-status-badge]`)?.getAttribute('data-status-badge') === 'fail', id);
  });

  it('fixes every demo circuit that has a size fix with one click each; the verdicts are the engine’s for the changed job', async () => {
    const page = await app.newPage();
    let job = demo;
    const fixed = analyse(demo).circuits.filter((c) => c.fixes.some((f) => f.kind === 'size'));
    expect(fixed.length).toBeGreaterThan(1);
    for (const c of fixed) {
      const size = c.fixes.find((f) => f.kind === 'size') as Extract<CircuitResult['fixes'][number], { kind: 'size' }>;
      job = { ...job, links: job.links.map((l) => (l.id === c.link ? { ...l, cable: { ...l.cable, active: size.active, earth: size.earth } } : l)) };
      const expected = analyse(job).circuits.find((r) => r.link === c.link)!.verdict;
      expect(expected).not.toBe(c.verdict); // the click changes what the schedule shows
      await selectRow(page, c.link);
      await page.click(`[data-fixes="${c.link}"] [data-fix="size"]`);
      await page.waitForFunction(
        ([link, verdict]) => document.querySelector(`[data-schedule-row="${link}"] [data-verdict-cell]`)?.getAttribute('data-verdict-cell') === verdict,
        [c.link, expected] as const,
      );
    }
  });

  it('fixes it from the schedule row’s Fix menu too', async () => {
    const page = await app.newPage();
    const id = failing.link;
    await page.click(`[data-fix-menu="${id}"]`);
    // The menu opens just below its button and on top of everything: what is at its first fix's
    // centre is that fix (a layout container around the schedule once clipped and moved it).
    const placed = await page.evaluate((link) => {
      const button = document.querySelector(`[data-fix-menu="${link}"]`)!.getBoundingClientRect();
      const fix = document.querySelector(`[data-fix-menu-list="${link}"] [data-fix]`)!;
      const r = fix.getBoundingClientRect();
      const hit = document.elementFromPoint(r.left + r.width / 2, r.top + r.height / 2);
      return { onTop: !!hit && fix.contains(hit), below: r.top >= button.bottom && r.top - button.bottom < 40 };
    }, id);
    expect(placed).toEqual({ onTop: true, below: true });
    await page.click(`[data-fix-menu-list="${id}"] [data-fix="length"]`);
    await page.waitForFunction(
      (link) => document.querySelector(`[data-schedule-row="${link}"] .lwp-sticky-status [data-status-badge]`)?.getAttribute('data-status-badge') === 'pass',
      id,
    );
    expect(await page.locator('body').textContent()).toContain('rounded down to 0.1 m, so it still passes');
  });
});

describe('readings on site', () => {
  it('imports a CSV file of readings as one step and shows them in the testing view; a typed reading is one more', async () => {
    const page = await app.newPage();
    // The import replaces C01's reading and adds C04's; C02 is typed (the demo has readings of its own).
    expect(demoZs('C01')).not.toBe('0.52');
    expect(demoZs('C04')).toBe('');
    expect(demoZs('C02')).toBe('');
    const chooser = page.waitForEvent('filechooser');
    await page.click('[data-command="readings.import"]');
    await (await chooser).setFiles({
      name: 'readings.csv',
      mimeType: 'text/csv',
      buffer: Buffer.from('Circuit,Zs (Ω),Temperature,Date,Instrument\nC01,0.52,14,2026-12-02,Meter A\nC04,0.37,14,2026-12-02,Meter A\n'),
    });
    await page.waitForFunction(() => document.body.textContent?.includes('Imported 2 readings from readings.csv'));

    await page.click('[data-schedule-view="testing"]');
    const zs = page.locator('[data-testing-link="C01"][data-testing-cell="zs"]');
    expect(await zs.inputValue()).toBe('0.52');
    expect(await page.locator('[data-testing-limit="C01"]').textContent()).toMatch(/ at 14 °C$/);
    expect(await page.locator('[data-testing-status="C04"] [data-status-badge]').count()).toBe(1);

    // Type the next one with the keyboard: Enter moves to the next circuit's reading.
    const c02 = page.locator('[data-testing-link="C02"][data-testing-cell="zs"]');
    await c02.click();
    await c02.fill('0.95');
    await c02.press('Enter');
    expect(await page.evaluate(() => document.activeElement?.getAttribute('data-testing-link'))).toBe('C03');
    await page.waitForSelector('[data-testing-status="C02"] [data-status-badge]');

    // Undo takes back the typed reading, then the whole import in one step.
    await page.evaluate(() => (document.activeElement as HTMLElement | null)?.blur());
    await page.click('[data-command="edit.undo"]');
    await page.waitForFunction((zs) => (document.querySelector('[data-testing-link="C02"][data-testing-cell="zs"]') as HTMLInputElement).value === zs, demoZs('C02'));
    await page.click('[data-command="edit.undo"]');
    await page.waitForFunction((zs) => (document.querySelector('[data-testing-link="C01"][data-testing-cell="zs"]') as HTMLInputElement).value === zs, demoZs('C01'));
    expect(await page.locator('[data-testing-link="C04"][data-testing-cell="zs"]').inputValue()).toBe(demoZs('C04'));
  });

  it('refuses a bad readings file, naming the line and column, and changes nothing', async () => {
    const page = await app.newPage();
    const chooser = page.waitForEvent('filechooser');
    await page.click('[data-command="readings.import"]');
    await (await chooser).setFiles({ name: 'bad.csv', mimeType: 'text/csv', buffer: Buffer.from('link,zs\nC01,0.5\nC99,0.4\n') });
    await page.waitForFunction(() => document.body.textContent?.includes('line 3, column 1 (link id): there is no link "C99" in this job'));
    expect(await page.locator('[data-command="edit.undo"]').isDisabled()).toBe(true);
  });
});
