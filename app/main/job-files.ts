// Reading and writing job files: Node's fs only, no Electron, so the rules are unit-tested.
// - Reading goes through the engine's parseJob; a file it refuses comes back with every problem.
// - A file that failed to load is remembered and never written over, even by Save As.
// - Saving writes a temporary file beside the target and renames it over, so a crash or a full
//   disk mid-write leaves the old file whole.

import { randomBytes } from 'node:crypto';
import { promises as fs } from 'node:fs';
import path from 'node:path';
import { formatProblem, parseJob, type Problem } from '../../engine/index.js';

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
    text = await fs.readFile(file, 'utf8');
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
    await writeFileAtomic(file, text);
  } catch (error) {
    return { ok: false, message: `Could not save ${file}: ${reason(error)}. The file on disk is as it was.` };
  }
  return { ok: true, path: file };
}

/** Writes `data` to a temporary file in the same folder, flushes it, then renames it over `file`
 *  (atomic on one file system). On failure the temporary file is removed and `file` is untouched. */
export async function writeFileAtomic(file: string, data: string | Uint8Array): Promise<void> {
  const dir = path.dirname(file);
  const temp = path.join(dir, `.${path.basename(file)}.${process.pid}.${randomBytes(6).toString('hex')}.tmp`);
  let handle: fs.FileHandle | null = null;
  try {
    handle = await fs.open(temp, 'wx', 0o644);
    await handle.writeFile(data);
    await handle.sync();
    await handle.close();
    handle = null;
    await keepMode(file, temp);
    await fs.rename(temp, file);
  } catch (error) {
    if (handle) await handle.close().catch(() => undefined);
    await fs.rm(temp, { force: true }).catch(() => undefined);
    throw error;
  }
}

/** A file saved over keeps its permissions. */
async function keepMode(file: string, temp: string): Promise<void> {
  try {
    const stat = await fs.stat(file);
    await fs.chmod(temp, stat.mode & 0o7777);
  } catch {
    // no earlier file: the new file keeps the default mode
  }
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
    };
    if (known[code]) return known[code];
  }
  return error instanceof Error ? error.message : String(error);
}
