// A generated installation of any size, for benchmarks and size tests (invented data).

import type { Job, JobNode, Link } from '../../engine/index.js';
import { newJob } from '../../engine/index.js';

/**
 * A supply, a main switchboard, `boards` distribution boards and `points` final subcircuits
 * spread over them (invented data). Every check has something to work on: the points draw
 * currents (so design currents, voltage drop and capacity are checked), the boards have a
 * diversity, the cables state their capacity, the devices their breaking capacity, the supply its
 * maximum fault level, and every tenth circuit carries a measured reading.
 */
export function generateJob(points: number, boards = Math.max(1, Math.ceil(points / 24)), known = true): Job {
  const job = newJob();
  job.job.title = `Generated installation, ${points} circuits`;
  const nodes: JobNode[] = [
    {
      id: 'S1',
      kind: 'supply',
      name: 'Supply',
      at: { x: 0, y: 0 },
      phases: 3,
      source: known ? { type: 'fault-current', current: 40000, xr: 3 } : { type: 'unknown' },
      ...(known ? { maxFault: { current: 45000, xr: 3 } } : {}),
    },
    { id: 'MSB', kind: 'board', name: 'Main switchboard', at: { x: 0, y: 160 }, diversity: 0.3 },
  ];
  const links: Link[] = [
    {
      id: 'M1',
      from: 'S1',
      to: 'MSB',
      cable: { length: 15, material: 'Cu', active: 630, earth: 300, parallel: 4, capacity: 4000, insulation: 'xlpe' },
      device: { type: 'adjustable', rating: 3200, instantaneous: 10000, breaking: 65 },
    },
  ];
  for (let b = 1; b <= boards; b++) {
    nodes.push({ id: `DB${b}`, kind: 'board', name: `Board ${b}`, at: { x: b * 900, y: 320 }, diversity: 0.5 });
    links.push({
      id: `SM${b}`,
      from: 'MSB',
      to: `DB${b}`,
      cable: { length: 20 + (b % 7) * 10, material: 'Cu', active: 25, earth: 16, capacity: 100 },
      device: { type: 'mcb', curve: 'C', rating: 80, breaking: 25 },
    });
  }
  const uses = ['socket-outlets', 'lighting', 'fixed-equipment', 'motor', 'other'] as const;
  for (let p = 1; p <= points; p++) {
    const board = ((p - 1) % boards) + 1;
    const use = uses[p % uses.length]!;
    const slot = Math.floor((p - 1) / boards);
    const lighting = use === 'lighting';
    nodes.push({ id: `P${p}`, kind: 'point', name: `Circuit ${p}`, use, current: lighting ? 0.5 : 1 + (p % 5) * 0.5, at: { x: board * 900 + (slot % 6) * 140, y: 520 + Math.floor(slot / 6) * 160 } });
    const area = lighting ? 1.5 : 2.5;
    links.push({
      id: `C${p}`,
      from: `DB${board}`,
      to: `P${p}`,
      cable: { length: 5 + ((p * 7) % 60), material: 'Cu', active: area, earth: area, capacity: lighting ? 17 : 24 },
      device: { type: 'mcb', curve: use === 'motor' ? 'D' : lighting ? 'B' : 'C', rating: lighting ? 10 : 20, breaking: 10 },
      ...(use === 'socket-outlets' ? { rcd: { sensitivity: 0.03 } } : {}),
      ...(p % 10 === 0 ? { measured: { zs: 0.4 + (p % 13) * 0.1, temperature: 20 } } : {}),
    });
  }
  job.nodes = nodes;
  job.links = links;
  return job;
}

/** A chain of `boards` boards, each fed from the one before, with one circuit at the far end
 *  (invented data): the deepest tree the element limit allows. */
export function generateChain(boards: number): Job {
  const job = newJob();
  job.job.title = `Generated chain of ${boards} boards`;
  const nodes: JobNode[] = [{ id: 'S1', kind: 'supply', name: 'Supply', at: { x: 0, y: 0 }, source: { type: 'fault-current', current: 20000 } }];
  const links: Link[] = [];
  let from = 'S1';
  for (let b = 1; b <= boards; b++) {
    nodes.push({ id: `B${b}`, kind: 'board', name: `Board ${b}`, at: { x: 0, y: b * 160 } });
    links.push({ id: `L${b}`, from, to: `B${b}`, cable: { length: 0.5, material: 'Cu', active: 240, earth: 120 }, device: { type: 'mcb', curve: 'C', rating: 63 } });
    from = `B${b}`;
  }
  nodes.push({ id: 'P1', kind: 'point', name: 'Far circuit', use: 'other', at: { x: 0, y: (boards + 1) * 160 } });
  links.push({ id: 'C1', from, to: 'P1', cable: { length: 10, material: 'Cu', active: 2.5, earth: 2.5 }, device: { type: 'mcb', curve: 'C', rating: 16 } });
  job.nodes = nodes;
  job.links = links;
  return job;
}

/** One board feeding a chain of `points` points, each fed from the one before (invented data):
 *  a tree as deep as the chain of boards, but with no board to split the printout by. */
export function generatePointChain(points: number): Job {
  const job = generateChain(1);
  job.job.title = `Generated chain of ${points} points`;
  job.nodes = job.nodes.filter((n) => n.kind !== 'point');
  job.links = job.links.filter((l) => l.to !== 'P1');
  let from = 'B1';
  for (let i = 1; i <= points; i++) {
    job.nodes.push({ id: `P${i}`, kind: 'point', name: `Point ${i}`, use: 'other', at: { x: (i % 7) * 50, y: 320 + i * 120 } });
    job.links.push({ id: `C${i}`, from, to: `P${i}`, cable: { length: 0.2, material: 'Cu', active: 2.5, earth: 2.5 }, device: { type: 'mcb', curve: 'C', rating: 16 } });
    from = `P${i}`;
  }
  return job;
}

/** One board with `circuits` final subcircuits on it (invented data): the widest tree. */
export function generateWideBoard(circuits: number): Job {
  const job = generateJob(circuits, 1);
  job.job.title = `Generated board with ${circuits} circuits`;
  return job;
}
