// Work for when the browser is idle (autosave, the editor's rehearsed edit).

/** Runs `fn` when the browser is idle (requestIdleCallback, at the latest after `timeoutMs`),
 *  else on the next turn; the handle cancels it. */
export function whenIdle(fn: () => void, timeoutMs: number): { cancel(): void } {
  if (typeof window !== 'undefined' && typeof window.requestIdleCallback === 'function') {
    const handle = window.requestIdleCallback(fn, { timeout: timeoutMs });
    return { cancel: () => window.cancelIdleCallback(handle) };
  }
  const handle = setTimeout(fn, 0);
  return { cancel: () => clearTimeout(handle) };
}
