// The record definitions (engine/model/schema.ts) and what is generated from them: the loader's
// quick check (engine/model/generated/clean.ts) and the published JSON Schemas (schema/*.json).
//  - the generated files are what the definitions give today (regenerate: npm run gen:schema);
//  - the quick check and the reporting check agree on every record, valid or broken (fast-check);
//  - the demo jobs and the fixtures validate against the job schema with an independent
//    validator (Ajv, JSON Schema draft 2020-12), broken files do not, and the results of
//    analysing them validate against the results schema, whose records allow no other keys.

import { readFileSync, readdirSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import fc from 'fast-check';
import { Ajv2020 } from 'ajv/dist/2020.js';
import { describe, expect, it } from 'vitest';
import { analyse, parseJob, serialiseJob } from '../../engine/index.js';
import { emitClean, jobSchema, resultsSchema } from '../../engine/model/schema-emit.js';
import { cleanDetails, cleanLink, cleanNode, cleanRules } from '../../engine/model/generated/clean.js';
import { reportFields } from '../../engine/model/check-spec.js';
import { Site, isObject } from '../../engine/model/fields.js';
import { DETAILS, LINK, NODE, RULES, type ObjectSpec } from '../../engine/model/schema.js';
import type { Problem } from '../../engine/model/problems.js';
import { generateJob } from '../bench/generate.js';
import { board, cable, faultCurrentSupply, jobFile, link, mcb, point, unknownSupply } from './helpers.js';

const root = fileURLToPath(new URL('../..', import.meta.url));
const read = (path: string): string => readFileSync(root + path, 'utf8');

describe('generated from the definitions', () => {
  it('engine/model/generated/clean.ts is up to date (npm run gen:schema)', () => {
    expect(read('engine/model/generated/clean.ts')).toBe(emitClean());
  });
  it('schema/job.schema.json and schema/results.schema.json are up to date', () => {
    expect(JSON.parse(read('schema/job.schema.json'))).toEqual(jobSchema());
    expect(JSON.parse(read('schema/results.schema.json'))).toEqual(resultsSchema());
  });
});

// ------------------------------------------------------------------------------------------
// The two checks agree

const NODES: unknown[] = [
  faultCurrentSupply('S1', 6000),
  { id: 'S2', kind: 'supply', source: { type: 'impedance', r: 0.1, x: 0.05 }, phases: 3, maxFault: { current: 9000, xr: 2 }, measured: { ze: 0.2, date: '2026-01-01' } },
  unknownSupply('S3'),
  board('DB1', { diversity: 0.8, name: 'Board', notes: null }),
  point('P1', 'lighting', { current: 6, handHeld: false, phases: 1, powerFactor: 0.9 }),
  point('P2', 'motor', { phases: 3 }),
];
const LINKS: unknown[] = [
  link('M1', 'S1', 'DB1', cable(10, 16, 6, { parallel: 2, insulation: 'xlpe', earthMaterial: 'Al', reactance: 0.00008, capacity: 80, derating: 0.9, earthInCable: false })),
  link('C1', 'DB1', 'P1', cable(20, 1.5, 1.5), { device: { type: 'curve', rating: 16, points: [[32, 10], [160, 0.1]] }, rcd: { sensitivity: 0.03 }, measured: { zs: 0.9, temperature: 18 } }),
  link('C2', 'DB1', 'P2', cable(30, 4, 2.5), { device: { type: 'adjustable', rating: 100, instantaneous: 800, tolerance: 0.1, breaking: 6, letThrough: 1e5 }, requiredTime: 0.4, phases: 3 }),
  link('C3', 'DB1', 'P2', cable(5, 2.5, 2.5), { device: { type: 'fixed', rating: 20, tripCurrent: 100, label: 'F20' }, designCurrent: 12, powerFactor: 0.8, voltageDropLimit: 4 }),
  link('C4', 'DB1', 'P2', cable(5, 2.5, 2.5), { device: mcb('B', 10), name: 'Four' }),
];
const RULE_SETS: unknown[] = [
  { basis: 'iec', voltage: 230, resistivity: { Cu: 0.0225 }, multiples: { B: 5, C: 10 }, measuredRule: 'fixed-factor', measuredFactor: 0.8 },
  { basis: 'au-nz', voltageFactor: 0.95, unknownSourceShare: 0.8, voltageDropResistivity: { Al: 0.03 }, shortCircuitResistivity: { Cu: 0.0178 }, maxVoltageFactor: 1.1, reactance: 0.00008, voltageDropLimit: 5 },
];
const DETAIL_SETS: unknown[] = [{ title: 'T', site: '', client: 'C', designer: null, reference: 'R', revision: 'A', date: '2026-01-01', notes: '', later: [1] }];

type Path = Array<string | number>;
function paths(value: unknown): Path[] {
  const out: Path[] = [];
  const stack: Array<{ v: unknown; p: Path }> = [{ v: value, p: [] }];
  while (stack.length) {
    const { v, p } = stack.pop()!;
    out.push(p);
    if (Array.isArray(v)) v.forEach((x, i) => stack.push({ v: x, p: [...p, i] }));
    else if (typeof v === 'object' && v !== null) for (const [k, x] of Object.entries(v)) stack.push({ v: x, p: [...p, k] });
  }
  return out;
}

const oddValue = fc.constantFrom<unknown>(
  undefined, null, 0, -0, -1, 0.5, 1, 3, 2.5, 1e308, -1e308, Infinity, -Infinity, NaN, 5e-324, 3601, 0.011, 101, 1.5, 61, -31,
  '', ' ', '\u00a0', 'x', 'mcb', 'curve', 'fixed', 'adjustable', 'supply', 'board', 'point', 'impedance', 'unknown', 'fault-current',
  'Cu', 'Al', 'B', 'C', 'D', 'pvc', 'xlpe', 'lighting', true, false, [], [1], [[1, 2]], [[1, 2], [3, 1]], [[3, 1], [1, 2]], {}, { a: 1 },
);
const oddKey = fc.constantFrom('id', 'kind', 'type', 'rating', 'curve', 'points', 'source', 'cable', 'device', 'rcd', 'measured', 'Zz', 'Cu', 'B', 'x', 'y', 'at');

/** `base` with a few values replaced, deleted or added, anywhere inside it. */
function mutated(bases: unknown[]): fc.Arbitrary<unknown> {
  return fc
    .tuple(fc.nat(bases.length - 1), fc.array(fc.tuple(fc.nat(), fc.boolean(), oddKey, oddValue), { minLength: 1, maxLength: 3 }))
    .map(([b, edits]) => {
      const value: unknown = structuredClone(bases[b]);
      for (const [at, addKey, key, shared] of edits) {
        const odd: unknown = structuredClone(shared); // the constants are shared between runs
        const all = paths(value).filter((p) => p.length > 0);
        if (all.length === 0) break;
        const path = all[at % all.length]!;
        let parent = value as Record<string | number, unknown>;
        for (const step of path.slice(0, -1)) parent = parent[step] as Record<string | number, unknown>;
        const last = path[path.length - 1]!;
        if (addKey && typeof parent === 'object' && parent !== null && !Array.isArray(parent)) parent[key] = odd;
        else if (odd === undefined && !Array.isArray(parent)) delete parent[last];
        else parent[last] = odd;
      }
      return value;
    });
}

function reported(value: unknown, spec: ObjectSpec): Problem[] {
  const problems: Problem[] = [];
  if (!isObject(value)) return [{ severity: 'error', where: 'x', field: '', message: 'not an object' }];
  reportFields(new Site(problems, 'x'), value, spec);
  return problems;
}

describe('the quick check and the reporting check agree', () => {
  const cases: Array<[string, (v: unknown) => boolean, ObjectSpec, unknown[]]> = [
    ['nodes', cleanNode, NODE, NODES],
    ['links', cleanLink, LINK, LINKS],
    ['rules', cleanRules, RULES, RULE_SETS],
    ['job details', cleanDetails, DETAILS, DETAIL_SETS],
  ];
  for (const [name, clean, spec, bases] of cases) {
    it(`on ${name}: the valid ones pass both`, () => {
      for (const b of bases) {
        expect(reported(b, spec)).toEqual([]);
        expect(clean(b)).toBe(true);
      }
    });
    it(`on ${name}: every mutated record is passed by both or by neither`, () => {
      fc.assert(
        fc.property(mutated(bases), (v) => {
          expect(clean(v)).toBe(reported(v, spec).length === 0);
        }),
        { numRuns: 1500 },
      );
    });
  }
});

// ------------------------------------------------------------------------------------------
// The published schemas, checked by an independent validator

const ajv = new Ajv2020({ allErrors: true, strict: false });
const validateJob = ajv.compile(JSON.parse(read('schema/job.schema.json')) as object);
const validateResults = ajv.compile(JSON.parse(read('schema/results.schema.json')) as object);

const jobFiles = [
  'assets/demo.lwj',
  'assets/demo-unknown-source.lwj',
  ...readdirSync(root + 'tests/fixtures').filter((f) => f.endsWith('.lwj')).map((f) => `tests/fixtures/${f}`),
  ...readdirSync(root + 'tests/cli/fixtures').filter((f) => f.endsWith('.lwj')).map((f) => `tests/cli/fixtures/${f}`),
];

describe('the published JSON Schemas', () => {
  it('finds the demo jobs and the fixtures', () => {
    expect(jobFiles.length).toBeGreaterThanOrEqual(8);
  });
  for (const path of jobFiles) {
    it(`${path}: the schema and the loader agree, and its results fit the results schema`, () => {
      const text = read(path);
      let value: unknown;
      try {
        value = JSON.parse(text);
      } catch {
        value = undefined;
      }
      const loaded = parseJob(text);
      if (value === undefined) {
        expect(loaded.ok).toBe(false); // not JSON: nothing to hold against the schema
        return;
      }
      const fits = validateJob(value);
      if (loaded.ok) {
        expect(validateJob.errors ?? []).toEqual([]);
        expect(fits).toBe(true);
        const results = JSON.parse(JSON.stringify(analyse(loaded.job))) as unknown;
        expect(validateResults(results), JSON.stringify(validateResults.errors?.slice(0, 3))).toBe(true);
      } else if (fits) {
        // Valid against the schema but refused: only the rules that span records can do that.
        expect(loaded.problems.every((p) => /id|from|to|cycle|phases|fed/.test(p.field + p.message))).toBe(true);
      }
    });
  }
  it('a job written by the program fits the schema, and a broken field does not', () => {
    const job = generateJob(30);
    const written = JSON.parse(serialiseJob(job)) as { links: Array<{ cable: Record<string, unknown> }> };
    expect(validateJob(written)).toBe(true);
    written.links[3]!.cable.length = -1;
    expect(validateJob(written)).toBe(false);
    expect(parseJob(JSON.stringify(written)).ok).toBe(false);
  });
  it('the results of a generated job with every check fit the results schema, with no extra keys', () => {
    const results = JSON.parse(JSON.stringify(analyse(generateJob(200)))) as { circuits: Array<Record<string, unknown>> };
    expect(validateResults(results), JSON.stringify(validateResults.errors?.slice(0, 3))).toBe(true);
    results.circuits[0]!.surprise = 1;
    expect(validateResults(results)).toBe(false);
  });
  it('the job schema holds every field the definitions do (one each, with a description)', () => {
    const schema = JSON.parse(read('schema/job.schema.json')) as { $defs: Record<string, { properties: Record<string, { description?: string }> }> };
    const link = schema.$defs.link!.properties;
    for (const f of LINK.fields) expect(link[f.key]?.description).toBe(f.doc);
    expect(Object.keys(schema.$defs)).toEqual(expect.arrayContaining(['details', 'rules', 'node', 'link', 'cable', 'device', 'source']));
  });
});

describe('sparse lists (the editor checks only the records an edit touched)', () => {
  it('skips holes, as the records left out are known to be valid, and names true places', async () => {
    const { loadJob } = await import('../../engine/index.js');
    const file = JSON.parse(serialiseJob(generateJob(30))) as { nodes: unknown[]; links: Array<Record<string, unknown>> };
    const nodes: unknown[] = new Array(file.nodes.length);
    const links: unknown[] = new Array(file.links.length);
    links[7] = { ...file.links[7], cable: { ...(file.links[7]!.cable as object), length: 40 } };
    nodes[0] = file.nodes[0];
    expect(loadJob({ ...file, nodes, links }).ok).toBe(false); // its far end is not among the nodes
    links[7] = { ...file.links[7], cable: { ...(file.links[7]!.cable as object), length: -4 } };
    const bad = loadJob({ ...file, nodes, links });
    expect(bad.ok).toBe(false);
    if (!bad.ok) {
      expect(bad.problems.some((p) => p.where.startsWith('nodes[1]') || p.message.includes('each node must be an object'))).toBe(false);
      expect(bad.problems.find((p) => p.field === 'cable.length')?.where).toBe(`links[7] (${String(file.links[7]!.id)})`);
    }
  });
});
