// The length edit rehearsed when the browser is idle after a job opens (editor.ts rehearseSoon):
// it changes nothing in the store, and the edits after it give exactly the results of a fresh
// analysis (the rehearsal ran from the same analysis the first real edit starts from).
import { describe, expect, it } from 'vitest';
import { analyse } from '../../engine/index.js';
import { useEditor } from '../../app/renderer/store/index.js';
import { generateJob } from '../bench/generate.js';

const idle = () => new Promise<void>((ok) => setTimeout(ok, 20));

describe('the rehearsed length edit after a job opens', () => {
  it('leaves the store as it was, and the first edits after it are exact', async () => {
    const job = generateJob(120);
    useEditor.getState().loadJob(job, { name: 'rehearsal.lwj' });
    const before = useEditor.getState();
    await idle();
    const after = useEditor.getState();
    expect(after).toBe(before);
    expect(after.job).toBe(job);
    expect(after.dirty).toBe(false);
    expect(after.canUndo).toBe(false);

    // Edit the link a rehearsal would pick (the last final subcircuit) and another one.
    const points = new Set(job.nodes.filter((n) => n.kind === 'point').map((n) => n.id));
    const finals = job.links.filter((l) => points.has(l.to));
    for (const link of [finals.at(-1)!, finals[0]!]) {
      const outcome = useEditor.getState().apply({ op: 'update-link', id: link.id, patch: { cable: { ...link.cable, length: 250 } } });
      expect(outcome.ok).toBe(true);
      const s = useEditor.getState();
      const fresh = analyse(s.job);
      for (const c of fresh.circuits) {
        const shown = s.resultById[c.link];
        expect(shown?.status, c.link).toBe(c.status);
        if (c.zs === null) expect(shown?.zs, c.link).toBeNull();
        else expect(shown?.zs, c.link).toBeCloseTo(c.zs, 9);
      }
      expect(s.results.summary).toEqual(fresh.summary);
    }
  });

  it('does nothing for a job replaced before the browser was idle', async () => {
    useEditor.getState().loadJob(generateJob(40), { name: 'first.lwj' });
    const second = generateJob(60);
    useEditor.getState().loadJob(second, { name: 'second.lwj' });
    const before = useEditor.getState();
    await idle();
    expect(useEditor.getState()).toBe(before);
    expect(useEditor.getState().job).toBe(second);
  });
});
