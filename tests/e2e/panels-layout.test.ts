// End to end in headless Chromium: the loop breakdown beside a schedule that keeps its columns,
// the breakdown following the selection (and staying when pinned), the schedule's head while
// scrolling, the legend, and keys typed in a field staying in the field.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { startApp, stopApp, type App } from './harness.js';

let app: App;
beforeAll(async () => {
  app = await startApp();
});
afterAll(async () => {
  await stopApp();
});

/** Column heads of the schedule that are inside its visible box (not scrolled away or covered). */
async function visibleHeads(page: Page): Promise<string[]> {
  return page.evaluate(() => {
    const body = document.querySelector('.lwp-schedule-body')!.getBoundingClientRect();
    const ratio = document.querySelector('th.lwp-sticky-ratio')!.getBoundingClientRect();
    return [...document.querySelectorAll<HTMLElement>('.lwp-schedule-table thead th')]
      .filter((th) => {
        const r = th.getBoundingClientRect();
        const sticky = th.classList.contains('lwp-sticky-ratio') || th.classList.contains('lwp-sticky-status');
        return r.left >= body.left - 1 && r.right <= (sticky ? body.right + 1 : ratio.left + 1) && r.width > 0;
      })
      .map((th) => th.querySelector('[data-sort]')!.getAttribute('data-sort')!);
  });
}

describe('loop breakdown and schedule at 1280 × 800', () => {
  it('opens the breakdown without taking columns from the schedule, and follows the selection', async () => {
    const page = await app.newPage({ viewport: { width: 1280, height: 800 } });
    const before = await visibleHeads(page);
    await page.click('[data-command="view.traceWorst"]');
    await page.waitForSelector('[data-breakdown-box] [data-panel="breakdown"]');
    expect(await visibleHeads(page)).toEqual(before);
    expect(before).toEqual(expect.arrayContaining(['id', 'name', 'cable', 'length', 'device', 'ratio', 'status']));
    // The drawer lies inside the sheet, clear of the schedule.
    const drawer = (await page.locator('[data-breakdown-box]').boundingBox())!;
    const schedule = (await page.locator('[data-panel="schedule"]').boundingBox())!;
    expect(drawer.y + drawer.height).toBeLessThanOrEqual(schedule.y);

    const worst = (await page.getAttribute('[data-breakdown]', 'data-breakdown'))!;
    const other = await page.$$eval('[data-schedule-row]', (rows, w) => rows.map((r) => r.getAttribute('data-schedule-row')!).find((id) => id !== w)!, worst);
    await page.click(`[data-schedule-row="${other}"] td:nth-child(3)`);
    await expect.poll(() => page.getAttribute('[data-breakdown]', 'data-breakdown')).toBe(other);
    await expect.poll(() => page.locator(`[data-link-label="${other}"]`).getAttribute('class')).toContain('is-traced');
    expect(await page.textContent('[data-breakdown-mode]')).toMatch(/Follows the selected circuit/);

    // Pinned, it stays on its link.
    await page.click('[data-action="pin-breakdown"]');
    expect(await page.textContent('[data-breakdown-mode]')).toMatch(new RegExp(`Pinned to ${other}`));
    await page.click(`[data-schedule-row="${worst}"] td:nth-child(3)`);
    await expect.poll(() => page.getAttribute(`[data-schedule-row="${worst}"]`, 'aria-selected')).toBe('true');
    expect(await page.getAttribute('[data-breakdown]', 'data-breakdown')).toBe(other);

    // Folded, only its head is left.
    await page.click('[data-action="collapse-breakdown"]');
    expect(await page.locator('[data-segment]').count()).toBe(0);
    const folded = (await page.locator('[data-breakdown-box]').boundingBox())!;
    expect(folded.height).toBeLessThan(drawer.height);
  });

  it('keeps the schedule head in view while its rows scroll', async () => {
    const page = await app.newPage({ viewport: { width: 1280, height: 800 } });
    const head = page.locator('[data-sort="ratio"]');
    const top = (await head.boundingBox())!.y;
    await page.locator('.lwp-schedule-body').evaluate((el) => {
      el.scrollTop = el.scrollHeight;
    });
    await expect.poll(async () => (await head.boundingBox())!.y).toBeCloseTo(top, 0);
    expect(await page.locator('.lwp-schedule-body').evaluate((el) => el.scrollTop)).toBeGreaterThan(0);
  });

  it('lets the schedule be made taller with its splitter, and keeps the size', async () => {
    const page = await app.newPage({ viewport: { width: 1280, height: 800 } });
    const bar = page.locator('[data-splitter="schedule"]');
    const h0 = (await page.locator('.lw-bottom').boundingBox())!.height;
    const b = (await bar.boundingBox())!;
    await page.mouse.move(b.x + b.width / 2, b.y + 3);
    await page.mouse.down();
    await page.mouse.move(b.x + b.width / 2, b.y - 97, { steps: 5 });
    await page.mouse.up();
    await expect.poll(async () => Math.round((await page.locator('.lw-bottom').boundingBox())!.height - h0)).toBe(100);
    expect(await page.evaluate(() => localStorage.getItem('loopwright.layout'))).toMatch(/"bottomHeight":\d+/);
  });
});

describe('legend and keys', () => {
  it('shows the legend of statuses and line styles beside the sheet', async () => {
    const page = await app.newPage();
    const legend = page.locator('.lw-palette [data-legend]');
    expect(await legend.isVisible()).toBe(true);
    for (const s of ['pass', 'fail', 'rcd', 'unchecked']) expect(await legend.locator(`[data-legend-status="${s}"]`).isVisible()).toBe(true);
    expect(await legend.locator('[data-legend-line="traced"]').textContent()).toMatch(/dashed/);
    // The traced sample is drawn dashed, as the sheet draws the traced path.
    const dash = await legend.locator('[data-legend-line="traced"] path').evaluate((p) => getComputedStyle(p).strokeDasharray);
    expect(dash).not.toBe('none');
  });

  it('Find opens with the cursor in its search box; shortcuts typed in a field stay in the field', async () => {
    const page = await app.newPage();
    await page.locator('[data-sheet] .react-flow__pane').click({ position: { x: 20, y: 20 } });
    await page.keyboard.press('Control+f');
    await page.waitForSelector('[data-find]');
    expect(await page.evaluate(() => document.activeElement?.hasAttribute('data-find'))).toBe(true);
    await page.keyboard.press('Escape');

    const first = (await page.getAttribute('[data-schedule-row]', 'data-schedule-row'))!;
    const name = page.locator(`[data-schedule-row="${first}"] [data-cell="name"]`);
    await name.click();
    const nodes = await page.locator('[data-node-id]').count();
    const links = await page.locator('[data-link-id]').count();
    // The click selected the row's link: Delete outside a field would remove it.
    await expect.poll(() => page.getAttribute(`[data-schedule-row="${first}"]`, 'aria-selected')).toBe('true');
    for (const key of ['Delete', 'Backspace', 'Control+a', 'Control+z', 'Control+c', 'Control+v', 'Shift+Digit1']) await name.press(key);
    expect(await page.locator('[data-node-id]').count()).toBe(nodes);
    expect(await page.locator('[data-link-id]').count()).toBe(links);
    expect(await page.isDisabled('[data-command="edit.undo"]')).toBe(true);
    expect(await page.locator('[role="dialog"]').count()).toBe(0);
  });
});
