// `npm start`: run Loopwright as a desktop app, opening the demo job (or the file given:
// `npm start -- path/to/job.lwj`).
//  1. Find the Electron runtime (node_modules/electron resolves to its binary's path).
//  2. If it is missing, try to fetch it (node node_modules/electron/install.js; needs internet).
//  3. Still missing: say so in one line (stderr), pointing at `npm run web`, then run the main
//     job anyway, the command-line check of the demo job (stdout), and exit 0.
//  4. Build (scripts/build.mjs), then start Electron on this folder.
// LOOPWRIGHT_NO_ELECTRON=1 behaves as if the runtime were missing and skips the download (for tests).
import { spawn, spawnSync } from 'node:child_process';
import { existsSync } from 'node:fs';
import { createRequire } from 'node:module';
import { resolve } from 'node:path';
import { fileURLToPath } from 'node:url';

const root = fileURLToPath(new URL('..', import.meta.url));
const require = createRequire(import.meta.url);
const MISSING =
  'Electron runtime is missing (could not download it); run "npm run web" to use Loopwright in your browser at http://127.0.0.1:5173';
const DOWNLOAD_TIMEOUT_MS = 120_000;

/** The Electron binary's path, or null when it is not installed. */
function electronBinary() {
  if (process.env.LOOPWRIGHT_NO_ELECTRON === '1') return null;
  try {
    const id = require.resolve('electron');
    delete require.cache[id];
    const binary = require('electron');
    return typeof binary === 'string' && existsSync(binary) ? binary : null;
  } catch {
    return null;
  }
}

function tryDownload() {
  if (process.env.LOOPWRIGHT_NO_ELECTRON === '1') return;
  const install = resolve(root, 'node_modules/electron/install.js');
  if (!existsSync(install)) return;
  spawnSync(process.execPath, [install], { cwd: root, stdio: 'ignore', timeout: DOWNLOAD_TIMEOUT_MS });
}

async function main() {
  let binary = electronBinary();
  if (!binary) {
    tryDownload();
    binary = electronBinary();
  }
  if (!binary) {
    console.error(MISSING);
    const cli = spawnSync(process.execPath, [resolve(root, 'node_modules/tsx/dist/cli.mjs'), resolve(root, 'app/cli/main.ts'), 'check', resolve(root, 'assets/demo.lwj')], {
      cwd: root,
      stdio: ['ignore', 'inherit', 'inherit'],
    });
    // The check's own exit status says whether the demo passes (it has a failing circuit on
    // purpose); `npm start` itself did what it could, so it succeeds unless the check broke.
    process.exit(cli.status === 0 || cli.status === 1 ? 0 : 1);
  }
  const { buildAll } = await import('./build.mjs');
  await buildAll();
  const files = process.argv.slice(2).filter((a) => !a.startsWith('-'));
  const job = files.length > 0 ? files.map((f) => resolve(process.cwd(), f)) : [resolve(root, 'assets/demo.lwj')];
  const env = { ...process.env };
  delete env.ELECTRON_RUN_AS_NODE;
  const child = spawn(binary, [root, ...job], { cwd: root, env, stdio: 'inherit' });
  child.on('exit', (code, signal) => process.exit(signal ? 1 : (code ?? 0)));
  for (const sig of ['SIGINT', 'SIGTERM']) process.on(sig, () => child.kill(sig));
}

main().catch((error) => {
  console.error(`Loopwright did not start: ${error instanceof Error ? error.message : String(error)}`);
  process.exit(1);
});
