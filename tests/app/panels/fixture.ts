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

/**
 * A version 2 job with loads (invented data, for tests only): a single-phase supply of known
 * impedance, a board with diversity, C1 a short lighting circuit that passes every check, C2 a
 * long 2.5 mm² circuit carrying 20 A whose voltage drop fails (about 15 % of U0 by
 * method-depth.md section 3), C3 a circuit with a measured reading.
 */
export function loadsJob(): Job {
  const value = {
    format: 'loopwright.job',
    version: 2,
    job: { title: 'Loads test', site: '', client: '', designer: '', reference: 'T-2', revision: 'A', date: '2026-12-01', notes: '' },
    rules: { basis: 'iec' },
    nodes: [
      { id: 'S1', kind: 'supply', name: 'Point of supply', at: { x: 0, y: 0 }, source: { type: 'impedance', r: 0.2, x: 0.1 },
        phases: 1, maxFault: { current: 6000, xr: 1 } },
      { id: 'MSB', kind: 'board', name: 'Main switchboard', at: { x: 0, y: 160 }, diversity: 0.9 },
      { id: 'P1', kind: 'point', name: 'Hall lights', use: 'lighting', at: { x: -200, y: 320 }, current: 2 },
      { id: 'P2', kind: 'point', name: 'Shed heater', use: 'fixed-equipment', at: { x: 0, y: 320 }, current: 20, powerFactor: 1 },
      { id: 'P3', kind: 'point', name: 'Garage', use: 'socket-outlets', at: { x: 200, y: 320 }, current: 8 },
    ],
    links: [
      { id: 'M1', from: 'S1', to: 'MSB', cable: { length: 10, material: 'Cu', active: 16, earth: 6 },
        device: { type: 'curve', rating: 63, points: [[200, 10], [400, 1], [1000, 0.1]], breaking: 10 } },
      { id: 'C1', from: 'MSB', to: 'P1', name: 'Hall lights', cable: { length: 12, material: 'Cu', active: 1.5, earth: 1.5 },
        device: { type: 'mcb', curve: 'B', rating: 10, breaking: 6 } },
      { id: 'C2', from: 'MSB', to: 'P2', name: 'Shed heater', cable: { length: 120, material: 'Cu', active: 2.5, earth: 2.5 },
        device: { type: 'mcb', curve: 'B', rating: 20, breaking: 6 }, rcd: { sensitivity: 0.03 } },
      { id: 'C3', from: 'MSB', to: 'P3', name: 'Garage power', cable: { length: 20, material: 'Cu', active: 2.5, earth: 2.5 },
        device: { type: 'mcb', curve: 'C', rating: 16, breaking: 6 }, measured: { zs: 0.75, temperature: 15, date: '2026-11-30', instrument: 'LT-1' } },
    ],
  };
  const loaded = loadJob(value);
  if (!loaded.ok) throw new Error(`fixture does not load: ${loaded.problems.map((p) => p.message).join('; ')}`);
  return loaded.job;
}
