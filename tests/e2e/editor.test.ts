// End to end in headless Chromium against the browser build: draw a job from nothing with the
// mouse and keyboard, watch a circuit fail past its maximum length and pass again after undo,
// and trace the worst loop with its breakdown.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { CAUTION } from '../../engine/index.js';
import { startApp, stopApp, type App } from './harness.js';
import { connect, dropPart, leaveFields, statuses, typeField } from './helpers.js';

let app: App;
beforeAll(async () => {
  app = await startApp();
});
afterAll(async () => {
  await stopApp();
});

async function newJob(page: Page) {
  // The demo has no unsaved changes, so New asks nothing.
  let asked = false;
  page.once('dialog', (d) => {
    asked = true;
    void d.dismiss();
  });
  await page.click('[data-command="file.new"]');
  await page.waitForFunction(() => document.querySelectorAll('[data-node-id]').length === 0);
  expect(asked).toBe(false);
}

describe('drawing a job from nothing', () => {
  it('places parts, connects them, types lengths and devices, fails past the maximum and undoes', async () => {
    const page = await app.newPage();
    const cspErrors: string[] = [];
    page.on('console', (m) => {
      if (/Content Security Policy/i.test(m.text())) cspErrors.push(m.text());
    });
    await newJob(page);

    // A supply and a board by dragging from the palette; two points from the context menu.
    await dropPart(page, 'supply', 0.5, 0.12);
    await page.waitForSelector('[data-node-id="S1"]');
    await dropPart(page, 'board', 0.5, 0.4);
    await page.waitForSelector('[data-node-id="B1"]');
    const sheet = (await page.locator('[data-sheet]').boundingBox())!;
    // Nothing selected, so the points are placed unconnected (a part added with a board selected
    // is fed from it; that has its own test in work.test.ts).
    await page.mouse.click(sheet.x + sheet.width * 0.9, sheet.y + sheet.height * 0.3);
    for (const [fx, id] of [[0.3, 'P1'], [0.7, 'P2']] as const) {
      await page.mouse.click(sheet.x + sheet.width * fx, sheet.y + sheet.height * 0.75, { button: 'right' });
      await page.click('.lw-menu [data-command="insert.point"]');
      await page.waitForSelector(`[data-node-id="${id}"]`);
    }

    // Links by dragging from handle to handle.
    await connect(page, 'S1', 'B1');
    await page.waitForSelector('[data-link-id="M1"]', { state: 'attached' });
    await connect(page, 'B1', 'P1');
    await page.waitForSelector('[data-link-id="C1"]', { state: 'attached' });
    await connect(page, 'B1', 'P2');
    await page.waitForSelector('[data-link-id="C2"]', { state: 'attached' });

    // The radial rule while drawing: a second feeder into P1 is refused, with the reason.
    await connect(page, 'S1', 'P1');
    await expect.poll(() => page.textContent('[data-message]')).toMatch(/refused.*P1.*already fed by link C1 from B1/);
    expect(await page.locator('[data-link-id]').count()).toBe(3);

    // Lengths and devices typed into the details panel.
    await page.click('[data-link-label="M1"]');
    await typeField(page, 'cable.length', '15');
    await page.click('[data-link-label="C1"]');
    await typeField(page, 'cable.length', '30');
    await page.locator('.lw-right [data-field="device.type"]').selectOption('mcb');
    await page.locator('.lw-right [data-field="device.curve"]').selectOption('C');
    await typeField(page, 'device.rating', '16');
    // A new socket-outlet circuit starts with a 30 mA RCD; without it a failing loop is a plain FAIL.
    await page.locator('.lw-right [data-field="rcd"]').uncheck();
    await expect.poll(async () => (await statuses(page)).C1).toBe('pass');
    const label = await page.textContent('[data-link-label="C1"]');
    expect(label).toContain('C16');
    expect(label).toContain('2.5/2.5 Cu, 30 m');

    // Past its maximum length (C16 on 2.5/2.5 Cu with the source unknown: about 85 m by the
    // AS/NZS 3000:2018 B5.2.2 formula, less the drawn mains' share) the circuit fails.
    await typeField(page, 'cable.length', '150');
    await expect.poll(async () => (await statuses(page)).C1).toBe('fail');
    expect(await page.textContent('[data-link-label="C1"]')).toContain('✗ FAIL');

    // Undo from the keyboard brings it back.
    await leaveFields(page);
    await page.keyboard.press('Control+z');
    await expect.poll(async () => (await statuses(page)).C1).toBe('pass');
    await page.keyboard.press('Control+Shift+z');
    await expect.poll(async () => (await statuses(page)).C1).toBe('fail');
    await page.click('[data-command="edit.undo"]');
    await expect.poll(async () => (await statuses(page)).C1).toBe('pass');

    // Select all and delete from the keyboard, then undo.
    await page.click('.lw-statusbar');
    await leaveFields(page);
    await page.keyboard.press('Control+a');
    await page.keyboard.press('Delete');
    await expect.poll(() => page.locator('[data-node-id]').count()).toBe(0);
    await page.keyboard.press('Control+z');
    await expect.poll(() => page.locator('[data-node-id]').count()).toBe(4);
    expect(cspErrors).toEqual([]);
  });

  it('refuses a link that would close a loop, saying which node already feeds which', async () => {
    const page = await app.newPage();
    await newJob(page);
    const sheet = (await page.locator('[data-sheet]').boundingBox())!;
    for (const [fx, id] of [[0.3, 'B1'], [0.7, 'B2']] as const) {
      await page.mouse.click(sheet.x + sheet.width * fx, sheet.y + sheet.height * 0.3, { button: 'right' });
      await page.click('.lw-menu [data-command="insert.board"]');
      await page.waitForSelector(`[data-node-id="${id}"]`);
    }
    await connect(page, 'B1', 'B2');
    await page.waitForSelector('[data-link-id]', { state: 'attached' });
    const [first] = Object.keys(await statuses(page));
    await connect(page, 'B2', 'B1');
    await expect.poll(() => page.textContent('[data-message]')).toBe(
      `✗ Link from B2 to B1 refused: "B1" already feeds "B2" (through link ${first}), so this link would close a loop; the network must be radial (a tree from each supply)`,
    );
    expect(await page.locator('[data-link-id]').count()).toBe(1);
  });
});

describe('the worst loop', () => {
  for (const viewport of [{ width: 1280, height: 800 }, { width: 1600, height: 1000 }]) {
    it(`frames the whole traced path beside the breakdown drawer at ${viewport.width}x${viewport.height}`, async () => {
      const page = await app.newPage({ viewport });
      await page.click('[data-command="view.traceWorst"]');
      await page.waitForSelector('[data-breakdown-box]');
      // Every traced node and link label (the demo's: S1 → M1 → MSB → SM1 → DBW → W07 → P17).
      const hidden = () => page.evaluate(() => {
        const sheet = document.querySelector('[data-sheet]')!.getBoundingClientRect();
        const drawer = document.querySelector('[data-breakdown-box]')!.getBoundingClientRect();
        const traced = [...document.querySelectorAll('[data-node-id].is-traced, [data-link-label].is-traced')];
        if (traced.length < 7) return [`only ${traced.length} traced`];
        return traced.filter((e) => {
          const r = e.getBoundingClientRect();
          const off = r.x < sheet.x || r.y < sheet.y || r.right > sheet.right || r.bottom > sheet.bottom;
          const under = r.x < drawer.right && r.right > drawer.x && r.y < drawer.bottom && r.bottom > drawer.y;
          return off || under;
        }).map((e) => e.getAttribute('data-node-id') ?? e.getAttribute('data-link-label'));
      });
      await expect.poll(hidden).toEqual([]);
    });
  }

  it('highlights the path on the sheet and opens its breakdown', async () => {
    const page = await app.newPage();
    await page.click('[data-command="view.traceWorst"]');
    await page.waitForSelector('[data-breakdown-box]');
    const worst = await page.evaluate(async () => {
      const traced = [...document.querySelectorAll('.is-traced')].map((e) => e.getAttribute('data-node-id') ?? e.getAttribute('data-link-id') ?? e.getAttribute('data-link-label'));
      return [...new Set(traced)];
    });
    // The demo's worst loop ends at W07 (assets/demo.lwj notes); its path runs S1 → M1 → MSB → SM1 → DBW → W07 → P17.
    expect(worst.sort()).toEqual(['DBW', 'M1', 'MSB', 'P17', 'S1', 'SM1', 'W07'].sort());
    // Highlighted by line weight and dash, not only colour.
    const dash = await page.$eval('[data-link-id="W07"] path.react-flow__edge-path', (p) => getComputedStyle(p).strokeDasharray);
    const width = await page.$eval('[data-link-id="W07"] path.react-flow__edge-path', (p) => parseFloat(getComputedStyle(p).strokeWidth));
    expect(dash).not.toBe('none');
    expect(width).toBeGreaterThanOrEqual(4);
    const breakdown = await page.textContent('[data-breakdown-box]');
    expect(breakdown).toContain('W07');
    expect(breakdown).toMatch(/SM1/);
  });
});

describe('readability of the demo', () => {
  async function overlaps(page: Page): Promise<string[]> {
    return page.evaluate(() => {
      const boxes = [...document.querySelectorAll('[data-link-label], [data-node-id]')].map((e) => {
        const r = e.getBoundingClientRect();
        return { id: e.getAttribute('data-link-label') ?? e.getAttribute('data-node-id'), r };
      });
      const found: string[] = [];
      for (let i = 0; i < boxes.length; i++) {
        for (let j = i + 1; j < boxes.length; j++) {
          const a = boxes[i]!.r;
          const b = boxes[j]!.r;
          if (a.left < b.right - 0.5 && b.left < a.right - 0.5 && a.top < b.bottom - 0.5 && b.top < a.bottom - 0.5) found.push(`${boxes[i]!.id} × ${boxes[j]!.id}`);
        }
      }
      return found;
    });
  }

  it('no link label overlaps another label or a node, as opened and after auto-arrange', async () => {
    const page = await app.newPage();
    expect(await page.locator('[data-link-label]').count()).toBe(23);
    expect(await overlaps(page)).toEqual([]);
    await page.click('[data-command="arrange.auto"]');
    await expect.poll(() => page.evaluate(() => document.querySelector('[data-command="edit.undo"]')?.hasAttribute('disabled'))).toBe(false);
    await page.waitForTimeout(400);
    expect(await overlaps(page)).toEqual([]);
    await page.screenshot({ path: 'test-results/demo-arranged.png' });
  });

  it('shows every status by symbol and word as well as colour', async () => {
    const page = await app.newPage();
    // The status line may lead with the link's id (zoomed out) and name a failing check after a colon.
    const words = await page.$$eval('[data-link-label]', (els) => els.map((e) => {
      const id = e.getAttribute('data-link-label')!;
      const text = e.querySelector('.lw-label-status')?.textContent ?? '';
      return text.startsWith(`${id} `) ? text.slice(id.length + 1) : text;
    }));
    for (const w of words) expect(w).toMatch(/^(✓ pass|✗ FAIL|⚠ RCD-reliant|○ unchecked)(: .+)?$/);
    const heads = new Set(words.map((w) => w.replace(/:.*$/, '')));
    expect(heads).toContain('✓ pass');
    expect(heads).toContain('✗ FAIL');
    expect(heads).toContain('○ unchecked');
  });

  it('shows the caution in the status bar and in full in the About dialog', async () => {
    const page = await app.newPage();
    expect(await page.textContent('[data-caution]')).toMatch(/design aid.*verify by testing.*local wiring rules/i);
    await page.click('[data-caution]');
    expect(await page.textContent('[data-caution-full]')).toContain(CAUTION);
  });
});

describe('moving and finding', () => {
  it('a drag moves a node as one undo step', async () => {
    const page = await app.newPage();
    await page.keyboard.press('Control+f');
    await page.fill('[data-find]', 'P05');
    await page.keyboard.press('Enter');
    await page.waitForTimeout(400);
    const position = () => page.$eval('.react-flow__node[data-id="P05"]', (e) => (e as HTMLElement).style.transform);
    const before = await position();
    const box = (await page.locator('[data-node-id="P05"]').boundingBox())!;
    await page.mouse.move(box.x + box.width / 2, box.y + box.height / 2);
    await page.mouse.down();
    for (let i = 1; i <= 10; i++) await page.mouse.move(box.x + box.width / 2 + i * 6, box.y + box.height / 2 + i * 8);
    await page.mouse.up();
    await expect.poll(position).not.toBe(before);
    expect(await page.textContent('[data-doc-title]')).toContain('unsaved');
    await leaveFields(page);
    await page.keyboard.press('Control+z');
    await expect.poll(position).toBe(before);
    expect(await page.textContent('[data-doc-title]')).not.toContain('unsaved');
  });

  it('find selects by name and opens that element in the details panel', async () => {
    const page = await app.newPage();
    await page.click('[data-command="edit.find"]');
    await page.fill('[data-find]', 'winch');
    await page.click('[data-find-hit]');
    await expect.poll(() => page.textContent('.lw-right')).toContain('Hull-lift winch');
    // Nodes come before links among equal matches: the point P14 is chosen.
    expect(await page.$eval('[data-node-id="P14"]', (e) => e.className)).toMatch(/is-selected/);
  });
});
