// End to end in headless Chromium against the browser build: the circuit schedule's sort,
// filter and row selection, and refused bad values in the details panel and the schedule.
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { analyse, parseJob, type Job, type Results } from '../../engine/index.js';
import { startApp, stopApp, type App } from './harness.js';

let app: App;
let demo: Job;
let results: Results;

beforeAll(async () => {
  const loaded = parseJob(readFileSync(fileURLToPath(new URL('../../assets/demo.lwj', import.meta.url)), 'utf8'));
  if (!loaded.ok) throw new Error('the demo job does not load');
  demo = loaded.job;
  results = analyse(demo);
  app = await startApp();
});
afterAll(async () => {
  await stopApp();
});

async function rowIds(page: Page): Promise<string[]> {
  return page.$$eval('[data-panel="schedule"] [data-schedule-row]', (rows) => rows.map((r) => r.getAttribute('data-schedule-row')!));
}

/** Ids in the expected order: by a key, nulls last, file order on ties. */
function expectedOrder(key: (id: string) => number | null, direction: 'asc' | 'desc'): string[] {
  const sign = direction === 'asc' ? 1 : -1;
  const rows = demo.links.map((l, index) => ({ id: l.id, v: key(l.id), index }));
  rows.sort((a, b) => {
    if (a.v === null || b.v === null) return a.v === b.v ? a.index - b.index : a.v === null ? 1 : -1;
    return sign * (a.v - b.v) || a.index - b.index;
  });
  return rows.map((r) => r.id);
}

const ratioOf = (id: string) => results.circuits.find((c) => c.link === id)?.ratio ?? null;
const lengthOf = (id: string) => demo.links.find((l) => l.id === id)!.cable.length;

describe('circuit schedule', () => {
  it('lists every link, worst ratio first, and sorts by another column on a click of its head', async () => {
    const page = await app.newPage();
    await page.waitForSelector('[data-schedule-row]');
    expect(await rowIds(page)).toEqual(expectedOrder(ratioOf, 'desc'));
    // The worst row is the one the results document names as worst.
    expect((await rowIds(page))[0]).toBe(results.worst!.link);

    await page.click('[data-sort="length"]');
    expect(await rowIds(page)).toEqual(expectedOrder(lengthOf, 'desc'));
    await page.click('[data-sort="length"]');
    expect(await rowIds(page)).toEqual(expectedOrder(lengthOf, 'asc'));
    await page.click('[data-sort="ratio"]');
    expect(await rowIds(page)).toEqual(expectedOrder(ratioOf, 'desc'));
  });

  it('filters by verdict', async () => {
    const page = await app.newPage();
    await page.click('[data-verdict-filter="fail"]');
    const failing = results.circuits.filter((c) => c.verdict === 'fail').map((c) => c.link);
    expect(failing.length).toBeGreaterThan(0);
    expect((await rowIds(page)).sort()).toEqual(failing.sort());
    await expect.poll(() => page.textContent('[data-verdict-filter="fail"]')).toContain(`(${results.summary.verdict.fail})`);
    await page.click('[data-verdict-filter="all"]');
    expect(await rowIds(page)).toHaveLength(demo.links.length);
  });

  it('selects a link on a row click and centres it on the sheet', async () => {
    const page = await app.newPage();
    const sheet = (await page.locator('[data-sheet]').boundingBox())!;
    // Prefer a link whose label starts outside the visible sheet, so centring shows.
    const ids = await rowIds(page);
    let target = ids[ids.length - 1]!;
    for (const id of ids) {
      const box = await page.locator(`[data-link-label="${id}"]`).boundingBox();
      if (!box || box.x + box.width < sheet.x || box.x > sheet.x + sheet.width || box.y > sheet.y + sheet.height || box.y + box.height < sheet.y) {
        target = id;
        break;
      }
    }
    await page.click(`[data-schedule-row="${target}"] td:nth-child(3)`);
    await page.waitForSelector(`[data-panel="details"] [data-details-link="${target}"]`);
    await expect.poll(() => page.getAttribute(`[data-schedule-row="${target}"]`, 'aria-selected')).toBe('true');
    await expect.poll(() => page.locator(`[data-link-label="${target}"]`).getAttribute('class')).toContain('is-selected');
    await expect
      .poll(async () => {
        const box = await page.locator(`[data-link-label="${target}"]`).boundingBox();
        if (!box) return false;
        const cx = box.x + box.width / 2;
        const cy = box.y + box.height / 2;
        return cx > sheet.x && cx < sheet.x + sheet.width && cy > sheet.y && cy < sheet.y + sheet.height;
      }, { timeout: 5000 })
      .toBe(true);
  });
});

describe('refused values', () => {
  it('keeps the last good length in the details panel and says why beside the field', async () => {
    const page = await app.newPage();
    const link = demo.links.find((l) => l.device)!;
    await page.click(`[data-schedule-row="${link.id}"] td:nth-child(3)`);
    const input = page.locator('[data-panel="details"] [data-field="cable.length"]');
    await expect.poll(() => input.inputValue()).toBe(String(link.cable.length));
    await input.fill('-5');
    await input.press('Enter');
    const error = page.locator('[data-panel="details"] [data-field-error="cable.length"]');
    await expect.poll(() => error.textContent()).toMatch(/must be ≥ 0 m, got -5/);
    expect(await error.getAttribute('role')).toBe('alert');
    expect(await input.inputValue()).toBe(String(link.cable.length));
    // The drawing still shows the old length, and nothing can be undone.
    expect(await page.textContent(`[data-link-label="${link.id}"]`)).toContain(`${link.cable.length} m`);
    expect(await page.isDisabled('[data-command="edit.undo"]')).toBe(true);

    // The engine's own rule, through the store: an id already in use.
    const idInput = page.locator('[data-panel="details"] [data-field="id"]');
    await idInput.fill(demo.nodes[0]!.id);
    await idInput.press('Enter');
    await expect.poll(() => page.textContent('[data-panel="details"] [data-field-error="id"]')).toMatch(/already used/);
    expect(await idInput.inputValue()).toBe(link.id);

    // A good value then commits and clears the message.
    await input.fill(String(link.cable.length + 1));
    await input.press('Enter');
    await expect.poll(() => page.textContent(`[data-link-label="${link.id}"]`)).toContain(`${link.cable.length + 1} m`);
    expect(await page.locator('[data-panel="details"] [data-field-error="cable.length"]').count()).toBe(0);
  });

  it('refuses a bad value typed into a schedule cell', async () => {
    const page = await app.newPage();
    const link = demo.links[0]!;
    const cell = page.locator(`[data-schedule-row="${link.id}"] [data-cell="cable.active"]`);
    await cell.fill('abc');
    await cell.press('Enter');
    await expect
      .poll(() => page.textContent(`[data-schedule-row="${link.id}"] [data-cell-error="cable.active"]`))
      .toMatch(/"abc" is not a number/);
    expect(await cell.inputValue()).toBe(String(link.cable.active));
  });
});
