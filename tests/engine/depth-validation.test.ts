// Every field that job format version 2 adds (/work/shared/job-format.md, "Job file, version 2")
// refused when out of range, each problem naming its place, its field, what is allowed and the
// bad value; the phase rules of method-depth.md §1 as errors with their place; a refused file is
// left as it was.

import { describe, expect, it } from 'vitest';
import { formatProblem, loadJob } from '../../engine/index.js';
import type { Problem } from '../../engine/index.js';
import type { Obj } from './helpers.js';

/** nodes[0] S1 supply, nodes[1] MSB board, nodes[2] P1 point; links[0] M1, links[1] C1 (C20). */
function base(): Obj {
  return {
    format: 'loopwright.job',
    version: 2,
    job: { title: 'Test job', site: '', client: '', designer: '', reference: 'T-1', revision: 'A', date: '2026-01-01', notes: '' },
    rules: { basis: 'au-nz' },
    nodes: [
      { id: 'S1', kind: 'supply', source: { type: 'unknown' } },
      { id: 'MSB', kind: 'board' },
      { id: 'P1', kind: 'point', use: 'socket-outlets' },
    ],
    links: [
      { id: 'M1', from: 'S1', to: 'MSB', cable: { length: 10, material: 'Cu', active: 16, earth: 6 } },
      { id: 'C1', from: 'MSB', to: 'P1', cable: { length: 20, material: 'Cu', active: 2.5, earth: 2.5 }, device: { type: 'mcb', curve: 'C', rating: 20 } },
    ],
  };
}

/** Set a dotted path such as `links.1.cable.derating` in a copy of the base file. */
function withValue(path: string, value: unknown): Obj {
  const file = base();
  const keys = path.split('.');
  let here: Record<string, unknown> = file;
  for (const key of keys.slice(0, -1)) {
    if (typeof here[key] !== 'object' || here[key] === null) here[key] = {};
    here = here[key] as Record<string, unknown>;
  }
  here[keys[keys.length - 1] as string] = value;
  return file;
}

function errors(file: Obj): Problem[] {
  const copy = structuredClone(file);
  const result = loadJob(file);
  expect(file).toEqual(copy); // nothing the user made is changed by a refusal
  expect(result.ok).toBe(false);
  return result.ok ? [] : result.problems.filter((p) => p.severity === 'error');
}

/** The file is refused with exactly one error, at `where`, that reads `where: text`. */
function expectMessage(file: Obj, where: string, field: string, ...contains: string[]): void {
  const errs = errors(file);
  expect(errs.map(formatProblem)).toHaveLength(1);
  const p = errs[0] as Problem;
  expect(p.where).toBe(where);
  expect(p.field).toBe(field);
  const text = formatProblem(p);
  expect(text.startsWith(`${where}: ${field} `)).toBe(true);
  for (const c of contains) expect(text).toContain(c);
}

const S1 = 'nodes[0] (S1)';
const MSB = 'nodes[1] (MSB)';
const P1 = 'nodes[2] (P1)';
const C1 = 'links[1] (C1)';

describe('version 2 fields: each bad value refused with its place', () => {
  it('the message in the form job-format.md gives: links[4] (C3): designCurrent must be a number > 0, got -2', () => {
    const file = base();
    const nodes = file.nodes as Obj[];
    const links = file.links as Obj[];
    for (const i of [2, 3, 4]) {
      nodes.push({ id: `P${i}`, kind: 'point', use: 'other' });
      links.push({ id: `C${i}`, from: 'MSB', to: `P${i}`, cable: { length: 5, material: 'Cu', active: 2.5, earth: 2.5 }, device: { type: 'mcb', curve: 'B', rating: 16 } });
    }
    (links[4] as Obj).designCurrent = -2;
    expect(links[4]?.id).toBe('C4');
    // links[4] is C4 in this file: the place is its index and its id
    expect(errors(file).map(formatProblem)).toEqual(['links[4] (C4): designCurrent must be a number > 0, got -2']);
  });

  it.each([
    // [path, value, where, field, what the message must show]
    ['nodes.0.phases', 2, S1, 'phases', ['1, 3', 'got 2']],
    ['nodes.0.maxFault', { current: 0 }, S1, 'maxFault.current', ['> 0', 'got 0']],
    ['nodes.0.maxFault', { current: -400 }, S1, 'maxFault.current', ['> 0', 'got -400']],
    ['nodes.0.maxFault', { xr: 1 }, S1, 'maxFault.current', ['> 0']],
    ['nodes.0.maxFault', { current: 6000, xr: -1 }, S1, 'maxFault.xr', ['≥ 0', 'got -1']],
    ['nodes.0.maxFault', { current: 6000, xr: 'high' }, S1, 'maxFault.xr', ['"high"']],
    ['nodes.0.measured', { ze: 0 }, S1, 'measured.ze', ['> 0', 'got 0']],
    ['nodes.0.measured', { date: '2026-11-30' }, S1, 'measured.ze', ['> 0']],
    ['nodes.0.measured', { ze: 0.3, date: 5 }, S1, 'measured.date', ['got 5']],
    ['nodes.0.measured', { ze: 0.3, instrument: false }, S1, 'measured.instrument', ['got false']],
    ['nodes.1.diversity', 0, MSB, 'diversity', ['> 0', '≤ 1', 'got 0']],
    ['nodes.1.diversity', 1.5, MSB, 'diversity', ['> 0', '≤ 1', 'got 1.5']],
    ['nodes.1.diversity', -0.5, MSB, 'diversity', ['got -0.5']],
    ['nodes.2.current', -1, P1, 'current', ['≥ 0', 'got -1']],
    ['nodes.2.phases', 2, P1, 'phases', ['1, 3', 'got 2']],
    ['nodes.2.powerFactor', 0, P1, 'powerFactor', ['> 0', '≤ 1', 'got 0']],
    ['nodes.2.powerFactor', 1.2, P1, 'powerFactor', ['> 0', '≤ 1', 'got 1.2']],
    ['links.1.phases', 2, C1, 'phases', ['1, 3', 'got 2']],
    ['links.1.designCurrent', 0, C1, 'designCurrent', ['> 0', 'got 0']],
    ['links.1.designCurrent', 'lots', C1, 'designCurrent', ['> 0', '"lots"']],
    ['links.1.powerFactor', 0, C1, 'powerFactor', ['> 0', '≤ 1', 'got 0']],
    ['links.1.powerFactor', 1.01, C1, 'powerFactor', ['> 0', '≤ 1', 'got 1.01']],
    ['links.1.voltageDropLimit', 0, C1, 'voltageDropLimit', ['> 0', 'got 0']],
    ['links.1.voltageDropLimit', -3, C1, 'voltageDropLimit', ['> 0', 'got -3']],
    ['links.1.measured', { zs: 0 }, C1, 'measured.zs', ['> 0', 'got 0']],
    ['links.1.measured', {}, C1, 'measured.zs', ['> 0']],
    ['links.1.measured', { zs: 0.9, temperature: 61 }, C1, 'measured.temperature', ['-30', '60', 'got 61']],
    ['links.1.measured', { zs: 0.9, temperature: -31 }, C1, 'measured.temperature', ['-30', '60', 'got -31']],
    ['links.1.measured', { zs: 0.9, date: 20261130 }, C1, 'measured.date', ['got 20261130']],
    ['links.1.measured', { zs: 0.9, instrument: 3 }, C1, 'measured.instrument', ['got 3']],
    ['links.1.cable.insulation', 'rubber', C1, 'cable.insulation', ['"pvc"', '"xlpe"', '"rubber"']],
    ['links.1.cable.earthInCable', 'yes', C1, 'cable.earthInCable', ['"yes"']],
    ['links.1.cable.capacity', 0, C1, 'cable.capacity', ['> 0', 'got 0']],
    ['links.1.cable.capacity', -25, C1, 'cable.capacity', ['> 0', 'got -25']],
    ['links.1.cable.derating', 0, C1, 'cable.derating', ['> 0', '≤ 1', 'got 0']],
    ['links.1.cable.derating', 1.1, C1, 'cable.derating', ['> 0', '≤ 1', 'got 1.1']],
    ['links.1.device.letThrough', 0, C1, 'device.letThrough', ['> 0', 'got 0']],
    ['links.1.device.letThrough', -5000, C1, 'device.letThrough', ['> 0', 'got -5000']],
    ['links.1.device.breaking', 0, C1, 'device.breaking', ['> 0', 'got 0']],
    ['rules.voltageDropLimit', 0, 'rules', 'voltageDropLimit', ['> 0', 'got 0']],
    ['rules.voltageDropResistivity', { Cu: 0 }, 'rules', 'voltageDropResistivity.Cu', ['> 0', 'got 0']],
    ['rules.voltageDropResistivity', { Al: -0.036 }, 'rules', 'voltageDropResistivity.Al', ['> 0', 'got -0.036']],
    ['rules.maxVoltageFactor', 0, 'rules', 'maxVoltageFactor', ['> 0', 'got 0']],
    ['rules.shortCircuitResistivity', { Al: -1 }, 'rules', 'shortCircuitResistivity.Al', ['> 0', 'got -1']],
    ['rules.shortCircuitResistivity', { Cu: 0 }, 'rules', 'shortCircuitResistivity.Cu', ['> 0', 'got 0']],
    ['rules.measuredRule', 'guess', 'rules', 'measuredRule', ['"temperature"', '"fixed-factor"', '"guess"']],
    ['rules.measuredFactor', 0, 'rules', 'measuredFactor', ['> 0', '≤ 1', 'got 0']],
    ['rules.measuredFactor', 1.5, 'rules', 'measuredFactor', ['> 0', '≤ 1', 'got 1.5']],
    // the records themselves
    ['nodes.0.maxFault', 5, S1, 'maxFault', ['object', 'got 5']],
    ['nodes.0.measured', 'x', S1, 'measured', ['object', '"x"']],
    ['links.1.measured', [], C1, 'measured', ['object', 'got []']],
    ['links.1.measured', { zs: 0.5, temperature: '20' }, C1, 'measured.temperature', ['"20"']],
    ['rules.voltageDropResistivity', 5, 'rules', 'voltageDropResistivity', ['object', 'got 5']],
    ['rules.shortCircuitResistivity', { Fe: 0.1 }, 'rules', 'shortCircuitResistivity.Fe', ['"Cu"', '"Al"']],
  ] as Array<[string, unknown, string, string, string[]]>)('%s = %j', (path, value, where, field, shows) => {
    expectMessage(withValue(path, value), where, field, ...shows);
  });

  it('the edges that are allowed load: diversity 1, powerFactor 1, current 0, xr 0, temperatures −30 and 60, measuredFactor 1', () => {
    const file = base();
    const [s1, msb, p1] = file.nodes as Obj[];
    const [, c1] = file.links as Obj[];
    Object.assign(s1 as Obj, { phases: 1, maxFault: { current: 6000, xr: 0 }, measured: { ze: 0.2, date: '2026-11-30', instrument: 'tester' } });
    Object.assign(msb as Obj, { diversity: 1 });
    Object.assign(p1 as Obj, { current: 0, phases: 1, powerFactor: 1 });
    Object.assign(c1 as Obj, { phases: 1, designCurrent: 0.1, powerFactor: 1, voltageDropLimit: 5, measured: { zs: 0.5, temperature: -30 } });
    (file.rules as Obj).measuredFactor = 1;
    expect(loadJob(file).ok).toBe(true);
    ((file.links as Obj[])[1] as Obj).measured = { zs: 0.5, temperature: 60 };
    expect(loadJob(file).ok).toBe(true);
  });

  it('several bad fields are all listed in one refusal, each with its place', () => {
    const file = base();
    ((file.nodes as Obj[])[1] as Obj).diversity = 2;
    ((file.links as Obj[])[1] as Obj).designCurrent = -2;
    ((file.links as Obj[])[0] as Obj).cable = { length: 10, material: 'Cu', active: 16, earth: 6, derating: 3 };
    const texts = errors(file).map(formatProblem);
    expect(texts).toHaveLength(3);
    expect(texts.some((t) => t.startsWith(`${MSB}: diversity`))).toBe(true);
    expect(texts.some((t) => t.startsWith(`${C1}: designCurrent`))).toBe(true);
    expect(texts.some((t) => t.startsWith('links[0] (M1): cable.derating'))).toBe(true);
  });
});

describe('the phase rules (method-depth.md §1) are errors with their place', () => {
  it('a three-phase link under a single-phase supply: the link is named', () => {
    const file = base();
    ((file.nodes as Obj[])[0] as Obj).phases = 1;
    ((file.links as Obj[])[1] as Obj).phases = 3;
    const errs = errors(file);
    expect(errs).toHaveLength(1);
    expect(errs[0]?.where).toBe(C1);
    expect(errs[0]?.field).toBe('phases');
    expect(formatProblem(errs[0] as Problem)).toContain('S1');
  });

  it('a three-phase link fed by a single-phase link: the link and the feeder are named', () => {
    const file = base();
    ((file.nodes as Obj[])[0] as Obj).phases = 3;
    ((file.links as Obj[])[0] as Obj).phases = 1;
    ((file.links as Obj[])[1] as Obj).phases = 3;
    const errs = errors(file);
    expect(errs).toHaveLength(1);
    expect(errs[0]?.where).toBe(C1);
    expect(formatProblem(errs[0] as Problem)).toContain('M1');
  });

  it('a three-phase link fed higher up by a single-phase link (two levels above)', () => {
    // S1 (3 phases) -M1 (1 phase)-> MSB -SM1-> DB -C1 (3 phases)-> P1: C1 is refused, and SM1
    // (a submain under a three-phase supply, 3 by derivation) with it, each at its own place
    const file = base();
    const nodes = file.nodes as Obj[];
    const links = file.links as Obj[];
    (nodes[0] as Obj).phases = 3;
    nodes.push({ id: 'DB', kind: 'board' });
    (links[0] as Obj).phases = 1;
    links[1] = { ...(links[1] as Obj), from: 'DB', phases: 3 };
    links.push({ id: 'SM1', from: 'MSB', to: 'DB', cable: { length: 10, material: 'Cu', active: 10, earth: 6 } });
    const errs = errors(file);
    expect(errs.find((p) => p.where === C1)?.field).toBe('phases');
    expect(errs.every((p) => p.field === 'phases')).toBe(true);
    expect(errs.map((p) => p.where).sort()).toEqual([C1, 'links[2] (SM1)']);
  });

  it('a three-phase point whose feeding link has 1 phase: the point is named, and its link', () => {
    const file = base();
    ((file.nodes as Obj[])[0] as Obj).phases = 3;
    ((file.links as Obj[])[1] as Obj).phases = 1;
    ((file.nodes as Obj[])[2] as Obj).phases = 3;
    const errs = errors(file);
    expect(errs).toHaveLength(1);
    expect(errs[0]?.where).toBe(P1);
    expect(errs[0]?.field).toBe('phases');
    expect(formatProblem(errs[0] as Problem)).toContain('C1');
  });

  it('a three-phase point under a single-phase supply (its link is 1-phase by derivation)', () => {
    const file = base();
    ((file.nodes as Obj[])[0] as Obj).phases = 1;
    ((file.nodes as Obj[])[2] as Obj).phases = 3;
    const errs = errors(file);
    expect(errs).toHaveLength(1);
    expect(errs[0]?.where).toBe(P1);
  });

  it('the same shapes load when the phases agree', () => {
    const file = base();
    ((file.nodes as Obj[])[0] as Obj).phases = 3;
    ((file.nodes as Obj[])[2] as Obj).phases = 3;
    expect(loadJob(file).ok).toBe(true); // C1 becomes 3-phase by derivation
    const one = base();
    ((one.nodes as Obj[])[0] as Obj).phases = 3;
    ((one.links as Obj[])[1] as Obj).phases = 1; // a single-phase circuit under a three-phase supply
    expect(loadJob(one).ok).toBe(true);
  });
});
