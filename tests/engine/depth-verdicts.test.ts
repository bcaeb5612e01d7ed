// Verdicts and the summary counts across every check (job-format.md, "Results document, version
// 2"): a verdict fails when the loop or any other check fails, relies on an RCD when the loop or
// the reading does, passes when the loop passes, else is unchecked.

import { describe, expect, it } from 'vitest';
import { board, cable, circuit, jobFile, link, mcb, point, run, unknownSupply } from './helpers.js';
import type { Obj } from './helpers.js';

const v2 = (parts: Parameters<typeof jobFile>[0]): Obj => ({ ...jobFile(parts), version: 2 });
const rcd = { sensitivity: 0.03 };

describe('verdicts: the loop, the drop and the readings (au-nz, unknown source)', () => {
  // C20 breakers: Ia = 7.5 · 20 = 150 A (AS/NZS 3000:2018 Table B5.1 note), s · B = 0.8 · 230 / 150 = 1.226667 Ω;
  // 2.5 mm² copper: 0.018 Ω/m (+ j0.00016), so 10 m uses 0.18 Ω and 80 m 1.44 Ω (fails)
  const file = v2({
    nodes: [
      unknownSupply('S1'),
      board('MSB'),
      point('P1', 'socket-outlets', { current: 16, powerFactor: 1 }),
      point('P2', 'socket-outlets'),
      point('P3', 'socket-outlets'),
      point('P4', 'socket-outlets'),
      point('P5', 'socket-outlets'),
    ],
    links: [
      link('M1', 'S1', 'MSB', cable(5, 16, 6)),
      // loop passes (0.54 Ω); drop 3.76 % in C1 + 0.10 % in M1 against its own 3 % limit: fails
      link('C1', 'MSB', 'P1', cable(30, 2.5, 2.5), { device: mcb('C', 20), voltageDropLimit: 3 }),
      // loop passes; the reading 1.5 Ω at 20 °C corrects to 1.5 · 1.305 = 1.9575 Ω > B = 1.533 Ω: fails
      link('C2', 'MSB', 'P2', cable(10, 2.5, 2.5), { device: mcb('C', 20), measured: { zs: 1.5 } }),
      // the same reading with an RCD: the reading relies on the RCD
      link('C3', 'MSB', 'P3', cable(10, 2.5, 2.5), { device: mcb('C', 20), rcd, measured: { zs: 1.5 } }),
      // loop fails at 80 m, with an RCD: rcd
      link('C4', 'MSB', 'P4', cable(80, 2.5, 2.5), { device: mcb('C', 20), rcd }),
      // everything in order
      link('C5', 'MSB', 'P5', cable(10, 2.5, 2.5), { device: mcb('C', 20) }),
    ],
  });

  it('each circuit gets the verdict of its worst check', () => {
    const r = run(file);
    const c = (id: string) => circuit(r, id);
    expect([c('C1').status, c('C1').voltageStatus, c('C1').verdict]).toEqual(['pass', 'fail', 'fail']);
    expect([c('C2').status, c('C2').measured?.status, c('C2').verdict]).toEqual(['pass', 'fail', 'fail']);
    expect([c('C3').status, c('C3').measured?.status, c('C3').verdict]).toEqual(['pass', 'rcd', 'rcd']);
    expect([c('C4').status, c('C4').verdict]).toEqual(['rcd', 'rcd']);
    expect([c('C5').status, c('C5').verdict]).toEqual(['pass', 'pass']);
    expect([c('M1').status, c('M1').verdict]).toEqual(['unchecked', 'unchecked']);
  });

  it('the summary counts the loop, the verdicts and every check', () => {
    const s = run(file).summary;
    expect({ pass: s.pass, fail: s.fail, rcd: s.rcd, unchecked: s.unchecked }).toEqual({ pass: 4, fail: 0, rcd: 1, unchecked: 1 });
    expect(s.verdict).toEqual({ pass: 1, fail: 2, rcd: 2, unchecked: 1 });
    // voltage: C1 fails; M1 arrives at a board, C2–C5 carry no load
    expect(s.checks.voltage).toEqual({ pass: 0, fail: 1, unchecked: 5 });
    // au-nz has no built-in capacity table, nothing states breaking, the source is unknown
    expect(s.checks.capacity).toEqual({ pass: 0, fail: 0, unchecked: 6 });
    expect(s.checks.breaking).toEqual({ pass: 0, fail: 0, unchecked: 6 });
    expect(s.checks.withstand).toEqual({ pass: 0, fail: 0, unchecked: 6 });
    // over the links that carry a reading only
    expect(s.checks.measured).toEqual({ pass: 0, fail: 1, rcd: 1, unchecked: 0 });
  });

  it('an unprotected link with a failing drop is a fail, not unchecked', () => {
    const f = v2({
      rules: { voltageDropLimit: 1 },
      nodes: [unknownSupply('S1'), point('P1', 'other', { current: 20, powerFactor: 1 })],
      // 2 · 20 · 40 · 0.0225 / 2.5 = 7.2 V → 3.13 % > 1 %
      links: [link('C1', 'S1', 'P1', cable(40, 2.5, 2.5))],
    });
    const c = circuit(run(f), 'C1');
    expect(c.status).toBe('unchecked');
    expect(c.voltageStatus).toBe('fail');
    expect(c.verdict).toBe('fail');
  });
});

describe('verdicts: capacity, breaking and withstand (iec, known source)', () => {
  // Ze = 0.1 + j0.05 Ω, single phase; B16: Ia = 5 · 16 = 80 A (IEC 60898-1, from memory),
  // B = 230 / 80 = 2.875 Ω; every loop below is under 0.4 Ω and passes
  // letThrough 10000 A²s keeps the withstand at √10000 / 115 = 0.87 mm² where it is not the point
  const lt = { letThrough: 10000 };
  const file = v2({
    rules: { basis: 'iec' },
    nodes: [
      { id: 'S1', kind: 'supply', phases: 1, source: { type: 'impedance', r: 0.1, x: 0.05 } },
      point('P1', 'other', { current: 20 }),
      point('P2', 'other'),
      point('P3', 'other'),
      point('P4', 'other', { current: 10 }),
      point('P5', 'other', { current: 10 }),
    ],
    links: [
      // Ib 20 A > In 16 A: capacity fails (Iz 27 A: IEC 60364-5-52 Table B.52.4, method C, from memory)
      link('C1', 'S1', 'P1', cable(10, 2.5, 2.5), { device: mcb('B', 16, lt) }),
      // fault level at S1 = 1.1 · 230 / |0.1 + j0.05| = 253 / 0.111803 = 2262.9 A > 1 kA: breaking fails
      link('C2', 'S1', 'P2', cable(10, 2.5, 2.5), { device: mcb('B', 16, { ...lt, breaking: 1 }) }),
      // Zs = |0.1 + 10 · 0.0206293 · (1/2.5 + 1/1.5) + j(0.05 + 0.0016)| = |0.320046 + j0.0516| = 0.324179 Ω
      // If = 230 / 0.324179 = 709.5 A; √(709.5² · 0.1) / 115 = 1.95 mm² > 1.5 mm²: withstand fails
      link('C3', 'S1', 'P3', cable(10, 2.5, 1.5), { device: mcb('B', 16) }),
      // 10 A ≤ 16 A ≤ 27 A, 6 kA ≥ 2263 A, 0.87 mm² ≤ 2.5 mm²: passes
      link('C4', 'S1', 'P4', cable(10, 2.5, 2.5), { device: mcb('B', 16, { ...lt, breaking: 6 }) }),
      // a stated capacity Iz 12 A < In 16 A: capacity fails
      link('C5', 'S1', 'P5', cable(10, 2.5, 2.5, { capacity: 12 }), { device: mcb('B', 16, lt) }),
    ],
  });

  it('each failing check fails the verdict of a circuit whose loop passes', () => {
    const r = run(file);
    const c = (id: string) => circuit(r, id);
    for (const id of ['C1', 'C2', 'C3', 'C4', 'C5']) expect(c(id).status).toBe('pass');
    expect(c('C1').capacity).toBe(27);
    expect([c('C1').capacityStatus, c('C1').verdict]).toEqual(['fail', 'fail']);
    expect([c('C2').breakingStatus, c('C2').verdict]).toEqual(['fail', 'fail']);
    expect([c('C3').withstandStatus, c('C3').verdict]).toEqual(['fail', 'fail']);
    expect([c('C4').capacityStatus, c('C4').breakingStatus, c('C4').withstandStatus, c('C4').voltageStatus, c('C4').verdict]).toEqual([
      'pass',
      'pass',
      'pass',
      'pass',
      'pass',
    ]);
    expect(c('C5').capacity).toBe(12);
    expect([c('C5').capacityStatus, c('C5').verdict]).toEqual(['fail', 'fail']);
  });

  it('the summary counts them', () => {
    const s = run(file).summary;
    expect({ pass: s.pass, fail: s.fail, rcd: s.rcd, unchecked: s.unchecked }).toEqual({ pass: 5, fail: 0, rcd: 0, unchecked: 0 });
    expect(s.verdict).toEqual({ pass: 1, fail: 4, rcd: 0, unchecked: 0 });
    expect(s.checks.capacity).toEqual({ pass: 1, fail: 2, unchecked: 2 });
    expect(s.checks.breaking).toEqual({ pass: 1, fail: 1, unchecked: 3 });
    expect(s.checks.withstand).toEqual({ pass: 4, fail: 1, unchecked: 0 });
    expect(s.checks.measured).toEqual({ pass: 0, fail: 0, rcd: 0, unchecked: 0 });
  });
});
