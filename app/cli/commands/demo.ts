// `demo [--variant known|unknown]`: print a demo job file, so that
// `npm run --silent cli -- demo > my.lwj` gives a job to open, check and change.

import { fileURLToPath } from 'node:url';
import type { OptionSpec } from '../args.js';
import { EXIT, type Command } from '../command.js';
import { readTextFile } from '../io.js';

export const DEMO_FILES = {
  known: fileURLToPath(new URL('../../../assets/demo.lwj', import.meta.url)),
  unknown: fileURLToPath(new URL('../../../assets/demo-unknown-source.lwj', import.meta.url)),
} as const;

type Variant = keyof typeof DEMO_FILES;

const options: OptionSpec[] = [
  {
    name: 'variant',
    value: 'NAME',
    choices: Object.keys(DEMO_FILES),
    summary: 'which supply the demo assumes: its source impedance known (default) or unknown',
  },
];

export const demo: Command = {
  summary: 'print the demo job (a .lwj file) on standard output',
  usage: 'demo [--variant known|unknown]',
  details: [
    'The demo is an invented boat-repair yard: a main switchboard, two distribution boards',
    'and their final subcircuits, with one circuit that fails and one that relies on an RCD.',
    'Save it with `npm run --silent cli -- demo > my.lwj`, then `check my.lwj`.',
  ],
  options,
  positionals: { min: 0, max: 0 },
  run({ args, out, err }) {
    const chosen = args.options.variant;
    const variant: Variant = chosen === 'unknown' ? 'unknown' : 'known';
    const read = readTextFile(DEMO_FILES[variant]);
    if (!read.ok) {
      err(`${read.message}\n`);
      return EXIT.unusable;
    }
    out(read.text.endsWith('\n') ? read.text : `${read.text}\n`);
    return EXIT.ok;
  },
};
