// Autosave: written once edits pause and the browser is idle, skipped when nothing changed
// since the last write, removed when the job is back to its saved state; restore unchanged.
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { AUTOSAVE_DELAY_MS, AUTOSAVE_KEY, RECOVER_KEY, startAutosave, takeRecovery } from '../../app/renderer/io/autosave.js';
import { useEditor } from '../../app/renderer/store/index.js';
import { smallJob } from './fixture.js';

const s = () => useEditor.getState();
let stop: (() => void) | null = null;

beforeEach(() => {
  vi.useFakeTimers();
  localStorage.clear();
  s().loadJob(smallJob(), { name: 'test.lwj' });
});

afterEach(() => {
  stop?.();
  stop = null;
  vi.restoreAllMocks();
  vi.unstubAllGlobals();
  vi.useRealTimers();
});

const length = (id: string, metres: number) => s().apply({ op: 'update-link', id, patch: { cable: { ...s().job.links.find((l) => l.id === id)!.cable, length: metres } } });

describe('autosave', () => {
  it('writes the job once edits pause, not on every edit', () => {
    const setItem = vi.spyOn(Storage.prototype, 'setItem');
    stop = startAutosave();
    length('C1', 30);
    vi.advanceTimersByTime(AUTOSAVE_DELAY_MS - 50);
    length('C1', 31);
    vi.advanceTimersByTime(AUTOSAVE_DELAY_MS - 50);
    expect(setItem).not.toHaveBeenCalled();
    vi.runAllTimers();
    expect(setItem).toHaveBeenCalledTimes(1);
    const entry = JSON.parse(localStorage.getItem(AUTOSAVE_KEY)!) as { text: string; fileName: string };
    expect(entry.fileName).toBe('test.lwj');
    expect(entry.text).toContain('"length": 31');
  });

  it('waits for the browser to be idle when it can', () => {
    const idle: Array<() => void> = [];
    vi.stubGlobal('requestIdleCallback', (fn: () => void) => idle.push(fn));
    vi.stubGlobal('cancelIdleCallback', () => undefined);
    stop = startAutosave();
    length('C1', 30);
    vi.runAllTimers();
    expect(localStorage.getItem(AUTOSAVE_KEY)).toBeNull();
    expect(idle).toHaveLength(1);
    idle[0]!();
    expect(localStorage.getItem(AUTOSAVE_KEY)).not.toBeNull();
  });

  it('skips the write when the job is the one already written', () => {
    stop = startAutosave();
    length('C1', 30);
    vi.runAllTimers();
    const setItem = vi.spyOn(Storage.prototype, 'setItem');
    // An edit undone before the write leaves the same job as last written.
    length('C2', 40);
    s().undo();
    vi.runAllTimers();
    expect(setItem).not.toHaveBeenCalled();
    // Selection and messages are not saved, so they never cause a write.
    s().select({ nodes: ['P1'], links: [] });
    vi.runAllTimers();
    expect(setItem).not.toHaveBeenCalled();
    length('C2', 41);
    vi.runAllTimers();
    expect(setItem).toHaveBeenCalledTimes(1);
  });

  it('leaves nothing behind once the job is back to its saved state', () => {
    stop = startAutosave();
    length('C1', 30);
    vi.runAllTimers();
    expect(localStorage.getItem(AUTOSAVE_KEY)).not.toBeNull();
    s().undo();
    vi.runAllTimers();
    expect(localStorage.getItem(AUTOSAVE_KEY)).toBeNull();
  });

  it('writes at once when the page is hidden', () => {
    stop = startAutosave();
    length('C1', 30);
    window.dispatchEvent(new Event('pagehide'));
    expect(localStorage.getItem(AUTOSAVE_KEY)).not.toBeNull();
  });

  it('offers what an earlier session left, moved aside so this session cannot overwrite it', () => {
    stop = startAutosave();
    length('C1', 77);
    vi.runAllTimers();
    stop();
    stop = null;
    const recovery = takeRecovery();
    expect(recovery?.job.links.find((l) => l.id === 'C1')?.cable.length).toBe(77);
    expect(localStorage.getItem(AUTOSAVE_KEY)).toBeNull();
    expect(localStorage.getItem(RECOVER_KEY)).not.toBeNull();
  });
});
