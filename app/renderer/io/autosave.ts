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

let timer: ReturnType<typeof setTimeout> | null = null;

function write(): void {
  timer = null;
  const s = useEditor.getState();
  try {
    if (!s.dirty) localStorage.removeItem(AUTOSAVE_KEY);
    else {
      const entry: Autosaved = { text: serialiseJob(s.job), fileName: s.fileName, savedAt: new Date().toISOString() };
      localStorage.setItem(AUTOSAVE_KEY, JSON.stringify(entry));
    }
  } catch {
    // Storage full or disabled: the job itself is untouched; nothing else to do.
  }
}

/** Starts autosaving; returns a function that stops it. */
export function startAutosave(): () => void {
  const stop = useEditor.subscribe((s, prev) => {
    if (s.job === prev.job && s.dirty === prev.dirty) return;
    if (timer) clearTimeout(timer);
    timer = setTimeout(write, 300);
  });
  const flush = () => {
    if (timer) {
      clearTimeout(timer);
      write();
    }
  };
  window.addEventListener('pagehide', flush);
  return () => {
    stop();
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
