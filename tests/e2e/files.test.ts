// End to end: open a .lwj through the file input, check every drawn status against the engine's
// results document, save it back (download intercepted) with the same job content; autosave and
// the restore offer after a reload; a refused file leaves the open job untouched.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { analyse, parseJob, serialiseJob } from '../../engine/index.js';
import { startApp, stopApp, type App } from './harness.js';
import { findAndSelect, leaveFields, statuses, typeField } from './helpers.js';

let app: App;
let dir: string;
beforeAll(async () => {
  app = await startApp();
  dir = mkdtempSync(join(tmpdir(), 'lw-files-'));
});
afterAll(async () => {
  await stopApp();
});

/** The demo with a twist, so it cannot pass by showing the demo that opens at start. */
function variantJob(): string {
  const loaded = parseJob(readFileSync(resolve('assets/demo.lwj'), 'utf8'));
  if (!loaded.ok) throw new Error('demo did not load');
  const job = loaded.job;
  job.job.title = 'Variant for the file test';
  job.links = job.links.map((l) => (l.id === 'C04' ? { ...l, cable: { ...l.cable, length: 400 } } : l));
  return serialiseJob(job);
}

describe('files in the browser', () => {
  it('opens a job through the file input (asking nothing) and draws the engine’s statuses', async () => {
    const page = await app.newPage();
    const text = variantJob();
    const file = join(dir, 'variant.lwj');
    writeFileSync(file, text);
    let asked = false;
    page.on('dialog', (d) => {
      asked = true;
      void d.accept();
    });
    await page.setInputFiles('input[data-open-job]', file);
    await expect.poll(() => page.textContent('[data-doc-title]')).toContain('variant.lwj');
    expect(asked).toBe(false);
    const parsed = parseJob(text);
    if (!parsed.ok) throw new Error('variant did not load');
    const expected = Object.fromEntries(analyse(parsed.job).circuits.map((c) => [c.link, c.status]));
    expect(expected.C04).toBe('fail');
    expect(await statuses(page)).toEqual(expected);
  });

  it('saves the job back as a download with the same content', async () => {
    const page = await app.newPage();
    await page.evaluate(() => {
      delete (window as unknown as { showSaveFilePicker?: unknown }).showSaveFilePicker;
    });
    const text = variantJob();
    const file = join(dir, 'roundtrip.lwj');
    writeFileSync(file, text);
    await page.setInputFiles('input[data-open-job]', file);
    await expect.poll(() => page.textContent('[data-doc-title]')).toContain('roundtrip.lwj');
    const [download] = await Promise.all([page.waitForEvent('download'), page.click('[data-command="file.save"]')]);
    expect(download.suggestedFilename()).toBe('roundtrip.lwj');
    const saved = readFileSync((await download.path())!, 'utf8');
    expect(JSON.parse(saved)).toEqual(JSON.parse(text));
    expect(saved).toBe(text);
    expect(await page.textContent('[data-doc-title]')).not.toContain('unsaved');
  });

  it('asks before opening over unsaved changes, and keeps them when the user says no', async () => {
    const page = await app.newPage();
    await findAndSelect(page, 'C01');
    await typeField(page, 'cable.length', '41');
    await expect.poll(() => page.textContent('[data-doc-title]')).toContain('unsaved');
    const file = join(dir, 'other.lwj');
    writeFileSync(file, variantJob());
    const messages: string[] = [];
    page.once('dialog', (d) => {
      messages.push(d.message());
      void d.dismiss();
    });
    await page.setInputFiles('input[data-open-job]', file);
    await expect.poll(() => messages.length).toBe(1);
    expect(messages[0]).toMatch(/unsaved changes/);
    expect(await page.textContent('[data-doc-title]')).not.toContain('other.lwj');
  });

  it('refuses a broken file, lists where the problems are, and keeps the open job', async () => {
    const page = await app.newPage();
    const bad = JSON.parse(variantJob()) as { links: Array<{ cable: { length: number } }> };
    bad.links[3]!.cable.length = -5;
    const file = join(dir, 'broken.lwj');
    writeFileSync(file, JSON.stringify(bad));
    const before = await statuses(page);
    await page.setInputFiles('input[data-open-job]', file);
    await page.waitForSelector('[data-problems]');
    expect(await page.textContent('[data-problems]')).toMatch(/links\[3\] \(\w+\): cable\.length/);
    expect(await statuses(page)).toEqual(before);
  });

  it('autosaves after an edit and offers to restore it after a reload', async () => {
    const page = await app.newPage();
    await findAndSelect(page, 'C04');
    await typeField(page, 'cable.length', '400');
    await expect.poll(async () => (await statuses(page)).C04).toBe('fail');
    await leaveFields(page);
    // Under this tab's own key (loopwright.autosave.v1.<tab>), so another tab never overwrites it.
    await expect.poll(() => page.evaluate(() => Object.keys(localStorage).some((k) => k.startsWith('loopwright.autosave.v1.'))), { timeout: 5000 }).toBe(true);
    await page.reload();
    await page.waitForSelector('[data-restore-banner]');
    // The demo opened again (C04 passes) until the user restores.
    expect((await statuses(page)).C04).toBe('pass');
    await page.click('[data-restore]');
    await expect.poll(async () => (await statuses(page)).C04).toBe('fail');
    expect(await page.textContent('[data-doc-title]')).toContain('unsaved');
    await page.reload();
    // Restored and still unsaved: offered again; Discard removes the offer for good.
    await page.waitForSelector('[data-restore-banner]');
    await page.click('[data-discard]');
    await page.reload();
    await page.waitForSelector('[data-node-id]');
    expect(await page.locator('[data-restore-banner]').count()).toBe(0);
  });
});

describe('printing in the browser', () => {
  it('prints the printout’s own sheets (diagram, schedule, assumptions) from a print view', async () => {
    const page = await app.newPage();
    await page.evaluate(() => {
      const w = window as unknown as { print(): void; printed?: Array<{ title: string; width: number }> };
      w.print = () => {
        w.printed = [...document.querySelectorAll<HTMLImageElement>('[data-print-view] img')].map((i) => ({ title: i.alt, width: i.naturalWidth }));
      };
    });
    await page.click('[data-command="file.print"]');
    const printed = await page.waitForFunction(() => (window as unknown as { printed?: unknown }).printed).then((h) => h.jsonValue()) as Array<{ title: string; width: number }>;
    expect(printed.length).toBeGreaterThanOrEqual(3);
    for (const sheet of printed) expect(sheet.width).toBeGreaterThan(0);
    expect(printed.map((p) => p.title).join(' | ')).toMatch(/schedule/i);
    expect(await page.locator('[data-print-view]').count()).toBe(0);
  });
});
