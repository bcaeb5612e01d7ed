// The shared end-to-end harness: builds the renderer once per run (vite build), serves
// dist/renderer on a free port with the same static server as `npm run web`, and launches
// headless Chromium (CHROMIUM_PATH, else /usr/bin/chromium) with a fresh profile.
//
//   const app = await startApp();          // in beforeAll
//   const page = await app.newPage();      // a fresh page with the demo job open
//   await stopApp();                       // in afterAll
import { existsSync, statSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import type { Server } from 'node:http';
import { chromium, type Browser, type BrowserContext, type Page } from 'playwright-core';

const root = resolve(fileURLToPath(new URL('../..', import.meta.url)));
const dist = join(root, 'dist/renderer');

export const CHROMIUM_ARGS = [
  '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run',
  '--disable-background-networking', '--disable-component-update', '--disable-sync',
];

export function chromiumPath(): string {
  const candidates = [process.env.CHROMIUM_PATH, '/usr/bin/chromium', '/usr/bin/chromium-browser', '/usr/bin/google-chrome'];
  const found = candidates.find((p): p is string => !!p && existsSync(p));
  if (!found) throw new Error('Chromium not found: install it (apt-get install -y chromium) or set CHROMIUM_PATH');
  return found;
}

export interface App {
  url: string;
  browser: Browser;
  /** A new page (own context: own storage, downloads accepted) with the app loaded and the demo open. */
  newPage(options?: { viewport?: { width: number; height: number } }): Promise<Page>;
}

let running: { app: App; server: Server; contexts: BrowserContext[] } | null = null;
let built = false;

async function buildOnce(): Promise<void> {
  if (built || process.env.LOOPWRIGHT_E2E_NO_BUILD === '1') return;
  const web = (await import(join(root, 'scripts/web.mjs'))) as { build(): Promise<void> };
  await web.build();
  built = true;
}

export async function startApp(): Promise<App> {
  if (running) return running.app;
  await buildOnce();
  if (!existsSync(join(dist, 'index.html')) || !statSync(join(dist, 'index.html')).isFile()) {
    throw new Error(`the renderer build is missing: ${dist}/index.html`);
  }
  const web = (await import(join(root, 'scripts/web.mjs'))) as { serve(dir: string, port: number): Promise<Server> };
  const server = await web.serve(dist, 0);
  const address = server.address();
  const port = typeof address === 'object' && address ? address.port : 0;
  const url = `http://127.0.0.1:${port}/`;
  // playwright-core gives every launch a fresh temporary profile (user-data-dir) of its own.
  const browser = await chromium.launch({ executablePath: chromiumPath(), headless: true, args: CHROMIUM_ARGS });
  const contexts: BrowserContext[] = [];
  const app: App = {
    url,
    browser,
    async newPage(options) {
      const context = await browser.newContext({ acceptDownloads: true, viewport: options?.viewport ?? { width: 1600, height: 1000 } });
      contexts.push(context);
      const page = await context.newPage();
      page.on('pageerror', (e) => console.error(`[page error] ${e.message}`));
      page.on('console', (m) => {
        if (m.type() === 'error') console.error(`[console] ${m.text()}`);
      });
      await page.goto(url);
      await page.waitForSelector('[data-node-id]', { timeout: 30_000 });
      return page;
    },
  };
  running = { app, server, contexts };
  return app;
}

export async function stopApp(): Promise<void> {
  if (!running) return;
  const { server, app, contexts } = running;
  running = null;
  for (const c of contexts) await c.close().catch(() => undefined);
  await app.browser.close().catch(() => undefined);
  await new Promise<void>((ok) => server.close(() => ok()));
}
