// A file that is not JSON is refused as a whole, saying where the JSON breaks when the parser
// gives a position.
import { describe, expect, it } from 'vitest';
import { parseJob } from '../../engine/index.js';

describe('not JSON', () => {
  it('names the line and column of the break', () => {
    const r = parseJob('{"format": "loopwright.job",\n  "version": 1,\n  oops }');
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.problems).toHaveLength(1);
    expect(r.problems[0]!.where).toBe('file');
    expect(r.problems[0]!.message).toMatch(/not valid JSON .*line 3 column 3/);
  });
});
