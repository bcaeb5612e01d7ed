// Help texts, built from the command registry so every command and option is described.

import { describeOptions } from './args.js';
import type { Command } from './command.js';

/** How the command was started, for the usage lines: `loopwright` from the installed command
 *  (bin/loopwright.mjs marks the process before it loads the bundle), else the npm script. */
export function runPrefix(): string {
  return (globalThis as { __loopwrightBin?: unknown }).__loopwrightBin === true ? 'loopwright' : 'npm run --silent cli --';
}

const HELP_USAGE = 'help [COMMAND]';

export function generalHelp(commands: Readonly<Record<string, Command>>): string {
  const run = runPrefix();
  const entries = Object.values(commands).map((c) => [c.usage, c.summary] as const);
  entries.push([HELP_USAGE, 'describe every command, or one command in full']);
  const width = Math.max(...entries.map(([u]) => u.length));
  const lines = [
    'Loopwright command line: fault-loop impedance checks for low-voltage installations.',
    '',
    `Usage: ${run} COMMAND [ARGUMENTS] [OPTIONS]`,
    '',
    'Commands:',
    ...entries.map(([usage, summary]) => `  ${usage.padEnd(width)}  ${summary}`),
  ];
  for (const [name, command] of Object.entries(commands)) {
    lines.push('', `Options of ${name}:`, ...describeOptions(command.options));
  }
  lines.push(
    '',
    'Exit status: 0 success (no link\'s verdict fails or relies on an RCD, over every check); 1 a',
    'verdict fails or relies on an RCD; 2 the job could not be read or the command line was wrong.',
    '',
    `Run \`${run} COMMAND --help\` for one command in full.`,
  );
  return `${lines.join('\n')}\n`;
}

export function commandHelp(name: string, command: Command): string {
  const run = runPrefix();
  const lines = [
    `Usage: ${run} ${command.usage}`,
    '',
    `${name}: ${command.summary}`,
    ...(command.details.length > 0 ? ['', ...command.details] : []),
    '',
    'Options:',
    ...describeOptions(command.options),
  ];
  return `${lines.join('\n')}\n`;
}
