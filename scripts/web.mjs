// `npm run web`: build the renderer with Vite, then serve dist/renderer at http://127.0.0.1:5173
// (PORT overrides) with a small static server. `--no-build` serves what is already built.
import { createServer } from 'node:http';
import { readFile, stat } from 'node:fs/promises';
import { extname, join, normalize, resolve, sep } from 'node:path';
import { fileURLToPath } from 'node:url';

const here = fileURLToPath(new URL('..', import.meta.url));
const dir = resolve(here, 'dist/renderer');

const TYPES = {
  '.html': 'text/html; charset=utf-8',
  '.js': 'text/javascript; charset=utf-8',
  '.mjs': 'text/javascript; charset=utf-8',
  '.css': 'text/css; charset=utf-8',
  '.json': 'application/json; charset=utf-8',
  '.lwj': 'application/json; charset=utf-8',
  '.svg': 'image/svg+xml',
  '.png': 'image/png',
  '.ico': 'image/x-icon',
  '.woff2': 'font/woff2',
  '.ttf': 'font/ttf',
  '.wasm': 'application/wasm',
  '.map': 'application/json; charset=utf-8',
};

export async function build() {
  const { build: viteBuild } = await import('vite');
  await viteBuild({ configFile: resolve(here, 'vite.config.ts'), logLevel: 'warn' });
}

/** The page's own Content-Security-Policy (the meta tag of root/index.html, which vite.config.ts
 *  fills from app/shared/csp.ts), sent as a header too, with framing refused (a meta policy
 *  cannot say frame-ancestors). A strict policy when the page has none. */
export async function headerPolicy(root = dir) {
  const html = await readFile(join(root, 'index.html'), 'utf8').catch(() => '');
  const m = /<meta\s+http-equiv=["']Content-Security-Policy["']\s+content="([^"]*)"/i.exec(html);
  const meta = m ? m[1].replace(/&quot;/g, '"').replace(/&#39;/g, "'").replace(/&amp;/g, '&') : "default-src 'self'; object-src 'none'; base-uri 'none'";
  return `${meta}; frame-ancestors 'none'`;
}

/** Serves `root` on host:port; resolves with the server once it listens. */
export function serve(root = dir, port = 5173, host = '127.0.0.1') {
  const server = createServer(async (req, res) => {
    try {
      const url = new URL(req.url ?? '/', 'http://localhost');
      let path = decodeURIComponent(url.pathname);
      if (path.endsWith('/')) path += 'index.html';
      const file = normalize(join(root, path));
      if (file !== root && !file.startsWith(root + sep)) {
        res.writeHead(403).end('Forbidden');
        return;
      }
      const info = await stat(file).catch(() => null);
      if (!info || !info.isFile()) {
        res.writeHead(404, { 'content-type': 'text/plain; charset=utf-8' }).end(`Not found: ${path}`);
        return;
      }
      const body = await readFile(file);
      res.writeHead(200, {
        'content-type': TYPES[extname(file)] ?? 'application/octet-stream',
        'cache-control': 'no-cache',
        'x-content-type-options': 'nosniff',
        'content-security-policy': await headerPolicy(root),
        'x-frame-options': 'DENY',
      });
      res.end(req.method === 'HEAD' ? undefined : body);
    } catch (e) {
      res.writeHead(500, { 'content-type': 'text/plain; charset=utf-8' }).end(String(e));
    }
  });
  return new Promise((ok, fail) => {
    server.once('error', fail);
    server.listen(port, host, () => ok(server));
  });
}

const isMain = process.argv[1] && resolve(process.argv[1]) === fileURLToPath(import.meta.url);
if (isMain) {
  const port = Number(process.env.PORT ?? 5173);
  if (!Number.isInteger(port) || port < 0 || port > 65535) {
    console.error(`PORT must be a port number (0–65535), got ${process.env.PORT}`);
    process.exit(2);
  }
  try {
    if (!process.argv.includes('--no-build')) await build();
    const server = await serve(dir, port);
    const address = server.address();
    console.log(`Loopwright is running at http://127.0.0.1:${typeof address === 'object' && address ? address.port : port}/ (Ctrl+C stops it)`);
  } catch (e) {
    console.error(e && e.code === 'EADDRINUSE' ? `Port ${port} is in use; set PORT to another port, e.g. PORT=5174 npm run web` : String(e?.stack ?? e));
    process.exit(1);
  }
}
