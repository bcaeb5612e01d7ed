// Every "Bad input" rule of /work/shared/job-format.md: the file is refused as a whole, every
// problem listed with where it is (`links[1] (C1)`), the field named and the bad value shown.

import { describe, expect, it } from 'vitest';
import { formatProblem, loadJob, parseJob } from '../../engine/index.js';
import type { Problem } from '../../engine/index.js';
import { board, cable, jobFile, link, mcb, point, unknownSupply } from './helpers.js';
import type { Obj } from './helpers.js';

const DELETE = Symbol('delete');

/** nodes[0] S1 supply, nodes[1] MSB board, nodes[2] P1 point; links[0] M1, links[1] C1 (C20). */
function base(): Obj {
  return jobFile({
    nodes: [unknownSupply('S1'), board('MSB'), point('P1', 'socket-outlets')],
    links: [
      link('M1', 'S1', 'MSB', cable(10, 16, 6)),
      link('C1', 'MSB', 'P1', cable(20, 2.5, 2.5), { device: mcb('C', 20), rcd: { sensitivity: 0.03 } }),
    ],
  });
}

/** Set (or delete) a dotted path such as `links.1.cable.length` in a copy of the base file. */
function withValue(path: string, value: unknown): Obj {
  const file = base();
  const keys = path.split('.');
  let here: Record<string, unknown> = file;
  for (const key of keys.slice(0, -1)) {
    if (typeof here[key] !== 'object' || here[key] === null) here[key] = {};
    here = here[key] as Record<string, unknown>;
  }
  const last = keys[keys.length - 1] as string;
  if (value === DELETE) delete here[last];
  else here[last] = value;
  return file;
}

function refused(value: unknown): Problem[] {
  const result = loadJob(value);
  expect(result.ok).toBe(false);
  if (result.ok) return [];
  expect(result.problems.length).toBeGreaterThan(0);
  for (const p of result.problems) {
    expect(p.where.length).toBeGreaterThan(0);
    expect(p.message.length).toBeGreaterThan(0);
  }
  return result.problems.filter((p) => p.severity === 'error');
}

function expectOne(problems: Problem[], where: string, field: string, shows: string[] = []): Problem {
  const found = problems.find((p) => p.where === where && (p.field === field || p.field.startsWith(`${field}[`)));
  expect(found, `a problem at ${where} on ${field}; got:\n${problems.map(formatProblem).join('\n')}`).toBeDefined();
  const p = found as Problem;
  expect(p.severity).toBe('error');
  expect(p.message).toContain(field);
  for (const s of shows) expect(p.message).toContain(s);
  expect(formatProblem(p).startsWith(`${where}: `)).toBe(true);
  return p;
}

describe('the file as a whole', () => {
  it('the base file is valid', () => {
    expect(loadJob(base()).ok).toBe(true);
  });

  it('not JSON', () => {
    for (const text of ['{ "format": "loopwright.job", ', '', 'hello', '{"a":1,}']) {
      const r = parseJob(text);
      expect(r.ok).toBe(false);
      if (r.ok) continue;
      expect(r.problems[0]?.message).toMatch(/JSON/);
    }
  });

  it('JSON that is not a job object', () => {
    for (const text of ['[]', '"text"', '42', 'null']) {
      const r = parseJob(text);
      expect(r.ok).toBe(false);
    }
  });

  it('wrong format name', () => {
    const problems = refused(withValue('format', 'loopwright.results'));
    expect(problems.map((p) => p.message).join(' ')).toMatch(/format/);
    expect(refused(withValue('format', DELETE)).length).toBeGreaterThan(0);
  });

  it('a newer version is refused, saying so, and nothing is read', () => {
    const result = parseJob(JSON.stringify(withValue('version', 3)));
    expect(result.ok).toBe(false);
    if (result.ok) return;
    const text = result.problems.map(formatProblem).join(' ');
    expect(text).toMatch(/version/i);
    expect(text).toMatch(/2/);
    expect(text).toMatch(/newer/i);
    expect('job' in result).toBe(false);
  });

  it('a problem with a newer version file is the version, even when the rest is bad too', () => {
    const file = withValue('version', 7);
    (file.links as Obj[])[1] = { id: 'C1' };
    const problems = refused(file);
    expect(problems.map((p) => p.message).join(' ')).toMatch(/7/);
  });
});

describe('fields: missing or out of range, with location, field and value', () => {
  // [path to set, value, where, field, text the message must show]
  const cases: Array<[string, unknown, string, string, string[]]> = [
    ['links.1.cable.length', -5, 'links[1] (C1)', 'cable.length', ['-5']],
    ['links.1.cable.length', DELETE, 'links[1] (C1)', 'cable.length', []],
    ['links.1.cable.length', '20', 'links[1] (C1)', 'cable.length', ['20']],
    ['links.1.cable.active', 0, 'links[1] (C1)', 'cable.active', ['0']],
    ['links.1.cable.earth', -1.5, 'links[1] (C1)', 'cable.earth', ['-1.5']],
    ['links.1.cable.earth', DELETE, 'links[1] (C1)', 'cable.earth', []],
    ['links.1.cable.material', 'Fe', 'links[1] (C1)', 'cable.material', ['Fe']],
    ['links.1.cable.earthMaterial', 'Zn', 'links[1] (C1)', 'cable.earthMaterial', ['Zn']],
    ['links.1.cable.parallel', 1.5, 'links[1] (C1)', 'cable.parallel', ['1.5']],
    ['links.1.cable.parallel', 0, 'links[1] (C1)', 'cable.parallel', ['0']],
    ['links.1.cable.reactance', -0.001, 'links[1] (C1)', 'cable.reactance', ['-0.001']],
    ['links.1.cable', DELETE, 'links[1] (C1)', 'cable', []],
    ['links.1.device.type', 'fuse', 'links[1] (C1)', 'device.type', ['fuse']],
    ['links.1.device.curve', 'E', 'links[1] (C1)', 'device.curve', ['E']],
    ['links.1.device.rating', 0, 'links[1] (C1)', 'device.rating', ['0']],
    ['links.1.device.rating', DELETE, 'links[1] (C1)', 'device.rating', []],
    ['links.1.rcd.sensitivity', -0.03, 'links[1] (C1)', 'rcd.sensitivity', ['-0.03']],
    ['links.1.requiredTime', -1, 'links[1] (C1)', 'requiredTime', ['-1']],
    ['links.0.from', DELETE, 'links[0] (M1)', 'from', []],
    ['nodes.2.use', 'kettle', 'nodes[2] (P1)', 'use', ['kettle']],
    ['nodes.2.phases', 2, 'nodes[2] (P1)', 'phases', ['2']],
    ['nodes.1.diversity', 1.5, 'nodes[1] (MSB)', 'diversity', ['1.5']],
    ['nodes.1.kind', 'tree', 'nodes[1] (MSB)', 'kind', ['tree']],
    ['nodes.0.source.type', 'guess', 'nodes[0] (S1)', 'source.type', ['guess']],
    ['nodes.0.source', DELETE, 'nodes[0] (S1)', 'source', []],
  ];
  for (const [path, value, where, field, shows] of cases) {
    it(`${path} = ${value === DELETE ? '(missing)' : JSON.stringify(value)} → ${where}: ${field}`, () => {
      expectOne(refused(withValue(path, value)), where, field, shows);
    });
  }

  it('a supply impedance must be finite and not negative', () => {
    const file = withValue('nodes.0.source', { type: 'impedance', r: -0.1, x: 0.05 });
    expectOne(refused(file), 'nodes[0] (S1)', 'source.r', ['-0.1']);
  });

  it('a prospective fault current must be > 0', () => {
    const file = withValue('nodes.0.source', { type: 'fault-current', current: 0 });
    expectOne(refused(file), 'nodes[0] (S1)', 'source.current', ['0']);
  });

  it('device fields of each kind', () => {
    expectOne(refused(withValue('links.1.device', { type: 'adjustable', rating: 100 })), 'links[1] (C1)', 'device.instantaneous');
    expectOne(refused(withValue('links.1.device', { type: 'fixed', rating: 32 })), 'links[1] (C1)', 'device.tripCurrent');
    expectOne(refused(withValue('links.1.device', { type: 'mcb', rating: 32 })), 'links[1] (C1)', 'device.curve');
  });

  it('rules: basis and overrides', () => {
    const bad = (rules: Obj) => refused(jobFile({ rules, nodes: [unknownSupply('S1')], links: [] }));
    const at = (problems: Problem[], word: string) =>
      expect(
        problems.some((p) => p.where.startsWith('rules') && `${p.field} ${p.message}`.includes(word)),
        problems.map(formatProblem).join('\n'),
      ).toBe(true);
    at(bad({ basis: 'uk' }), 'basis');
    at(bad({ voltage: -230 }), 'voltage');
    at(bad({ voltageFactor: 0 }), 'voltageFactor');
    at(bad({ unknownSourceShare: 1.5 }), 'unknownSourceShare');
    at(bad({ reactance: -1 }), 'reactance');
    at(bad({ resistivity: { Cu: -0.02 } }), 'resistivity');
    at(bad({ multiples: { C: 0 } }), 'multiples');
  });
});

describe('non-finite numbers', () => {
  it('Infinity and NaN handed to loadJob', () => {
    expectOne(refused(withValue('links.1.cable.length', Infinity)), 'links[1] (C1)', 'cable.length');
    expectOne(refused(withValue('links.1.cable.length', Number.NaN)), 'links[1] (C1)', 'cable.length', ['NaN']);
    expectOne(refused(withValue('links.1.device.rating', -Infinity)), 'links[1] (C1)', 'device.rating');
  });

  it('a JSON number too large for a double (1e999 reads as Infinity)', () => {
    const text = JSON.stringify(base()).replace('"length":20', '"length":1e999');
    expect(text).toContain('1e999');
    const r = parseJob(text);
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expectOne(r.problems, 'links[1] (C1)', 'cable.length');
  });
});

describe('curve points', () => {
  const curve = (points: unknown) => withValue('links.1.device', { type: 'curve', rating: 63, points });
  it('current must rise', () => {
    expectOne(refused(curve([[200, 10], [150, 1]])), 'links[1] (C1)', 'device.points');
  });
  it('time must fall', () => {
    expectOne(refused(curve([[200, 1], [400, 10]])), 'links[1] (C1)', 'device.points');
  });
  it('at least two points', () => {
    expectOne(refused(curve([[200, 10]])), 'links[1] (C1)', 'device.points');
    expectOne(refused(curve([])), 'links[1] (C1)', 'device.points');
    expectOne(refused(withValue('links.1.device', { type: 'curve', rating: 63 })), 'links[1] (C1)', 'device.points');
  });
  it('points are pairs of positive numbers', () => {
    expectOne(refused(curve([[0, 10], [400, 1]])), 'links[1] (C1)', 'device.points');
    expectOne(refused(curve([[200, 10, 3], [400, 1]])), 'links[1] (C1)', 'device.points');
  });
});
