// The rules that span records (job-format.md "Bad input"): ids unique across nodes and links,
// from/to exist, no node fed by two links, no cycles, no supply fed; every problem collected;
// unreached nodes and odd conductor sizes are warnings; unknown top-level keys are kept.

import { describe, expect, it } from 'vitest';
import { formatProblem, loadJob, parseJob, serialiseJob } from '../../engine/index.js';
import type { Problem } from '../../engine/index.js';
import { board, cable, jobFile, link, mcb, point, unknownSupply } from './helpers.js';
import type { Obj } from './helpers.js';

function errors(file: Obj): Problem[] {
  const r = loadJob(file);
  expect(r.ok).toBe(false);
  return r.ok ? [] : r.problems.filter((p) => p.severity === 'error');
}

function listing(problems: Problem[]): string {
  return problems.map(formatProblem).join('\n');
}

const nodes = () => [unknownSupply('S1'), board('MSB'), point('P1', 'lighting'), point('P2', 'lighting')];
const m1 = () => link('M1', 'S1', 'MSB', cable(10, 16, 6));
const c = (id: string, from: string, to: string) => link(id, from, to, cable(10, 2.5, 2.5), { device: mcb('C', 16) });

describe('graph rules', () => {
  it('duplicate ids between two nodes', () => {
    const p = errors(jobFile({ nodes: [...nodes(), board('P1')], links: [m1(), c('C1', 'MSB', 'P1')] }));
    expect(p.some((x) => x.where === 'nodes[4] (P1)' && x.field === 'id' && x.message.includes('P1')), listing(p)).toBe(true);
  });

  it('duplicate ids across a node and a link', () => {
    const p = errors(jobFile({ nodes: nodes(), links: [m1(), c('MSB', 'MSB', 'P1')] }));
    expect(p.some((x) => x.where === 'links[1] (MSB)' && x.field === 'id' && x.message.includes('MSB')), listing(p)).toBe(true);
  });

  it('duplicate ids between two links', () => {
    const p = errors(jobFile({ nodes: nodes(), links: [m1(), c('C1', 'MSB', 'P1'), c('C1', 'MSB', 'P2')] }));
    expect(p.some((x) => x.where === 'links[2] (C1)' && x.field === 'id'), listing(p)).toBe(true);
  });

  it('every repeat of an id names the record that had it first, in nodes and in links', () => {
    // Three boards called P1 (the first is the point), and links that reuse a node's id and a link's.
    const p = errors(jobFile({
      nodes: [...nodes(), board('P1'), board('P1'), board('DB1')],
      links: [m1(), c('C1', 'MSB', 'P1'), c('P2', 'MSB', 'DB1'), c('C1', 'MSB', 'P2'), c('C1', 'S1', 'P2')],
    }));
    const ids = p.filter((x) => x.field === 'id').map((x) => `${x.where}: ${x.message}`);
    expect(ids, listing(p)).toEqual([
      'nodes[4] (P1): id "P1" is already used by nodes[2] (P1); ids must be unique across nodes and links',
      'nodes[5] (P1): id "P1" is already used by nodes[2] (P1); ids must be unique across nodes and links',
      'links[2] (P2): id "P2" is already used by nodes[3] (P2); ids must be unique across nodes and links',
      'links[3] (C1): id "C1" is already used by links[1] (C1); ids must be unique across nodes and links',
      'links[4] (C1): id "C1" is already used by links[1] (C1); ids must be unique across nodes and links',
    ]);
    // from and to name the first node with the id: C1 feeds the point P1, not a board P1.
    expect(p.some((x) => x.field === 'from' || (x.field === 'to' && x.message.includes('not a node'))), listing(p)).toBe(false);
  });

  it('from names no node', () => {
    const p = errors(jobFile({ nodes: nodes(), links: [m1(), c('C1', 'DB9', 'P1')] }));
    expect(p.some((x) => x.where === 'links[1] (C1)' && x.field === 'from' && x.message.includes('DB9')), listing(p)).toBe(true);
  });

  it('to names no node', () => {
    const p = errors(jobFile({ nodes: nodes(), links: [m1(), c('C1', 'MSB', 'P9')] }));
    expect(p.some((x) => x.where === 'links[1] (C1)' && x.field === 'to' && x.message.includes('P9')), listing(p)).toBe(true);
  });

  it('a node fed by two links', () => {
    const p = errors(jobFile({ nodes: nodes(), links: [m1(), c('C1', 'MSB', 'P1'), c('C2', 'MSB', 'P1')] }));
    const hit = p.find((x) => x.where.includes('C2') || x.where.includes('C1'));
    expect(hit, listing(p)).toBeDefined();
    expect(hit?.message).toContain('P1');
  });

  it('a cycle', () => {
    // S1 → MSB, and DB1 → DB2 → DB1: every node fed by one link, but DB1/DB2 form a loop
    const p = errors(
      jobFile({
        nodes: [unknownSupply('S1'), board('MSB'), board('DB1'), board('DB2')],
        links: [m1(), c('X1', 'DB1', 'DB2'), c('X2', 'DB2', 'DB1')],
      }),
    );
    expect(p.some((x) => /cycl|circular|loop/i.test(x.message) && /X1|X2/.test(x.where)), listing(p)).toBe(true);
  });

  it('a link from a node to itself', () => {
    const p = errors(jobFile({ nodes: nodes(), links: [m1(), c('C1', 'MSB', 'MSB')] }));
    expect(p.some((x) => x.where === 'links[1] (C1)'), listing(p)).toBe(true);
  });

  it('a supply fed by a link', () => {
    const p = errors(
      jobFile({ nodes: [...nodes(), unknownSupply('S2')], links: [m1(), c('C1', 'MSB', 'S2')] }),
    );
    expect(p.some((x) => x.where === 'links[1] (C1)' && x.message.includes('S2')), listing(p)).toBe(true);
  });

  it('every problem is collected: three problems give three errors', () => {
    // links[1] C1: cable.length −5; links[2] C2: device.rating 0; nodes[3] P2: use "kettle"
    const file = jobFile({
      nodes: [unknownSupply('S1'), board('MSB'), point('P1', 'lighting'), point('P2', 'kettle')],
      links: [
        m1(),
        link('C1', 'MSB', 'P1', cable(-5, 2.5, 2.5), { device: mcb('C', 16) }),
        link('C2', 'MSB', 'P2', cable(10, 2.5, 2.5), { device: mcb('C', 0) }),
      ],
    });
    const p = errors(file);
    expect(p.length, listing(p)).toBe(3);
    const where = p.map((x) => `${x.where} ${x.field}`).sort();
    expect(where).toEqual(['links[1] (C1) cable.length', 'links[2] (C2) device.rating', 'nodes[3] (P2) use']);
  });

  it('field and graph problems of one link are both listed', () => {
    const p = errors(jobFile({ nodes: nodes(), links: [m1(), link('C1', 'MSB', 'P9', cable(-5, 2.5, 2.5))] }));
    expect(p.some((x) => x.field === 'cable.length'), listing(p)).toBe(true);
    expect(p.some((x) => x.field === 'to'), listing(p)).toBe(true);
  });
});

describe('warnings, not errors', () => {
  it('a board and point that no supply reaches', () => {
    const r = loadJob(
      jobFile({
        nodes: [...nodes(), board('DBX'), point('PX', 'lighting')],
        links: [m1(), c('C1', 'MSB', 'P1'), c('C2', 'MSB', 'P2'), c('X1', 'DBX', 'PX')],
      }),
    );
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    const w = r.warnings.filter((x) => x.severity === 'warning');
    expect(w.some((x) => x.where.includes('DBX'))).toBe(true);
    expect(w.some((x) => x.where.includes('PX'))).toBe(true);
  });

  it('a non-standard conductor size is accepted with a warning', () => {
    const r = loadJob(
      jobFile({ nodes: nodes(), links: [m1(), link('C1', 'MSB', 'P1', cable(10, 3, 2.5), { device: mcb('C', 16) })] }),
    );
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.warnings.some((x) => x.severity === 'warning' && x.where.includes('C1')), listing(r.warnings)).toBe(true);
  });
});

describe('unknown top-level keys', () => {
  it('are kept through parse → serialise', () => {
    const file = jobFile({
      nodes: nodes(),
      links: [m1(), c('C1', 'MSB', 'P1')],
      extra: { futureThing: { a: [1, 2, { b: 'c' }] }, viewer: 'x' },
    });
    const r = parseJob(JSON.stringify(file));
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    const saved = serialiseJob(r.job);
    expect(saved.endsWith('\n')).toBe(true);
    const back = JSON.parse(saved) as Obj;
    expect(back.futureThing).toEqual({ a: [1, 2, { b: 'c' }] });
    expect(back.viewer).toBe('x');
    expect(back.format).toBe('loopwright.job');
    expect(back.version).toBe(2);
    // 2-space JSON
    expect(saved).toBe(`${JSON.stringify(back, null, 2)}\n`);
  });
});
