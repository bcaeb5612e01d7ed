// Known source: Ze given as an impedance or derived from a prospective fault current.
// Zs = |Ze + Σ links|, limit B = c·U0/Ia, If = c·U0/Zs, ratio Zs/B (method.md "The check").

import { describe, expect, it } from 'vitest';
import {
  board,
  cable,
  circuit,
  expectRel,
  faultCurrentSupply,
  impedanceSupply,
  jobFile,
  link,
  mcb,
  point,
  run,
} from './helpers.js';

describe('worked multi-level loop sum: supply → mains → MSB → submain → DB → final', () => {
  // Ze = 0.15 + j0.10 Ω (stated impedance). au-nz: ρCu 0.0225, x 0.00008 Ω/m, U0 230 V, c 1.
  // M1  25 m 35/16 Cu: R = 0.0225·25·(1/35 + 1/16) = 0.5625·0.0910714 = 0.0512277; X = 2·0.00008·25 = 0.004
  // SM1 40 m 16/6  Cu: R = 0.0225·40·(1/16 + 1/6)  = 0.9·0.2291667    = 0.20625;   X = 0.0064
  // C1  20 m 2.5/2.5 : R = 0.0225·20·(2/2.5)       = 0.45·0.8          = 0.36;      X = 0.0032
  // At MSB: 0.2012277 + j0.1040 → |.| = 0.2265140 Ω
  // At DB:  0.4074777 + j0.1104 → |.| = 0.4221685 Ω
  // At P1:  0.7674777 + j0.1136 → |.| = 0.7758395 Ω
  const results = run(
    jobFile({
      nodes: [
        impedanceSupply('S1', 0.15, 0.1),
        board('MSB'),
        board('DB1'),
        point('P1', 'socket-outlets'),
      ],
      links: [
        link('M1', 'S1', 'MSB', cable(25, 35, 16)),
        link('SM1', 'MSB', 'DB1', cable(40, 16, 6), { device: mcb('C', 63) }),
        link('C1', 'DB1', 'P1', cable(20, 2.5, 2.5), { device: mcb('C', 20) }),
      ],
    }),
  );

  it('unprotected mains still report Zs at their far end', () => {
    const m = circuit(results, 'M1');
    expect(m.method).toBe('known-source');
    expect(m.role).toBe('consumer-mains');
    expect(m.status).toBe('unchecked');
    expectRel(m.zs, 0.22651397);
  });

  it('submain: Zs 0.42217 Ω against C63 limit 230/472.5 = 0.48677 Ω → ratio 0.86728, pass', () => {
    const s = circuit(results, 'SM1');
    expect(s.role).toBe('submain');
    expectRel(s.zs, 0.42216847);
    expectRel(s.tripCurrent, 472.5); // 7.5 × 63
    expectRel(s.limit, 0.48677249);
    expectRel(s.faultCurrent, 544.80620); // 230 / 0.42216847
    expectRel(s.ratio, 0.86728088); // 0.42216847 / 0.48677249
    expect(s.clearingTime).toBe(0.1); // If ≥ Ia: instantaneous, 0.1 s
    expect(s.requiredTime).toBe(5);
    expect(s.status).toBe('pass');
    // maximum length of SM1: |A + L·z'| = 0.48677 with A = Ze + M1 = 0.2012277 + j0.104,
    // z' = 0.0225·(1/16+1/6) + j0.00016 = 0.00515625 + j0.00016 → quadratic root L = 52.8248 m
    expectRel(s.maxLength, 52.824757, 1e-5);
  });

  it('final subcircuit: Zs 0.77584 Ω, If 296.45 A, C20 limit 1.53333 Ω, ratio 0.50598, pass', () => {
    const c = circuit(results, 'C1');
    expect(c.role).toBe('final-subcircuit');
    expect(c.protectedBy).toBe('C1');
    expectRel(c.zs, 0.77583951);
    expectRel(c.faultCurrent, 296.45306); // 230 / 0.77583951
    expectRel(c.tripCurrent, 150);
    expectRel(c.limit, 1.53333333); // 230 / 150
    expectRel(c.ratio, 0.50598229); // 0.77583951 / 1.53333333
    expect(c.clearingTime).toBe(0.1);
    expect(c.requiredTime).toBe(0.4); // socket-outlets, device 20 A ≤ 63 A
    expect(c.status).toBe('pass');
    // own = |C1| = |0.36 + j0.0032| = 0.3600142; upstream = |M1 + SM1| = |0.2574777 + j0.0104| = 0.2576876
    expectRel(c.own, 0.36001422);
    expectRel(c.upstream, 0.25768765, 1e-5);
    // maxLength: A = Ze + M1 + SM1 = 0.4074777 + j0.1104, z' = 0.018 + j0.00016, B = 1.533333:
    // a = 0.018² + 0.00016² = 3.240256e-4, b = 2(0.4074777·0.018 + 0.1104·0.00016) = 0.0147045,
    // c = 0.4221685² − 1.533333² = −2.172885 → L = (−b + √(b² − 4ac)) / 2a = 62.2847 m
    expectRel(c.maxLength, 62.284669, 1e-5);
  });
});

describe('Ze from a prospective earth-fault current', () => {
  // Ipf = 2000 A → |Ze| = 230 / 2000 = 0.115 Ω.
  // M1 10 m 16/6: R = 0.0225·10·0.2291667 = 0.0515625, X = 0.0016
  // C1 15 m 2.5/2.5: R = 0.0225·15·0.8 = 0.27, X = 0.0024
  function job(xr?: number) {
    return run(
      jobFile({
        nodes: [faultCurrentSupply('S1', 2000, xr), board('MSB'), point('P1', 'socket-outlets')],
        links: [
          link('M1', 'S1', 'MSB', cable(10, 16, 6)),
          link('C1', 'MSB', 'P1', cable(15, 2.5, 2.5), { device: mcb('C', 20) }),
        ],
      }),
    );
  }

  it('X/R = 2: R = 0.115/√5 = 0.0514296, X = 0.1028591', () => {
    const r = job(2);
    // at MSB: 0.1029921 + j0.1044591 → 0.1466938 Ω
    expectRel(circuit(r, 'M1').zs, 0.14669381);
    // at P1: 0.3729921 + j0.1068591 → 0.3879974 Ω; If = 592.7875 A; ratio 0.3879974/1.533333 = 0.2530418
    const c = circuit(r, 'C1');
    expectRel(c.zs, 0.38799736);
    expectRel(c.faultCurrent, 592.78754);
    expectRel(c.ratio, 0.25304176);
    expect(c.status).toBe('pass');
    // maxLength: A = Ze + M1 = 0.1029921 + j0.1044591, z' = 0.018 + j0.00016, B = 1.533333 → 79.2145 m
    expectRel(c.maxLength, 79.214485, 1e-5);
  });

  it('X/R defaults to 1: R = X = 0.115/√2 = 0.0813173', () => {
    const r = job();
    // at MSB: 0.1328798 + j0.0829173 → 0.1566279 Ω
    expectRel(circuit(r, 'M1').zs, 0.15662794);
    // at P1: 0.4028798 + j0.0853173 → 0.4118145 Ω; If = 558.5039 A
    const c = circuit(r, 'C1');
    expectRel(c.zs, 0.41181447);
    expectRel(c.faultCurrent, 558.50393);
    expectRel(c.ratio, 0.26857465);
    expectRel(c.maxLength, 77.638149, 1e-5);
  });
});

describe('known source failing', () => {
  it('Zs above the budget fails; clearing time null below Ia', () => {
    // Ze = 2 + j0 Ω, C1 0 m: Zs = 2 Ω; C16: B = 230/120 = 1.916667 → ratio 1.043478, If 115 A < 120 A
    const r = run(
      jobFile({
        nodes: [impedanceSupply('S1', 2, 0), point('P1', 'lighting')],
        links: [link('C1', 'S1', 'P1', cable(0, 2.5, 2.5), { device: mcb('C', 16) })],
      }),
    );
    const c = circuit(r, 'C1');
    expectRel(c.zs, 2);
    expectRel(c.faultCurrent, 115);
    expectRel(c.ratio, 1.04347826);
    expect(c.clearingTime).toBeNull();
    expect(c.status).toBe('fail');
    expect(c.maxLength).toBe(0); // A = Ze alone already exceeds B
  });
});
