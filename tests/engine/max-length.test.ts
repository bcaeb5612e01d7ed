// Maximum length: solve |A + L·z'| = B for L ≥ 0 (method.md "Maximum length").

import { describe, expect, it } from 'vitest';
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

function knownOne(length: number, cab: Obj = {}) {
  // Ze = 0.3 + j0.4 Ω (|Ze| = 0.5), one C16 final on 2.5/2.5 Cu straight from the supply.
  return circuit(
    run(
      jobFile({
        nodes: [impedanceSupply('S1', 0.3, 0.4), point('P1', 'lighting')],
        links: [link('C1', 'S1', 'P1', cable(length, 2.5, 2.5, cab), { device: mcb('C', 16) })],
      }),
    ),
    'C1',
  );
}

describe('the quadratic root', () => {
  it('matches a hand solve with a reactive Ze (A not in line with z)', () => {
    // A = 0.3 + j0.4, z' = 0.018 + j0.00016, B = 230/120 = 1.916667
    // a = 0.018² + 0.00016² = 3.2402560e-4
    // b = 2·(0.3·0.018 + 0.4·0.00016) = 2·(0.0054 + 0.000064) = 0.010928
    // c = 0.5² − 1.916667² = 0.25 − 3.673611 = −3.423611
    // L = (−0.010928 + √(0.010928² + 4·3.240256e-4·3.423611)) / (2·3.240256e-4) = 87.30154 m
    const c = knownOne(30);
    expectRel(c.maxLength, 87.3015354, 1e-6);
  });

  it('does not depend on the link’s present length', () => {
    expectRel(knownOne(5).maxLength, 87.3015354, 1e-6);
    expectRel(knownOne(200).maxLength, 87.3015354, 1e-6);
  });

  it('at the maximum length the link just meets its limit (ratio 1)', () => {
    const c = knownOne(87.3015354209915);
    expectRel(c.ratio, 1, 1e-6);
  });

  it('two parallel sets double it here (z′ halves): 174.60307 m', () => {
    expectRel(knownOne(30, { parallel: 2 }).maxLength, 174.6030708, 1e-6);
  });
});

describe('the zero case', () => {
  it('known source: Ze alone already reaches B → 0', () => {
    // |Ze| = |1.5 + j1.5| = 2.1213 > 1.916667 (C16)
    const r = run(
      jobFile({
        nodes: [impedanceSupply('S1', 1.5, 1.5), point('P1', 'lighting')],
        links: [link('C1', 'S1', 'P1', cable(10, 2.5, 2.5), { device: mcb('C', 16) })],
      }),
    );
    expect(circuit(r, 'C1').maxLength).toBe(0);
  });

  it('unknown source: the legs before a chained link already use the share → 0', () => {
    // C1 100 m 2.5/2.5 own = 1.8000711 > s·B = 1.533333, so its chained leg C1b has no length left
    const r = run(
      jobFile({
        nodes: [unknownSupply('S1'), board('MSB'), point('P1', 'lighting'), point('P2', 'lighting')],
        links: [
          link('M1', 'S1', 'MSB', cable(5, 16, 6)),
          link('C1', 'MSB', 'P1', cable(100, 2.5, 2.5), { device: mcb('C', 16) }),
          link('C1b', 'P1', 'P2', cable(10, 2.5, 2.5)),
        ],
      }),
    );
    expect(circuit(r, 'C1b').maxLength).toBe(0);
    // C1 itself: 1.533333 / 0.0180007 = 85.1818 m (its own length plays no part)
    expectRel(circuit(r, 'C1').maxLength, 85.181820, 1e-6);
  });
});

describe('x = 0 gives the closed form Lmax = 0.8·U0·Sa·Se / (Ia·ρ·(Sa + Se)) (AS/NZS 3000:2018 B5.2.2)', () => {
  function lmax(curve: 'B' | 'C' | 'D', rating: number, cab: Obj) {
    return circuit(
      run(
        jobFile({
          rules: { reactance: 0 },
          nodes: [unknownSupply('S1'), board('MSB'), point('P1', 'fixed-equipment')],
          links: [
            link('M1', 'S1', 'MSB', cable(5, 16, 6)),
            link('C1', 'MSB', 'P1', cab, { device: mcb(curve, rating) }),
          ],
        }),
      ),
      'C1',
    ).maxLength;
  }
  it('C16 1.5/1.5 Cu: 414 / 8.1 = 51.1111 m', () => {
    expectRel(lmax('C', 16, cable(40, 1.5, 1.5)), 51.1111111, 1e-9);
  });
  it('C32 4/2.5 Cu: 1840 / 35.1 = 52.42165 m', () => {
    expectRel(lmax('C', 32, cable(40, 4, 2.5)), 52.4216524, 1e-9);
  });
  it('C32 16/6 Al: 0.8·230·96 / (240·0.036·22) = 17664 / 190.08 = 92.92929 m', () => {
    expectRel(lmax('C', 32, cable(40, 16, 6, { material: 'Al' })), 92.9292929, 1e-9);
  });
});
