// In-page measurement for the browser benchmark (tests/bench/ui.ts). The page runs under the
// app's Content-Security-Policy (no eval), so each probe is sent whole as script text through
// the driver (page.evaluate of a string), never compiled inside the page.

export interface Timing {
  /** From the action to the first frame after its outcome shows (the condition holds). */
  ms: number;
  /** From the action until the page is quiet again (no frame gap over 50 ms for 300 ms). */
  settledMs: number;
  /** Longest gap between frames from the action until quiet. */
  worstFrameMs: number;
}

/**
 * Script text: runs `action` (statements) in the page, then waits frame by frame until `until`
 * (an expression) holds and the page has been quiet for 300 ms.
 */
export function measureScript(action: string, until: string, timeoutMs = 60_000): string {
  return `(async () => {
    const frame = () => new Promise((ok) => requestAnimationFrame(() => setTimeout(() => ok(performance.now()), 0)));
    const until = () => Boolean(${until});
    const t0 = performance.now();
    await (async () => { ${action} })();
    let last = performance.now();
    let done = null;
    let quietSince = last;
    let worst = 0;
    for (;;) {
      const now = await frame();
      const gap = now - last;
      if (gap > worst) worst = gap;
      if (gap > 50) quietSince = now;
      last = now;
      if (done === null && until()) done = now;
      if (done !== null && now - quietSince >= 300) break;
      if (now - t0 > ${timeoutMs}) throw new Error('timed out after ${timeoutMs} ms waiting for ' + ${JSON.stringify(until)});
    }
    return { ms: done - t0, settledMs: Math.max(done, quietSince) - t0, worstFrameMs: worst };
  })()`;
}

/** Script text: starts recording the gaps between frames (while the driver moves the mouse). */
export const START_FRAME_LOG = `(() => {
  window.__lwFrames = [];
  window.__lwFramesOn = true;
  let last = performance.now();
  const tick = () => {
    const now = performance.now();
    window.__lwFrames.push(now - last);
    last = now;
    if (window.__lwFramesOn) requestAnimationFrame(tick);
  };
  requestAnimationFrame(tick);
})()`;

/** Script text: stops recording and returns the frame gaps (ms). */
export const STOP_FRAME_LOG = `(() => { window.__lwFramesOn = false; return window.__lwFrames.slice(1); })()`;

/** Script text: opens a job through the app's file input (as a user picking a file would). */
export function openScript(text: string, name: string): string {
  return `
    const file = new File([${JSON.stringify(text)}], ${JSON.stringify(name)}, { type: 'application/json' });
    const input = document.querySelector('input[data-open-job]');
    const dt = new DataTransfer();
    dt.items.add(file);
    input.files = dt.files;
    input.dispatchEvent(new Event('change', { bubbles: true }));`;
}

/** Script text (awaited inside measureScript's action): types a value into an input and presses
 *  Enter (React sees input, renders, then keydown). */
export function typeScript(selector: string, value: string): string {
  return `
    const input = document.querySelector(${JSON.stringify(selector)});
    if (!input) throw new Error('no ' + ${JSON.stringify(selector)});
    input.focus(); // already focused by the benchmark's click into the field: nothing to do
    Object.getOwnPropertyDescriptor(HTMLInputElement.prototype, 'value').set.call(input, ${JSON.stringify(value)});
    input.dispatchEvent(new Event('input', { bubbles: true }));
    // React renders the typed text before the key arrives, as it does between a person's keys.
    await new Promise((ok) => setTimeout(ok, 0));
    input.dispatchEvent(new KeyboardEvent('keydown', { key: 'Enter', code: 'Enter', bubbles: true }));`;
}

/** Script text: a click on the first element matching the selector. */
export function clickScript(selector: string): string {
  return `
    const el = document.querySelector(${JSON.stringify(selector)});
    if (!el) throw new Error('no ' + ${JSON.stringify(selector)});
    el.click();`;
}
