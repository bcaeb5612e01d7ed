// Unknown top-level keys are kept through load and save (forward compatibility), as plain data,
// even when a key's name would mean something to JavaScript objects.
import { describe, expect, it } from 'vitest';
import { parseJob, serialiseJob } from '../../engine/index.js';

const base = { format: 'loopwright.job', version: 1, nodes: [], links: [] };

describe('unknown top-level keys', () => {
  it('keeps a key named __proto__ as data and does not change the job object', () => {
    const text = JSON.stringify(base).replace(/}$/, ',"__proto__":{"polluted":true},"laterFeature":{"a":2}}');
    const loaded = parseJob(text);
    expect(loaded.ok).toBe(true);
    if (!loaded.ok) return;
    expect(({} as Record<string, unknown>).polluted).toBeUndefined();
    expect(Object.getPrototypeOf(loaded.job.extra)).toBe(Object.prototype);
    const again = JSON.parse(serialiseJob(loaded.job)) as Record<string, unknown>;
    expect(Object.prototype.hasOwnProperty.call(again, '__proto__')).toBe(true);
    expect(again.laterFeature).toEqual({ a: 2 });
  });

  it('refuses a job whose links are missing, naming the field', () => {
    const loaded = parseJob(JSON.stringify({ format: 'loopwright.job', version: 1, nodes: [] }));
    expect(loaded.ok).toBe(false);
    if (loaded.ok) return;
    expect(loaded.problems.map((p) => `${p.where}: ${p.message}`).join('\n')).toMatch(/links must be a list of links/);
  });
});
