// Reading and writing job files: Node's fs only, no Electron, so the rules are unit-tested.
// - Reading goes through the engine's parseJob; a file it refuses comes back with every problem.
// - A file that failed to load is remembered and never written over, even by Save As.
// - Reading takes at most the engine's size limit from any path (a device or a pipe included).
// - Saving goes through writeFileSafely (safe-files.ts): a temporary file flushed and renamed
//   over, the folder flushed, the previous version kept as NAME.bak, a read-only file refused,
//   a symbolic link written through, leftovers of a crash removed. A crash, a power cut or a
//   full disk mid-write leaves the old file whole.

import path from 'node:path';
import { formatProblem, LIMITS, parseJob, type Problem } from '../../engine/index.js';
import { readBounded, removeLeftovers, writeFileSafely } from './safe-files.js';

export type ReadResult =
  | { ok: true; path: string; text: string; warnings: Problem[] }
  | { ok: false; path: string; message: string; problems: Problem[] };

/** Files that could not be loaded: Save must never write over them (their content might be a
 *  newer version's job, or a hand-edited file with one typo: either way it is the user's). */
export class RefusedFiles {
  private readonly paths = new Set<string>();

  private key(file: string): string {
    const full = path.resolve(file);
    return process.platform === 'win32' || process.platform === 'darwin' ? full.toLowerCase() : full;
  }
  add(file: string): void {
    this.paths.add(this.key(file));
  }
  delete(file: string): void {
    this.paths.delete(this.key(file));
  }
  has(file: string): boolean {
    return this.paths.has(this.key(file));
  }
}

/** Reads and checks a job file. Never throws: an unreadable or bad file gives ok: false with a
 *  message saying which file and why, and every problem parseJob found. */
export async function readJobFile(file: string, refused: RefusedFiles): Promise<ReadResult> {
  let text: string;
  try {
    const read = await readBounded(file, LIMITS.size);
    if (!read.ok) {
      refused.add(file);
      const mb = (LIMITS.size / (1024 * 1024)).toFixed(0);
      return { ok: false, path: file, message: `${path.basename(file)} was not opened: it is larger than ${mb} MB, the limit for a job file. The file has not been changed.`, problems: [] };
    }
    text = new TextDecoder('utf-8').decode(read.bytes);
  } catch (error) {
    refused.add(file);
    return { ok: false, path: file, message: `Could not read ${file}: ${reason(error)}`, problems: [] };
  }
  if (text.charCodeAt(0) === 0xfeff) text = text.slice(1);
  const loaded = parseJob(text);
  if (!loaded.ok) {
    refused.add(file);
    const errors = loaded.problems.filter((p) => p.severity === 'error').length;
    return {
      ok: false,
      path: file,
      message: `${path.basename(file)} was not opened: ${errors} problem${errors === 1 ? '' : 's'} found. The file has not been changed.`,
      problems: loaded.problems,
    };
  }
  refused.delete(file);
  await removeLeftovers(file); // temporary files of a save that a crash interrupted
  return { ok: true, path: file, text, warnings: loaded.warnings };
}

/** The problems as lines for a message box, at most `max` of them. */
export function problemLines(problems: readonly Problem[], max = 20): string {
  const lines = problems.slice(0, max).map((p) => `• ${formatProblem(p)}`);
  if (problems.length > max) lines.push(`… and ${problems.length - max} more`);
  return lines.join('\n');
}

export type SaveResult = { ok: true; path: string } | { ok: false; message: string };

/** Saves job text to `file`, refusing a file that failed to load and text that is not a JSON
 *  object (a renderer fault must not put garbage over a good job). */
export async function saveJobText(file: string, text: string, refused: RefusedFiles): Promise<SaveResult> {
  if (refused.has(file)) {
    return {
      ok: false,
      message: `${path.basename(file)} could not be loaded earlier, so it will not be written over. Choose another name with Save As.`,
    };
  }
  let value: unknown;
  try {
    value = JSON.parse(text);
  } catch (error) {
    return { ok: false, message: `Not saved: the job text is not valid JSON (${reason(error)}).` };
  }
  if (typeof value !== 'object' || value === null || Array.isArray(value)) {
    return { ok: false, message: 'Not saved: the job text is not a job (expected a JSON object).' };
  }
  try {
    await writeFileSafely(file, text, { backup: true });
  } catch (error) {
    return { ok: false, message: `Could not save ${file}: ${reason(error)}. The file on disk is as it was.` };
  }
  return { ok: true, path: file };
}

/** Writes `data` over `file` with the care of writeFileSafely, without a backup (for the app's
 *  own files: the recent list, the window state). On failure `file` is untouched and no
 *  temporary file is left. */
export async function writeFileAtomic(file: string, data: string | Uint8Array): Promise<void> {
  await writeFileSafely(file, data);
}

export function reason(error: unknown): string {
  if (error && typeof error === 'object' && 'code' in error) {
    const code = String((error as { code: unknown }).code);
    const known: Record<string, string> = {
      ENOENT: 'the file or its folder does not exist',
      EACCES: 'permission denied',
      EPERM: 'permission denied',
      EISDIR: 'it is a folder',
      ENOSPC: 'the disk is full',
      EROFS: 'the disk is read-only',
      ELOOP: 'too many symbolic links',
    };
    if (error instanceof Error && (code === 'EREADONLY' || code === 'ENOTFILE' || code === 'ELOOP')) return error.message;
    if (known[code]) return known[code];
  }
  return error instanceof Error ? error.message : String(error);
}
