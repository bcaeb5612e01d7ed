#!/usr/bin/env node
// `loopwright COMMAND ...`: the command line as installed (`npx loopwright`, or `loopwright`
// after `npm link`). It runs the bundle that `npm run build:cli` writes to dist/cli/ (the
// `prepare` script builds it on `npm ci` and `npm install`); `npm run --silent cli -- ...` runs
// the same program from source through tsx.
// A missing bundle (dist/ deleted) is rebuilt here when the build script and esbuild are at hand;
// otherwise one line says how to build it. Never a stack trace: exit status 2, as for bad usage.
import { existsSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';

const UNUSABLE = 2;
const root = dirname(dirname(fileURLToPath(import.meta.url)));
const bundle = join(root, 'dist', 'cli', 'loopwright.mjs');
const buildScript = join(root, 'scripts', 'build.mjs');
const HOW = `build it with \`npm run build:cli\` in ${root} (after \`npm install\`)`;

function firstLine(error) {
  const text = error instanceof Error ? error.message : String(error);
  return text.split('\n')[0] ?? '';
}

function giveUp(message) {
  process.stderr.write(`loopwright: ${message}\n`);
  process.exit(UNUSABLE);
}

/** Build the missing bundle: null when it was built, else why not. */
async function rebuild() {
  if (!existsSync(buildScript)) return 'no build script here';
  try {
    const { buildCli } = await import(pathToFileURL(buildScript).href);
    await buildCli();
  } catch (error) {
    return `rebuilding failed: ${firstLine(error)}`;
  }
  if (!existsSync(bundle)) return 'rebuilding wrote no bundle';
  process.stderr.write(`loopwright: rebuilt the missing command-line bundle in ${dirname(bundle)}\n`);
  return null;
}

if (!existsSync(bundle)) {
  const failure = await rebuild();
  if (failure !== null) giveUp(`the command-line bundle ${bundle} is missing (${failure}); ${HOW}`);
}

// The usage lines then name this command rather than the npm script (app/cli/help.ts).
globalThis.__loopwrightBin = true;
try {
  await import(pathToFileURL(bundle).href);
} catch (error) {
  giveUp(`could not load the command-line bundle ${bundle}: ${firstLine(error)}; re${HOW}`);
}
