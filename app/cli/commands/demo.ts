// `demo [--variant known|unknown]`: print a demo job file, so that
// `npm run --silent cli -- demo > my.lwj` gives a job to open, check and change.
// The demo jobs live in the package's assets/ folder. This module runs from app/cli/commands/
// (tsx) or from a chunk of the bundle in dist/cli/ (bin/loopwright.mjs), at different depths, so
// the folder is found by walking up to the package root rather than by a fixed relative path.

import { existsSync, readFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import type { OptionSpec } from '../args.js';
import { EXIT, type Command } from '../command.js';
import { readTextFile } from '../io.js';

/** Each variant's file in the package's assets/ folder. */
export const DEMO_ASSETS = {
  known: 'demo.lwj',
  unknown: 'demo-unknown-source.lwj',
} as const;

type Variant = keyof typeof DEMO_ASSETS;

const PACKAGE_NAME = 'loopwright';

/** Whether `dir` is Loopwright's package root: its package.json names the package. */
function isPackageRoot(dir: string): boolean {
  const manifest = join(dir, 'package.json');
  if (!existsSync(manifest)) return false;
  try {
    const parsed: unknown = JSON.parse(readFileSync(manifest, 'utf8'));
    return typeof parsed === 'object' && parsed !== null && (parsed as { name?: unknown }).name === PACKAGE_NAME;
  } catch {
    return false;
  }
}

/** The nearest folder at or above `from` that is the package root, or null. */
export function findPackageRoot(from: string): string | null {
  for (let dir = from; ; ) {
    if (isPackageRoot(dir)) return dir;
    const up = dirname(dir);
    if (up === dir) return null;
    dir = up;
  }
}

/** Where this module runs from (a source file, or a chunk of the bundle). */
function here(): string {
  return dirname(fileURLToPath(import.meta.url));
}

/** The demo file of a variant, or why it cannot be found. */
export function demoFile(variant: Variant, from: string = here()): { ok: true; path: string } | { ok: false; message: string } {
  const root = findPackageRoot(from);
  if (root === null) {
    return {
      ok: false,
      message: `demo: the demo jobs were not found: no ${PACKAGE_NAME} package folder (package.json and assets/) at or above ${from}`,
    };
  }
  return { ok: true, path: join(root, 'assets', DEMO_ASSETS[variant]) };
}

const options: OptionSpec[] = [
  {
    name: 'variant',
    value: 'NAME',
    choices: Object.keys(DEMO_ASSETS),
    summary: 'which supply the demo assumes: its source impedance known (default) or unknown',
  },
];

export const demo: Command = {
  summary: 'print the demo job (a .lwj file) on standard output',
  usage: 'demo [--variant known|unknown]',
  details: [
    'The demo is an invented boat-repair yard: a main switchboard, two distribution boards',
    'and their final subcircuits, with one circuit that fails and one that relies on an RCD.',
    'Save it with `loopwright demo > my.lwj` (or `npm run --silent cli -- demo > my.lwj` in the',
    'project folder), then `check my.lwj`.',
  ],
  options,
  positionals: { min: 0, max: 0 },
  run({ args, out, err }) {
    const chosen = args.options.variant;
    const variant: Variant = chosen === 'unknown' ? 'unknown' : 'known';
    const file = demoFile(variant);
    if (!file.ok) {
      err(`${file.message}\n`);
      return EXIT.unusable;
    }
    const read = readTextFile(file.path);
    if (!read.ok) {
      err(`${read.message}\n`);
      return EXIT.unusable;
    }
    out(read.text.endsWith('\n') ? read.text : `${read.text}\n`);
    return EXIT.ok;
  },
};
