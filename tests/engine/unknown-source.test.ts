// Unknown source: own ≤ s·B and the tool's own upstream test upstream ≤ (1 − s)·B,
// ratio = max(own/(s·B), upstream/((1 − s)·B)); and every rules / cable override.

import { describe, expect, it } from 'vitest';
import { board, cable, circuit, expectRel, jobFile, link, mcb, point, run, unknownSupply } from './helpers.js';
import type { Obj } from './helpers.js';

describe('the 80 % share and the upstream 20 % check', () => {
  // C20 au-nz: Ia = 150 A, B = 230/150 = 1.533333 Ω, s·B = 1.226667 Ω, (1 − s)·B = 0.306667 Ω.
  // C1 10 m 2.5/2.5: own = |0.18 + j0.0016| = 0.1800071 Ω → own share 0.1467449.
  function job(mains: Obj) {
    return run(
      jobFile({
        nodes: [unknownSupply('S1'), board('MSB'), point('P1', 'socket-outlets')],
        links: [
          link('M1', 'S1', 'MSB', mains),
          link('C1', 'MSB', 'P1', cable(10, 2.5, 2.5), { device: mcb('C', 20) }),
        ],
      }),
    );
  }

  it('mains within 20 %: passes on the own share', () => {
    // M1 10 m 16/6: |0.0515625 + j0.0016| = 0.0515873 → upstream share 0.0515873/0.306667 = 0.1682195
    const c = circuit(job(cable(10, 16, 6)), 'C1');
    expect(c.method).toBe('unknown-source');
    expect(c.zs).toBeNull();
    expect(c.faultCurrent).toBeNull();
    expect(c.clearingTime).toBeNull();
    expectRel(c.own, 0.18000711);
    expectRel(c.upstream, 0.05158732);
    expectRel(c.limit, 1.22666667);
    expectRel(c.ratio, 0.16821952); // max(0.1467449, 0.1682195): the upstream share is larger
    expect(c.status).toBe('pass');
  });

  it('own loop fits but the drawn mains use more than 20 %: fail, with a note', () => {
    // M1 60 m 6/2.5: R = 0.0225·60·(1/6 + 1/2.5) = 1.35·0.5666667 = 0.765, X = 0.0096
    // upstream = 0.7650602 Ω → share 0.7650602/0.306667 = 2.4947616 > 1, own share 0.1467449 ≤ 1
    const c = circuit(job(cable(60, 6, 2.5)), 'C1');
    expectRel(c.own, 0.18000711);
    expectRel(c.upstream, 0.76506023);
    expectRel(c.ratio, 2.49476163);
    expect(c.status).toBe('fail');
    expect(c.notes.length).toBeGreaterThan(0);
    // maximum length ignores the upstream test: s·B / |z'| = 1.226667 / 0.0180007 = 68.1455 m
    expectRel(c.maxLength, 68.145456, 1e-6);
  });
});

describe('multi-level, unknown source: upstream is every drawn link from the supply to the origin', () => {
  it('final at a DB behind a submain', () => {
    // M1 10 m 16/6 = 0.0515625 + j0.0016; SM1 20 m 10/4: R = 0.0225·20·(0.1 + 0.25) = 0.1575, X = 0.0032
    // upstream of C1 = |0.2090625 + j0.0048| = 0.2091176 Ω
    // C1 C16 15 m 2.5/2.5: own = |0.27 + j0.0024| = 0.2700107; B = 1.916667, s·B = 1.533333, (1−s)B = 0.383333
    // ratio = max(0.2700107/1.533333, 0.2091176/0.383333) = max(0.1760939, 0.5455242) = 0.5455242
    const r = run(
      jobFile({
        nodes: [unknownSupply('S1'), board('MSB'), board('DB'), point('P1', 'lighting')],
        links: [
          link('M1', 'S1', 'MSB', cable(10, 16, 6)),
          link('SM1', 'MSB', 'DB', cable(20, 10, 4), { device: mcb('C', 40) }),
          link('C1', 'DB', 'P1', cable(15, 2.5, 2.5), { device: mcb('C', 16) }),
        ],
      }),
    );
    const c = circuit(r, 'C1');
    expectRel(c.upstream, 0.20911760, 1e-6);
    expectRel(c.own, 0.27001067, 1e-6);
    expectRel(c.ratio, 0.54552418, 1e-6);
    expect(c.status).toBe('pass');
    // SM1 itself: own = |0.1575 + j0.0032| = 0.1575325, upstream = M1 = 0.0515873;
    // C40: Ia 300, B = 0.766667, s·B = 0.613333, (1−s)·B = 0.153333
    // ratio = max(0.2568465, 0.3364390) = 0.3364390
    const s = circuit(r, 'SM1');
    expectRel(s.own, 0.15753250, 1e-6);
    expectRel(s.upstream, 0.05158732, 1e-6);
    expectRel(s.ratio, 0.33643903, 1e-6);
  });
});

describe('overrides', () => {
  // Base: S1 unknown → M1 10 m 16/6 (no device) → MSB → C1 C16 on 20 m 1.5/1.5 → P1 (lighting).
  // Base own = |0.6 + j0.0032| = 0.6000085, upstream = 0.0515873, Ia = 120, B = 1.916667.
  function job(rules: Obj, c1: Obj = {}, device: Obj = mcb('C', 16)) {
    return circuit(
      run(
        jobFile({
          rules,
          nodes: [unknownSupply('S1'), board('MSB'), point('P1', 'lighting')],
          links: [
            link('M1', 'S1', 'MSB', cable(10, 16, 6)),
            link('C1', 'MSB', 'P1', cable(20, 1.5, 1.5, c1), { device }),
          ],
        }),
      ),
      'C1',
    );
  }

  it('base values', () => {
    const c = job({});
    expectRel(c.own, 0.60000853);
    expectRel(c.limit, 1.53333333); // 0.8 × 230 / 120
    expectRel(c.ratio, 0.39130991); // 0.6000085 / 1.533333
    expectRel(c.maxLength, 51.110384);
  });

  it('voltage 240 V: limit 0.8·240/120 = 1.6 Ω, maxLength 1.6/0.0300004 = 53.3326 m', () => {
    const c = job({ voltage: 240 });
    expectRel(c.limit, 1.6);
    expectRel(c.ratio, 0.37500533);
    expectRel(c.maxLength, 53.332575);
  });

  it('voltageFactor 0.95: limit 0.8·0.95·230/120 = 1.456667 Ω', () => {
    const c = job({ voltageFactor: 0.95 });
    expectRel(c.limit, 1.45666667);
    expectRel(c.ratio, 0.41190517);
    expectRel(c.maxLength, 48.554865);
  });

  it('unknownSourceShare 0.7: limit 0.7·1.916667 = 1.341667, upstream budget 0.575', () => {
    // ratio = max(0.6000085/1.341667, 0.0515873/0.575) = max(0.4472113, 0.0897171)
    const c = job({ unknownSourceShare: 0.7 });
    expectRel(c.limit, 1.34166667);
    expectRel(c.ratio, 0.44721133);
    expectRel(c.maxLength, 44.721586);
  });

  it('unknownSourceShare 0.7 makes the upstream share decide', () => {
    // M1 60 m 6/2.5 = 0.7650602 Ω upstream: share 0.7650602/0.575 = 1.3305395 > 1 → fail
    const r = run(
      jobFile({
        rules: { unknownSourceShare: 0.7 },
        nodes: [unknownSupply('S1'), board('MSB'), point('P1', 'lighting')],
        links: [
          link('M1', 'S1', 'MSB', cable(60, 6, 2.5)),
          link('C1', 'MSB', 'P1', cable(20, 1.5, 1.5), { device: mcb('C', 16) }),
        ],
      }),
    );
    const c = circuit(r, 'C1');
    expectRel(c.ratio, 1.33053954);
    expect(c.status).toBe('fail');
  });

  it('rules reactance 0: own = R = 0.6, maxLength = closed form 51.1111 m', () => {
    const c = job({ reactance: 0 });
    expectRel(c.own, 0.6);
    expectRel(c.upstream, 0.0515625);
    expectRel(c.maxLength, 51.111111);
  });

  it('per-cable reactance 0.001 Ω/m: X = 2·0.001·20 = 0.04, own = |0.6 + j0.04| = 0.6013319', () => {
    const c = job({}, { reactance: 0.001 });
    expectRel(c.own, 0.60133186);
    expectRel(c.upstream, 0.05158732); // M1 keeps the rules' reactance
    expectRel(c.maxLength, 50.997908); // 1.533333 / |0.03 + j0.002|
  });

  it('resistivity Cu 0.02: own = |0.5333333 + j0.0032|, upstream = |0.0458333 + j0.0016|', () => {
    const c = job({ resistivity: { Cu: 0.02 } });
    expectRel(c.own, 0.53334293);
    expectRel(c.upstream, 0.04586125);
    expectRel(c.maxLength, 57.498965);
  });

  it('multiples C 10: Ia = 160, limit 0.8·230/160 = 1.15 Ω', () => {
    const c = job({ multiples: { C: 10 } });
    expectRel(c.tripCurrent, 160);
    expectRel(c.limit, 1.15);
    expectRel(c.maxLength, 38.332788);
  });

  it('multiples B 3 and D 15 apply to their curves only', () => {
    expectRel(job({ multiples: { B: 3, D: 15 } }, {}, mcb('B', 16)).tripCurrent, 48); // 3 × 16
    expectRel(job({ multiples: { B: 3, D: 15 } }, {}, mcb('D', 16)).tripCurrent, 240); // 15 × 16
    expectRel(job({ multiples: { B: 3, D: 15 } }, {}, mcb('C', 16)).tripCurrent, 120); // 7.5 × 16
  });

  it('parallel 2: R and X halve, own = |0.3 + j0.0016| = 0.3000043, maxLength doubles', () => {
    const c = job({}, { parallel: 2 });
    expectRel(c.own, 0.30000427);
    expectRel(c.maxLength, 102.220768);
  });

  it('earthMaterial Al on a Cu cable: R = 0.0225·20/1.5 + 0.036·20/1.5 = 0.3 + 0.48 = 0.78', () => {
    const c = job({}, { earthMaterial: 'Al' });
    expectRel(c.own, 0.78000656);
    expectRel(c.maxLength, 39.315908); // 1.533333 / |0.039 + j0.00016|
  });

  it('aluminium active and earth: ρ 0.036', () => {
    // C1 Al 20 m 1.5/1.5: R = 0.036·20·2/1.5 = 0.96, X = 0.0032 → own 0.9600053
    const c = job({}, { material: 'Al' });
    expectRel(c.own, 0.96000533);
  });

  it('iec basis resistivity: C1 R = 0.0206293·20·2/1.5 = 0.5501149', () => {
    // own = |0.5501149 + j0.0032| = 0.5501242; C16 iec Ia = 160, limit 0.8·230/160 = 1.15
    const c = job({ basis: 'iec' });
    expectRel(c.own, 0.55012423, 1e-6);
    expectRel(c.limit, 1.15);
  });
});
