// Edges of the method: U0 and c with a stated fault current, rating boundaries of t_req, curve
// end points, a forest of supplies with both methods, the loop breakdown, and the model helpers.

import { describe, expect, it } from 'vitest';
import { CAUTION, defaultLinkFor, loadJob, loopBreakdown, newJob, STANDARD_SIZES, toFileObject } from '../../engine/index.js';
import type { Job } from '../../engine/index.js';
import {
  board,
  cable,
  circuit,
  expectRel,
  faultCurrentSupply,
  impedanceSupply,
  jobFile,
  link,
  load,
  mcb,
  point,
  run,
  unknownSupply,
} from './helpers.js';

describe('U0 and c with a stated fault current', () => {
  it('Ze = U0/Ipf uses the job’s U0; If = c·U0/Zs; B = c·U0/Ia', () => {
    // U0 240, c 0.95, Ipf 2400 A → |Ze| = 240/2400 = 0.1 Ω; C1 0 m → Zs = 0.1 Ω
    // If = 0.95·240/0.1 = 2280 A; C20 (au-nz 7.5 × 20 = 150 A): B = 228/150 = 1.52 Ω; ratio 0.1/1.52
    const r = run(
      jobFile({
        rules: { voltage: 240, voltageFactor: 0.95 },
        nodes: [faultCurrentSupply('S1', 2400), point('P1', 'socket-outlets')],
        links: [link('C1', 'S1', 'P1', cable(0, 2.5, 2.5), { device: mcb('C', 20) })],
      }),
    );
    const c = circuit(r, 'C1');
    expectRel(c.zs, 0.1);
    expectRel(c.faultCurrent, 2280);
    expectRel(c.limit, 1.52);
    expectRel(c.ratio, 0.065789474);
  });

  it('X/R = 0: Ze is all resistance', () => {
    // |Ze| = 230/1000 = 0.23 = R; C1 10 m 2.5/2.5 = 0.18 + j0.0016 → |0.41 + j0.0016| = 0.4100031
    const r = run(
      jobFile({
        nodes: [faultCurrentSupply('S1', 1000, 0), point('P1', 'lighting')],
        links: [link('C1', 'S1', 'P1', cable(10, 2.5, 2.5), { device: mcb('C', 16) })],
      }),
    );
    expectRel(circuit(r, 'C1').zs, 0.41000312);
  });
});

describe('t_req at the rating boundaries', () => {
  function tReq(basis: string, use: string, rating: number): number | null {
    const r = run(
      jobFile({
        rules: { basis },
        nodes: [unknownSupply('S1'), board('DB'), point('P1', use)],
        links: [
          link('M1', 'S1', 'DB', cable(5, 35, 16)),
          link('C1', 'DB', 'P1', cable(5, 16, 16), { device: mcb('C', rating) }),
        ],
      }),
    );
    return circuit(r, 'C1').requiredTime;
  }
  it('au-nz: socket-outlets on 63 A → 0.4 s (≤ 63 A); motor on 10 A → 5 s', () => {
    expect(tReq('au-nz', 'socket-outlets', 63)).toBe(0.4);
    expect(tReq('au-nz', 'motor', 10)).toBe(5);
    expect(tReq('au-nz', 'other', 10)).toBe(5);
  });
  it('iec: 32 A → 0.4 s (≤ 32 A), 40 A → 5 s, whatever the use', () => {
    expect(tReq('iec', 'motor', 32)).toBe(0.4);
    expect(tReq('iec', 'socket-outlets', 40)).toBe(5);
    expect(tReq('iec', 'fixed-equipment', 6)).toBe(0.4);
  });
});

describe('curve end points', () => {
  // (200 A, 10 s), (400 A, 1 s), (800 A, 0.1 s)
  function ia(requiredTime: number) {
    const r = run(
      jobFile({
        nodes: [unknownSupply('S1'), board('DB'), point('P1', 'fixed-equipment')],
        links: [
          link('M1', 'S1', 'DB', cable(5, 35, 16)),
          link('C1', 'DB', 'P1', cable(5, 2.5, 2.5), {
            device: { type: 'curve', rating: 63, points: [[200, 10], [400, 1], [800, 0.1]] },
            requiredTime,
          }),
        ],
      }),
    );
    return circuit(r, 'C1').tripCurrent;
  }
  it('t_req equal to the longest time → that point’s current', () => expectRel(ia(10), 200));
  it('t_req equal to the shortest time → that point’s current', () => expectRel(ia(0.1), 800));
  it('t_req just below the shortest time → unknown', () => expect(ia(0.09)).toBeNull());
});

describe('a forest: two supplies, one of each method', () => {
  // S1 unknown → MSB → C1 C16 20 m 2.5/2.5: own share 0.3600142/1.533333 = 0.2347919, upstream share 0.134576
  // S2 Ze 1 + j0 → C2 C16 10 m 2.5/2.5: Zs = |1.18 + j0.0016| = 1.1800011; ratio 1.1800011/1.916667 = 0.6156527
  const r = run(
    jobFile({
      nodes: [unknownSupply('S1'), board('MSB'), point('P1', 'lighting'), impedanceSupply('S2', 1, 0), point('P2', 'lighting')],
      links: [
        link('M1', 'S1', 'MSB', cable(10, 16, 6)),
        link('C1', 'MSB', 'P1', cable(20, 2.5, 2.5), { device: mcb('C', 16) }),
        link('C2', 'S2', 'P2', cable(10, 2.5, 2.5), { device: mcb('C', 16) }),
      ],
    }),
  );
  it('each tree uses its own supply’s method', () => {
    expect(circuit(r, 'C1').method).toBe('unknown-source');
    expect(circuit(r, 'C2').method).toBe('known-source');
    expectRel(circuit(r, 'C1').ratio, 0.23479188);
    expectRel(circuit(r, 'C2').ratio, 0.61565275);
  });
  it('the worst path starts at the second supply', () => {
    expect(r.worst?.link).toBe('C2');
    expect(r.worst?.path).toEqual(['S2', 'C2', 'P2']);
  });
});

describe('loopBreakdown', () => {
  const job: Job = load(
    jobFile({
      nodes: [impedanceSupply('S1', 0.15, 0.1), board('MSB'), board('DB1'), point('P1', 'socket-outlets'), point('P2', 'lighting')],
      links: [
        link('M1', 'S1', 'MSB', cable(25, 35, 16)),
        link('SM1', 'MSB', 'DB1', cable(40, 16, 6), { device: mcb('C', 63) }),
        link('C1', 'DB1', 'P1', cable(20, 2.5, 2.5), { device: mcb('C', 20) }),
        link('C1b', 'P1', 'P2', cable(10, 2.5, 2.5)),
      ],
    }),
  );
  it('known source: Ze then every link from the supply; total = Zs; shares of the limit', () => {
    // same figures as the worked loop sum in known-source.test.ts
    const b = loopBreakdown(job, 'C1');
    expect(b).not.toBeNull();
    if (!b) return;
    expect(b.method).toBe('known-source');
    expect(b.segments.map((s) => [s.kind, s.id])).toEqual([
      ['source', 'S1'],
      ['link', 'M1'],
      ['link', 'SM1'],
      ['link', 'C1'],
    ]);
    expect(b.segments.map((s) => s.upstream)).toEqual([true, true, true, false]);
    expectRel(b.total, 0.77583951);
    expectRel(b.limit, 1.53333333);
    const m1 = b.segments[1];
    expectRel(m1?.r, 0.05122768);
    expectRel(m1?.x, 0.004);
    expectRel(b.segments[3]?.z, 0.36001422);
    expectRel(b.segments[3]?.share, 0.23479188); // 0.3600142 / 1.533333
  });
  it('a chained leg: links before the protecting link are upstream', () => {
    const b = loopBreakdown(job, 'C1b');
    expect(b?.segments.map((s) => s.upstream)).toEqual([true, true, true, false, false]);
  });
  it('an unknown link gives null', () => {
    expect(loopBreakdown(job, 'NOPE')).toBeNull();
  });
});

describe('model helpers', () => {
  it('STANDARD_SIZES are the IEC 60228 nominal areas of method.md', () => {
    expect([...STANDARD_SIZES]).toEqual([1, 1.5, 2.5, 4, 6, 10, 16, 25, 35, 50, 70, 95, 120, 150, 185, 240, 300, 400, 500, 630]);
  });
  it('newJob is an empty au-nz job that loads', () => {
    const j = newJob();
    expect(j.rules.basis).toBe('au-nz');
    expect(j.nodes).toEqual([]);
    expect(j.links).toEqual([]);
    expect(loadJob(toFileObject(j)).ok).toBe(true);
  });
  it('defaultLinkFor gives a valid link for each role', () => {
    const j = load(
      jobFile({
        nodes: [unknownSupply('S1'), board('MSB'), board('DB'), point('P1', 'socket-outlets'), point('P2', 'lighting')],
        links: [],
      }),
    );
    j.links.push(defaultLinkFor(j, 'S1', 'MSB', 'M1'));
    j.links.push(defaultLinkFor(j, 'MSB', 'DB', 'SM1'));
    j.links.push(defaultLinkFor(j, 'DB', 'P1', 'C1'));
    j.links.push(defaultLinkFor(j, 'P1', 'P2', 'C1b'));
    const again = loadJob(toFileObject(j));
    expect(again.ok).toBe(true);
    expect(j.links.map((l) => [l.id, l.from, l.to])).toEqual([
      ['M1', 'S1', 'MSB'],
      ['SM1', 'MSB', 'DB'],
      ['C1', 'DB', 'P1'],
      ['C1b', 'P1', 'P2'],
    ]);
    expect(j.links[2]?.device).toBeDefined(); // a final subcircuit from a board is protected
    expect(j.links[3]?.device).toBeUndefined(); // a leg leaving a point has no device of its own
    for (const l of j.links) {
      expect(STANDARD_SIZES).toContain(l.cable.active);
      expect(STANDARD_SIZES).toContain(l.cable.earth);
    }
  });
  it('CAUTION names the design-aid status, testing and local rules', () => {
    expect(CAUTION).toMatch(/design aid/i);
    expect(CAUTION).toMatch(/test/i);
    expect(CAUTION).toMatch(/local wiring rules/i);
  });
});
