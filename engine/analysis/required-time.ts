// The required disconnection time t_req for a link, by basis and use.
//
// au-nz (AS/NZS 3000:2018 clause 5.7.4, from memory): 0.4 s for a final subcircuit whose far
//   point supplies socket-outlets and whose protecting device is rated ≤ 63 A, or whose far point
//   is hand-held equipment; 5 s for every other circuit.
// iec (IEC 60364-4-41:2005 Table 41.1 and 411.3.2.3, TN, 230 V, from memory): 0.4 s for a final
//   circuit whose protecting device is rated ≤ 32 A; 5 s otherwise.
// Consumer mains and submains always 5 s. A link's own `requiredTime` overrides.

import type { BasisName, Device, JobNode, Link } from '../model/types.js';
import type { LinkRole } from './results.js';

export const SHORT_TIME = 0.4;
export const LONG_TIME = 5;

export function requiredTime(basis: BasisName, link: Link, role: LinkRole, farNode: JobNode | undefined, device: Device): number {
  if (link.requiredTime !== undefined) return link.requiredTime;
  if (role !== 'final-subcircuit' || farNode?.kind !== 'point') return LONG_TIME;
  if (basis === 'iec') return device.rating <= 32 ? SHORT_TIME : LONG_TIME;
  if (farNode.handHeld === true) return SHORT_TIME;
  if (farNode.use === 'socket-outlets' && device.rating <= 63) return SHORT_TIME;
  return LONG_TIME;
}
