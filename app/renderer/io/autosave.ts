// Autosave in the browser: after every edit the job goes to localStorage; after a reload or a
// crash the app offers to restore it. A job with no unsaved changes leaves nothing behind.
import { parseJob, serialiseJob, type Job } from '../../../engine/index.js';
import { useEditor } from '../store/editor.js';

export const AUTOSAVE_KEY = 'loopwright.autosave.v1';
/** Where an earlier session's unsaved job waits until the user restores or discards it. */
export const RECOVER_KEY = 'loopwright.recover.v1';

export interface Autosaved {
  text: string;
  fileName: string | null;
  savedAt: string;
}

/** Quiet time after the last change before a write is considered. */
export const AUTOSAVE_DELAY_MS = 300;
/** A write waits for the browser to be idle, but no longer than this. */
export const AUTOSAVE_IDLE_TIMEOUT_MS = 2000;

let timer: ReturnType<typeof setTimeout> | null = null;
let idle: { cancel(): void } | null = null;
// What the last write left in storage, so an unchanged job is not serialised again.
let written: { job: unknown; dirty: boolean; fileName: string | null } | null = null;

/** Runs `fn` when the browser is idle (requestIdleCallback), else on the next turn. */
function whenIdle(fn: () => void): { cancel(): void } {
  if (typeof window !== 'undefined' && typeof window.requestIdleCallback === 'function') {
    const handle = window.requestIdleCallback(fn, { timeout: AUTOSAVE_IDLE_TIMEOUT_MS });
    return { cancel: () => window.cancelIdleCallback(handle) };
  }
  const handle = setTimeout(fn, 0);
  return { cancel: () => clearTimeout(handle) };
}

function cancelPending(): boolean {
  const pending = timer !== null || idle !== null;
  if (timer) clearTimeout(timer);
  idle?.cancel();
  timer = null;
  idle = null;
  return pending;
}

function write(): void {
  cancelPending();
  const s = useEditor.getState();
  // Serialising a large job takes a while: skip it when storage already holds this state.
  if (written && written.job === s.job && written.dirty === s.dirty && written.fileName === s.fileName) return;
  try {
    if (!s.dirty) localStorage.removeItem(AUTOSAVE_KEY);
    else {
      const entry: Autosaved = { text: serialiseJob(s.job), fileName: s.fileName, savedAt: new Date().toISOString() };
      localStorage.setItem(AUTOSAVE_KEY, JSON.stringify(entry));
    }
    written = { job: s.job, dirty: s.dirty, fileName: s.fileName };
  } catch {
    // Storage full or disabled: the job itself is untouched; the next change tries again.
    written = null;
  }
}

/**
 * Starts autosaving: a change is written once edits pause for AUTOSAVE_DELAY_MS and the browser
 * is idle (so a large job's serialisation does not hold up typing or dragging), and at once when
 * the page is hidden. Returns a function that stops it.
 */
export function startAutosave(): () => void {
  written = null;
  const stop = useEditor.subscribe((s, prev) => {
    if (s.job === prev.job && s.dirty === prev.dirty && s.fileName === prev.fileName) return;
    cancelPending();
    timer = setTimeout(() => {
      timer = null;
      idle = whenIdle(() => {
        idle = null;
        write();
      });
    }, AUTOSAVE_DELAY_MS);
  });
  const flush = () => {
    if (cancelPending()) write();
  };
  window.addEventListener('pagehide', flush);
  return () => {
    stop();
    cancelPending();
    window.removeEventListener('pagehide', flush);
  };
}

/**
 * What an earlier session left unsaved, if it can still be read. Call once at start, before
 * startAutosave: the entry is moved aside so this session's autosave cannot overwrite it.
 */
export function takeRecovery(): (Autosaved & { job: Job }) | null {
  try {
    const fresh = localStorage.getItem(AUTOSAVE_KEY);
    if (fresh) {
      localStorage.setItem(RECOVER_KEY, fresh);
      localStorage.removeItem(AUTOSAVE_KEY);
    }
    const raw = localStorage.getItem(RECOVER_KEY);
    if (!raw) return null;
    const entry = JSON.parse(raw) as Autosaved;
    const loaded = parseJob(entry.text);
    return loaded.ok ? { ...entry, job: loaded.job } : null;
  } catch {
    return null;
  }
}

export function discardRecovery(): void {
  try {
    localStorage.removeItem(RECOVER_KEY);
  } catch {
    // nothing to remove
  }
}
