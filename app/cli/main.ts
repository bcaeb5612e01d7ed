// Loopwright's command line. Run as `npm run --silent cli -- COMMAND ...`.
// Every failure ends in a plain message and exit status 2, never a stack trace: even the
// program's own modules are loaded inside the guard.

import type { Output } from './command.js';

const UNUSABLE = 2;

function oneLine(error: unknown): string {
  const text = error instanceof Error ? error.message : String(error);
  return text.split('\n')[0] ?? '';
}

const stdio: Output = {
  out: (text) => void process.stdout.write(text),
  err: (text) => void process.stderr.write(text),
};

// A reader that closes the pipe early (`| head`) is not an error of ours.
process.stdout.on('error', (error: NodeJS.ErrnoException) => {
  if (error.code === 'EPIPE') process.exit(process.exitCode ?? 0);
});

const fatal = (error: unknown): void => {
  process.stderr.write(`loopwright: internal error: ${oneLine(error)}\n`);
  process.exitCode = UNUSABLE;
};
process.on('uncaughtException', fatal);
process.on('unhandledRejection', fatal);

try {
  const { runCli } = await import('./run.js');
  process.exitCode = await runCli(process.argv.slice(2), stdio);
} catch (error) {
  fatal(error);
}
