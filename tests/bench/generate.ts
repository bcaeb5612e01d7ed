// A generated installation of any size, for benchmarks and size tests (invented data).

import type { Job, JobNode, Link } from '../../engine/index.js';
import { newJob } from '../../engine/index.js';

/** A supply, a main switchboard, `boards` distribution boards and `points` final subcircuits spread over them. */
export function generateJob(points: number, boards = Math.max(1, Math.ceil(points / 24)), known = true): Job {
  const job = newJob();
  job.job.title = `Generated installation, ${points} circuits`;
  const nodes: JobNode[] = [
    { id: 'S1', kind: 'supply', name: 'Supply', at: { x: 0, y: 0 }, source: known ? { type: 'fault-current', current: 6000 } : { type: 'unknown' } },
    { id: 'MSB', kind: 'board', name: 'Main switchboard', at: { x: 0, y: 160 } },
  ];
  const links: Link[] = [{ id: 'M1', from: 'S1', to: 'MSB', cable: { length: 15, material: 'Cu', active: 95, earth: 50 } }];
  for (let b = 1; b <= boards; b++) {
    nodes.push({ id: `DB${b}`, kind: 'board', name: `Board ${b}`, at: { x: b * 900, y: 320 } });
    links.push({ id: `SM${b}`, from: 'MSB', to: `DB${b}`, cable: { length: 20 + (b % 7) * 10, material: 'Cu', active: 25, earth: 16 }, device: { type: 'mcb', curve: 'C', rating: 80 } });
  }
  const uses = ['socket-outlets', 'lighting', 'fixed-equipment', 'motor', 'other'] as const;
  for (let p = 1; p <= points; p++) {
    const board = ((p - 1) % boards) + 1;
    const use = uses[p % uses.length]!;
    const slot = Math.floor((p - 1) / boards);
    nodes.push({ id: `P${p}`, kind: 'point', name: `Circuit ${p}`, use, at: { x: board * 900 + (slot % 6) * 140, y: 520 + Math.floor(slot / 6) * 160 } });
    links.push({
      id: `C${p}`,
      from: `DB${board}`,
      to: `P${p}`,
      cable: { length: 5 + ((p * 7) % 60), material: 'Cu', active: use === 'lighting' ? 1.5 : 2.5, earth: use === 'lighting' ? 1.5 : 2.5 },
      device: { type: 'mcb', curve: use === 'motor' ? 'D' : use === 'lighting' ? 'B' : 'C', rating: use === 'lighting' ? 10 : 20 },
      ...(use === 'socket-outlets' ? { rcd: { sensitivity: 0.03 } } : {}),
    });
  }
  job.nodes = nodes;
  job.links = links;
  return job;
}
