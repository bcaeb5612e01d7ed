import { promises as fs } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { addRecent, parseRecent, RECENT_CAP, RecentFiles, removeRecent } from '../../app/main/recent.js';
import { clampBounds, DEFAULT_SIZE, loadWindowState, MIN_SIZE, parseWindowState, saveWindowState } from '../../app/main/window-state.js';

describe('recent files', () => {
  it('puts the newest first and drops the earlier copy', () => {
    const list = addRecent(addRecent(addRecent([], '/j/a.lwj'), '/j/b.lwj'), '/j/a.lwj');
    expect(list).toEqual(['/j/a.lwj', '/j/b.lwj']);
  });

  it('is capped', () => {
    let list: string[] = [];
    for (let i = 0; i < RECENT_CAP + 5; i++) list = addRecent(list, `/j/${i}.lwj`);
    expect(list).toHaveLength(RECENT_CAP);
    expect(list[0]).toBe(`/j/${RECENT_CAP + 4}.lwj`);
    expect(list).not.toContain('/j/0.lwj');
  });

  it('treats names differing in case as one file where the file system does', () => {
    expect(addRecent(['/J/A.lwj'], '/j/a.lwj', RECENT_CAP, 'win32')).toEqual(['/j/a.lwj']);
    expect(addRecent(['/J/A.lwj'], '/j/a.lwj', RECENT_CAP, 'linux')).toEqual(['/j/a.lwj', '/J/A.lwj']);
    expect(removeRecent(['/j/a.lwj', '/j/b.lwj'], '/j/a.lwj', 'linux')).toEqual(['/j/b.lwj']);
  });

  it('a damaged list file gives an empty or cleaned list, never a crash', () => {
    expect(parseRecent('not json')).toEqual([]);
    expect(parseRecent('[1,2]')).toEqual([]);
    expect(parseRecent('{"files":"x"}')).toEqual([]);
    expect(parseRecent('{"files":["/a.lwj", 3, "relative.lwj", "/a.lwj", "/b.lwj"]}')).toEqual(['/a.lwj', '/b.lwj']);
  });

  it('is kept in the user-data folder across runs', async () => {
    const dir = await fs.mkdtemp(path.join(os.tmpdir(), 'loopwright-recent-'));
    try {
      const first = new RecentFiles(dir);
      await first.load();
      await first.add('/j/a.lwj');
      await first.add('/j/b.lwj');
      const second = new RecentFiles(dir);
      await second.load();
      expect(second.files).toEqual(['/j/b.lwj', '/j/a.lwj']);
      await second.clear();
      const third = new RecentFiles(dir);
      await third.load();
      expect(third.files).toEqual([]);
    } finally {
      await fs.rm(dir, { recursive: true, force: true });
    }
  });
});

describe('window position', () => {
  const laptop = { x: 0, y: 0, width: 1920, height: 1040 };
  const right = { x: 1920, y: 0, width: 2560, height: 1400 };

  it('keeps a window that is on a display where it is', () => {
    expect(clampBounds({ x: 100, y: 80, width: 1200, height: 800 }, [laptop])).toEqual({ x: 100, y: 80, width: 1200, height: 800 });
    expect(clampBounds({ x: 2000, y: 100, width: 1400, height: 900 }, [laptop, right])).toEqual({ x: 2000, y: 100, width: 1400, height: 900 });
  });

  it('centres a window on the primary display when its display is gone', () => {
    const b = clampBounds({ x: 2000, y: 100, width: 1400, height: 900 }, [laptop]);
    expect(b).toEqual({ x: 260, y: 70, width: 1400, height: 900 });
  });

  it('pulls a window that hangs off an edge back on, and trims one bigger than the display', () => {
    expect(clampBounds({ x: 1500, y: -20, width: 1200, height: 800 }, [laptop])).toEqual({ x: 720, y: 0, width: 1200, height: 800 });
    expect(clampBounds({ x: 0, y: 0, width: 3000, height: 2000 }, [laptop])).toEqual({ x: 0, y: 0, width: 1920, height: 1040 });
  });

  it('a window across two displays goes wholly onto the one it covers most', () => {
    expect(clampBounds({ x: 1700, y: 100, width: 1200, height: 800 }, [laptop, right])).toEqual({ x: 1920, y: 100, width: 1200, height: 800 });
    expect(clampBounds({ x: 1000, y: 100, width: 1200, height: 800 }, [laptop, right])).toEqual({ x: 720, y: 100, width: 1200, height: 800 });
  });

  it('never makes a window smaller than the minimum, unless the display is', () => {
    const b = clampBounds({ x: 10, y: 10, width: 100, height: 50 }, [laptop]);
    expect(b.width).toBe(MIN_SIZE.width);
    expect(b.height).toBe(MIN_SIZE.height);
    const tiny = { x: 0, y: 0, width: 640, height: 480 };
    expect(clampBounds(null, [tiny])).toEqual(tiny);
  });

  it('with nothing saved, opens at the default size in the middle of the primary display', () => {
    expect(clampBounds(null, [laptop, right])).toEqual({
      x: (laptop.width - DEFAULT_SIZE.width) / 2,
      y: (laptop.height - DEFAULT_SIZE.height) / 2,
      ...DEFAULT_SIZE,
    });
  });

  it('reads back what it saved, and ignores a damaged state file', async () => {
    const dir = await fs.mkdtemp(path.join(os.tmpdir(), 'loopwright-state-'));
    try {
      expect(await loadWindowState(dir)).toBeNull();
      const state = { bounds: { x: 5, y: 6, width: 1000, height: 700 }, maximized: true };
      await saveWindowState(dir, state);
      expect(await loadWindowState(dir)).toEqual(state);
      expect(parseWindowState('{"bounds":{"x":"a","y":0,"width":1,"height":1}}')).toBeNull();
      expect(parseWindowState('{"bounds":{"x":0,"y":0,"width":-5,"height":1}}')).toBeNull();
      expect(parseWindowState('garbage')).toBeNull();
    } finally {
      await fs.rm(dir, { recursive: true, force: true });
    }
  });
});
