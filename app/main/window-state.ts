// Window size and position, remembered for the app in a JSON file in the user-data folder and
// clamped to a display that is there now (a monitor may have been unplugged since).

import { promises as fs } from 'node:fs';
import path from 'node:path';
import { writeFileAtomic } from './job-files.js';

export interface Rect {
  x: number;
  y: number;
  width: number;
  height: number;
}

export interface WindowState {
  bounds: Rect;
  maximized: boolean;
}

export const STATE_FILE = 'window-state.json';
export const DEFAULT_SIZE = { width: 1400, height: 900 };
export const MIN_SIZE = { width: 800, height: 560 };
/** How much of a window must show on a display for it to count as being there. */
const GRAB = { width: 120, height: 40 };

/** Bounds that fit on one of `displays` (their work areas). A window keeps to the display it
 *  overlaps most, pulled fully onto it and trimmed to its size; a window that shows less than a
 *  grab-able strip on every display (its monitor was unplugged) is centred on the primary display
 *  (`displays[0]`). */
export function clampBounds(saved: Rect | null, displays: readonly Rect[]): Rect {
  const primary = displays[0] ?? { x: 0, y: 0, width: DEFAULT_SIZE.width, height: DEFAULT_SIZE.height };
  const want = saved ?? { x: NaN, y: NaN, width: DEFAULT_SIZE.width, height: DEFAULT_SIZE.height };
  let home: Rect | undefined;
  let best = 0;
  for (const d of displays) {
    const overlap = intersect(want, d);
    if (!overlap || overlap.width < Math.min(GRAB.width, want.width) || overlap.height < Math.min(GRAB.height, want.height)) continue;
    if (overlap.width * overlap.height > best) {
      best = overlap.width * overlap.height;
      home = d;
    }
  }
  const area = home ?? primary;
  const width = Math.round(Math.max(Math.min(want.width, area.width), Math.min(MIN_SIZE.width, area.width)));
  const height = Math.round(Math.max(Math.min(want.height, area.height), Math.min(MIN_SIZE.height, area.height)));
  if (!home) {
    return { x: Math.round(area.x + (area.width - width) / 2), y: Math.round(area.y + (area.height - height) / 2), width, height };
  }
  const x = Math.round(Math.min(Math.max(want.x, area.x), area.x + area.width - width));
  const y = Math.round(Math.min(Math.max(want.y, area.y), area.y + area.height - height));
  return { x, y, width, height };
}

function intersect(a: Rect, b: Rect): Rect | null {
  const x = Math.max(a.x, b.x);
  const y = Math.max(a.y, b.y);
  const right = Math.min(a.x + a.width, b.x + b.width);
  const bottom = Math.min(a.y + a.height, b.y + b.height);
  return right > x && bottom > y ? { x, y, width: right - x, height: bottom - y } : null;
}

/** The state file's content, or null when it is missing or malformed. */
export function parseWindowState(text: string): WindowState | null {
  let value: unknown;
  try {
    value = JSON.parse(text);
  } catch {
    return null;
  }
  if (!value || typeof value !== 'object') return null;
  const { bounds, maximized } = value as { bounds?: unknown; maximized?: unknown };
  if (!bounds || typeof bounds !== 'object') return null;
  const b = bounds as Record<string, unknown>;
  const nums = [b.x, b.y, b.width, b.height];
  if (!nums.every((n) => typeof n === 'number' && Number.isFinite(n) && Math.abs(n) < 100_000)) return null;
  const rect = { x: b.x as number, y: b.y as number, width: b.width as number, height: b.height as number };
  if (rect.width <= 0 || rect.height <= 0) return null;
  return { bounds: rect, maximized: maximized === true };
}

/** A new window opened while others are open steps down and right so it does not hide them. */
export function cascade(bounds: Rect, step: number, area: Rect): Rect {
  const moved = { ...bounds, x: bounds.x + step * 28, y: bounds.y + step * 28 };
  return clampBounds(moved, [area]);
}

export async function loadWindowState(dir: string): Promise<WindowState | null> {
  try {
    return parseWindowState(await fs.readFile(path.join(dir, STATE_FILE), 'utf8'));
  } catch {
    return null;
  }
}

export async function saveWindowState(dir: string, state: WindowState): Promise<void> {
  await fs.mkdir(dir, { recursive: true });
  await writeFileAtomic(path.join(dir, STATE_FILE), `${JSON.stringify(state, null, 2)}\n`);
}
