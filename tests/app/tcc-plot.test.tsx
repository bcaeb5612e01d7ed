// The time–current view: log positions of its marks, the characteristics it draws, the
// discrimination flag, and status by symbol and word with the caution beside it.
import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { act, render } from '@testing-library/react';
import { beforeEach, describe, expect, it } from 'vitest';
import { CAUTION, parseJob, resolveRules, type Job } from '../../engine/index.js';
import { DetailsPanel } from '../../app/renderer/panels/index.js';
import { useEditor } from '../../app/renderer/store/index.js';
import { characteristic, discrimination, timeAt } from '../../app/renderer/panels/tcc/characteristic.js';
import { decadeDomain, decades, logPosition } from '../../app/renderer/panels/tcc/scale.js';
import { tccModel } from '../../app/renderer/panels/tcc/TccView.js';
import { libraryEntry } from '../../app/renderer/panels/devices/library.js';

function demo(): Job {
  const loaded = parseJob(readFileSync(resolve(import.meta.dirname, '../../assets/demo.lwj'), 'utf8'));
  if (!loaded.ok) throw new Error('the demo does not load');
  return loaded.job;
}

const auNz = resolveRules({ basis: 'au-nz' });

describe('log axes', () => {
  it('places a value by its log10 between the decades', () => {
    const axis = { lo: 1, hi: 1000, from: 0, to: 300 };
    expect(logPosition(axis, 1)).toBe(0);
    expect(logPosition(axis, 10)).toBeCloseTo(100, 9);
    expect(logPosition(axis, Math.sqrt(10))).toBeCloseTo(50, 9);
    expect(logPosition(axis, 1000)).toBeCloseTo(300, 9);
    // Time runs upwards: a reversed range.
    const time = { lo: 0.01, hi: 10000, from: 260, to: 20 };
    expect(logPosition(time, 0.1)).toBeCloseTo(220, 9);
    expect(logPosition(time, 5)).toBeCloseTo(260 - 40 * (Math.log10(5) + 2), 9);
  });

  it('marks every decade and takes whole decades that hold the values', () => {
    expect(decades(0.01, 10000)).toEqual([0.01, 0.1, 1, 10, 100, 1000, 10000]);
    expect(decadeDomain([29, 6000])).toEqual({ lo: 10, hi: 10000 });
    expect(decadeDomain([150, 160])).toEqual({ lo: 100, hi: 10000 });
  });
});

describe('characteristics and the discrimination flag', () => {
  it('a breaker is a stylised step at Ia = multiple × In down to 0.1 s', () => {
    const c = characteristic({ type: 'mcb', curve: 'C', rating: 20 }, auNz);
    expect(c.stylised).toBe(true);
    // AS/NZS 3000:2018 Table B5.1 note: curve C trips at 7.5 × In.
    expect(c.ia).toBe(150);
    expect(c.points.at(-1)).toEqual([150, 0.1]);
    expect(timeAt(c, 150)).toBe(0.1);
    expect(timeAt(c, 149)!).toBeGreaterThan(0.1);
  });

  it('a curve device is its own points, read log–log between them', () => {
    const c = characteristic({ type: 'curve', rating: 63, points: [[100, 100], [1000, 1]] }, auNz);
    expect(c.stylised).toBe(false);
    expect(timeAt(c, Math.sqrt(100 * 1000))).toBeCloseTo(10, 9);
    expect(timeAt(c, 99)).toBeNull();
    expect(timeAt(c, 5000)).toBe(1);
  });

  it('flags an upstream device that operates at Imax within the downstream time, and only then', () => {
    const down = characteristic({ type: 'mcb', curve: 'B', rating: 10 }, auNz);
    const fuse = characteristic(libraryEntry('gG-63')!.device, auNz);
    // At 4 kA the gG 63 A curve is past its last point (Imax 0.1 s = 820 A): 0.1 s, not slower
    // than the breaker's 0.1 s.
    expect(discrimination(down, fuse, 4000, 'X').kind).toBe('flag');
    // At 300 A the fuse is still in its long-time part (between If 100.8 A at 1 h and 320 A at 5 s).
    const low = discrimination(down, fuse, 300, 'X');
    expect(low.kind).toBe('clear');
    expect(discrimination(down, fuse, null, 'X').kind).toBe('unknown');
    expect(discrimination(down, null, 4000, 'X').kind).toBe('unknown');
  });
});

describe('the plot of a demo circuit', () => {
  beforeEach(() => useEditor.getState().loadJob(demo(), { name: 'demo.lwj' }));

  function view(id: string) {
    const utils = render(<DetailsPanel />);
    act(() => useEditor.getState().select({ nodes: [], links: [id] }));
    const tcc = utils.container.querySelector(`[data-tcc="${id}"]`) as HTMLElement;
    expect(tcc).not.toBeNull();
    return tcc;
  }

  /** Where v sits between the plot's decade ticks, in decades from the first tick. */
  function decadesAlong(svg: Element, axis: 'current' | 'time', pos: number): number {
    const ticks = [...svg.querySelectorAll(`[data-tick-${axis}]`)].map((g) => ({
      v: Number(g.getAttribute(`data-tick-${axis}`)),
      at: Number(g.querySelector('line')!.getAttribute(axis === 'current' ? 'x1' : 'y1')),
    }));
    const a = ticks[0]!;
    const b = ticks[1]!;
    return Math.log10(a.v) + (pos - a.at) / (b.at - a.at);
  }

  it('marks If, Ia, the required time, the clearing time and Imax at their log positions', () => {
    const tcc = view('W01');
    const r = useEditor.getState().resultById.W01!;
    expect(r.faultCurrent).not.toBeNull();
    const svg = tcc.querySelector('svg.lwt-plot')!;
    const x = (mark: string) => Number(svg.querySelector(`[data-tcc-mark="${mark}"]`)!.getAttribute('x1'));
    const y = (mark: string) => Number(svg.querySelector(`[data-tcc-mark="${mark}"]`)!.getAttribute('y1'));
    expect(decadesAlong(svg, 'current', x('faultCurrent'))).toBeCloseTo(Math.log10(r.faultCurrent!), 6);
    expect(decadesAlong(svg, 'current', x('tripCurrent'))).toBeCloseTo(Math.log10(r.tripCurrent!), 6);
    expect(decadesAlong(svg, 'current', x('faultLevel'))).toBeCloseTo(Math.log10(r.faultLevel!), 6);
    expect(decadesAlong(svg, 'time', y('requiredTime'))).toBeCloseTo(Math.log10(0.4), 6);
    const dot = svg.querySelector('[data-tcc-mark="clearingTime"]')!;
    expect(decadesAlong(svg, 'current', Number(dot.getAttribute('data-x')))).toBeCloseTo(Math.log10(r.faultCurrent!), 6);
    expect(decadesAlong(svg, 'time', Number(dot.getAttribute('data-y')))).toBeCloseTo(Math.log10(r.clearingTime!), 6);
  });

  it('draws the upstream device (the fuse on the submain feeding the board) and starts its line at its first point', () => {
    const tcc = view('W01');
    const svg = tcc.querySelector('svg.lwt-plot')!;
    const up = svg.querySelector('[data-tcc-curve="upstream"]')!.getAttribute('d')!;
    const [, px, py] = /^M([\d.]+),([\d.]+)/.exec(up)!;
    const fuse = useEditor.getState().job.links.find((l) => l.id === 'SM1')!.device as { points: Array<[number, number]> };
    expect(decadesAlong(svg, 'current', Number(px))).toBeCloseTo(Math.log10(fuse.points[0]![0]), 2);
    expect(decadesAlong(svg, 'time', Number(py))).toBeCloseTo(Math.log10(fuse.points[0]![1]), 2);
    expect(tcc.textContent).toContain('on SM1');
  });

  it('shows status and the flag by symbol and word, says what is stylised, and keeps the caution', () => {
    const tcc = view('W01');
    const status = tcc.querySelector('[data-tcc-status]')!;
    expect(status.getAttribute('data-tcc-status')).toBe('pass');
    expect(status.textContent).toMatch(/✓\s*pass/);
    const m = tccModel(useEditor.getState().job, useEditor.getState().resultById, 'W01')!;
    const flag = tcc.querySelector('[data-discrimination]')!;
    expect(flag.getAttribute('data-discrimination')).toBe(m.flag.kind);
    // The 63 A fuse at ≈ 4 kA clears at its last point's 0.04 s, within the breaker's 0.1 s.
    expect(m.flag.kind).toBe('flag');
    expect(flag.textContent).toMatch(/⚠\s*may not discriminate/);
    expect(tcc.querySelector('[data-tcc-stylised]')!.textContent).toMatch(/Stylised: C20/);
    expect(tcc.textContent).toContain(CAUTION);
  });

  it('says discrimination is not assessed where there is no upstream device', () => {
    const tcc = view('SM1'); // fed by the consumer mains, which has no device
    expect(tcc.querySelector('[data-discrimination]')!.getAttribute('data-discrimination')).toBe('unknown');
    expect(tcc.querySelector('[data-tcc-curve="upstream"]')).toBeNull();
    expect(tcc.querySelector('[data-tcc-stylised]')).toBeNull(); // the fuse is its own curve
  });

  it('a circuit protected from above (a leg leaving a point) plots the device that protects it', () => {
    const m = tccModel(useEditor.getState().job, useEditor.getState().resultById, 'C03b')!;
    expect(m.down!.link).toBe('C03');
    expect(m.imax).toBe(useEditor.getState().resultById.C03!.faultLevel);
  });
});
