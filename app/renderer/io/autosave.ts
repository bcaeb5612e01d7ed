// Autosave in the browser: after every edit the job goes to localStorage; after a reload or a
// crash the app offers to restore it. A job with no unsaved changes leaves nothing behind.
import { parseJob, serialiseJob, type Job } from '../../../engine/index.js';
import { useEditor } from '../store/editor.js';
import { whenIdle } from '../store/idle.js';
import { liveTabs, tabId } from './session.js';

/** Every tab autosaves under a key of its own (this prefix and its id), so two tabs never overwrite each other. */
export const AUTOSAVE_PREFIX = 'loopwright.autosave.v1';
export const AUTOSAVE_KEY = `${AUTOSAVE_PREFIX}.${tabId()}`;
/** Where an earlier session's unsaved job waits until the user restores or discards it (this tab's). */
export const RECOVER_KEY = `loopwright.recover.v1.${tabId()}`;
/** The job last saved in this browser (any tab), and in this tab, reopened after a reload instead of the demo. */
export const SAVED_KEY = 'loopwright.saved.v1';
export const TAB_SAVED_KEY = `${SAVED_KEY}.${tabId()}`;

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
// Whether the user has been told that the autosave does not fit (told once until a write succeeds).
let toldFull = false;

/** A storage write refused for room (QuotaExceededError, or the older names some browsers use). */
export function isQuotaError(e: unknown): boolean {
  return e instanceof DOMException && (e.name === 'QuotaExceededError' || e.name === 'NS_ERROR_DOM_QUOTA_REACHED' || e.code === 22);
}

function size(text: string): string {
  const kb = (text.length * 2) / 1024;
  return kb >= 1024 ? `${(kb / 1024).toFixed(1)} MB` : `${Math.ceil(kb)} kB`;
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
  let text = '';
  try {
    if (!s.dirty) localStorage.removeItem(AUTOSAVE_KEY);
    else {
      const entry: Autosaved = { text: serialiseJob(s.job), fileName: s.fileName, savedAt: new Date().toISOString() };
      text = JSON.stringify(entry);
      localStorage.setItem(AUTOSAVE_KEY, text);
    }
    written = { job: s.job, dirty: s.dirty, fileName: s.fileName };
    toldFull = false;
  } catch (e) {
    // Storage full or disabled: the job itself is untouched; the next change tries again. The
    // user is told (once), since a reload would then lose the changes.
    written = null;
    if (!toldFull) {
      toldFull = true;
      const why = isQuotaError(e)
        ? `this job (${size(text)}) does not fit in the browser's storage`
        : `the browser refused to store it (${e instanceof Error ? e.message : String(e)})`;
      useEditor.getState().setMessage({ kind: 'error', text: `Autosave failed: ${why}; save the job to a file (Save) to keep your changes` });
    }
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
      }, AUTOSAVE_IDLE_TIMEOUT_MS);
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
    } else if (!localStorage.getItem(RECOVER_KEY)) {
      // Nothing of this tab's own: the newest autosave a closed tab left (never an open tab's).
      const orphan = orphanKey();
      const text = orphan ? localStorage.getItem(orphan) : null;
      if (orphan && text) {
        localStorage.setItem(RECOVER_KEY, text);
        localStorage.removeItem(orphan);
      }
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

/** The key of the newest autosave whose tab is closed (the single key of older versions counts as one). */
function orphanKey(): string | null {
  const live = liveTabs();
  let best: { key: string; at: string } | null = null;
  for (let i = 0; i < localStorage.length; i++) {
    const key = localStorage.key(i);
    if (!key || key === AUTOSAVE_KEY) continue;
    const owner = key === AUTOSAVE_PREFIX ? '' : key.startsWith(`${AUTOSAVE_PREFIX}.`) ? key.slice(AUTOSAVE_PREFIX.length + 1) : null;
    if (owner === null || (owner !== '' && live.has(owner))) continue;
    let at = '';
    try {
      at = String((JSON.parse(localStorage.getItem(key) ?? '{}') as Partial<Autosaved>).savedAt ?? '');
    } catch {
      continue;
    }
    if (!best || at > best.at) best = { key, at };
  }
  return best?.key ?? null;
}

/**
 * Remembers a job just saved to a file, so a reload reopens it (not the demo). Says so when it
 * does not fit: the file itself was saved all the same.
 */
export function rememberSaved(text: string, fileName: string): void {
  const entry = JSON.stringify({ text, fileName, savedAt: new Date().toISOString() } satisfies Autosaved);
  try {
    localStorage.setItem(TAB_SAVED_KEY, entry);
    localStorage.setItem(SAVED_KEY, entry);
  } catch (e) {
    try {
      localStorage.removeItem(TAB_SAVED_KEY);
    } catch {
      // nothing to remove
    }
    useEditor.getState().setMessage({
      kind: 'info',
      text: `Saved ${fileName}; it is too large for the browser to reopen after a reload (${isQuotaError(e) ? 'storage full' : 'storage refused'}): open the file again then`,
    });
  }
}

/** The job to reopen at start: this tab's last saved one, else the last saved in this browser; null for the demo. */
export function takeSaved(): (Autosaved & { job: Job }) | null {
  for (const key of [TAB_SAVED_KEY, SAVED_KEY]) {
    try {
      const raw = localStorage.getItem(key);
      if (!raw) continue;
      const entry = JSON.parse(raw) as Autosaved;
      const loaded = parseJob(entry.text);
      if (loaded.ok) return { ...entry, job: loaded.job };
    } catch {
      // unreadable: try the next, else the demo
    }
  }
  return null;
}

export function discardRecovery(): void {
  try {
    localStorage.removeItem(RECOVER_KEY);
  } catch {
    // nothing to remove
  }
}
