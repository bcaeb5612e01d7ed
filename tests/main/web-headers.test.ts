// The browser build's server (scripts/web.mjs) sends the page's Content-Security-Policy as a
// header as well as the meta tag, and refuses framing (which a meta policy cannot).
import { promises as fs } from 'node:fs';
import type { Server } from 'node:http';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { CSP } from '../../app/shared/csp.js';

let dir: string;
let server: Server;
let base: string;

beforeAll(async () => {
  dir = await fs.mkdtemp(path.join(os.tmpdir(), 'loopwright-web-'));
  // The page as vite.config.ts builds it: the policy of app/shared/csp.ts in a meta tag.
  await fs.writeFile(path.join(dir, 'index.html'), `<!doctype html><html><head><meta http-equiv="Content-Security-Policy" content="${CSP}" /></head><body></body></html>`);
  await fs.writeFile(path.join(dir, 'app.js'), 'export {};');
  const web = (await import(path.resolve('scripts/web.mjs'))) as { serve(root: string, port: number): Promise<Server> };
  server = await web.serve(dir, 0);
  const address = server.address();
  base = `http://127.0.0.1:${typeof address === 'object' && address ? address.port : 0}`;
});

afterAll(async () => {
  await new Promise((r) => server.close(r));
  await fs.rm(dir, { recursive: true, force: true });
});

describe('the browser build server', () => {
  it('sends the same policy as the meta tag, with framing refused, on the page and its files', async () => {
    for (const file of ['/', '/app.js']) {
      const res = await fetch(`${base}${file}`);
      expect(res.status).toBe(200);
      expect(res.headers.get('content-security-policy')).toBe(`${CSP}; frame-ancestors 'none'`);
      expect(res.headers.get('x-frame-options')).toBe('DENY');
      expect(res.headers.get('x-content-type-options')).toBe('nosniff');
    }
  });
});
