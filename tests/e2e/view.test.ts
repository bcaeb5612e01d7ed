// End to end: the demo's first view is readable and says how to see it all; Fit shows the whole
// job; parts added from the palette one after another each get a place of their own.
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

const zoom = (page: Page) =>
  page.$eval('.react-flow__viewport', (e) => new DOMMatrixReadOnly(getComputedStyle(e).transform).a);

function inside(box: { x: number; y: number; width: number; height: number }, outer: { x: number; y: number; width: number; height: number }) {
  return box.x >= outer.x && box.y >= outer.y && box.x + box.width <= outer.x + outer.width && box.y + box.height <= outer.y + outer.height;
}

describe('the first view of the demo', () => {
  it('shows the supply at a readable zoom, says Fit shows everything, and Fit does', async () => {
    const page = await app.newPage();
    await page.waitForSelector('[data-node-id="S1"]');
    await expect.poll(() => page.textContent('[data-message]')).toContain('Fit (Shift+1) shows all of it');
    expect(await zoom(page)).toBeGreaterThanOrEqual(0.6);
    const sheet = (await page.locator('[data-sheet]').boundingBox())!;
    expect(inside((await page.locator('[data-node-id="S1"]').boundingBox())!, sheet)).toBe(true);

    await page.click('[data-command="view.fit"]');
    await expect.poll(() => zoom(page)).toBeLessThan(0.6);
    // Every node on screen once the Fit glide ends.
    const outside = () => page.$$eval('[data-node-id]', (els, outer) => els.filter((e) => {
      const r = e.getBoundingClientRect();
      return r.x < outer.x || r.y < outer.y || r.right > outer.x + outer.width || r.bottom > outer.y + outer.height;
    }).map((e) => e.getAttribute('data-node-id')), sheet);
    await expect.poll(outside).toEqual([]);
  });
});

describe('adding parts from the palette', () => {
  it('puts each new part in a place of its own', async () => {
    const page = await app.newPage();
    await page.waitForSelector('[data-node-id="S1"]');
    const before = await page.locator('[data-node-id]').count();
    for (let i = 0; i < 3; i++) await page.click('[data-part="point"]');
    await expect.poll(() => page.locator('[data-node-id]').count()).toBe(before + 3);
    const boxes = await page.$$eval('[data-node-id]', (els) => els.map((e) => {
      const r = e.getBoundingClientRect();
      return { id: e.getAttribute('data-node-id')!, x: r.x, y: r.y, w: r.width, h: r.height };
    }));
    for (const a of boxes) {
      for (const b of boxes) {
        if (a.id >= b.id) continue;
        const overlap = a.x < b.x + b.w && b.x < a.x + a.w && a.y < b.y + b.h && b.y < a.y + a.h;
        expect(overlap, `${a.id} on ${b.id}`).toBe(false);
      }
    }
  });
});

describe('the minimap', () => {
  for (const viewport of [{ width: 1600, height: 1000 }, { width: 1280, height: 800 }]) {
    it(`covers no node or link label of the demo's first view at ${viewport.width}x${viewport.height}`, async () => {
      const page = await app.newPage({ viewport });
      await page.waitForSelector('[data-node-id="S1"]');
      await page.waitForSelector('.react-flow__minimap');
      const covered = await page.evaluate(() => {
        const m = document.querySelector('.react-flow__minimap')!.getBoundingClientRect();
        return [...document.querySelectorAll('[data-node-id], [data-link-label]')].filter((e) => {
          const r = e.getBoundingClientRect();
          return r.width > 0 && r.x < m.right && r.right > m.x && r.y < m.bottom && r.bottom > m.y;
        }).map((e) => e.getAttribute('data-node-id') ?? e.getAttribute('data-link-label'));
      });
      expect(covered).toEqual([]);
    });
  }
});
