// The browser build's storage: each tab autosaves under its own key (two tabs never overwrite
// each other), a closed tab's autosave is offered and an open tab's is left alone, an autosave
// that does not fit says so, and the job last saved is what reopens after a reload.
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import {
  AUTOSAVE_KEY, AUTOSAVE_PREFIX, RECOVER_KEY, rememberSaved, startAutosave, takeRecovery, takeSaved,
} from '../../app/renderer/io/autosave.js';
import { TABS_KEY, tabId } from '../../app/renderer/io/session.js';
import { serialiseJob } from '../../engine/index.js';
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
  vi.useRealTimers();
});

function entry(title: string, savedAt: string): string {
  const job = smallJob();
  return JSON.stringify({ text: serialiseJob({ ...job, job: { ...job.job, title } }), fileName: `${title}.lwj`, savedAt });
}

describe('autosave per tab', () => {
  it('writes under this tab\'s own key and leaves another tab\'s autosave as it was', () => {
    expect(AUTOSAVE_KEY).toBe(`${AUTOSAVE_PREFIX}.${tabId()}`);
    const other = `${AUTOSAVE_PREFIX}.othertab`;
    localStorage.setItem(other, entry('Other tab', '2026-01-01T00:00:00Z'));
    stop = startAutosave();
    s().apply({ op: 'set-details', patch: { title: 'Mine' } });
    vi.runAllTimers();
    expect(localStorage.getItem(AUTOSAVE_KEY)).toContain('Mine');
    expect(localStorage.getItem(other)).toContain('Other tab');
  });

  it('offers the newest autosave a closed tab left, never one an open tab is still writing', () => {
    localStorage.setItem(TABS_KEY, JSON.stringify({ open1: Date.now() }));
    localStorage.setItem(`${AUTOSAVE_PREFIX}.open1`, entry('Open tab', '2026-03-01T00:00:00Z'));
    localStorage.setItem(`${AUTOSAVE_PREFIX}.closed1`, entry('Closed older', '2026-01-01T00:00:00Z'));
    localStorage.setItem(`${AUTOSAVE_PREFIX}.closed2`, entry('Closed newer', '2026-02-01T00:00:00Z'));
    const recovery = takeRecovery();
    expect(recovery?.job.job.title).toBe('Closed newer');
    expect(localStorage.getItem(RECOVER_KEY)).toContain('Closed newer');
    expect(localStorage.getItem(`${AUTOSAVE_PREFIX}.closed2`)).toBeNull();
    expect(localStorage.getItem(`${AUTOSAVE_PREFIX}.open1`)).toContain('Open tab');
  });

  it('an autosave that does not fit tells the user once, and the job is untouched', () => {
    vi.spyOn(Storage.prototype, 'setItem').mockImplementation(() => {
      throw new DOMException('full', 'QuotaExceededError');
    });
    stop = startAutosave();
    s().apply({ op: 'set-details', patch: { title: 'Big' } });
    vi.runAllTimers();
    expect(s().message).toEqual({ kind: 'error', text: expect.stringMatching(/^Autosave failed: this job \(\d+ kB\) does not fit in the browser's storage; save the job to a file/) as unknown as string });
    expect(s().job.job.title).toBe('Big');
    s().setMessage(null);
    s().apply({ op: 'set-details', patch: { title: 'Bigger' } });
    vi.runAllTimers();
    expect(s().message).toBeNull();
  });
});

describe('the saved job reopens', () => {
  it('this tab\'s last saved job first, else the last saved in the browser', () => {
    expect(takeSaved()).toBeNull();
    localStorage.setItem('loopwright.saved.v1', entry('Browser last', '2026-01-01T00:00:00Z'));
    expect(takeSaved()?.job.job.title).toBe('Browser last');
    const job = { ...smallJob(), job: { ...smallJob().job, title: 'Saved here' } };
    rememberSaved(serialiseJob(job), 'here.lwj');
    const again = takeSaved();
    expect(again?.job.job.title).toBe('Saved here');
    expect(again?.fileName).toBe('here.lwj');
  });
});
