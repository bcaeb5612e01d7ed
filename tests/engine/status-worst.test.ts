// RCD status, the worst fault path and the summary counts (method.md "Ratio", "RCD").

import { describe, expect, it } from 'vitest';
import { board, cable, circuit, expectRel, jobFile, link, mcb, point, run, unknownSupply } from './helpers.js';
import type { Obj } from './helpers.js';

// Unknown source, au-nz, every final a C16 on 2.5/2.5 Cu: Ia 120 A, s·B = 1.533333 Ω.
// M1 10 m 16/6 upstream share = 0.0515873 / 0.383333 = 0.1345756 for every final.
// own of L m of 2.5/2.5 = |0.018·L + j0.00016·L|: 20 m → 0.3600142 (share 0.2347919),
// 100 m → 1.8000711 (share 1.1739594), 120 m → 2.1600853 (share 1.4087513).
const RCD = { sensitivity: 0.03 };
const c16 = mcb('C', 16);

function linksInOrder(r3First: boolean): Obj[] {
  const r3 = [
    link('R3a', 'MSB', 'PR3a', cable(20, 2.5, 2.5), { device: c16 }),
    link('R3b', 'PR3a', 'PR3b', cable(100, 2.5, 2.5), { rcd: RCD }), // its own RCD does not count
  ];
  const r4 = [
    link('R4a', 'MSB', 'PR4a', cable(20, 2.5, 2.5), { device: c16, rcd: RCD }),
    link('R4b', 'PR4a', 'PR4b', cable(100, 2.5, 2.5)), // protected by R4a, which has an RCD
  ];
  return [
    link('M1', 'S1', 'MSB', cable(10, 16, 6)),
    link('A', 'MSB', 'PA', cable(20, 2.5, 2.5), { device: c16 }),
    link('R1', 'MSB', 'PR1', cable(100, 2.5, 2.5), { device: c16, rcd: RCD }),
    link('R2', 'MSB', 'PR2', cable(20, 2.5, 2.5), { device: c16, rcd: RCD }),
    ...(r3First ? [...r3, ...r4] : [...r4, ...r3]),
  ];
}

function job(r3First = true) {
  return run(
    jobFile({
      nodes: [
        unknownSupply('S1'),
        board('MSB'),
        ...['PA', 'PR1', 'PR2', 'PR3a', 'PR3b', 'PR4a', 'PR4b'].map((id) => point(id, 'lighting')),
      ],
      links: linksInOrder(r3First),
    }),
  );
}

describe('RCD status', () => {
  const r = job();
  it('a failing circuit whose protecting link has an RCD is `rcd`, never pass', () => {
    const c = circuit(r, 'R1');
    expectRel(c.ratio, 1.17395942);
    expect(c.status).toBe('rcd');
  });
  it('a passing circuit with an RCD stays `pass`', () => {
    const c = circuit(r, 'R2');
    expectRel(c.ratio, 0.23479188);
    expect(c.status).toBe('pass');
  });
  it('only the protecting link’s RCD counts', () => {
    // R3b: own = |C(20 m) + C(100 m)| = 2.1600853 → share 1.4087513 > 1
    expectRel(circuit(r, 'R3b').ratio, 1.4087513);
    expect(circuit(r, 'R3b').protectedBy).toBe('R3a');
    expect(circuit(r, 'R3b').status).toBe('fail');
    expect(circuit(r, 'R4b').protectedBy).toBe('R4a');
    expect(circuit(r, 'R4b').status).toBe('rcd');
  });
  it('an RCD does not rescue a failing upstream 20 % test into pass', () => {
    // M1 60 m 6/2.5 (0.7650602 Ω) against (1 − s)·B = 0.383333: share 0.7650602/0.383333 = 1.9958093 → fails → rcd
    const res = run(
      jobFile({
        nodes: [unknownSupply('S1'), board('MSB'), point('P', 'lighting')],
        links: [
          link('M1', 'S1', 'MSB', cable(60, 6, 2.5)),
          link('C', 'MSB', 'P', cable(5, 2.5, 2.5), { device: c16, rcd: RCD }),
        ],
      }),
    );
    expectRel(circuit(res, 'C').ratio, 1.9958093, 1e-6);
    expect(circuit(res, 'C').status).toBe('rcd');
  });
});

describe('worst fault path', () => {
  it('highest ratio among checked links; first in file order on a tie; path from the supply', () => {
    // R3b and R4b tie exactly (1.4087513): identical cables and upstream
    const r = job(true);
    expect(r.worst).not.toBeNull();
    expect(r.worst?.link).toBe('R3b');
    expectRel(r.worst?.ratio, 1.4087513);
    expect(r.worst?.path).toEqual(['S1', 'M1', 'MSB', 'R3a', 'PR3a', 'R3b', 'PR3b']);
  });

  it('with the file order swapped the other tied link wins', () => {
    const r = job(false);
    expect(r.worst?.link).toBe('R4b');
    expect(r.worst?.path).toEqual(['S1', 'M1', 'MSB', 'R4a', 'PR4a', 'R4b', 'PR4b']);
  });

  it('worst.ratio is the worst circuit’s ratio and no checked ratio exceeds it', () => {
    const r = job();
    const checked = r.circuits.filter((c) => c.status !== 'unchecked' && c.ratio !== null);
    const max = Math.max(...checked.map((c) => c.ratio as number));
    expect(r.worst?.ratio).toBe(max);
    expect(r.worst?.ratio).toBe(circuit(r, r.worst?.link ?? '').ratio);
  });

  it('null when nothing is checked', () => {
    const r = run(
      jobFile({
        nodes: [unknownSupply('S1'), board('MSB'), point('P', 'lighting')],
        links: [link('M1', 'S1', 'MSB', cable(10, 16, 6)), link('C', 'MSB', 'P', cable(10, 2.5, 2.5))],
      }),
    );
    expect(r.worst).toBeNull();
    expect(r.summary).toMatchObject({ pass: 0, fail: 0, rcd: 0, unchecked: 2 });
  });

  it('a small passing job: worst is its only checked link', () => {
    const r = run(
      jobFile({
        nodes: [unknownSupply('S1'), board('MSB'), point('P', 'lighting')],
        links: [
          link('M1', 'S1', 'MSB', cable(10, 16, 6)),
          link('C', 'MSB', 'P', cable(20, 2.5, 2.5), { device: c16 }),
        ],
      }),
    );
    expect(r.worst).toEqual({ link: 'C', ratio: circuit(r, 'C').ratio, path: ['S1', 'M1', 'MSB', 'C', 'P'] });
    expectRel(r.worst?.ratio, 0.23479188);
  });
});

describe('summary', () => {
  it('counts every link by status', () => {
    // M1 unchecked; A, R2, R3a, R4a pass; R3b fail; R1, R4b rcd
    const r = job();
    expect(r.summary).toMatchObject({ pass: 4, fail: 1, rcd: 2, unchecked: 1 });
    const total = r.summary.pass + r.summary.fail + r.summary.rcd + r.summary.unchecked;
    expect(total).toBe(r.circuits.length);
  });
});
