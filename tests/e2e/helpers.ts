// Small helpers for driving the sheet in the end-to-end tests.
import type { Page } from 'playwright-core';

export async function statuses(page: Page): Promise<Record<string, string>> {
  return page.$$eval('[data-link-id]', (els) => Object.fromEntries(els.map((e) => [e.getAttribute('data-link-id')!, e.getAttribute('data-status')!])));
}

export async function centreOf(page: Page, selector: string): Promise<{ x: number; y: number }> {
  const box = await page.locator(selector).first().boundingBox();
  if (!box) throw new Error(`${selector} is not on screen`);
  return { x: box.x + box.width / 2, y: box.y + box.height / 2 };
}

/** The centre of `selector` once it has stopped moving (a connect may rearrange the sheet and
 *  move the view, taking a few frames, later on a loaded machine). */
async function settledCentreOf(page: Page, selector: string): Promise<{ x: number; y: number }> {
  let last = await centreOf(page, selector);
  for (let tries = 0; tries < 40; tries++) {
    await page.waitForTimeout(100);
    const now = await centreOf(page, selector);
    if (Math.abs(now.x - last.x) < 0.5 && Math.abs(now.y - last.y) < 0.5) return now;
    last = now;
  }
  return last;
}

/** Drags from one node's outgoing handle to another node's incoming handle with the mouse. */
export async function connect(page: Page, from: string, to: string): Promise<void> {
  const a = await settledCentreOf(page, `.react-flow__handle.source[data-nodeid="${from}"]`);
  const b = await settledCentreOf(page, `.react-flow__handle.target[data-nodeid="${to}"]`);
  await page.mouse.move(a.x, a.y);
  await page.mouse.down();
  await page.mouse.move((a.x + b.x) / 2, (a.y + b.y) / 2, { steps: 8 });
  await page.mouse.move(b.x, b.y, { steps: 8 });
  await page.mouse.up();
}

/** Drops a part from the palette onto the sheet at a point given as fractions of the sheet's size. */
export async function dropPart(page: Page, kind: 'supply' | 'board' | 'point', fx: number, fy: number): Promise<void> {
  const sheet = await page.locator('[data-sheet]').boundingBox();
  if (!sheet) throw new Error('no sheet');
  await page.dragAndDrop(`[data-part="${kind}"]`, '[data-sheet] .react-flow__pane', {
    targetPosition: { x: sheet.width * fx, y: sheet.height * fy },
  });
}

/** Types a value into a details-panel field and commits it with Enter. */
export async function typeField(page: Page, field: string, value: string): Promise<void> {
  const input = page.locator(`.lw-right [data-field="${field}"]`).first();
  await input.fill(value);
  await input.press('Enter');
}

/** Moves the keyboard focus out of any field, so shortcuts act on the job. */
export async function leaveFields(page: Page): Promise<void> {
  await page.evaluate(() => (document.activeElement as HTMLElement | null)?.blur());
}

/** Selects a node or link by id through Find (which also centres it on the sheet). */
export async function findAndSelect(page: Page, id: string): Promise<void> {
  await leaveFields(page);
  await page.click('[data-command="edit.find"]');
  await page.fill('[data-find]', id);
  await page.keyboard.press('Enter');
  await page.waitForTimeout(350);
}
