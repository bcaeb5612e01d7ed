// Jobs for the renderer-core tests (invented data, for tests only).
import { newJob, type Job } from '../../engine/index.js';

/** S1 → M1 → MSB → C1 → P1 (socket-outlets), MSB → C2 → P2 (lighting). */
export function smallJob(): Job {
  const job = newJob();
  return {
    ...job,
    job: { ...job.job, title: 'Test job' },
    nodes: [
      { id: 'S1', kind: 'supply', name: 'Supply', at: { x: 0, y: 0 }, source: { type: 'unknown' } },
      { id: 'MSB', kind: 'board', name: 'Main board', at: { x: 0, y: 160 } },
      { id: 'P1', kind: 'point', name: 'Sockets', use: 'socket-outlets', at: { x: -200, y: 320 } },
      { id: 'P2', kind: 'point', name: 'Lights', use: 'lighting', at: { x: 200, y: 320 } },
    ],
    links: [
      { id: 'M1', from: 'S1', to: 'MSB', cable: { length: 10, material: 'Cu', active: 16, earth: 6 } },
      { id: 'C1', from: 'MSB', to: 'P1', cable: { length: 20, material: 'Cu', active: 2.5, earth: 2.5 }, device: { type: 'mcb', curve: 'C', rating: 20 } },
      { id: 'C2', from: 'MSB', to: 'P2', cable: { length: 25, material: 'Cu', active: 1.5, earth: 1.5 }, device: { type: 'mcb', curve: 'B', rating: 10 } },
    ],
  };
}
