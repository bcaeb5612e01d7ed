// The recent-files list: most recent first, no duplicates, capped. Kept in a JSON file in the
// app's user-data folder; the OS list (app.addRecentDocument) is fed by files.ts.

import { promises as fs } from 'node:fs';
import path from 'node:path';
import { writeFileAtomic } from './job-files.js';

export const RECENT_CAP = 10;
export const RECENT_FILE = 'recent-files.json';

function sameFile(a: string, b: string, platform: string): boolean {
  const caseless = platform === 'win32' || platform === 'darwin';
  return caseless ? a.toLowerCase() === b.toLowerCase() : a === b;
}

/** `file` moved to the front of `list`, earlier copies dropped, at most `cap` entries. */
export function addRecent(list: readonly string[], file: string, cap = RECENT_CAP, platform = process.platform): string[] {
  const full = path.resolve(file);
  return [full, ...list.filter((f) => !sameFile(f, full, platform))].slice(0, cap);
}

export function removeRecent(list: readonly string[], file: string, platform = process.platform): string[] {
  return list.filter((f) => !sameFile(f, path.resolve(file), platform));
}

/** The list from the state file; anything malformed is dropped rather than trusted. */
export function parseRecent(text: string, cap = RECENT_CAP): string[] {
  let value: unknown;
  try {
    value = JSON.parse(text);
  } catch {
    return [];
  }
  const files = value && typeof value === 'object' && !Array.isArray(value) ? (value as { files?: unknown }).files : undefined;
  if (!Array.isArray(files)) return [];
  const out: string[] = [];
  for (const f of files) {
    if (typeof f === 'string' && f.length > 0 && f.length <= 4096 && path.isAbsolute(f) && !f.includes('\0')) {
      if (!out.includes(f)) out.push(f);
    }
  }
  return out.slice(0, cap);
}

export class RecentFiles {
  private list: string[] = [];

  constructor(private readonly dir: string) {}

  get files(): readonly string[] {
    return this.list;
  }

  async load(): Promise<void> {
    try {
      this.list = parseRecent(await fs.readFile(path.join(this.dir, RECENT_FILE), 'utf8'));
    } catch {
      this.list = [];
    }
  }

  async add(file: string): Promise<void> {
    this.list = addRecent(this.list, file);
    await this.store();
  }

  async remove(file: string): Promise<void> {
    this.list = removeRecent(this.list, file);
    await this.store();
  }

  async clear(): Promise<void> {
    this.list = [];
    await this.store();
  }

  private async store(): Promise<void> {
    await fs.mkdir(this.dir, { recursive: true });
    await writeFileAtomic(path.join(this.dir, RECENT_FILE), `${JSON.stringify({ files: this.list }, null, 2)}\n`);
  }
}
