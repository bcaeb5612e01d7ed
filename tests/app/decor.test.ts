// The sheet's read-out names kept across edits (flow.ts decorKeeper): after any run of status
// changes they read exactly as a decor built afresh, only the nodes whose feeder's status moved
// are redone, and an edit that moves no status hands back the last decor itself.
import { describe, expect, it } from 'vitest';
import { decorKeeper, flowList, sheetDecor, toFlowNode } from '../../app/renderer/sheet/flow.js';
import { generateJob } from '../bench/generate.js';

const STATUSES = ['pass', 'fail', 'rcd', 'unchecked'] as const;

/** A small deterministic generator (invented data for the test, not a property of any job). */
function lcg(seed: number): () => number {
  let x = seed >>> 0;
  return () => {
    x = (Math.imul(x, 1664525) + 1013904223) >>> 0;
    return x / 2 ** 32;
  };
}

function ids(job: { nodes: readonly { id: string }[]; links: readonly { id: string }[] }): string[] {
  return [...job.nodes.map((n) => n.id), ...job.links.map((l) => l.id)];
}

describe('the sheet decor kept across edits', () => {
  const job = generateJob(60);
  const searchable = { nodes: job.nodes, links: job.links };

  it('reads every node and link exactly as a fresh decor after many status changes (past the layer limit)', () => {
    const random = lcg(7);
    let results: Record<string, { status: string }> = Object.fromEntries(job.links.map((l) => [l.id, { status: 'pass' }]));
    const keep = decorKeeper();
    keep(searchable, results);
    for (let round = 0; round < 30; round++) {
      const next = { ...results };
      const flips = 1 + Math.floor(random() * 3);
      for (let k = 0; k < flips; k++) {
        const link = job.links[Math.floor(random() * job.links.length)]!;
        next[link.id] = { status: STATUSES[Math.floor(random() * STATUSES.length)]! };
      }
      results = next;
      const kept = keep(searchable, results);
      const fresh = sheetDecor(searchable, results);
      for (const id of ids(job)) expect(kept.label.get(id), `${id} after round ${round}`).toBe(fresh.label.get(id));
      expect([...kept.unfed]).toEqual([...fresh.unfed]);
    }
  });

  it('hands back the same decor when no status moved, and redoes only the node fed by a changed link', () => {
    const keep = decorKeeper();
    const results: Record<string, { status: string }> = Object.fromEntries(job.links.map((l) => [l.id, { status: 'pass' }]));
    const first = keep(searchable, results);
    // New result objects with the same statuses (an edit that moved numbers, not verdicts).
    const same = Object.fromEntries(job.links.map((l) => [l.id, { status: 'pass' }]));
    expect(keep(searchable, same)).toBe(first);

    const link = job.links.find((l) => job.nodes.find((n) => n.id === l.to)?.kind === 'point')!;
    const changed = keep(searchable, { ...same, [link.id]: { status: 'fail' } });
    expect(changed).not.toBe(first);
    expect(changed.changedFrom?.base).toBe(first);
    expect([...changed.changedFrom!.ids]).toEqual([link.to]);
    expect(changed.label.get(link.to)).toMatch(new RegExp(`fed by ${link.id}: ✗ FAIL$`));

    // The flow list remakes that one node: every other entry is the very same object.
    const list = flowList(toFlowNode);
    const before = list(job.nodes, [], first);
    const after = list(job.nodes, [], changed);
    const moved = after.flatMap((n, i) => (n === before[i] ? [] : [n.id]));
    expect(moved).toEqual([link.to]);
  });

  it('starts afresh when an id, name or end changes (a new searchable object)', () => {
    const keep = decorKeeper();
    const results = Object.fromEntries(job.links.map((l) => [l.id, { status: 'pass' }]));
    keep(searchable, results);
    const nodes = job.nodes.map((n, i) => (i === 3 ? { ...n, name: 'Renamed board' } : n));
    const renamed = keep({ nodes, links: job.links }, results);
    expect(renamed.changedFrom).toBeUndefined();
    expect(renamed.label.get(nodes[3]!.id)).toContain('"Renamed board"');
  });
});
