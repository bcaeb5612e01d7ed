// Limits before work (engine/model/limits.ts): a file too big, with too many elements or nested
// deeper than the format allows is refused at once, saying which limit and where; nothing
// deep is ever walked by recursion. Syntax errors give a line and column.
import { describe, expect, it } from 'vitest';
import { parseJob, type LoadResult, type Problem } from '../../engine/index.js';
import { checkLimits, FORMAT_DEPTH, jsonSyntaxError, LIMITS, scanLimits } from '../../engine/model/limits.js';
import { showValue } from '../../engine/model/problems.js';
import { board, cable, jobFile, link, point, unknownSupply } from './helpers.js';

function refusal(r: LoadResult): Problem {
  expect(r.ok).toBe(false);
  if (r.ok) throw new Error('loaded');
  expect(r.problems).toHaveLength(1);
  return r.problems[0]!;
}

const small = () =>
  jobFile({
    nodes: [unknownSupply('S1'), board('MSB'), point('P1', 'lighting')],
    links: [
      link('M1', 'S1', 'MSB', cable(10, 16, 6)),
      link('C1', 'MSB', 'P1', cable(20, 1.5, 1.5), { device: { type: 'curve', rating: 16, points: [[32, 10], [160, 0.1]] } }),
    ],
  });

/** `depth` nested lists: [[[...]]]. */
const nested = (depth: number) => `${'['.repeat(depth)}${']'.repeat(depth)}`;

describe('nesting', () => {
  it('a job as deep as the format goes (a curve device, level 6) and 2 more levels under an unknown key load', () => {
    expect(FORMAT_DEPTH).toBe(6);
    expect(LIMITS.depth).toBe(8);
    const text = JSON.stringify(small()).replace(/}$/, `,"laterFeature":${nested(LIMITS.depth - 1)}}`);
    expect(parseJob(text).ok).toBe(true);
  });

  it('one level more is refused, naming the limit and the path', () => {
    const text = JSON.stringify(small()).replace(/}$/, `,"laterFeature":${nested(LIMITS.depth)}}`);
    const p = refusal(parseJob(text));
    expect(p.where).toBe('file');
    expect(p.field).toBe('laterFeature[0][0][0][0][0][0][0]');
    expect(p.message).toMatch(/more than 8 levels deep at laterFeature\[0\]\[0\]\[0\]\[0\]\[0\]\[0\]\[0\] \(line 1 column \d+\)/);
  });

  it('a value nested 6,000 deep inside a device is refused at its path, without overflowing the stack', () => {
    const file = small();
    const text = JSON.stringify(file).replace('"points":[[32,10]', `"points":[[32,${nested(6000)}]`);
    const p = refusal(parseJob(text));
    expect(p.field).toBe('links[1].device.points[0][1][0][0]');
    expect(p.message).toMatch(/more than 8 levels deep at links\[1\]\.device\.points\[0\]\[1\]\[0\]\[0\] \(line 1 column \d+\)/);
  });

  it('objects nested 50,000 deep, and 100,000 lists with a deep one among them (the full text scan), are refused', () => {
    const deepObjects = `{"format":"loopwright.job","version":1,"x":${'{"a":'.repeat(50_000)}1${'}'.repeat(50_000)}}`;
    expect(refusal(parseJob(deepObjects)).field).toBe('x.a.a.a.a.a.a.a');
    // More objects and lists than the quick count allows, so the whole text is scanned before JSON.parse.
    const many = `{"format":"loopwright.job","version":1,"x":[${Array.from({ length: 100_000 }, () => '{"a":{}}').join(',')},${nested(20)}]}`;
    expect(checkLimits(many)?.field).toBe('x[100000][0][0][0][0][0][0]');
  });

  it('brackets and quotes inside texts are not nesting', () => {
    const file = small();
    (file.job as Record<string, unknown>).notes = `${'['.repeat(50)} "quoted" \\ ${'{'.repeat(50)}`;
    expect(parseJob(JSON.stringify(file)).ok).toBe(true);
    expect(scanLimits(JSON.stringify(file))).toBeNull();
  });

  it('an odd key in the path is quoted and cut', () => {
    const key = `a key with spaces ${'x'.repeat(60)}`;
    const text = `{"format":"loopwright.job","version":1,${JSON.stringify(key)}:${nested(9)}}`;
    const p = refusal(parseJob(text));
    expect(p.field).toMatch(/^\["a key with spaces x+…"\]\[0\]/);
    expect(p.field.length).toBeLessThan(80);
  });
});

describe('elements', () => {
  it('200,000 list items load as far as the limits go; one more is refused at its place', () => {
    const within = JSON.stringify(small()).replace(/}$/, `,"later":[${Array(LIMITS.elements - 100).fill(0).join(',')}]}`);
    expect(checkLimits(within)).toBeNull();
    expect(scanLimits(within)).toBeNull();
    const over = JSON.stringify(small()).replace(/}$/, `,"later":[${Array(LIMITS.elements).fill(0).join(',')}]}`);
    const p = refusal(parseJob(over));
    expect(p.message).toMatch(/more than 200,000 elements .*passed at later\[\d+\] \(line 1 column \d+\)/);
  });

  it('200,001 empty nodes are refused before JSON.parse builds them', () => {
    const text = `{"format":"loopwright.job","version":1,"nodes":[${Array(LIMITS.elements + 1).fill('{}').join(',')}],"links":[]}`;
    const p = checkLimits(text);
    expect(p?.field).toBe(`nodes[${LIMITS.elements}]`);
    expect(p?.message).toMatch(/more than 200,000 elements/);
  });
});

// A file of the current version is counted against the limits record by record as the loader
// reads it (LimitCount): a record its quick check passed is walked only when it holds a key the
// format does not name. The same limits, and the same messages, as for the whole-file walk.
describe('counted as the records are read (a version 2 file)', () => {
  const v2 = () => ({ ...small(), version: 2 });
  const links = (file: Record<string, unknown>) => file.links as Array<Record<string, unknown>>;
  const deepList = (levels: number): unknown => {
    let v: unknown = [];
    for (let i = 1; i < levels; i++) v = [v];
    return v;
  };

  it('an unknown key in a valid link\'s cable may nest to the limit; one more level is refused at its path', () => {
    // file 1 → links 2 → link 3 → cable 4 → the unknown key's lists from 5.
    const within = v2();
    (links(within)[1]!.cable as Record<string, unknown>).later = deepList(LIMITS.depth - 4);
    expect(parseJob(JSON.stringify(within)).ok).toBe(true);
    const over = v2();
    (links(over)[1]!.cable as Record<string, unknown>).later = deepList(LIMITS.depth - 3);
    const p = refusal(parseJob(JSON.stringify(over)));
    expect(p.field).toBe('links[1].cable.later[0][0][0][0]');
    expect(p.message).toMatch(/more than 8 levels deep at links\[1\]\.cable\.later\[0\]\[0\]\[0\]\[0\] \(line 1 column \d+\)/);
  });

  it('a 6,000-deep value under an unknown key of a valid node is refused without overflowing the stack', () => {
    const file = v2();
    const text = JSON.stringify(file).replace('"id":"MSB"', `"id":"MSB","drawing":${nested(6000)}`);
    const p = refusal(parseJob(text));
    expect(p.field).toBe('nodes[1].drawing[0][0][0][0][0]');
  });

  it('a record with a wrong value nested 6,000 deep gets the limit, not a message that shows the value', () => {
    const text = JSON.stringify(v2()).replace('"length":20', `"length":${nested(6000)}`);
    const p = refusal(parseJob(text));
    expect(p.field).toBe('links[1].cable.length[0][0][0][0]');
    expect(p.message).toMatch(/more than 8 levels deep/);
  });

  it("a valid curve's points count as list items: 60,000 load, 70,000 pass the element limit", () => {
    const withPoints = (n: number) => {
      const file = v2();
      const points = Array.from({ length: n }, (_, i) => [i + 1, n + 1 - i]);
      links(file)[1]!.device = { type: 'curve', rating: 16, points };
      return JSON.stringify(file);
    };
    // 3 nodes, 2 links and three items per point (the point and its two numbers).
    expect(parseJob(withPoints(60_000)).ok).toBe(true);
    const p = refusal(parseJob(withPoints(70_000)));
    expect(p.message).toMatch(/more than 200,000 elements .*passed at links\[1\]\.device\.points\[\d+\]/);
  });

  it('a list under an unknown key of a valid link counts its items', () => {
    const file = v2();
    links(file)[0]!.survey = Array(LIMITS.elements).fill(0);
    const p = refusal(parseJob(JSON.stringify(file)));
    expect(p.message).toMatch(/more than 200,000 elements .*passed at links\[0\]\.survey\[\d+\]/);
  });
});

describe('size', () => {
  it('a text over 50 MB is refused at once, saying so', () => {
    const text = ' '.repeat(LIMITS.size + 1);
    const p = refusal(parseJob(text));
    expect(p.where).toBe('file');
    expect(p.message).toMatch(/the file is 50\.0 MB, over the limit of 50\.0 MB/);
  });
});

describe('syntax errors give a line and column', () => {
  // Node 20's JSON.parse says "Unexpected token 'o', ..." with no position for these.
  it.each([
    ['{"a": x}', /found "x" where a value was expected, line 1 column 7/],
    ['{\n  "a": 1,\n  oops\n}', /found "o" where a property name in double quotes was expected, line 3 column 3/],
    ['[1,\n2,\n\u0001]', /found a control character \(U\+0001\) where a value was expected, line 3 column 1/],
    ['{"a": "b\u0007"}', /a text holds a control character \(U\+0007\).*line 1 column 9/],
    ['{"a": 1} trailing', /after the end of the JSON value, line 1 column 10/],
    ['{"a": [1, 2}', /found "}" where "," or "]" was expected, line 1 column 12/],
    ['{"a" 1}', /where ":" was expected after a property name, line 1 column 6/],
    ['{"a": "never closed', /never closed/],
    ['', /the file ends where a value was expected, line 1 column 1/],
    ['{"a": tru}', /found "t" where a value was expected, line 1 column 7/],
  ])('%j', (text, expected) => {
    const p = refusal(parseJob(text));
    expect(p.message).toMatch(/^the file is not valid JSON \(/);
    expect(p.message).toMatch(expected);
  });

  it('finds nothing wrong in valid JSON', () => {
    for (const text of ['{}', '[]', '{"a":[1,-2.5e3,true,false,null,"x\\u0041\\n"]}', ' "s" ', '0']) expect(jsonSyntaxError(text), text).toBeNull();
  });

  it('a byte order mark is not counted in the column', () => {
    expect(refusal(parseJob('\ufeff{"a": x}')).message).toMatch(/line 1 column 7/);
  });
});

describe('bad values are shown briefly', () => {
  it('cuts long texts and big values, and escapes what a terminal would act on', () => {
    expect(showValue('x'.repeat(100))).toBe(`"${'x'.repeat(40)}…"`);
    expect(showValue('😀'.repeat(30))).toBe(`"${'😀'.repeat(20)}…"`); // never half a character
    expect(showValue(Array(100_000).fill(1))).toBe('[1,1,1,1,1,1,1,1,"…"]');
    expect(showValue('\u001b[31mred\u009b\u202e')).toBe('"\\u001b[31mred\\u009b\\u202e"');
    expect(showValue({ a: 'y'.repeat(100) }).length).toBeLessThanOrEqual(61);
  });

  it('a record or envelope value that is not what it must be is cut and escaped in its message too', () => {
    const file: Record<string, unknown> = { ...small(), version: 2 };
    (file.nodes as unknown[])[1] = Array(150_000).fill(7);
    (file.links as unknown[])[0] = `\u001b[2J${'x'.repeat(500)}`;
    const r = parseJob(JSON.stringify(file));
    expect(r.ok).toBe(false);
    if (r.ok) return;
    const node = r.problems.find((q) => q.where === 'nodes[1]');
    expect(node?.message).toBe('each node must be an object, got [7,7,7,7,7,7,7,7,"…"]');
    const link = r.problems.find((q) => q.where === 'links[0]');
    expect(link?.message).toMatch(/^each link must be an object, got "\\u001b\[2Jx+…"$/);
    expect(link!.message.length).toBeLessThan(100);
    const format = refusal(parseJob(JSON.stringify({ ...small(), format: 'y'.repeat(10_000) })));
    expect(format.message).toMatch(/got "y{40}…"$/);
    const version = refusal(parseJob(JSON.stringify({ ...small(), version: ['\u0007'.repeat(100)] })));
    expect(version.message.length).toBeLessThan(120);
    expect(version.message).not.toMatch(/\u0007/);
  });

  it('a long bad value in a job is cut in its message', () => {
    const file = small();
    ((file.links as Record<string, unknown>[])[0]!.cable as Record<string, unknown>).material = 'copper'.repeat(100);
    const r = parseJob(JSON.stringify(file));
    expect(r.ok).toBe(false);
    if (r.ok) return;
    const p = r.problems.find((q) => q.field === 'cable.material');
    expect(p?.message).toMatch(/got "(copper){6}copp…"/);
    expect(p!.message.length).toBeLessThan(200);
  });
});
