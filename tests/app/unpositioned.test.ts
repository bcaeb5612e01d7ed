// A job written by another tool may carry no drawing positions: opening it lays those nodes out
// without making an undo step or marking the job changed, and never moves what the user drew.
import { describe, expect, it } from 'vitest';
import { useEditor } from '../../app/renderer/store/index.js';
import type { Job } from '../../engine/index.js';
import { smallJob } from './fixture.js';

const s = () => useEditor.getState();

async function settled(check: () => boolean): Promise<void> {
  for (let i = 0; i < 200 && !check(); i++) await new Promise((r) => setTimeout(r, 10));
}

function stripped(job: Job, keep: (id: string) => boolean): Job {
  return { ...job, nodes: job.nodes.map((n) => (keep(n.id) ? n : (({ at: _at, ...rest }) => rest)(n))) } as Job;
}

describe('opening a job without positions', () => {
  it('lays out every node when none has a position, as a clean job with no undo step', async () => {
    const job = stripped(smallJob(), () => false);
    s().loadJob(job, { name: 'other-tool.lwj' });
    await settled(() => s().job.nodes.every((n) => n.at !== undefined));
    const at = s().job.nodes.map((n) => n.at!);
    expect(at.every((p) => Number.isFinite(p.x) && Number.isFinite(p.y))).toBe(true);
    expect(new Set(at.map((p) => `${p.x},${p.y}`)).size).toBe(at.length); // no two stacked
    expect(s().dirty).toBe(false);
    expect(s().canUndo).toBe(false);
  });

  it('places only the missing nodes, to the right, and keeps the drawn ones where they are', async () => {
    const full = smallJob();
    const keepId = full.nodes[0]!.id;
    const job = stripped(full, (id) => id === keepId);
    s().loadJob(job, { name: 'partly.lwj' });
    await settled(() => s().job.nodes.every((n) => n.at !== undefined));
    const kept = s().job.nodes.find((n) => n.id === keepId)!;
    expect(kept.at).toEqual(full.nodes[0]!.at);
    for (const n of s().job.nodes) if (n.id !== keepId) expect(n.at!.x).toBeGreaterThan(kept.at!.x);
  });
});
