// Every device kind: trip current Ia and clearing time at the fault current (method.md
// "Trip current Ia"). Curve points used throughout: (200 A, 10 s), (400 A, 1 s), (800 A, 0.1 s).

import { describe, expect, it } from 'vitest';
import { deviceMark } from '../../engine/index.js';
import {
  board,
  cable,
  circuit,
  expectRel,
  impedanceSupply,
  jobFile,
  link,
  mcb,
  point,
  run,
  unknownSupply,
} from './helpers.js';
import type { Obj } from './helpers.js';

const POINTS: Array<[number, number]> = [
  [200, 10],
  [400, 1],
  [800, 0.1],
];
const curve = (rating: number): Obj => ({ type: 'curve', rating, points: POINTS });
const adjustable = (extra: Obj = {}): Obj => ({ type: 'adjustable', rating: 100, instantaneous: 800, ...extra });
const fixed = (tripCurrent: number, extra: Obj = {}): Obj => ({ type: 'fixed', rating: 32, tripCurrent, ...extra });

describe('trip current Ia per device kind (unknown source, au-nz)', () => {
  const finals: Array<[string, string, Obj, Obj]> = [
    ['A1', 'fixed-equipment', adjustable(), {}],
    ['A2', 'fixed-equipment', adjustable({ tolerance: 0.1 }), {}],
    ['F1', 'fixed-equipment', fixed(300, { label: 'Fuse 32 gG' }), {}],
    ['K1', 'fixed-equipment', curve(63), {}],
    ['K2', 'socket-outlets', curve(32), {}],
    ['K3', 'fixed-equipment', curve(63), { requiredTime: 20 }],
    ['K4', 'fixed-equipment', curve(63), { requiredTime: 0.05 }],
    ['K5', 'fixed-equipment', curve(63), { requiredTime: 1 }],
  ];
  const results = run(
    jobFile({
      nodes: [unknownSupply('S1'), board('MSB'), ...finals.map(([id, use]) => point(`P${id}`, use))],
      links: [
        link('M1', 'S1', 'MSB', cable(5, 16, 6)),
        ...finals.map(([id, , device, extra]) =>
          link(id, 'MSB', `P${id}`, cable(10, 2.5, 2.5), { device, ...extra }),
        ),
      ],
    }),
  );

  it('adjustable: Ii·(1 + τ), τ defaults to 0.2', () => {
    expectRel(circuit(results, 'A1').tripCurrent, 960); // 800 × 1.2
    expectRel(circuit(results, 'A2').tripCurrent, 880); // 800 × 1.1
    // limit = 0.8 × 230 / 960 = 0.1916667 Ω
    expectRel(circuit(results, 'A1').limit, 0.19166667);
  });

  it('fixed: the stated trip current; the label is the device shown', () => {
    const f = circuit(results, 'F1');
    expectRel(f.tripCurrent, 300);
    expectRel(f.limit, 0.61333333); // 0.8 × 230 / 300
    expect(f.device).toBe('Fuse 32 gG');
  });

  it('curve: log–log interpolation at t_req = 5 s', () => {
    // between (200, 10) and (400, 1): f = (log 5 − log 10)/(log 1 − log 10) = 0.30103
    // Ia = 200 · 2^0.30103 = 246.40474 A; limit = 0.8·230/246.40474 = 0.7467389 Ω
    const k = circuit(results, 'K1');
    expect(k.requiredTime).toBe(5);
    expectRel(k.tripCurrent, 246.404738);
    expectRel(k.limit, 0.74673889);
  });

  it('curve: log–log interpolation at t_req = 0.4 s (socket-outlets, 32 A)', () => {
    // between (400, 1) and (800, 0.1): f = log 0.4 / log 0.1 = 0.39794; Ia = 400 · 2^0.39794 = 527.05006 A
    const k = circuit(results, 'K2');
    expect(k.requiredTime).toBe(0.4);
    expectRel(k.tripCurrent, 527.050064);
  });

  it('curve: t_req exactly on a point gives that point’s current', () => {
    expectRel(circuit(results, 'K5').tripCurrent, 400);
  });

  it('curve: t_req above the longest time → current of that point (200 A)', () => {
    const k = circuit(results, 'K3');
    expect(k.requiredTime).toBe(20);
    expectRel(k.tripCurrent, 200);
  });

  it('curve: t_req below the shortest time → Ia unknown, fail with a note, never the worst', () => {
    const k = circuit(results, 'K4');
    expect(k.requiredTime).toBe(0.05);
    expect(k.tripCurrent).toBeNull();
    expect(k.limit).toBeNull();
    expect(k.ratio).toBeNull();
    expect(k.maxLength).toBeNull();
    expect(k.status).toBe('fail');
    expect(k.notes.length).toBeGreaterThan(0);
    expect(results.worst).not.toBeNull();
    expect(results.worst?.link).not.toBe('K4');
  });
});

describe('clearing time at the fault current (known source)', () => {
  // Each supply feeds one 0 m link straight to a point, so Zs = |Ze| = r and If = 230 / r.
  const cases: Array<[string, number, Obj]> = [
    ['CV_MID', 0.5, curve(63)], // If 460 A
    ['CV_LOW', 1, curve(63)], // If 230 A
    ['CV_TOP', 0.23, curve(63)], // If 1000 A
    ['CV_BELOW', 2, curve(63)], // If 115 A
    ['MCB_OK', 1, mcb('C', 20)], // If 230 A ≥ 150 A
    ['MCB_LOW', 2, mcb('C', 20)], // If 115 A < 150 A
    ['ADJ_OK', 0.2, adjustable()], // If 1150 A ≥ 960 A
    ['ADJ_LOW', 0.5, adjustable()], // If 460 A < 960 A
    ['FIX_OK', 0.5, fixed(300)], // If 460 A ≥ 300 A
    ['FIX_LOW', 1, fixed(300)], // If 230 A < 300 A
  ];
  const results = run(
    jobFile({
      nodes: cases.flatMap(([id, r]) => [impedanceSupply(`S_${id}`, r, 0), point(`P_${id}`, 'fixed-equipment')]),
      links: cases.map(([id, , device]) => link(id, `S_${id}`, `P_${id}`, cable(0, 2.5, 2.5), { device })),
    }),
  );

  it('curve, If inside the curve: time read by log–log interpolation', () => {
    // If = 460 between (400, 1) and (800, 0.1): f = log(1.15)/log 2 = 0.2016339, t = 0.1^0.2016339 = 0.6285881 s
    const c = circuit(results, 'CV_MID');
    expectRel(c.faultCurrent, 460);
    expectRel(c.clearingTime, 0.62858808);
    // t_req 5 s → Ia 246.40474, B = 230/246.40474 = 0.9334236; ratio 0.5/0.9334236 = 0.5356625
    expectRel(c.ratio, 0.53566247);
    expect(c.status).toBe('pass');
  });

  it('curve, If below Ia but on the curve: time still reported, the check fails', () => {
    // If = 230 between (200, 10) and (400, 1): t = 10 · 0.1^0.2016339 = 6.2858808 s > 5 s
    const c = circuit(results, 'CV_LOW');
    expectRel(c.clearingTime, 6.2858808);
    expectRel(c.ratio, 1.07132495); // 1 / 0.9334236
    expect(c.status).toBe('fail');
  });

  it('curve, If above the highest current: that point’s time, no extrapolation', () => {
    const c = circuit(results, 'CV_TOP');
    expectRel(c.clearingTime, 0.1);
    expect(c.status).toBe('pass');
  });

  it('curve, If below the lowest current: time null, fail', () => {
    const c = circuit(results, 'CV_BELOW');
    expect(c.clearingTime).toBeNull();
    expect(c.status).toBe('fail');
  });

  it('mcb, adjustable and fixed: 0.1 s once If ≥ Ia, null below', () => {
    for (const id of ['MCB_OK', 'ADJ_OK', 'FIX_OK']) {
      expect(circuit(results, id).clearingTime).toBe(0.1);
      expect(circuit(results, id).status).toBe('pass');
    }
    for (const id of ['MCB_LOW', 'ADJ_LOW', 'FIX_LOW']) {
      expect(circuit(results, id).clearingTime).toBeNull();
      expect(circuit(results, id).status).toBe('fail');
    }
  });
});

describe('deviceMark', () => {
  it('breakers read curve letter and rating; a label wins', () => {
    expect(deviceMark({ type: 'mcb', curve: 'C', rating: 20 })).toBe('C20');
    expect(deviceMark({ type: 'mcb', curve: 'B', rating: 16 })).toBe('B16');
    expect(deviceMark({ type: 'mcb', curve: 'D', rating: 63 })).toBe('D63');
    expect(deviceMark({ type: 'mcb', curve: 'C', rating: 20, label: 'QF3' })).toBe('QF3');
    expect(deviceMark({ type: 'fixed', rating: 32, tripCurrent: 300, label: 'F7' })).toBe('F7');
  });

  it('every kind gets a non-empty mark', () => {
    expect(deviceMark({ type: 'adjustable', rating: 100, instantaneous: 800 }).length).toBeGreaterThan(0);
    expect(deviceMark({ type: 'curve', rating: 63, points: POINTS }).length).toBeGreaterThan(0);
    expect(deviceMark({ type: 'fixed', rating: 32, tripCurrent: 300 }).length).toBeGreaterThan(0);
  });

  it('marks are kept per kind and rating: the same device again reads the same, another kind or rating differs', () => {
    const first = deviceMark({ type: 'mcb', curve: 'C', rating: 20 });
    expect(deviceMark({ type: 'mcb', curve: 'C', rating: 20, breaking: 6 })).toBe(first);
    expect(deviceMark({ type: 'mcb', curve: 'B', rating: 20 })).toBe('B20');
    expect(deviceMark({ type: 'fixed', rating: 20, tripCurrent: 100 })).toBe('20 A');
    expect(deviceMark({ type: 'adjustable', rating: 20, instantaneous: 200 })).toBe('20 A adj.');
    expect(deviceMark({ type: 'curve', rating: 20, points: POINTS })).toBe('20 A curve');
    expect(deviceMark({ type: 'mcb', curve: 'C', rating: 20.5 })).toBe('C20.5');
    // Past the cache's 4,096 ratings per kind it starts again; marks stay right.
    for (let r = 1; r <= 5000; r++) expect(deviceMark({ type: 'mcb', curve: 'D', rating: r })).toBe(`D${r}`);
    expect(deviceMark({ type: 'mcb', curve: 'D', rating: 7 })).toBe('D7');
  });
});
