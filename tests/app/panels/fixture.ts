// Jobs for the panel tests (invented data, for tests only) and store helpers.

import { loadJob, type Job } from '../../../engine/index.js';
import { useEditor } from '../../../app/renderer/store/index.js';

/**
 * One supply (unknown source), a board, and four final subcircuits chosen to cover every status:
 * C1 short (pass), C2 long with no RCD (fail), C3 long with an RCD (rcd), C4 without a device (unchecked).
 */
export function sampleJob(source: 'unknown' | 'known' = 'unknown'): Job {
  const value = {
    format: 'loopwright.job',
    version: 1,
    job: { title: 'Panel test', site: '', client: '', designer: '', reference: 'T-1', revision: 'A', date: '2026-12-01', notes: '' },
    rules: { basis: 'au-nz' },
    nodes: [
      { id: 'S1', kind: 'supply', name: 'Point of supply', at: { x: 0, y: 0 },
        source: source === 'known' ? { type: 'impedance', r: 0.2, x: 0.1 } : { type: 'unknown' } },
      { id: 'MSB', kind: 'board', name: 'Main switchboard', at: { x: 0, y: 160 } },
      { id: 'P1', kind: 'point', name: 'Kitchen', use: 'socket-outlets', at: { x: -200, y: 320 } },
      { id: 'P2', kind: 'point', name: 'Shed', use: 'socket-outlets', at: { x: 0, y: 320 } },
      { id: 'P3', kind: 'point', name: 'Garage', use: 'socket-outlets', at: { x: 200, y: 320 } },
      { id: 'P4', kind: 'point', name: 'Pump', use: 'motor', at: { x: 400, y: 320 } },
    ],
    links: [
      { id: 'M1', from: 'S1', to: 'MSB', cable: { length: 18, material: 'Cu', active: 16, earth: 6 } },
      { id: 'C1', from: 'MSB', to: 'P1', name: 'Kitchen power',
        cable: { length: 32, material: 'Cu', active: 2.5, earth: 2.5 },
        device: { type: 'mcb', curve: 'C', rating: 20 }, rcd: { sensitivity: 0.03 } },
      { id: 'C2', from: 'MSB', to: 'P2', name: 'Shed power',
        cable: { length: 120, material: 'Cu', active: 2.5, earth: 2.5 },
        device: { type: 'mcb', curve: 'C', rating: 20 } },
      { id: 'C3', from: 'MSB', to: 'P3', name: 'Garage power',
        cable: { length: 90, material: 'Cu', active: 2.5, earth: 2.5 },
        device: { type: 'mcb', curve: 'C', rating: 20 }, rcd: { sensitivity: 0.03 } },
      { id: 'C4', from: 'MSB', to: 'P4', cable: { length: 10, material: 'Cu', active: 4, earth: 2.5 } },
    ],
  };
  const loaded = loadJob(value);
  if (!loaded.ok) throw new Error(`fixture does not load: ${loaded.problems.map((p) => p.message).join('; ')}`);
  return loaded.job;
}

/** A job with `n` final subcircuits of rising length from one board, for the windowed schedule. */
export function largeJob(n: number): Job {
  const job = sampleJob();
  const nodes = job.nodes.slice(0, 2);
  const links = job.links.slice(0, 1);
  for (let i = 1; i <= n; i++) {
    nodes.push({ id: `P${i}`, kind: 'point', use: 'lighting', at: { x: i * 10, y: 320 } });
    links.push({ id: `C${i}`, from: 'MSB', to: `P${i}`, cable: { length: i % 97, material: 'Cu', active: 1.5, earth: 1.5 },
      device: { type: 'mcb', curve: 'B', rating: 10 } });
  }
  return { ...job, nodes, links };
}

export function load(job: Job): void {
  useEditor.getState().loadJob(job, { name: 'test.lwj' });
}

export function linkOf(id: string) {
  const link = useEditor.getState().job.links.find((l) => l.id === id);
  if (!link) throw new Error(`no link ${id}`);
  return link;
}
