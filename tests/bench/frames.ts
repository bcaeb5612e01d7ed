// The main thread's work per frame, from a Chromium trace (the browser benchmark's drag, ui.ts).
// Pure, so tests/engine/frames.test.ts can check it on made-up traces.

export interface TraceEvent { name: string; ph: string; ts: number; dur?: number; pid: number; tid: number; args?: { name?: string } }

/**
 * The main thread's work in each frame, in ms, from a Chromium trace: frames end where Chromium
 * marks the end of an animation frame's rendering ("AnimationFrame" spans, one a frame drawn), and
 * a frame's work is the time the renderer's main thread spent running tasks (input, script,
 * style, layout, paint) since the previous frame ended.
 */
export function workPerFrame(events: readonly TraceEvent[]): number[] {
  const main = events.find((e) => e.name === 'thread_name' && e.args?.name === 'CrRendererMain');
  if (!main) return [];
  const frames = events.filter((e) => e.pid === main.pid && e.name === 'AnimationFrame' && e.ph === 'e').map((e) => e.ts).sort((a, b) => a - b);
  const tasks = events
    .filter((e) => e.pid === main.pid && e.tid === main.tid && e.name === 'ThreadControllerImpl::RunTask' && e.ph === 'X' && (e.dur ?? 0) > 0)
    .sort((a, b) => a.ts - b.ts);
  const work: number[] = [];
  let t = 0;
  let reach = -Infinity; // end of the task time counted so far (a nested task is not counted twice)
  for (let f = 0; f + 1 < frames.length; f++) {
    const from = frames[f]!;
    const to = frames[f + 1]!;
    let busy = 0;
    while (t < tasks.length && tasks[t]!.ts < to) {
      const task = tasks[t]!;
      const start = Math.max(task.ts, from, reach);
      const end = Math.min(task.ts + task.dur!, to);
      if (end > start) busy += end - start;
      if (task.ts + task.dur! > to) break; // runs on into the next frame: counted there too
      reach = Math.max(reach, task.ts + task.dur!);
      t++;
    }
    work.push(busy / 1000);
  }
  return work;
}
