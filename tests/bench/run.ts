// npm run bench: speed and memory of the engine on large generated jobs.
// Targets (checked here, never by timed tests): a 2,000-circuit job parses and analyses in
// well under 100 ms on the build machine, so live analysis on every edit stays responsive.

import { analyse, parseJob, serialiseJob } from '../../engine/index.js';
import { generateJob } from './generate.js';

const TARGET_MS = 100;

function time<T>(label: string, runs: number, fn: () => T): { ms: number; value: T } {
  let value = fn();
  const start = performance.now();
  for (let i = 0; i < runs; i++) value = fn();
  const ms = (performance.now() - start) / runs;
  console.log(`${label.padEnd(44)} ${ms.toFixed(2).padStart(8)} ms`);
  return { ms, value };
}

let failed = false;
for (const size of [200, 2000, 10000]) {
  const job = generateJob(size);
  const text = serialiseJob(job);
  const parsed = time(`parse ${size} circuits (${(text.length / 1024).toFixed(0)} KiB)`, 10, () => parseJob(text));
  if (!parsed.value.ok) throw new Error('generated job failed to load');
  const before = process.memoryUsage().heapUsed;
  const analysed = time(`analyse ${size} circuits`, 10, () => analyse(job));
  const heap = (process.memoryUsage().heapUsed - before) / 1024 / 1024;
  console.log(`${'  heap growth'.padEnd(44)} ${heap.toFixed(1).padStart(8)} MiB`);
  if (size === 2000 && parsed.ms + analysed.ms > TARGET_MS) {
    console.log(`  over target: parse + analyse of 2,000 circuits should take < ${TARGET_MS} ms`);
    failed = true;
  }
}
// The editor in headless Chromium on 2,000 circuits (tests/bench/ui.ts); skipped without Chromium.
const { runUiBench } = await import('./ui.js');
if (await runUiBench()) failed = true;
process.exit(failed ? 1 : 0);
