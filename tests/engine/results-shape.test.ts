// The results document: exact field names, file order, nulls, the device label
// (/work/shared/job-format.md "Results document, version 1").

import { describe, expect, it } from 'vitest';
import { parseJob, analyse } from '../../engine/index.js';
import { board, cable, circuit, expectRel, jobFile, link, mcb, point, run, unknownSupply } from './helpers.js';

const CIRCUIT_FIELDS = [
  'link',
  'name',
  'from',
  'to',
  'role',
  'method',
  'protectedBy',
  'device',
  'tripCurrent',
  'requiredTime',
  'zs',
  'own',
  'upstream',
  'limit',
  'faultCurrent',
  'clearingTime',
  'ratio',
  'maxLength',
  'status',
  'notes',
  // version 2 (job-format.md "Results document, version 2")
  'phases',
  'designCurrent',
  'powerFactor',
  'voltageDrop',
  'voltageDropTotal',
  'voltageDropLimit',
  'voltageStatus',
  'capacity',
  'capacityStatus',
  'faultLevel',
  'breakingStatus',
  'earthMinArea',
  'withstandStatus',
  'testLimit',
  'measured',
  'fixes',
  'verdict',
];

// The example job of job-format.md, verbatim.
const EXAMPLE = `{
  "format": "loopwright.job",
  "version": 1,
  "job": { "title": "Bakery fit-out", "site": "12 Example Lane", "client": "", "designer": "",
           "reference": "J-0001", "revision": "A", "date": "2026-12-01", "notes": "" },
  "rules": { "basis": "au-nz" },
  "nodes": [
    { "id": "S1", "kind": "supply", "name": "Point of supply", "at": { "x": 0, "y": 0 },
      "source": { "type": "unknown" } },
    { "id": "MSB", "kind": "board", "name": "Main switchboard", "at": { "x": 0, "y": 160 } },
    { "id": "P1", "kind": "point", "name": "Kitchen socket-outlets", "use": "socket-outlets",
      "at": { "x": 0, "y": 320 } }
  ],
  "links": [
    { "id": "M1", "from": "S1", "to": "MSB",
      "cable": { "length": 18, "material": "Cu", "active": 16, "earth": 6 } },
    { "id": "C1", "from": "MSB", "to": "P1", "name": "Kitchen power",
      "cable": { "length": 32, "material": "Cu", "active": 2.5, "earth": 2.5 },
      "device": { "type": "mcb", "curve": "C", "rating": 20 },
      "rcd": { "sensitivity": 0.03 } }
  ]
}`;

describe('the format’s own example', () => {
  const loaded = parseJob(EXAMPLE);
  it('loads', () => expect(loaded.ok).toBe(true));
  if (!loaded.ok) return;
  const results = analyse(loaded.job);

  it('reproduces the published example results', () => {
    expect(results.format).toBe('loopwright.results');
    expect(results.version).toBe(2); // version 2: the fields of method-depth.md added
    expect(results.basis).toBe('au-nz');
    const c = circuit(results, 'C1');
    // own: 0.0225·32·(2/2.5) = 0.576, X = 2·0.00008·32 = 0.00512 → 0.5760228
    // upstream: 0.0225·18·(1/16 + 1/6) = 0.0928125, X = 0.00288 → 0.0928572
    // limit 0.8·230/150 = 1.226667; ratio 0.5760228/1.226667 = 0.4695838; maxLength 68.14546
    expect(c).toMatchObject({
      link: 'C1',
      name: 'Kitchen power',
      from: 'MSB',
      to: 'P1',
      role: 'final-subcircuit',
      method: 'unknown-source',
      protectedBy: 'C1',
      device: 'C20',
      zs: null,
      faultCurrent: null,
      clearingTime: null,
      status: 'pass',
      notes: [],
    });
    expectRel(c.tripCurrent, 150);
    expect(c.requiredTime).toBe(0.4);
    expectRel(c.own, 0.57602276, 1e-6);
    expectRel(c.upstream, 0.09285717, 1e-5);
    expectRel(c.limit, 1.22666667);
    expectRel(c.ratio, 0.46958377, 1e-6);
    expectRel(c.maxLength, 68.145456, 1e-6);
    expect(results.worst).toEqual({ link: 'C1', ratio: c.ratio, path: ['S1', 'M1', 'MSB', 'C1', 'P1'] });
    expect(results.summary).toMatchObject({ pass: 1, fail: 0, rcd: 0, unchecked: 1 });
  });

  it('has exactly the documented fields, top level and per circuit', () => {
    expect(Object.keys(results).sort()).toEqual(['basis', 'circuits', 'format', 'summary', 'supplies', 'version', 'worst']);
    for (const c of results.circuits) expect(Object.keys(c).sort()).toEqual([...CIRCUIT_FIELDS].sort());
    expect(Object.keys(results.worst ?? {}).sort()).toEqual(['link', 'path', 'ratio']);
    expect(Object.keys(results.summary).sort()).toEqual(['checks', 'fail', 'pass', 'rcd', 'unchecked', 'verdict']);
    expect(Object.keys(results.summary.checks).sort()).toEqual(['breaking', 'capacity', 'measured', 'voltage', 'withstand']);
  });

  it('is plain JSON: it survives a JSON round trip unchanged', () => {
    expect(JSON.parse(JSON.stringify(results))).toEqual(results);
  });

  it('the unnamed mains link has name null', () => {
    expect(circuit(results, 'M1').name).toBeNull();
    expect(circuit(results, 'M1').role).toBe('consumer-mains');
  });
});

describe('file order, basis and labels', () => {
  it('one entry per link, in file order, whatever the drawing order', () => {
    const r = run(
      jobFile({
        rules: { basis: 'iec' },
        nodes: [point('P2', 'lighting'), board('MSB'), point('P1', 'lighting'), unknownSupply('S1')],
        links: [
          link('Z9', 'MSB', 'P2', cable(10, 2.5, 2.5), { device: mcb('B', 10, { label: 'QF-lights' }) }),
          link('A1', 'MSB', 'P1', cable(10, 2.5, 2.5), { device: mcb('B', 16), name: 'Hall' }),
          link('M1', 'S1', 'MSB', cable(5, 16, 6)),
        ],
      }),
    );
    expect(r.basis).toBe('iec');
    expect(r.circuits.map((c) => c.link)).toEqual(['Z9', 'A1', 'M1']);
    expect(circuit(r, 'Z9').device).toBe('QF-lights');
    expect(circuit(r, 'Z9').name).toBeNull();
    expect(circuit(r, 'A1').device).toBe('B16');
    expect(circuit(r, 'A1').name).toBe('Hall');
    expect(circuit(r, 'M1').device).toBeNull();
  });

  it('a chained leg shows its protecting link’s device mark', () => {
    const r = run(
      jobFile({
        nodes: [unknownSupply('S1'), board('MSB'), point('P1', 'lighting'), point('P2', 'lighting')],
        links: [
          link('C1', 'MSB', 'P1', cable(10, 2.5, 2.5), { device: mcb('D', 10, { label: 'Q1' }) }),
          link('M1', 'S1', 'MSB', cable(5, 16, 6)),
          link('C1b', 'P1', 'P2', cable(10, 2.5, 2.5)),
        ],
      }),
    );
    expect(circuit(r, 'C1b').device).toBe('Q1');
    expect(circuit(r, 'C1b').protectedBy).toBe('C1');
  });

  it('a non-standard conductor size is accepted and noted in the results', () => {
    const file = jobFile({
      nodes: [unknownSupply('S1'), board('MSB'), point('P1', 'lighting')],
      links: [
        link('M1', 'S1', 'MSB', cable(5, 16, 6)),
        link('C1', 'MSB', 'P1', cable(10, 3, 2.5), { device: mcb('C', 16) }),
      ],
    });
    const r = run(file);
    const notes = circuit(r, 'C1').notes.join(' ');
    expect(notes).toMatch(/3/);
    expect(notes.length).toBeGreaterThan(0);
    expect(circuit(r, 'M1').notes.join(' ')).not.toMatch(/standard/i);
  });
});
