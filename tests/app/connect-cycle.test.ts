// The radial rule while drawing: a link that would close a loop is refused with a reason in the
// drawing's own terms (which node already feeds which, through which links).
import { describe, expect, it } from 'vitest';
import { loadJob, type Job } from '../../engine/index.js';
import { cycleReason } from '../../app/renderer/sheet/connect.js';
import { smallJob } from './fixture.js';

/** Two boards no supply reaches yet: B1 → SM1 → B2 → SM2 → B3. */
function looseChain(): Job {
  const job = smallJob();
  const cable = { length: 10, material: 'Cu' as const, active: 6, earth: 6 };
  return {
    ...job,
    nodes: [...job.nodes, { id: 'B1', kind: 'board', name: 'B1' }, { id: 'B2', kind: 'board', name: 'B2' }, { id: 'B3', kind: 'board', name: 'B3' }],
    links: [...job.links, { id: 'SM1', from: 'B1', to: 'B2', cable }, { id: 'SM2', from: 'B2', to: 'B3', cable }],
  };
}

describe('cycleReason', () => {
  it('names the link through which the target already feeds the source', () => {
    expect(cycleReason(looseChain(), 'B2', 'B1')).toBe(
      '"B1" already feeds "B2" (through link SM1), so this link would close a loop; the network must be radial (a tree from each supply)',
    );
  });

  it('names every link of a longer loop, from the target down', () => {
    expect(cycleReason(looseChain(), 'B3', 'B1')).toContain('(through links SM1, SM2)');
  });

  it('leaves a link into a supply to the plainer rule (a supply is fed by no link)', () => {
    expect(cycleReason(smallJob(), 'P1', 'S1')).toBeNull();
    const refused = loadJob({ ...smallJob(), links: [...smallJob().links, { id: 'X1', from: 'P1', to: 'S1', cable: { length: 1, material: 'Cu', active: 2.5, earth: 2.5 } }] });
    expect(refused.ok).toBe(false);
    if (!refused.ok) expect(refused.problems.map((p) => p.message).join(' ')).toMatch(/a supply is where the network starts and is fed by no link/);
  });

  it('says nothing for a link that keeps the network radial, or for a second feeder', () => {
    expect(cycleReason(looseChain(), 'MSB', 'B1')).toBeNull();
    expect(cycleReason(looseChain(), 'B3', 'P1')).toBeNull(); // P1 is fed twice: the job's own rule says so
    expect(cycleReason(smallJob(), 'P1', 'P1')).toBeNull();
  });
});
