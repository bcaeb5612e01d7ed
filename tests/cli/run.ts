// Runs the command line as a real process, exactly as `npm run --silent cli -- ...` does
// (tsx app/cli/main.ts), from the project root.

import { spawnSync } from 'node:child_process';
import { fileURLToPath } from 'node:url';

export const ROOT = fileURLToPath(new URL('../../', import.meta.url));
export const FIXTURES = fileURLToPath(new URL('./fixtures/', import.meta.url));
const TSX = fileURLToPath(new URL('../../node_modules/tsx/dist/cli.mjs', import.meta.url));

export interface Run {
  status: number | null;
  stdout: string;
  stderr: string;
}

export function cli(...args: string[]): Run {
  const result = spawnSync(process.execPath, [TSX, 'app/cli/main.ts', ...args], {
    cwd: ROOT,
    encoding: 'utf8',
    env: { ...process.env, NO_COLOR: '1', FORCE_COLOR: '0' },
    timeout: 60_000,
  });
  if (result.error !== undefined) throw result.error;
  return { status: result.status, stdout: result.stdout, stderr: result.stderr };
}

/** Signs of a stack trace or a raw exception reaching the user. */
export function looksLikeStackTrace(text: string): boolean {
  return /^\s+at\s/m.test(text) || /\bError:/.test(text) || /node:internal/.test(text);
}
