// Loading mutated jobs (fast-check): 10,000 valid jobs broken in cheap ways (keys deleted,
// values of the wrong type, huge, negative and NaN-like numbers, deep nesting, long texts,
// unicode and control characters, duplicated ids, cycles, cut or altered text) never make
// parseJob throw, always finish, and give either a job or problems that each say where they
// are. The seed is fixed in CI (tests/engine/setup.ts).

import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { parseJob, type LoadResult } from '../../engine/index.js';
import { checkValueLimits } from '../../engine/model/limits.js';
import { board, cable, faultCurrentSupply, jobFile, link, mcb, point, unknownSupply } from './helpers.js';

type Json = unknown;
type Path = Array<string | number>;

// Small jobs, so each run is cheap: together they hold every kind of node, device and source.
const BASES: Json[] = [
  jobFile({
    nodes: [faultCurrentSupply('S1', 6000), board('MSB'), board('DB1', { diversity: 0.8 }), point('P1', 'lighting', { current: 6 }), point('P2', 'motor', { phases: 3 })],
    links: [
      link('M1', 'S1', 'MSB', cable(10, 16, 6)),
      link('SM1', 'MSB', 'DB1', cable(25, 6, 2.5), { device: mcb('C', 32) }),
      link('C1', 'DB1', 'P1', cable(20, 1.5, 1.5), { device: { type: 'curve', rating: 16, points: [[32, 10], [160, 0.1]] }, rcd: { sensitivity: 0.03 } }),
      link('C2', 'MSB', 'P2', cable(30, 4, 2.5, { parallel: 2 }), { device: { type: 'adjustable', rating: 100, instantaneous: 800 } }),
    ],
  }),
  jobFile({
    nodes: [unknownSupply('S1'), point('P1', 'other', { handHeld: true }), { id: 'S2', kind: 'supply', source: { type: 'impedance', r: 0.1, x: 0.05 } }, point('P2', 'socket-outlets')],
    links: [link('C1', 'S1', 'P1', cable(5, 2.5, 2.5), { device: mcb('B', 10) }), link('C2', 'S2', 'P2', cable(15, 2.5, 2.5, { material: 'Al' }), { device: { type: 'fixed', rating: 20, tripCurrent: 100, label: 'F20' } })],
    extra: { laterFeature: { a: [1, 2] } },
  }),
];

// Each base also as a file of the current version (version 2 adds only optional fields), which
// the loader counts against the limits record by record as it reads (limits.ts LimitCount).
BASES.push(...BASES.map((b) => ({ ...(b as object), version: 2 })));

/** Every path to a value inside `root`, walked with a stack (the root itself is the empty path). */
function paths(root: Json): Path[] {
  const out: Path[] = [];
  const stack: Array<{ value: Json; path: Path }> = [{ value: root, path: [] }];
  while (stack.length > 0) {
    const { value, path } = stack.pop()!;
    out.push(path);
    if (Array.isArray(value)) value.forEach((v, i) => stack.push({ value: v, path: [...path, i] }));
    else if (typeof value === 'object' && value !== null) for (const [k, v] of Object.entries(value)) stack.push({ value: v, path: [...path, k] });
  }
  return out;
}

function parentOf(root: Json, path: Path): { parent: Record<string | number, Json>; key: string | number } | null {
  if (path.length === 0) return null;
  let parent = root as Record<string | number, Json>;
  for (const step of path.slice(0, -1)) parent = parent[step] as Record<string | number, Json>;
  return { parent, key: path[path.length - 1]! };
}

const nested = (depth: number): Json => {
  let v: Json = 1;
  for (let i = 0; i < depth; i++) v = i % 2 === 0 ? [v] : { a: v };
  return v;
};

const weirdNumber = fc.constantFrom<Json>(1e308, -1e308, -1, 0, -0, 5e-324, Number.MAX_SAFE_INTEGER + 2, 1e21, -273.15, 'NaN', 'Infinity', '-Infinity', '1e999', 0.1 + 0.2);
const weirdText = fc.oneof(
  fc.string({ unit: 'binary', maxLength: 20 }),
  fc.constantFrom('\u0000', '\u001b[31m', '\u202e', '\ud800', '=SUM(A1)', '<script>', '__proto__', 'constructor', ''),
  fc.integer({ min: 1_000, max: 20_000 }).map((n) => 'x'.repeat(n)),
);
const wrongType = fc.oneof(weirdNumber, weirdText, fc.constantFrom<Json>(null, true, false, [], {}, [1, 2], { type: 'unknown' }, [[1, 2], [3]]));

type Mutation = (root: Json, pick: number) => Json;

const mutation: fc.Arbitrary<Mutation> = fc.oneof(
  // delete a key or a list item
  fc.constant<Mutation>((root, pick) => {
    const all = paths(root);
    const at = parentOf(root, all[pick % all.length]!);
    if (at === null) return root;
    if (Array.isArray(at.parent)) at.parent.splice(at.key as number, 1);
    else delete at.parent[at.key];
    return root;
  }),
  // put a value of the wrong type, a weird number or text anywhere (the root included). A copy:
  // fc.constantFrom hands out the same object each time, and a later mutation could otherwise
  // change it for every job after, or set one of its keys to itself (a cycle no file can hold).
  wrongType.map<Mutation>((value) => (root, pick) => {
    const all = paths(root);
    const at = parentOf(root, all[pick % all.length]!);
    if (at === null) return structuredClone(value);
    at.parent[at.key] = structuredClone(value);
    return root;
  }),
  // nest a value deep: up to well past the depth limit
  fc.integer({ min: 1, max: 40 }).map<Mutation>((depth) => (root, pick) => {
    const all = paths(root);
    const at = parentOf(root, all[pick % all.length]!);
    if (at !== null) at.parent[at.key] = nested(depth);
    return root;
  }),
  // give one node or link the id of another
  fc.constant<Mutation>((root, pick) => {
    const r = root as { nodes?: Array<{ id?: Json }>; links?: Array<{ id?: Json }> };
    const items = [...(Array.isArray(r.nodes) ? r.nodes : []), ...(Array.isArray(r.links) ? r.links : [])].filter((x) => typeof x === 'object' && x !== null);
    if (items.length >= 2) items[(pick + 1) % items.length]!.id = items[pick % items.length]!.id;
    return root;
  }),
  // duplicate a link (a node fed twice, a repeated id)
  fc.constant<Mutation>((root, pick) => {
    const r = root as { links?: Json[] };
    if (Array.isArray(r.links) && r.links.length > 0) r.links.push(structuredClone(r.links[pick % r.links.length]));
    return root;
  }),
  // close a loop: a link fed from a node below it, or from its own far end
  fc.constant<Mutation>((root, pick) => {
    const r = root as { links?: Array<{ from?: Json; to?: Json }> };
    if (!Array.isArray(r.links) || r.links.length === 0) return root;
    const a = r.links[pick % r.links.length];
    const b = r.links[(pick >> 3) % r.links.length];
    if (typeof a === 'object' && a !== null && typeof b === 'object' && b !== null) a.from = b.to;
    return root;
  }),
);

/** Text-level damage: cut the file short, or put a character where it breaks the JSON. */
const textDamage = fc.oneof(
  fc.constant((text: string, pick: number) => text.slice(0, pick % (text.length + 1))),
  fc.constantFrom('{', '}', '[', ']', ',', ':', '"', '\\', '\u0000', 'x', '\n').map((c) => (text: string, pick: number) => {
    const at = pick % (text.length + 1);
    return `${text.slice(0, at)}${c}${text.slice(at)}`;
  }),
);

function expectPlaces(result: LoadResult): void {
  if (result.ok) {
    expect(typeof result.job).toBe('object');
    for (const w of result.warnings) expect(w.where.length, w.message).toBeGreaterThan(0);
    return;
  }
  expect(result.problems.length).toBeGreaterThan(0);
  for (const p of result.problems) {
    expect(typeof p.where).toBe('string');
    expect(p.where.length, p.message).toBeGreaterThan(0);
    expect(p.message.length).toBeGreaterThan(0);
  }
}

describe('loading mutated jobs', () => {
  it('never throws, and gives a job or located problems (10,000 jobs)', () => {
    const seen = { loaded: 0, refused: 0, deep: 0 };
    fc.assert(
      fc.property(
        fc.nat({ max: BASES.length - 1 }),
        fc.array(fc.tuple(mutation, fc.nat()), { minLength: 1, maxLength: 4 }),
        fc.option(fc.tuple(textDamage, fc.nat()), { freq: 5 }),
        (base, mutations, damage) => {
          let job = structuredClone(BASES[base]);
          for (const [mutate, pick] of mutations) if (typeof job === 'object' && job !== null) job = mutate(job, pick);
          let text = JSON.stringify(job) ?? 'undefined';
          if (damage !== null) text = damage[0](text, damage[1]);
          let result: LoadResult | undefined;
          expect(() => {
            result = parseJob(text);
          }).not.toThrow();
          expectPlaces(result!);
          if (result!.ok) seen.loaded++;
          else seen.refused++;
          if (!result!.ok && result!.problems.some((p) => /levels deep/.test(p.message))) seen.deep++;
          // Counted as the records are read or walked whole first, the limits say the same.
          let value: unknown = undefined;
          try {
            value = JSON.parse(text);
          } catch {
            return;
          }
          const limit = checkValueLimits(value, text);
          if (limit !== null) expect(result).toEqual({ ok: false, problems: [limit] });
          else if (!result!.ok) for (const p of result!.problems) expect(p.message).not.toMatch(/levels deep|elements; nothing was read|elements \(list items/);
        },
      ),
      { numRuns: 10_000 },
    );
    // The mutations reach every outcome: some jobs still load, some are refused, some too deep.
    expect(seen.loaded).toBeGreaterThan(0);
    expect(seen.refused).toBeGreaterThan(0);
    expect(seen.deep).toBeGreaterThan(0);
  });
});
