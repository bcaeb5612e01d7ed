// faultPath: the ids from the top of a link's tree to its far end (used by the sheet's trace and
// the loop breakdown). Invented test data.
import { describe, expect, it } from 'vitest';
import { faultPath, parseJob, type Job } from '../../engine/index.js';

function job(nodes: unknown[], links: unknown[]): Job {
  const r = parseJob(JSON.stringify({ format: 'loopwright.job', version: 1, nodes, links }));
  if (!r.ok) throw new Error(r.problems.map((p) => p.message).join('; '));
  return r.job;
}
const cable = { length: 10, material: 'Cu', active: 2.5, earth: 2.5 };

describe('faultPath', () => {
  const j = job(
    [
      { id: 'S', kind: 'supply', source: { type: 'unknown' } },
      { id: 'B', kind: 'board' },
      { id: 'P', kind: 'point', use: 'lighting' },
      { id: 'Q', kind: 'point', use: 'lighting' },
      { id: 'X', kind: 'board' },
      { id: 'R', kind: 'point', use: 'other' },
    ],
    [
      { id: 'M', from: 'S', to: 'B', cable },
      { id: 'C', from: 'B', to: 'P', cable, device: { type: 'mcb', curve: 'B', rating: 10 } },
      { id: 'D', from: 'P', to: 'Q', cable },
      { id: 'E', from: 'X', to: 'R', cable, device: { type: 'mcb', curve: 'C', rating: 16 } },
    ],
  );
  it('runs from the supply through every link to the far end', () => {
    expect(faultPath(j, 'D')).toEqual({ ids: ['S', 'M', 'B', 'C', 'P', 'D', 'Q'], reachesSupply: true });
  });
  it('says when no supply reaches the link', () => {
    expect(faultPath(j, 'E')).toEqual({ ids: ['X', 'E', 'R'], reachesSupply: false });
  });
  it('is null for an unknown link', () => {
    expect(faultPath(j, 'nope')).toBeNull();
  });
});
