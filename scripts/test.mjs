// `npm test`: the type check, then every Vitest project (engine, app, e2e) in one run.
// The e2e project drives the browser build in Chromium, so Chromium is found first and
// handed to the tests as CHROMIUM_PATH. Any failure sets a non-zero exit status.
// Extra arguments go to Vitest: `npm test -- tests/cli`.

import { spawnSync } from 'node:child_process';
import { accessSync, constants, statSync } from 'node:fs';
import { fileURLToPath } from 'node:url';

const root = fileURLToPath(new URL('..', import.meta.url));
const bin = (path) => fileURLToPath(new URL(`../node_modules/${path}`, import.meta.url));
const CANDIDATES = ['/usr/bin/chromium', '/usr/bin/chromium-browser', '/usr/bin/google-chrome'];
const HOW = 'install it with `apt-get install -y chromium` (Debian/Ubuntu) or set CHROMIUM_PATH to a Chromium or Chrome executable';

function executable(path) {
  try {
    accessSync(path, constants.X_OK);
    return statSync(path).isFile();
  } catch {
    return false;
  }
}

function findChromium() {
  const given = process.env.CHROMIUM_PATH;
  if (given !== undefined && given !== '') {
    if (executable(given)) return { path: given };
    return { problem: `npm test: CHROMIUM_PATH=${given} is not an executable file; ${HOW}.` };
  }
  const found = CANDIDATES.find(executable);
  if (found !== undefined) return { path: found };
  return { problem: `npm test: Chromium is needed for the end-to-end tests and was not found; ${HOW}.` };
}

function run(label, args, env = process.env) {
  const result = spawnSync(process.execPath, args, { cwd: root, stdio: 'inherit', env });
  if (result.error !== undefined) {
    console.error(`npm test: could not run ${label}: ${result.error.message}`);
    return 1;
  }
  if (result.signal !== null) return 1;
  return result.status ?? 1;
}

const chromium = findChromium();
if (chromium.problem !== undefined) {
  console.error(chromium.problem);
  process.exit(1);
}

console.log('Type check: tsc -p tsconfig.json --noEmit');
const typed = run('the type check', [bin('typescript/bin/tsc'), '-p', 'tsconfig.json', '--noEmit']);
if (typed !== 0) {
  console.error('npm test: the type check failed (above); tests not run.');
  process.exit(typed);
}

const env = { ...process.env, CHROMIUM_PATH: chromium.path };
process.exit(run('vitest', [bin('vitest/vitest.mjs'), 'run', ...process.argv.slice(2)], env));
