// Roles, protection through chained points, fused spurs, unprotected and unreached links,
// and the required disconnection time per basis and use (method.md "The network", "t_req").

import { describe, expect, it } from 'vitest';
import { linkRole, loadJob } from '../../engine/index.js';
import {
  board,
  cable,
  circuit,
  expectRel,
  impedanceSupply,
  jobFile,
  link,
  load,
  mcb,
  point,
  run,
  unknownSupply,
} from './helpers.js';
import type { Obj } from './helpers.js';

// S1 → M1 → MSB → SM1 (C40) → DB → C1 (C20) → P1 (lighting) → C1b → P2 (socket-outlets) → C1c → P3
//                                                                P2 → SP1 (fused spur, fixed 50 A) → P4 → SP1b → P5 (hand-held)
//                                  DB → C2 (C80) → P6 (socket-outlets)
//                                  DB → U2 (no device) → P9
//                 MSB → U1 (no device) → P7 → U1b → P8
// DBX (fed by nothing) → X1 (C16) → PX
function network(basis: 'au-nz' | 'iec', supply: Obj = unknownSupply('S1'), extraLinks: Obj = {}): Obj {
  return jobFile({
    rules: { basis },
    nodes: [
      supply,
      board('MSB'),
      board('DB'),
      point('P1', 'lighting'),
      point('P2', 'socket-outlets'),
      point('P3', 'fixed-equipment'),
      point('P4', 'socket-outlets'),
      point('P5', 'lighting', { handHeld: true }),
      point('P6', 'socket-outlets'),
      point('P7', 'lighting'),
      point('P8', 'lighting'),
      point('P9', 'lighting'),
      board('DBX'),
      point('PX', 'socket-outlets'),
    ],
    links: [
      link('M1', 'S1', 'MSB', cable(10, 16, 6)),
      link('SM1', 'MSB', 'DB', cable(20, 10, 4), { device: mcb('C', 40) }),
      link('C1', 'DB', 'P1', cable(15, 2.5, 2.5), { device: mcb('C', 20), ...extraLinks }),
      link('C1b', 'P1', 'P2', cable(10, 2.5, 2.5)),
      link('C1c', 'P2', 'P3', cable(5, 2.5, 2.5), { requiredTime: 1 }),
      link('SP1', 'P2', 'P4', cable(5, 1.5, 1.5), { device: { type: 'fixed', rating: 10, tripCurrent: 50 } }),
      link('SP1b', 'P4', 'P5', cable(3, 1.5, 1.5)),
      link('C2', 'DB', 'P6', cable(15, 2.5, 2.5), { device: mcb('C', 80) }),
      link('U1', 'MSB', 'P7', cable(12, 2.5, 2.5)),
      link('U1b', 'P7', 'P8', cable(5, 2.5, 2.5)),
      link('U2', 'DB', 'P9', cable(5, 2.5, 2.5)), // leaves a board: SM1's device above does not protect it
      link('X1', 'DBX', 'PX', cable(10, 2.5, 2.5), { device: mcb('C', 16) }),
    ],
  });
}

describe('roles', () => {
  const results = run(network('au-nz'));
  it('derived from the ends of each link', () => {
    const expected: Record<string, string> = {
      M1: 'consumer-mains',
      SM1: 'submain',
      C1: 'final-subcircuit',
      C1b: 'final-subcircuit',
      C1c: 'final-subcircuit',
      SP1: 'final-subcircuit',
      SP1b: 'final-subcircuit',
      C2: 'final-subcircuit',
      U1: 'final-subcircuit',
      U1b: 'final-subcircuit',
      U2: 'final-subcircuit',
      X1: 'final-subcircuit',
    };
    const job = load(network('au-nz'));
    for (const [id, role] of Object.entries(expected)) {
      expect(circuit(results, id).role, id).toBe(role);
      expect(linkRole(job, id), id).toBe(role);
    }
  });

  it('a link from a supply straight to a point is a final subcircuit', () => {
    const job = load(
      jobFile({
        nodes: [unknownSupply('S1'), point('P1', 'lighting')],
        links: [link('C1', 'S1', 'P1', cable(5, 2.5, 2.5), { device: mcb('C', 16) })],
      }),
    );
    expect(linkRole(job, 'C1')).toBe('final-subcircuit');
  });
});

describe('protection through chained points', () => {
  const results = run(network('au-nz'));

  it('a leg leaving a point inherits the device of the nearest link above', () => {
    const b = circuit(results, 'C1b');
    expect(b.protectedBy).toBe('C1');
    expect(b.device).toBe('C20');
    expectRel(b.tripCurrent, 150);
    // own = |C1 + C1b| = |0.27 + 0.18 + j(0.0024 + 0.0016)| = |0.45 + j0.004| = 0.4500178
    // upstream = |M1 + SM1| = |0.0515625 + 0.1575 + j0.0048| = 0.2091176
    // ratio = max(0.4500178/1.226667, 0.2091176/0.306667) = max(0.3668623, 0.6819052)
    expectRel(b.own, 0.45001778);
    expectRel(b.upstream, 0.2091176, 1e-6);
    expectRel(b.ratio, 0.6819052, 1e-6);
    // maxLength: A = C1 is collinear with z' (same cable), so L = 68.1455 − 15 = 53.1455 m
    expectRel(b.maxLength, 53.145456, 1e-6);
    const c = circuit(results, 'C1c');
    expect(c.protectedBy).toBe('C1');
    expectRel(c.own, 0.54002133); // |0.54 + j0.0048|
  });

  it('a fused spur leaving a point is protected by its own device', () => {
    const s = circuit(results, 'SP1');
    expect(s.protectedBy).toBe('SP1');
    expectRel(s.tripCurrent, 50);
    // own = |0.15 + j0.0008| = 0.1500021; upstream = |M1 + SM1 + C1 + C1b| = |0.6590625 + j0.0088| = 0.6591212
    // B = 230/50 = 4.6: ratio = max(0.1500021/3.68, 0.6591212/0.92) = 0.7164361
    expectRel(s.own, 0.15000213);
    expectRel(s.upstream, 0.65912125, 1e-6);
    expectRel(s.ratio, 0.71643614, 1e-6);
    const b = circuit(results, 'SP1b');
    expect(b.protectedBy).toBe('SP1');
    expectRel(b.own, 0.24000341); // |0.24 + j0.00128|
    expectRel(b.maxLength, 117.664922, 1e-6); // 3.68/0.0300004 − 5
  });

  it('unprotected links are unchecked with every device-dependent field null', () => {
    for (const id of ['M1', 'U1', 'U1b', 'U2']) {
      const u = circuit(results, id);
      expect(u.status, id).toBe('unchecked');
      expect(u.method, id).toBe('unknown-source');
      for (const field of ['protectedBy', 'device', 'tripCurrent', 'limit', 'ratio', 'maxLength', 'clearingTime'] as const) {
        expect(u[field], `${id}.${field}`).toBeNull();
      }
      expect(u.zs, id).toBeNull();
    }
  });

  it('unprotected links still report zs when the source is known', () => {
    // Ze = 0.2 + j0.1; M1 = 0.0515625 + j0.0016 → |0.2515625 + j0.1016| = 0.2713047
    // U1 12 m 2.5/2.5 = 0.216 + j0.00192 → |0.4675625 + j0.10352| = 0.4788852
    const r = run(network('au-nz', impedanceSupply('S1', 0.2, 0.1)));
    expectRel(circuit(r, 'M1').zs, 0.27130472);
    const u = circuit(r, 'U1');
    expect(u.status).toBe('unchecked');
    expect(u.method).toBe('known-source');
    expectRel(u.zs, 0.47888525);
    expect(u.tripCurrent).toBeNull();
    expect(u.limit).toBeNull();
    expect(u.ratio).toBeNull();
  });

  it('a link no supply reaches is unchecked, method null, with a note; loading only warns', () => {
    const loaded = loadJob(network('au-nz'));
    expect(loaded.ok).toBe(true);
    if (!loaded.ok) return;
    const warned = loaded.warnings.map((w) => `${w.where} ${w.message}`).join('\n');
    expect(loaded.warnings.every((w) => w.severity === 'warning')).toBe(true);
    expect(warned).toContain('DBX');
    expect(warned).toContain('PX');
    const x = circuit(results, 'X1');
    expect(x.status).toBe('unchecked');
    expect(x.method).toBeNull();
    expect(x.zs).toBeNull();
    expect(x.ratio).toBeNull();
    expect(x.notes.length).toBeGreaterThan(0);
  });
});

describe('required disconnection time', () => {
  it('au-nz: socket-outlets ≤ 63 A or hand-held → 0.4 s, else 5 s; mains and submains 5 s', () => {
    // AS/NZS 3000:2018 clause 5.7.4 (from memory)
    const r = run(network('au-nz'));
    const expected: Record<string, number> = {
      SM1: 5, // submain
      C1: 5, // lighting
      C1b: 0.4, // far point socket-outlets, protecting device 20 A ≤ 63 A
      C1c: 1, // requiredTime override on this link alone
      SP1: 0.4, // socket-outlets, 10 A
      SP1b: 0.4, // hand-held
      C2: 5, // socket-outlets but 80 A > 63 A
    };
    for (const [id, t] of Object.entries(expected)) expect(circuit(r, id).requiredTime, id).toBe(t);
  });

  it('iec: final circuits with a device ≤ 32 A → 0.4 s; handHeld plays no part', () => {
    // IEC 60364-4-41:2005 Table 41.1 and 411.3.2.3 (from memory)
    const r = run(network('iec'));
    const expected: Record<string, number> = {
      SM1: 5, // distribution circuit
      C1: 0.4, // lighting, 20 A ≤ 32 A
      C1b: 0.4,
      C1c: 1, // override
      SP1: 0.4,
      SP1b: 0.4,
      C2: 5, // 80 A > 32 A
    };
    for (const [id, t] of Object.entries(expected)) expect(circuit(r, id).requiredTime, id).toBe(t);
  });

  it('iec: a hand-held point on a 40 A device gets 5 s; au-nz gives it 0.4 s', () => {
    const file = (basis: string) =>
      jobFile({
        rules: { basis },
        nodes: [unknownSupply('S1'), board('DB'), point('P1', 'other', { handHeld: true }), board('DB2')],
        links: [
          link('C1', 'DB', 'P1', cable(5, 10, 10), { device: mcb('C', 40) }),
          link('M1', 'S1', 'DB', cable(5, 16, 16), { device: mcb('C', 20) }),
          link('SM2', 'DB', 'DB2', cable(5, 4, 4), { device: mcb('B', 16) }),
        ],
      });
    expect(circuit(run(file('iec')), 'C1').requiredTime).toBe(5);
    expect(circuit(run(file('au-nz')), 'C1').requiredTime).toBe(0.4);
    // consumer mains and submains are always 5 s, whatever the device rating
    expect(circuit(run(file('iec')), 'M1').requiredTime).toBe(5);
    expect(circuit(run(file('iec')), 'SM2').requiredTime).toBe(5);
  });

  it('requiredTime changes Ia of a curve device and nothing else in the job', () => {
    // C1 requiredTime 1 on the curve (200 A, 10 s)-(400 A, 1 s)-(800 A, 0.1 s) → Ia = 400 A
    const r = run(
      network('au-nz', unknownSupply('S1'), {
        device: { type: 'curve', rating: 20, points: [[200, 10], [400, 1], [800, 0.1]] },
        requiredTime: 1,
      }),
    );
    expect(circuit(r, 'C1').requiredTime).toBe(1);
    expectRel(circuit(r, 'C1').tripCurrent, 400);
    // C1b inherits the device and uses its own far point: socket-outlets, 20 A → 0.4 s → Ia 527.05006 A
    expect(circuit(r, 'C1b').requiredTime).toBe(0.4);
    expectRel(circuit(r, 'C1b').tripCurrent, 527.050064);
  });
});
