// What every command of the command line provides. The registry in commands/index.ts maps
// each name to one of these; `help`, the usage lines and the option parser all read it.

import type { OptionSpec, ParsedArgs } from './args.js';

export interface Output {
  /** Write to standard output (the command's result). */
  out(text: string): void;
  /** Write to standard error (problems, warnings). */
  err(text: string): void;
}

export interface CommandContext extends Output {
  args: ParsedArgs;
}

export interface Command {
  /** One line for the list of commands. */
  summary: string;
  /** The synopsis after the program name: `check JOB.lwj [--json]`. */
  usage: string;
  /** Further lines of explanation for `COMMAND --help`. */
  details: string[];
  options: OptionSpec[];
  /** How many positional arguments the command takes. */
  positionals: { min: number; max: number };
  /** Returns the exit status: 0, 1, or 2 (could not run). */
  run(ctx: CommandContext): Promise<number> | number;
}

/** Exit statuses shared by every command. */
export const EXIT = { ok: 0, findings: 1, unusable: 2 } as const;
