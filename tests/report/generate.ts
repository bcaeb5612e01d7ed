// A generated job of 201 links (invented, for tests only): one supply, a main switchboard,
// eight distribution boards of 24 final subcircuits each, with long runs that fail, RCDs,
// unprotected legs and both a known and an unknown source.

import type { Job, Link, JobNode } from '../../engine/index.js';

export function generatedJob(options: { drawn?: boolean; unknownSource?: boolean } = {}): Job {
  const drawn = options.drawn ?? true;
  const nodes: JobNode[] = [
    {
      id: 'S1', kind: 'supply', name: 'Point of supply',
      source: options.unknownSource === true ? { type: 'unknown' } : { type: 'impedance', r: 0.15, x: 0.05 },
    },
    { id: 'MSB', kind: 'board', name: 'Main switchboard' },
  ];
  const links: Link[] = [{ id: 'M1', from: 'S1', to: 'MSB', name: 'Consumer mains', cable: { length: 20, material: 'Cu', active: 95, earth: 50 } }];
  for (let b = 1; b <= 8; b++) {
    const db = `DB${b}`;
    nodes.push({ id: db, kind: 'board', name: `Distribution board ${b}` });
    links.push({
      id: `SM${b}`, from: 'MSB', to: db, name: `Submain ${b}`,
      cable: { length: 15 + b * 5, material: b % 2 === 0 ? 'Al' : 'Cu', active: 35, earth: 16 },
      device: { type: 'mcb', curve: 'C', rating: 63 },
    });
    for (let c = 1; c <= 24; c++) {
      const id = `F${b}-${String(c).padStart(2, '0')}`;
      const point = `P${b}-${String(c).padStart(2, '0')}`;
      nodes.push({ id: point, kind: 'point', name: `Circuit ${c} of board ${b}`, use: c % 3 === 0 ? 'lighting' : 'socket-outlets' });
      const link: Link = {
        id, from: db, to: point, name: `Final ${b}.${c}`,
        cable: { length: 5 + ((c * 7 + b * 3) % 60), material: 'Cu', active: c % 4 === 0 ? 1.5 : 2.5, earth: c % 4 === 0 ? 1.5 : 2.5 },
      };
      if (c !== 24) link.device = { type: 'mcb', curve: c % 5 === 0 ? 'D' : c % 2 === 0 ? 'B' : 'C', rating: c % 4 === 0 ? 16 : 20 };
      if (c % 3 === 1) link.rcd = { sensitivity: 0.03 };
      links.push(link);
    }
  }
  if (drawn) {
    nodes.forEach((n) => {
      if (n.id === 'S1') n.at = { x: 2400, y: 0 };
      else if (n.id === 'MSB') n.at = { x: 2400, y: 160 };
      else if (n.id.startsWith('DB')) n.at = { x: 2400, y: 160 + Number(n.id.slice(2)) * 340 };
      else {
        const [b, c] = n.id.slice(1).split('-').map(Number);
        n.at = { x: ((c ?? 1) - 1) * 200, y: 160 + (b ?? 1) * 340 + 170 };
      }
    });
  }
  return {
    format: 'loopwright.job', version: 2,
    job: { title: 'Generated test job, 201 links', site: 'Invented site', client: 'Test', designer: 'Test', reference: 'GEN-200', revision: 'B', date: '2026-01-15', notes: '' },
    rules: { basis: 'au-nz' }, nodes, links,
  };
}
