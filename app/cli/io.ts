// Reading job files for the command line, and writing its outputs. The command line never
// writes over an input file. Every failure comes back as one plain sentence naming the file.
// - Reading takes at most the engine's size limit (LIMITS.size bytes) from any path, a device
//   or a pipe included: `check /dev/zero` stops after that many bytes and says why.
// - Problems and warnings are made safe for a terminal (terminalText): a job's ids and names
//   can carry control characters and escape sequences.
// - Outputs (the printout's PDF and SVG sheets) are written with writeFileSafely
//   (app/main/safe-files.ts, Node only): flushed, renamed over, folder flushed, a read-only file
//   refused, a symbolic link written through, leftovers of a crash removed. A PDF written over
//   an earlier one keeps it beside the new one as NAME.pdf.bak (it may be the copy filed with
//   the job); the SVG sheets, one file per sheet in a folder, keep no backups.

import { closeSync, fstatSync, openSync, readSync } from 'node:fs';
import { formatProblem, LIMITS, parseJob, terminalText, type LoadResult, type Problem } from '../../engine/index.js';
import { writeFileSafely, writeFilesSafely } from '../main/safe-files.js';

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
    case 'ENXIO':
      return 'no such device';
    default:
      return error instanceof Error && error.message !== '' ? error.message.split('\n')[0] ?? code : 'unreadable';
  }
}

const MB = (LIMITS.size / (1024 * 1024)).toFixed(0);

/** At most `max` bytes of the file, or null when it holds more (then only max + 1 were read). */
function readAtMost(path: string, max: number): Uint8Array | null {
  const fd = openSync(path, 'r');
  try {
    const stat = fstatSync(fd);
    if (stat.isDirectory()) throw Object.assign(new Error('directory'), { code: 'EISDIR' });
    if (stat.isFile() && stat.size > max) return null;
    let grown = new Uint8Array(Math.min(max + 1, stat.isFile() ? stat.size + 1 : 1 << 16));
    let total = 0;
    for (;;) {
      if (total === grown.length) {
        if (grown.length > max) return null;
        const next = new Uint8Array(Math.min(max + 1, grown.length * 2));
        next.set(grown);
        grown = next;
      }
      const n = readSync(fd, grown, total, Math.min(grown.length - total, 1 << 20), null);
      if (n === 0) break;
      total += n;
      if (total > max) return null;
    }
    return grown.subarray(0, total);
  } finally {
    closeSync(fd);
  }
}

/** Read a UTF-8 text file, or say in one line why it cannot be read. */
export function readTextFile(path: string): ReadOutcome {
  try {
    const bytes = readAtMost(path, LIMITS.size);
    if (bytes === null) {
      return { ok: false, message: `cannot read ${path}: it holds more than ${MB} MB, the limit for a job file (reading stopped there)` };
    }
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
  if (!read.ok) return { ok: false, lines: [terminalText(read.message)] };
  const load = parseJob(read.text);
  if (!load.ok) {
    const count = load.problems.length;
    const head = `${path}: the job could not be read (${count} problem${count === 1 ? '' : 's'}); the file is left as it was.`;
    return { ok: false, lines: [head, ...load.problems.map((p) => `  ${formatProblem(p)}`)].map(terminalText) };
  }
  return { ok: true, load: { ...load, warnings: load.warnings.map(forTerminal) } };
}

/** A problem whose texts can go to a terminal as they are. */
function forTerminal(p: Problem): Problem {
  return { ...p, where: terminalText(p.where), field: terminalText(p.field), message: terminalText(p.message) };
}

/** Write an output file (never a job file) with the care of writeFileSafely, keeping the
 *  previous version as NAME.bak when `backup` is set; throws a plain error. */
export async function writeOutputFile(path: string, data: string | Uint8Array, options: { backup?: boolean } = {}): Promise<void> {
  await writeFileSafely(path, data, options);
}

/** Several outputs with the same care, each folder flushed once (writeFilesSafely). */
export async function writeOutputFiles(files: Iterable<{ path: string; data: string | Uint8Array }>): Promise<void> {
  await writeFilesSafely(files);
}
