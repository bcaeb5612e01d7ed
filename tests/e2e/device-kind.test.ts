// End to end in headless Chromium against the browser build: changing a passing demo circuit's
// device kind as a new user would. It must not show pass until the device's data is entered or
// picked from the library, and the form says which data is missing meanwhile.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { startApp, stopApp, type App } from './harness.js';
import { findAndSelect, statuses, typeField } from './helpers.js';

let app: App;

beforeAll(async () => {
  app = await startApp();
});
afterAll(async () => {
  await stopApp();
});

async function badge(page: Page, id: string): Promise<string | null> {
  return page.locator(`.lw-right [data-results="${id}"] [data-status-badge]`).first().getAttribute('data-status-badge');
}

describe('device kind change in the details panel', () => {
  it('a passing circuit is not shown passing after a kind change until its data is entered or picked', async () => {
    const page = await app.newPage();
    // C04, the water heater: C20 with no RCD, passing on its own loop.
    await expect.poll(async () => (await statuses(page)).C04).toBe('pass');
    await findAndSelect(page, 'C04');
    await page.waitForSelector('.lw-right [data-details-link="C04"]');
    expect(await badge(page, 'C04')).toBe('pass');

    // To a stated trip current: nothing is filled in, the circuit is unchecked, the form says why.
    await page.locator('.lw-right [data-field="device.type"]').selectOption('fixed');
    await expect.poll(async () => (await statuses(page)).C04).toBe('unchecked');
    expect(await badge(page, 'C04')).toBe('unchecked');
    const missing = page.locator('.lw-right [data-device-missing="C04"]');
    await expect.poll(() => missing.textContent()).toMatch(/Device data missing: rating In \(A\), trip current Ia \(A\)/);
    expect(await page.locator('.lw-right [data-field="device.tripCurrent"]').inputValue()).toBe('');
    expect(await page.textContent('[data-link-label="C04"]')).not.toContain('✓');

    // Half the data is still no pass.
    await typeField(page, 'device.rating', '20');
    await expect.poll(() => missing.textContent()).toMatch(/missing: trip current Ia \(A\)/);
    expect((await statuses(page)).C04).toBe('unchecked');

    // All of it: checked on what was entered (150 A, as C20 under au-nz).
    await typeField(page, 'device.tripCurrent', '150');
    await expect.poll(async () => (await statuses(page)).C04).toBe('pass');
    expect(await page.locator('.lw-right [data-device-missing]').count()).toBe(0);

    // To a fuse, then picked from the library: complete in one step, with its source shown.
    await page.locator('.lw-right [data-field="device.type"]').selectOption('curve');
    await expect.poll(async () => (await statuses(page)).C04).toBe('unchecked');
    await page.locator('.lw-right [data-field="device.library"]').selectOption('lib:gG-20');
    await expect.poll(async () => (await statuses(page)).C04).toBe('pass');
    await expect.poll(() => page.textContent('.lw-right [data-device-source]')).toMatch(/20 A gG fuse: IEC 60269-1/);
    expect(await page.locator('.lw-right [data-curve-row]').count()).toBe(3);

    // The time–current view of the circuit is there, with its caution.
    const tcc = page.locator('.lw-right [data-tcc="C04"]');
    await tcc.scrollIntoViewIfNeeded();
    expect(await tcc.locator('[data-tcc-curve="device"]').count()).toBe(1);
    expect(await tcc.textContent()).toMatch(/design aid/);
    await page.close();
  });
});
