// Save in the browser build: the File System Access picker where a person can answer it, a
// download when the browser is driven by automation (its native picker would never answer).
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { saveJob, savePicker } from '../../app/renderer/io/files.js';
import { useEditor } from '../../app/renderer/store/index.js';
import { smallJob } from './fixture.js';

const s = () => useEditor.getState();

function setWebdriver(value: boolean) {
  Object.defineProperty(navigator, 'webdriver', { value, configurable: true });
}

beforeEach(() => {
  s().loadJob(smallJob(), { name: 'small.lwj' });
  s().apply({ op: 'set-details', patch: { title: 'Edited' } });
  // jsdom has no object URLs.
  vi.stubGlobal('URL', Object.assign(URL, { createObjectURL: vi.fn(() => 'blob:x'), revokeObjectURL: vi.fn() }));
});

afterEach(() => {
  setWebdriver(false);
  delete (window as unknown as { showSaveFilePicker?: unknown }).showSaveFilePicker;
  vi.restoreAllMocks();
  vi.unstubAllGlobals();
});

describe('saving in the browser', () => {
  it('uses the save picker when a person drives the browser', () => {
    (window as unknown as { showSaveFilePicker: unknown }).showSaveFilePicker = vi.fn();
    setWebdriver(false);
    expect(savePicker()).toBeTypeOf('function');
  });

  it('downloads the .lwj when the browser is automated, and the job counts as saved', async () => {
    const picker = vi.fn(() => new Promise(() => {}));
    (window as unknown as { showSaveFilePicker: unknown }).showSaveFilePicker = picker;
    setWebdriver(true);
    expect(savePicker()).toBeNull();
    const clicks: string[] = [];
    vi.spyOn(HTMLAnchorElement.prototype, 'click').mockImplementation(function (this: HTMLAnchorElement) {
      clicks.push(this.download);
    });
    expect(s().dirty).toBe(true);
    await saveJob(false);
    expect(picker).not.toHaveBeenCalled();
    expect(clicks).toEqual(['small.lwj']);
    expect(s().dirty).toBe(false);
    expect(s().message?.text).toBe('Saved small.lwj');
  });
});
