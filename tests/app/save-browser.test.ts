// Save in the browser build: the File System Access picker where a person can answer it, a
// download when the browser is driven by automation (its native picker would never answer).
// Open in the browser build: a file over the size limit is refused from its size, unread.
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { LIMITS, serialiseJob } from '../../engine/index.js';
import { openFromInput, saveJob, savePicker } from '../../app/renderer/io/files.js';
import { useUi } from '../../app/renderer/app/ui.js';
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

/** A file input holding one file that says it is `size` bytes (no such buffer is made). */
function inputWith(name: string, size: number, text: string) {
  const read = vi.fn(async () => text);
  const file = { name, size, type: 'application/json', text: read } as unknown as File;
  const input = document.createElement('input');
  input.type = 'file';
  Object.defineProperty(input, 'files', { value: [file], configurable: true });
  return { input, read };
}

describe('opening in the browser', () => {
  beforeEach(() => useUi.setState({ problems: null }));

  it('refuses a file over the size limit before reading it, and keeps the open job', async () => {
    const before = s().job;
    const confirm = vi.spyOn(window, 'confirm').mockReturnValue(true);
    const { input, read } = inputWith('huge.lwj', LIMITS.size + 1, serialiseJob(smallJob()));
    await openFromInput(input);
    expect(read).not.toHaveBeenCalled();
    expect(confirm).not.toHaveBeenCalled(); // nothing to discard for: the file cannot be opened
    expect(s().job).toBe(before);
    expect(s().dirty).toBe(true); // the unsaved edit is still there
    expect(s().fileName).toBe('small.lwj');
    // the same words as the loader's refusal (engine/model/limits.ts)
    expect(useUi.getState().problems).toEqual({
      title: 'huge.lwj could not be opened',
      lines: ['file: the file is 50.0 MB, over the limit of 50.0 MB for a job file; nothing was read'],
    });
    expect(s().message).toEqual({ kind: 'error', text: 'huge.lwj could not be opened: it is larger than 50.0 MB, the limit for a job file' });
  });

  it('names the size of a much larger file', async () => {
    const { input, read } = inputWith('archive.lwj', 3 * 1024 * 1024 * 1024, '');
    await openFromInput(input);
    expect(read).not.toHaveBeenCalled();
    expect(useUi.getState().problems?.lines).toEqual(['file: the file is 3072.0 MB, over the limit of 50.0 MB for a job file; nothing was read']);
  });

  it('reads a file of exactly the limit as usual', async () => {
    vi.spyOn(window, 'confirm').mockReturnValue(true);
    const job = smallJob();
    job.job.title = 'At the limit';
    const { input, read } = inputWith('edge.lwj', LIMITS.size, serialiseJob(job));
    await openFromInput(input);
    expect(read).toHaveBeenCalledOnce();
    expect(useUi.getState().problems).toBeNull();
    expect(s().job.job.title).toBe('At the limit');
    expect(s().fileName).toBe('edge.lwj');
  });
});
