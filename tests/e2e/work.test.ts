// End to end in headless Chromium: the editor at work on the demo and on a job drawn from
// nothing: connect by dropping a cable on a part's body, move a circuit to another board, add
// circuits to a board, walk the failures, errors that clear, the laptop layout, two tabs.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { startApp, stopApp, type App } from './harness.js';
import { centreOf, findAndSelect, leaveFields, statuses } from './helpers.js';

let app: App;
beforeAll(async () => {
  app = await startApp();
});
afterAll(async () => {
  await stopApp();
});

async function newJob(page: Page) {
  await page.click('[data-command="file.new"]');
  await page.waitForFunction(() => document.querySelectorAll('[data-node-id]').length === 0);
}

/** Adds a part from the context menu with nothing selected (a selected board would feed it). */
async function addAt(page: Page, kind: 'supply' | 'board' | 'point', fx: number, fy: number, id: string) {
  await leaveFields(page);
  await page.keyboard.press('Escape');
  await page.keyboard.press('Escape');
  const sheet = (await page.locator('[data-sheet]').boundingBox())!;
  await page.mouse.click(sheet.x + sheet.width * fx, sheet.y + sheet.height * fy, { button: 'right' });
  await page.click(`.lw-menu [data-command="insert.${kind}"]`);
  await page.waitForSelector(`[data-node-id="${id}"]`);
}

/** Drags from a node's output dot and releases on the middle of another node's body. */
async function dropOnBody(page: Page, from: string, to: string) {
  const a = await centreOf(page, `.react-flow__handle.source[data-nodeid="${from}"]`);
  const box = (await page.locator(`[data-node-id="${to}"]`).boundingBox())!;
  // Lower half of the body, well away from its input dot.
  const b = { x: box.x + box.width * 0.3, y: box.y + box.height * 0.8 };
  await page.mouse.move(a.x, a.y);
  await page.mouse.down();
  await page.mouse.move((a.x + b.x) / 2, (a.y + b.y) / 2, { steps: 8 });
  await page.mouse.move(b.x, b.y, { steps: 8 });
  await page.mouse.up();
}

/** Nodes and link labels the overview map lies over (none when it is left out). */
async function coveredByMap(page: Page): Promise<string[]> {
  return page.evaluate(() => {
    const map = document.querySelector('.react-flow__minimap');
    if (!map || getComputedStyle(map).display === 'none') return [];
    const m = map.getBoundingClientRect();
    return [...document.querySelectorAll('[data-node-id], [data-link-label]')].filter((e) => {
      const r = e.getBoundingClientRect();
      return r.width > 0 && r.x < m.right && r.right > m.x && r.y < m.bottom && r.bottom > m.y;
    }).map((e) => e.getAttribute('data-node-id') ?? e.getAttribute('data-link-label')!);
  });
}

describe('connecting', () => {
  it('a cable released on a part body connects; a supply has no input dot; From moves a circuit', async () => {
    const page = await app.newPage();
    await newJob(page);
    await addAt(page, 'supply', 0.5, 0.1, 'S1');
    await addAt(page, 'board', 0.3, 0.4, 'B1');
    await addAt(page, 'board', 0.7, 0.4, 'B2');
    await addAt(page, 'point', 0.3, 0.75, 'P1');
    expect(await page.locator('.react-flow__handle.target[data-nodeid="S1"]').count()).toBe(0);
    // Not yet fed: flagged on the sheet in words.
    expect(await page.getAttribute('.react-flow__node[data-id="P1"]', 'aria-label')).toMatch(/P1.*not fed/);

    await dropOnBody(page, 'S1', 'B1');
    await page.waitForSelector('[data-link-id="M1"]', { state: 'attached' });
    await dropOnBody(page, 'S1', 'B2');
    await page.waitForSelector('[data-link-id="M2"]', { state: 'attached' });
    await dropOnBody(page, 'B1', 'P1');
    await page.waitForSelector('[data-link-id="C1"]', { state: 'attached' });
    expect(await page.evaluate(() => document.querySelector('.react-flow__node[data-id="P1"]')!.classList.contains('lw-unfed'))).toBe(false);

    // A release on empty sheet says so.
    const a = await centreOf(page, '.react-flow__handle.source[data-nodeid="B2"]');
    await page.mouse.move(a.x, a.y);
    await page.mouse.down();
    await page.mouse.move(a.x + 200, a.y + 60, { steps: 8 });
    await page.mouse.up();
    await expect.poll(() => page.textContent('[data-message]')).toMatch(/release the cable from B2 on a part/);

    // Move C1 to B2 from the details panel.
    await page.click('[data-link-label="C1"]');
    await page.locator('.lw-right [data-field="from"]').selectOption('B2');
    await expect.poll(() => page.evaluate(() => document.querySelector('.react-flow__edge[data-id="C1"], [data-testid="rf__edge-C1"]')?.getAttribute('aria-label') ?? '')).toMatch(/B2 to P1/);
    // Feeding B2 from P1 would loop: refused beside the field, nothing changed.
    await page.click('[data-link-label="M2"]');
    await page.locator('.lw-right [data-field="from"]').selectOption('P1');
    await expect.poll(() => page.textContent('.lw-right [data-field-error="from"]')).toMatch(/M2 cannot be fed from P1: "B2" already feeds "P1"/);
    expect(await page.locator('.lw-right [data-field="from"]').inputValue()).toBe('S1');
    await page.screenshot({ path: 'test-results/work-connect.png' });
  });
});

describe('adding circuits and walking the failures', () => {
  it('adds six circuits to a selected board in one step and undoes them together', async () => {
    const page = await app.newPage();
    const before = await page.locator('[data-link-id]').count();
    await findAndSelect(page, 'DBW');
    await leaveFields(page);
    await page.keyboard.press('Alt+c');
    await page.waitForSelector('[data-add-circuits]');
    await page.fill('[data-add-count]', '6');
    await page.locator('[data-add-use]').selectOption('lighting');
    await page.click('[data-add-ok]');
    await expect.poll(() => page.locator('[data-link-id]').count()).toBe(before + 6);
    expect(await page.textContent('[data-message]')).toMatch(/Added 6 lighting circuits to DBW/);
    await leaveFields(page);
    await page.keyboard.press('Control+z');
    await expect.poll(() => page.locator('[data-link-id]').count()).toBe(before);
  });

  it('F8 selects and frames each failing circuit in turn, failures before RCD-reliant', async () => {
    const page = await app.newPage({ viewport: { width: 1280, height: 800 } });
    const order = await page.evaluate(() => [...document.querySelectorAll('[data-link-id]')].map((e) => [e.getAttribute('data-link-id'), e.getAttribute('data-verdict')]));
    const failing = order.filter(([, s]) => s === 'fail').length;
    expect(failing).toBeGreaterThan(0);
    await leaveFields(page);
    const seen: string[] = [];
    for (let i = 0; i < failing + 1; i++) {
      await page.keyboard.press('F8');
      await expect.poll(() => page.textContent('[data-message]')).toMatch(/^(✗ FAIL|⚠ RCD-reliant) /);
      const text = (await page.textContent('[data-message]'))!;
      seen.push(text);
      const id = /^(?:✗ FAIL|⚠ RCD-reliant) (\S+)/.exec(text)![1]!;
      // Selected, and its label on screen inside the sheet.
      await expect.poll(() => page.evaluate((link) => {
        const label = document.querySelector(`[data-link-label="${link}"]`)?.getBoundingClientRect();
        const sheet = document.querySelector('[data-sheet]')!.getBoundingClientRect();
        return !!label && label.left >= sheet.left && label.right <= sheet.right && label.top >= sheet.top && label.bottom <= sheet.bottom;
      }, id)).toBe(true);
    }
    expect(seen.slice(0, failing).every((t) => t.startsWith('✗ FAIL'))).toBe(true);
    expect(seen[failing]!.startsWith('⚠ RCD-reliant') || seen[failing] === seen[0]).toBe(true);
    expect(Object.keys(await statuses(page)).length).toBe(order.length);
  });
});

describe('messages that clear', () => {
  it('a refused length shows beside the field and goes on a valid value; a schedule refusal goes on Escape and stays in its row', async () => {
    const page = await app.newPage();
    const first = (await page.getAttribute('[data-schedule-row]', 'data-schedule-row'))!;
    await page.click(`[data-link-label="${first}"]`);
    const field = page.locator('.lw-right [data-field="cable.length"]');
    await field.fill('-5');
    await field.press('Enter');
    await expect.poll(() => page.textContent('.lw-right [data-field-error="cable.length"]')).toMatch(/Length must be ≥ 0 m, got -5/);
    await field.fill('12');
    await field.press('Enter');
    await expect.poll(() => page.locator('.lw-right [data-field-error]').count()).toBe(0);
    // Far outside practice: accepted, with a warning beside the field.
    await field.fill('1e9');
    await field.press('Enter');
    await expect.poll(() => page.textContent('.lw-right [data-field-warning="cable.length"]')).toMatch(/far above practice/);
    await leaveFields(page);
    await page.keyboard.press('Control+z');
    await expect.poll(() => page.locator('.lw-right [data-field-warning]').count()).toBe(0);

    // In the schedule: the box sits inside its own row, and Escape closes it.
    const cell = page.locator(`[data-schedule-row="${first}"] [data-cell="cable.length"]`);
    await cell.fill('-7');
    await cell.press('Enter');
    const box = page.locator(`[data-schedule-row="${first}"] [data-cell-error="cable.length"]`);
    await expect.poll(() => box.count()).toBe(1);
    const row = (await page.locator(`[data-schedule-row="${first}"]`).boundingBox())!;
    const err = (await box.boundingBox())!;
    expect(err.y).toBeGreaterThanOrEqual(row.y - 1);
    expect(err.y + err.height).toBeLessThanOrEqual(row.y + row.height + 1);
    await cell.press('Escape');
    await expect.poll(() => box.count()).toBe(0);
  });
});

describe('keyboard', () => {
  it('connects two parts from the keyboard, reads parts and links out, and has a skip link and a tab list', async () => {
    const page = await app.newPage();
    await newJob(page);
    await addAt(page, 'board', 0.3, 0.3, 'B1');
    await addAt(page, 'point', 0.6, 0.7, 'P1');
    await page.click('[data-node-id="B1"]');
    await leaveFields(page);
    await page.keyboard.press('Alt+l');
    await page.waitForSelector('[data-connect-query]');
    await page.keyboard.type('P1');
    await page.keyboard.press('Enter');
    await page.waitForSelector('[data-link-id="C1"]', { state: 'attached' });
    expect(await page.getAttribute('.react-flow__node[data-id="P1"]', 'aria-label')).toMatch(/^Point P1 "Point P1", fed by C1: /);
    expect(await page.locator('[aria-label^="Link C1"]').count()).toBeGreaterThan(0);
    expect(await page.getAttribute('[role="tab"][aria-selected="true"]', 'aria-controls')).toBe('lw-tabpanel-details');
    await page.focus('[data-tab="details"]');
    await page.keyboard.press('ArrowRight');
    await expect.poll(() => page.getAttribute('[data-tab="job"]', 'aria-selected')).toBe('true');
    expect(await page.locator('[role="tabpanel"]#lw-tabpanel-job').count()).toBe(1);
    expect(await page.locator('[data-skip-schedule]').count()).toBe(1);
  });
});

describe('a link reached from the keyboard', () => {
  it('is brought into view when Tab reaches it off the sheet', async () => {
    const page = await app.newPage({ viewport: { width: 1280, height: 800 } });
    // A link whose far end is off the first view (the demo opens on the top of its tree).
    const off = await page.evaluate(() => {
      const sheet = document.querySelector('[data-sheet]')!.getBoundingClientRect();
      const edge = [...document.querySelectorAll<SVGGElement>('.react-flow__edge[data-id]')].find((e) => {
        const label = document.querySelector(`[data-link-label="${e.getAttribute('data-id')}"]`);
        const r = label?.getBoundingClientRect();
        return !r || r.right < sheet.left || r.left > sheet.right || r.bottom < sheet.top || r.top > sheet.bottom;
      });
      return edge?.getAttribute('data-id') ?? null;
    });
    expect(off).not.toBeNull();
    await page.keyboard.press('Shift');
    await page.evaluate((id) => document.querySelector<SVGGElement>(`.react-flow__edge[data-id="${id}"]`)!.focus(), off);
    await expect.poll(() => page.evaluate((id) => {
      const sheet = document.querySelector('[data-sheet]')!.getBoundingClientRect();
      const r = document.querySelector(`[data-link-label="${id}"]`)?.getBoundingClientRect();
      return !!r && r.left >= sheet.left && r.right <= sheet.right && r.top >= sheet.top && r.bottom <= sheet.bottom;
    }, off)).toBe(true);
  });
});

describe('a laptop screen, 1280 × 800', () => {
  it('docks the breakdown beside the schedule, folds the side columns, and Fit clears the out-of-view note', async () => {
    const page = await app.newPage({ viewport: { width: 1280, height: 800 } });
    await expect.poll(() => page.textContent('[data-message]')).toMatch(/part of the job is out of view/i);
    await page.click('[data-zoom="fit"]');
    await expect.poll(() => page.textContent('[data-message]')).not.toMatch(/out of view/);
    // Zoom controls sit under the drawing: no node or label under them.
    const bar = (await page.locator('.lw-zoombar').boundingBox())!;
    const sheet = (await page.locator('[data-sheet]').boundingBox())!;
    expect(bar.y).toBeGreaterThanOrEqual(sheet.y + sheet.height - 1);
    // The overview map covers nothing after Fit, nor after the drawing is panned under its corner.
    await page.waitForTimeout(400);
    expect(await coveredByMap(page)).toEqual([]);
    await page.mouse.move(sheet.x + sheet.width * 0.4, sheet.y + sheet.height * 0.6);
    await page.mouse.down();
    await page.mouse.move(sheet.x + sheet.width * 0.75, sheet.y + sheet.height * 0.1, { steps: 8 });
    await page.mouse.up();
    await page.waitForTimeout(300);
    expect(await coveredByMap(page)).toEqual([]);

    await page.click('[data-command="view.traceWorst"]');
    await page.waitForSelector('[data-breakdown-box]');
    await page.click('[data-action="dock-breakdown"]');
    await expect.poll(() => page.getAttribute('[data-breakdown-box]', 'data-dock')).toBe('schedule');
    const docked = (await page.locator('[data-breakdown-box]').boundingBox())!;
    const sheetNow = (await page.locator('[data-sheet]').boundingBox())!;
    expect(docked.y).toBeGreaterThanOrEqual(sheetNow.y + sheetNow.height);
    const before = sheetNow.width;
    await page.click('[data-action="fold-palette"]');
    await page.click('[data-action="fold-right"]');
    await expect.poll(async () => (await page.locator('[data-sheet]').boundingBox())!.width).toBeGreaterThan(before + 300);
    await page.screenshot({ path: 'test-results/work-1280-docked.png' });
    await page.click('[data-action="unfold-right"]');
    await page.waitForSelector('[data-tab="details"]');
  });
});

describe('two tabs and a reload', () => {
  it('two tabs keep their own autosave; after Save and a reload the saved job reopens', async () => {
    const page = await app.newPage();
    const context = page.context();
    const second = await context.newPage();
    await second.goto(app.url);
    await second.waitForSelector('[data-node-id]');
    const rename = async (p: Page, title: string) => {
      await p.click('[data-tab="job"]');
      const f = p.locator('.lw-right [data-field="job.title"]');
      await f.fill(title);
      await f.press('Enter');
    };
    await rename(page, 'Tab one');
    await rename(second, 'Tab two');
    await page.waitForTimeout(2600);
    const stored = await page.evaluate(() => Object.keys(localStorage).filter((k) => k.startsWith('loopwright.autosave.v1.')).map((k) => JSON.parse(localStorage.getItem(k)!).text as string));
    expect(stored.some((t) => t.includes('Tab one'))).toBe(true);
    expect(stored.some((t) => t.includes('Tab two'))).toBe(true);

    // Save (a download in an automated browser), reload: the saved job, not the demo.
    const download = page.waitForEvent('download');
    await leaveFields(page);
    await page.keyboard.press('Control+s');
    await download;
    await page.reload();
    await page.waitForSelector('[data-node-id]');
    await expect.poll(() => page.textContent('[data-message]')).toMatch(/Reopened .*as last saved/);
    await page.click('[data-tab="job"]');
    expect(await page.locator('.lw-right [data-field="job.title"]').inputValue()).toBe('Tab one');
  });
});
