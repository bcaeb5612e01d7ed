// The command registry: every command of the command line, by name. `help`, the usage
// lines and the dispatcher in main.ts all read this one table; add a command here.

import type { Command } from '../command.js';
import { check } from './check.js';
import { demo } from './demo.js';
import { report } from './report.js';

export const COMMANDS: Readonly<Record<string, Command>> = {
  check,
  demo,
  report,
};
