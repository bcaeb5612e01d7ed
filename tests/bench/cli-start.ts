// The command line's start-up time, for `npm run bench`: the wall time of `node
// bin/loopwright.mjs --help` (the installed command: its bundle in dist/cli/ loads, prints the
// help and exits), spawned several times in turn; the median is reported. Target: well under
// half a second (issue 12). A benchmark, never a test: nothing here runs under vitest.
//
// One untimed run comes first: it warms the file cache and, where dist/cli/ is missing, lets the
// bin script rebuild the bundle, so the build is not counted as start-up.

import { spawn } from 'node:child_process';
import { resolve } from 'node:path';
import { fileURLToPath } from 'node:url';

const root = resolve(fileURLToPath(new URL('../..', import.meta.url)));
const BIN = resolve(root, 'bin/loopwright.mjs');
const RUNS = 7;

/** Start-up target in milliseconds (issue 12: "well under half a second"). */
export const CLI_START_TARGET_MS = 500;

/** One run of `node bin/loopwright.mjs --help`: its wall time in milliseconds. */
function runOnce(): Promise<number> {
  return new Promise((done, fail) => {
    const start = performance.now();
    const child = spawn(process.execPath, [BIN, '--help'], { cwd: root, stdio: ['ignore', 'ignore', 'pipe'] });
    let stderr = '';
    child.stderr.setEncoding('utf8');
    child.stderr.on('data', (chunk: string) => (stderr += chunk));
    child.on('error', fail);
    child.on('close', (code) => {
      const ms = performance.now() - start;
      if (code === 0) done(ms);
      else fail(new Error(`node bin/loopwright.mjs --help exited with ${String(code)}: ${stderr.split('\n')[0] ?? ''}`));
    });
  });
}

function median(values: readonly number[]): number {
  const s = [...values].sort((a, b) => a - b);
  const mid = s.length >> 1;
  return s.length % 2 === 1 ? s[mid]! : (s[mid - 1]! + s[mid]!) / 2;
}

/** The median wall time of RUNS start-ups (run one after another), and every sample. */
export async function measureCliStart(): Promise<{ medianMs: number; samplesMs: number[] }> {
  await runOnce();
  const samplesMs: number[] = [];
  for (let i = 0; i < RUNS; i++) samplesMs.push(await runOnce());
  return { medianMs: median(samplesMs), samplesMs };
}
