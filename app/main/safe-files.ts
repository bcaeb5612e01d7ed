// Reading and writing files so that no work is lost: Node's fs only (no Electron), shared by the
// desktop app's saves and PDF export (app/main) and the command line's printout (app/cli/io.ts).
//
// writeFileSafely(file, data), and writeFilesSafely(files) for a set (one flush and one look for
// leftovers a folder):
//   1. A read-only file is refused (it is the user's way of saying "do not change this").
//   2. A symbolic link is followed: its target is written, and the link stays a link.
//   3. The data goes to a temporary file beside the target (`.NAME.PID.RANDOM.tmp`), is flushed
//      to the disk (fsync) and closed; the temporary file takes the old file's permissions.
//   4. With `backup`, the previous version is kept beside the file as `NAME.bak` (a hard link
//      to the old file, else a copy), replacing an older backup.
//   5. The temporary file is renamed over the target (atomic on one file system), then the
//      folder is flushed so the rename itself survives a power cut.
//   6. Temporary files of this name left behind by a crash (their process no longer runs) are
//      removed. On any failure the temporary file is removed and the target is as it was.
// readTextBounded(file, max): reads at most `max` bytes from any path (a device or a pipe
// included) and says when there was more.

import { randomBytes } from 'node:crypto';
import { constants, promises as fs } from 'node:fs';
import path from 'node:path';

export interface WriteOptions {
  /** Keep the previous version beside the file as NAME.bak. */
  backup?: boolean;
}

/** An error with a plain sentence for the user (and the code of the failure beneath it). */
export class FileRefusal extends Error {
  constructor(
    message: string,
    readonly code: string,
  ) {
    super(message);
  }
}

/** The file a path names, following symbolic links (a dangling link: the file it would create). */
export async function writeTarget(file: string): Promise<string> {
  let current = path.resolve(file);
  for (let hops = 0; hops < 40; hops++) {
    let stat;
    try {
      stat = await fs.lstat(current);
    } catch (error) {
      if (isCode(error, 'ENOENT')) return current;
      throw error;
    }
    if (!stat.isSymbolicLink()) return current;
    current = path.resolve(path.dirname(current), await fs.readlink(current));
  }
  throw new FileRefusal(`${file} is a chain of more than 40 symbolic links`, 'ELOOP');
}

function isCode(error: unknown, code: string): boolean {
  return typeof error === 'object' && error !== null && 'code' in error && (error as { code: unknown }).code === code;
}

/** A temporary file of ours or of an earlier run, `.NAME.PID[.RANDOM][.bak].tmp`, for one of
 *  `names`: the process that made it, else null. */
function leftoverOf(entry: string, names: ReadonlySet<string>): number | null {
  if (!entry.startsWith('.') || !entry.endsWith('.tmp')) return null;
  const rest = entry.slice(1, -'.tmp'.length);
  for (const body of rest.endsWith('.bak') ? [rest.slice(0, -'.bak'.length), rest] : [rest]) {
    const seg = body.split('.');
    const n = seg.length;
    // NAME.PID.RANDOM, else NAME.PID (a name may itself hold dots and digits)
    if (n >= 3 && /^\d+$/.test(seg[n - 2]!) && /^[0-9a-f]+$/.test(seg[n - 1]!) && names.has(seg.slice(0, -2).join('.'))) return Number(seg[n - 2]);
    if (n >= 2 && /^\d+$/.test(seg[n - 1]!) && names.has(seg.slice(0, -1).join('.'))) return Number(seg[n - 1]);
  }
  return null;
}

function running(pid: number): boolean {
  if (pid === process.pid) return true;
  try {
    process.kill(pid, 0);
    return true;
  } catch (error) {
    return !isCode(error, 'ESRCH');
  }
}

/** Removes temporary files of `file` left by a process that no longer runs. Never throws. */
export async function removeLeftovers(file: string): Promise<string[]> {
  return removeLeftoversOf(path.dirname(file), new Set([path.basename(file)]));
}

/** Temporary files of any of `names` in `dir` left by processes that no longer run, removed. */
async function removeLeftoversOf(dir: string, names: ReadonlySet<string>): Promise<string[]> {
  const removed: string[] = [];
  let entries: string[];
  try {
    entries = await fs.readdir(dir);
  } catch {
    return removed;
  }
  for (const name of entries) {
    const pid = leftoverOf(name, names);
    if (pid === null || running(pid)) continue;
    try {
      await fs.rm(path.join(dir, name), { force: true });
      removed.push(name);
    } catch {
      // left for the next save
    }
  }
  return removed;
}

async function refuseReadOnly(file: string, shown: string): Promise<number | null> {
  let stat;
  try {
    stat = await fs.stat(file);
  } catch (error) {
    if (isCode(error, 'ENOENT')) return null;
    throw error;
  }
  if (stat.isDirectory()) throw new FileRefusal(`${shown} is a folder`, 'EISDIR');
  if (!stat.isFile()) throw new FileRefusal(`${shown} is not a plain file (a device or a pipe), so it is not written over`, 'ENOTFILE');
  let writable = (stat.mode & 0o222) !== 0;
  if (writable) {
    try {
      await fs.access(file, constants.W_OK);
    } catch {
      writable = false;
    }
  }
  if (!writable) throw new FileRefusal(`${shown} is read-only, so it was not written over; save under another name, or make the file writable first`, 'EREADONLY');
  return stat.mode & 0o7777;
}

/** Flushes a folder's entries (the rename) to the disk; where a system cannot, does nothing. */
async function syncFolder(dir: string): Promise<void> {
  if (process.platform === 'win32') return;
  let handle: fs.FileHandle | null = null;
  try {
    handle = await fs.open(dir, 'r');
    await handle.sync();
  } catch {
    // some file systems refuse fsync on a folder; the rename is still atomic there
  } finally {
    await handle?.close().catch(() => undefined);
  }
}

async function keepBackup(target: string, dir: string): Promise<void> {
  const backup = `${target}.bak`;
  const staging = path.join(dir, `.${path.basename(target)}.${process.pid}.${randomBytes(6).toString('hex')}.bak.tmp`);
  try {
    try {
      await fs.link(target, staging);
    } catch {
      await fs.copyFile(target, staging);
    }
    await fs.rename(staging, backup);
  } finally {
    await fs.rm(staging, { force: true }).catch(() => undefined);
  }
}

/** Writes `data` to `file` so that the old content stays whole until the new one is safely
 *  on the disk (see the head of this file). Throws a FileRefusal or the fs error; `file` is
 *  then as it was. */
export async function writeFileSafely(file: string, data: string | Uint8Array, options: WriteOptions = {}): Promise<void> {
  const target = await replaceSafely(file, data, options);
  await syncFolder(path.dirname(target));
  await removeLeftovers(target);
}

/**
 * Writes several files (made one at a time as they are asked for), each with the care of
 * writeFileSafely, but flushes each folder and looks in it for leftovers once, at the end (a
 * folder of thousands of sheets is not listed once per sheet). Stops at the first failure, which
 * is thrown; the files written before it stay written, whole, and the one that failed is as it was.
 */
export async function writeFilesSafely(files: Iterable<{ path: string; data: string | Uint8Array }>, options: WriteOptions = {}): Promise<void> {
  const written = new Map<string, Set<string>>();
  try {
    for (const f of files) {
      const target = await replaceSafely(f.path, f.data, options);
      const dir = path.dirname(target);
      const names = written.get(dir) ?? new Set<string>();
      names.add(path.basename(target));
      written.set(dir, names);
    }
  } finally {
    for (const [dir, names] of written) {
      await syncFolder(dir);
      await removeLeftoversOf(dir, names);
    }
  }
}

/** Steps 1 to 5 for one file, without flushing its folder: the file actually written. */
async function replaceSafely(file: string, data: string | Uint8Array, options: WriteOptions): Promise<string> {
  const target = await writeTarget(file);
  const mode = await refuseReadOnly(target, file);
  const dir = path.dirname(target);
  const temp = path.join(dir, `.${path.basename(target)}.${process.pid}.${randomBytes(6).toString('hex')}.tmp`);
  let handle: fs.FileHandle | null = null;
  try {
    handle = await fs.open(temp, 'wx', 0o644);
    await handle.writeFile(data);
    await handle.sync();
    await handle.close();
    handle = null;
    if (mode !== null) await fs.chmod(temp, mode).catch(() => undefined);
    if (mode !== null && options.backup === true) await keepBackup(target, dir);
    await fs.rename(temp, target);
  } catch (error) {
    if (handle) await handle.close().catch(() => undefined);
    await fs.rm(temp, { force: true }).catch(() => undefined);
    throw error;
  }
  return target;
}

export type BoundedRead = { ok: true; bytes: Uint8Array } | { ok: false; tooBig: true; limit: number };

/** Reads at most `max` bytes of `file`, whatever it is (a plain file, a device, a pipe); a file
 *  with more is not read further and comes back as too big. Throws the fs error otherwise. */
export async function readBounded(file: string, max: number): Promise<BoundedRead> {
  const handle = await fs.open(file, 'r');
  try {
    const stat = await handle.stat();
    if (stat.isDirectory()) throw Object.assign(new Error(`${file} is a folder`), { code: 'EISDIR' });
    if (stat.isFile() && stat.size > max) return { ok: false, tooBig: true, limit: max };
    const chunks: Uint8Array[] = [];
    let total = 0;
    for (;;) {
      const want = Math.min(1 << 20, max + 1 - total);
      const buffer = new Uint8Array(want);
      const { bytesRead } = await handle.read(buffer, 0, want, null);
      if (bytesRead === 0) break;
      total += bytesRead;
      if (total > max) return { ok: false, tooBig: true, limit: max };
      chunks.push(buffer.subarray(0, bytesRead));
    }
    const bytes = new Uint8Array(total);
    let at = 0;
    for (const c of chunks) {
      bytes.set(c, at);
      at += c.length;
    }
    return { ok: true, bytes };
  } finally {
    await handle.close().catch(() => undefined);
  }
}
