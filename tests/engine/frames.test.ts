// The browser benchmark's per-frame work (tests/bench/frames.ts) on made-up traces: tasks of the
// renderer's main thread summed between the ends of consecutive animation frames.
import { describe, expect, it } from 'vitest';
import { workPerFrame, type TraceEvent } from '../bench/frames.js';

const MAIN = { pid: 7, tid: 1 };
const meta: TraceEvent = { name: 'thread_name', ph: 'M', ts: 0, ...MAIN, args: { name: 'CrRendererMain' } };
const task = (ms: number, durMs: number, where = MAIN): TraceEvent => ({ name: 'ThreadControllerImpl::RunTask', ph: 'X', ts: ms * 1000, dur: durMs * 1000, ...where });
const frameEnd = (ms: number): TraceEvent => ({ name: 'AnimationFrame', ph: 'e', ts: ms * 1000, pid: MAIN.pid, tid: 2 });

describe('work per frame from a trace', () => {
  it('sums the main thread tasks between frame ends, and nothing of other threads', () => {
    const events = [meta, frameEnd(0), task(1, 3), task(5, 4), task(6, 50, { pid: 7, tid: 9 }), frameEnd(16), task(18, 2), frameEnd(33)];
    expect(workPerFrame(events)).toEqual([7, 2]);
  });

  it('splits a task that runs past a frame end between the two frames, and counts a nested task once', () => {
    const events = [meta, frameEnd(0), task(10, 10), task(12, 2), frameEnd(16), frameEnd(32)];
    const work = workPerFrame(events);
    expect(work[0]).toBeCloseTo(6, 9);
    expect(work[1]).toBeCloseTo(4, 9);
  });

  it('gives nothing without the main thread or without two frame ends', () => {
    expect(workPerFrame([frameEnd(0), task(1, 3), frameEnd(16)])).toEqual([]);
    expect(workPerFrame([meta, frameEnd(0), task(1, 3)])).toEqual([]);
  });
});
