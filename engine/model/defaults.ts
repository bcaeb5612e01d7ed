// New jobs and new links: sensible starting values, chosen by the link's role.

import type { Job, Link } from './types.js';
import { CURRENT_VERSION, FORMAT_NAME } from './types.js';
import { emptyDetails } from './job-details.js';

export { STANDARD_SIZES } from './sizes.js';

export function newJob(): Job {
  return { format: FORMAT_NAME, version: CURRENT_VERSION, job: emptyDetails(), rules: { basis: 'au-nz' }, nodes: [], links: [] };
}

/**
 * A new link from `fromId` to `toId` with defaults for its role (common practice starting points,
 * to be edited): consumer mains 25/10 mm² Cu 10 m; submain 16/6 mm² Cu 20 m with a C63 breaker;
 * final subcircuit to socket-outlets 2.5/2.5 mm² Cu 20 m with C20 and a 30 mA RCD; to lighting
 * 1.5/1.5 mm² with B10; other points 2.5/2.5 mm² with C16. A leg leaving a point has no device.
 */
export function defaultLinkFor(job: Job, fromId: string, toId: string, id: string): Link {
  const from = job.nodes.find((n) => n.id === fromId);
  const to = job.nodes.find((n) => n.id === toId);
  if (to?.kind === 'point') {
    const cable = to.use === 'lighting'
      ? { length: 20, material: 'Cu' as const, active: 1.5, earth: 1.5 }
      : { length: 20, material: 'Cu' as const, active: 2.5, earth: 2.5 };
    if (from?.kind === 'point') return { id, from: fromId, to: toId, cable };
    if (to.use === 'lighting') return { id, from: fromId, to: toId, cable, device: { type: 'mcb', curve: 'B', rating: 10 } };
    if (to.use === 'socket-outlets') {
      return { id, from: fromId, to: toId, cable, device: { type: 'mcb', curve: 'C', rating: 20 }, rcd: { sensitivity: 0.03 } };
    }
    return { id, from: fromId, to: toId, cable, device: { type: 'mcb', curve: 'C', rating: 16 } };
  }
  if (from?.kind === 'supply') return { id, from: fromId, to: toId, cable: { length: 10, material: 'Cu', active: 25, earth: 10 } };
  return { id, from: fromId, to: toId, cable: { length: 20, material: 'Cu', active: 16, earth: 6 }, device: { type: 'mcb', curve: 'C', rating: 63 } };
}
