// Reading job files for the command line. Only reads: the command line never writes over
// an input file. Every failure comes back as one plain sentence naming the file.

import { readFileSync, statSync } from 'node:fs';
import { formatProblem, parseJob, type LoadResult } from '../../engine/index.js';

export type ReadOutcome = { ok: true; text: string } | { ok: false; message: string };

function reason(error: unknown): string {
  const code = typeof error === 'object' && error !== null && 'code' in error ? String(error.code) : '';
  switch (code) {
    case 'ENOENT':
      return 'no such file';
    case 'EACCES':
    case 'EPERM':
      return 'permission denied';
    case 'EISDIR':
      return 'it is a directory, not a job file';
    case 'ENAMETOOLONG':
      return 'the file name is too long';
    case 'ELOOP':
      return 'too many symbolic links';
    default:
      return error instanceof Error && error.message !== '' ? error.message.split('\n')[0] ?? code : 'unreadable';
  }
}

/** Read a UTF-8 text file, or say in one line why it cannot be read. */
export function readTextFile(path: string): ReadOutcome {
  try {
    if (statSync(path).isDirectory()) {
      return { ok: false, message: `cannot read ${path}: it is a directory, not a job file` };
    }
    const bytes = readFileSync(path);
    const text = new TextDecoder('utf-8', { fatal: true }).decode(bytes);
    return { ok: true, text };
  } catch (error) {
    if (error instanceof TypeError) {
      return { ok: false, message: `cannot read ${path}: it is not UTF-8 text` };
    }
    return { ok: false, message: `cannot read ${path}: ${reason(error)}` };
  }
}

export type JobFileOutcome =
  | { ok: true; load: Extract<LoadResult, { ok: true }> }
  | { ok: false; lines: string[] };

/** Read and load a job file through the engine's one parser. */
export function loadJobFile(path: string): JobFileOutcome {
  const read = readTextFile(path);
  if (!read.ok) return { ok: false, lines: [read.message] };
  const load = parseJob(read.text);
  if (!load.ok) {
    const count = load.problems.length;
    const head = `${path}: the job could not be read (${count} problem${count === 1 ? '' : 's'}); the file is left as it was.`;
    return { ok: false, lines: [head, ...load.problems.map((p) => `  ${formatProblem(p)}`)] };
  }
  return { ok: true, load };
}
