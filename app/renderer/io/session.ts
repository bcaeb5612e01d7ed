// Which browser tab this is, and which tabs are open: each tab of the app keeps its own autosave
// (two tabs never write over each other's), and an autosave left by a tab that was closed can
// still be found and offered. The tab's id lives in sessionStorage, so a reload keeps it.

const TAB_KEY = 'loopwright.tab';
/** Tabs open now, with when each was last seen (ms): `{ id: time }`. */
export const TABS_KEY = 'loopwright.tabs';
/** A tab not seen for this long is taken as closed. */
export const TAB_STALE_MS = 20_000;
const BEAT_MS = 5_000;

function storage(kind: 'local' | 'session'): Storage | null {
  try {
    return kind === 'local' ? globalThis.localStorage ?? null : globalThis.sessionStorage ?? null;
  } catch {
    return null;
  }
}

export function liveTabs(now = Date.now()): Set<string> {
  try {
    const seen = JSON.parse(storage('local')?.getItem(TABS_KEY) ?? '{}') as Record<string, number>;
    return new Set(Object.entries(seen).filter(([, t]) => typeof t === 'number' && now - t < TAB_STALE_MS).map(([id]) => id));
  } catch {
    return new Set();
  }
}

function fresh(): string {
  return `${Date.now().toString(36)}${Math.random().toString(36).slice(2, 8)}`;
}

let id: string | null = null;

/**
 * This tab's id. A tab opened as a copy of another (its session storage copied with it) gets a
 * new one when the other is still open under the same id.
 */
export function tabId(): string {
  if (id) return id;
  const session = storage('session');
  let mine = session?.getItem(TAB_KEY) ?? null;
  if (!mine || liveTabs().has(mine)) mine = fresh();
  try {
    session?.setItem(TAB_KEY, mine);
  } catch {
    // No session storage: the id holds for this page only.
  }
  id = mine;
  return mine;
}

function mark(present: boolean): void {
  const local = storage('local');
  if (!local) return;
  try {
    const seen = JSON.parse(local.getItem(TABS_KEY) ?? '{}') as Record<string, number>;
    const now = Date.now();
    for (const [k, t] of Object.entries(seen)) if (typeof t !== 'number' || now - t > TAB_STALE_MS * 3) delete seen[k];
    if (present) seen[tabId()] = now;
    else delete seen[tabId()];
    local.setItem(TABS_KEY, JSON.stringify(seen));
  } catch {
    // Storage full or blocked: other tabs then take this one as closed, which only means they may offer its autosave.
  }
}

/** Says this tab is open (now and every few seconds) until the page goes; returns a function that stops. */
export function startPresence(): () => void {
  mark(true);
  const timer = setInterval(() => mark(true), BEAT_MS);
  const gone = () => mark(false);
  const back = () => mark(true);
  window.addEventListener('pagehide', gone);
  window.addEventListener('pageshow', back);
  return () => {
    clearInterval(timer);
    window.removeEventListener('pagehide', gone);
    window.removeEventListener('pageshow', back);
    mark(false);
  };
}
