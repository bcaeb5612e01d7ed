// Writing out the definitions of schema.ts: the loader's quick check as TypeScript source
// (engine/model/generated/clean.ts) and the JSON Schemas of the job file and the results
// document (schema/*.schema.json). Run by scripts/gen-schema.ts; a test checks that the files in
// the repository are what this writes. Not used at run time.

import { CURRENT_VERSION, FORMAT_NAME } from './types.js';
import { DETAILS, LINK, NODE, RECORDS, RULES, type Field, type MapSpec, type NumberSpec, type ObjectSpec, type Spec } from './schema.js';
import { RESULTS, type ResultSpec } from './schema-results.js';
import type { NumberRule } from './fields.js';

// ---------------------------------------------------------------------------------------------
// The quick check

const IDENT = /^[A-Za-z_$][\w$]*$/;

function access(v: string, key: string): string {
  return IDENT.test(key) ? `${v}.${key}` : `${v}[${JSON.stringify(key)}]`;
}

function ruleTest(x: string, rule: NumberRule): string {
  const parts = [`typeof ${x} === 'number'`];
  if (rule.integer) parts.push(`Number.isInteger(${x})`);
  const lower = rule.min !== undefined || rule.above !== undefined;
  const upper = rule.max !== undefined || rule.below !== undefined;
  // Both bounds exclude NaN and ±Infinity; otherwise say so (x − x is 0 only for a finite x).
  if (!rule.integer && !(lower && upper)) parts.push(`${x} - ${x} === 0`);
  if (rule.min !== undefined) parts.push(`${x} >= ${rule.min}`);
  if (rule.above !== undefined) parts.push(`${x} > ${rule.above}`);
  if (rule.max !== undefined) parts.push(`${x} <= ${rule.max}`);
  if (rule.below !== undefined) parts.push(`${x} < ${rule.below}`);
  return parts.join(' && ');
}

interface Emitter {
  functions: Map<string, string>;
  maps: number;
  mapNames: Map<string, string>;
}

function test(e: Emitter, x: string, spec: Spec, required: boolean): string {
  const optional = (t: string) => (required ? t : `${x} === undefined || (${t})`);
  switch (spec.kind) {
    case 'number':
      return optional(ruleTest(x, spec.rule));
    case 'text': {
      const t = spec.nonEmpty ? `typeof ${x} === 'string' && filled(${x})` : `typeof ${x} === 'string'`;
      // An optional text may be null (read as absent).
      return required ? t : `${x} === undefined || ${x} === null || (${t})`;
    }
    case 'choice':
      return optional(spec.values.map((c) => `${x} === ${JSON.stringify(c)}`).join(' || '));
    case 'boolean':
      return optional(`${x} === true || ${x} === false`);
    case 'object':
      return optional(`${objectFunction(e, spec)}(${x})`);
    case 'map':
      return optional(`${mapFunction(e, spec)}(${x})`);
    case 'points':
      return optional(`cleanPoints(${x})`);
  }
}

function fieldLines(e: Emitter, fields: readonly Field[], indent: string): string[] {
  const lines: string[] = [];
  for (const f of fields) {
    lines.push(`${indent}x = ${access('v', f.key)};`);
    lines.push(`${indent}if (!(${test(e, 'x', f.spec, f.required === true)})) return false;`);
  }
  return lines;
}

function functionName(name: string): string {
  return `clean${name[0]!.toUpperCase()}${name.slice(1)}`;
}

function objectFunction(e: Emitter, spec: ObjectSpec): string {
  const name = functionName(spec.name);
  if (e.functions.has(name)) return name;
  e.functions.set(name, ''); // reserved, so a repeated definition is written once
  const lines = [`export function ${name}(v: any): boolean {`, '  if (typeof v !== \'object\' || v === null || Array.isArray(v)) return false;', '  let x: any;'];
  lines.push(...fieldLines(e, spec.fields, '  '));
  if (spec.variant) {
    lines.push(`  switch (${access('v', spec.variant.on)}) {`);
    for (const [tag, fields] of Object.entries(spec.variant.cases)) {
      lines.push(`    case ${JSON.stringify(tag)}:`);
      lines.push(...fieldLines(e, fields, '      '));
      lines.push('      break;');
    }
    lines.push('    default:', '      return false;', '  }');
  }
  lines.push('  return true;', '}');
  e.functions.set(name, lines.join('\n'));
  return name;
}

/**
 * The shape function of an object definition: for a value its quick check passed, the list items
 * it holds (a curve's points and the two numbers of each), or −1 when it, or an object in it, has
 * a key the definition does not name (the loader's limits then walk it: limits.ts LimitCount).
 * Each key is counted once, so "as many keys as known ones present" means "no other key".
 */
function shapeFunction(e: Emitter, spec: ObjectSpec): string {
  const name = `shape${spec.name[0]!.toUpperCase()}${spec.name.slice(1)}`;
  if (e.functions.has(name)) return name;
  e.functions.set(name, '');
  const lines = [`export function ${name}(v: any): number {`, '  let known = 0;', '  let items = 0;', '  let x: any;'];
  let usesN = false;
  const fieldShape = (fields: readonly Field[], indent: string, seen: Set<string>): void => {
    for (const f of fields) {
      if (seen.has(f.key)) continue;
      seen.add(f.key);
      const at = access('v', f.key);
      lines.push(`${indent}x = ${at};`);
      if (f.spec.kind === 'object') {
        usesN = true;
        lines.push(`${indent}if (x !== undefined) {`, `${indent}  known++;`, `${indent}  n = ${shapeFunction(e, f.spec)}(x);`, `${indent}  if (n < 0) return -1;`, `${indent}  items += n;`, `${indent}}`);
      } else if (f.spec.kind === 'points') {
        // The list's points, and the two numbers of each (the quick check saw pairs).
        lines.push(`${indent}if (x !== undefined) {`, `${indent}  known++;`, `${indent}  items += 3 * x.length;`, `${indent}}`);
      } else {
        lines.push(`${indent}if (x !== undefined) known++;`);
      }
    }
  };
  const base = new Set<string>();
  fieldShape(spec.fields, '  ', base);
  if (spec.variant) {
    lines.push(`  switch (${access('v', spec.variant.on)}) {`);
    for (const [tag, fields] of Object.entries(spec.variant.cases)) {
      lines.push(`    case ${JSON.stringify(tag)}:`);
      fieldShape(fields, '      ', new Set(base));
      lines.push('      break;');
    }
    lines.push('  }');
  }
  if (usesN) lines.splice(4, 0, '  let n: number;');
  lines.push('  return keyCount(v) === known ? items : -1;', '}');
  e.functions.set(name, lines.join('\n'));
  return name;
}

function mapFunction(e: Emitter, spec: MapSpec): string {
  // One function per kind of map (the three resistivity maps share one).
  const kind = `map:${JSON.stringify([spec.keys, spec.value.rule])}`;
  const known = e.mapNames.get(kind);
  if (known) return known;
  const name = `cleanMap${++e.maps}`;
  e.mapNames.set(kind, name);
  const keyTest = spec.keys.map((k) => `k !== ${JSON.stringify(k)}`).join(' && ');
  e.functions.set(
    name,
    [
      `function ${name}(v: any): boolean {`,
      "  if (typeof v !== 'object' || v === null || Array.isArray(v)) return false;",
      '  for (const k of Object.keys(v)) {',
      `    if (${keyTest}) return false;`,
      '    const x = v[k];',
      `    if (x !== undefined && !(${ruleTest('x', (spec.value as NumberSpec).rule)})) return false;`,
      '  }',
      '  return true;',
      '}',
    ].join('\n'),
  );
  return name;
}

const PRELUDE = `// GENERATED by scripts/gen-schema.ts from engine/model/schema.ts: do not edit by hand.
// The loader's quick check: each clean function answers whether a record is entirely valid
// (every field of it as schema.ts defines), with no message; a record it does not pass goes to
// the reporting check (check-spec.ts), which says what is wrong. Each shape function gives what
// the loader's limits count of a record the quick check passed (limits.ts LimitCount). A test
// keeps this file in step with the definitions, and others that the checks agree.

/* eslint-disable */

/** A text with a character other than white space (String.prototype.trim's white space). */
function filled(s: string): boolean {
  const c = s.charCodeAt(0);
  // A printable ASCII first character settles it without making a trimmed copy.
  return (c > 32 && c < 127) || s.trim() !== '';
}

/** How many keys an object has (its own and any inherited enumerable ones, as for-in sees). */
function keyCount(v: any): number {
  let n = 0;
  for (const _ in v) n++;
  return n;
}

/** At least two [current > 0, time > 0] points, current rising and time falling. */
function cleanPoints(v: any): boolean {
  if (!Array.isArray(v) || v.length < 2) return false;
  let lastI = 0;
  let lastT = Infinity;
  for (let i = 0; i < v.length; i++) {
    const p = v[i];
    if (!Array.isArray(p) || p.length !== 2) return false;
    const a = p[0];
    const t = p[1];
    if (typeof a !== 'number' || typeof t !== 'number' || !(a > 0) || !(t > 0) || a === Infinity || t === Infinity) return false;
    if (i > 0 && (a <= lastI || t >= lastT)) return false;
    lastI = a;
    lastT = t;
  }
  return true;
}
`;

/** The source of engine/model/generated/clean.ts. */
export function emitClean(): string {
  const e: Emitter = { functions: new Map(), maps: 0, mapNames: new Map() };
  for (const spec of Object.values(RECORDS)) objectFunction(e, spec);
  shapeFunction(e, NODE);
  shapeFunction(e, LINK);
  return `${PRELUDE}\n${[...e.functions.values()].join('\n\n')}\n`;
}

// ---------------------------------------------------------------------------------------------
// JSON Schema (draft 2020-12)

type JsonSchema = Record<string, unknown>;

function numberSchema(rule: NumberRule): JsonSchema {
  const s: JsonSchema = { type: rule.integer ? 'integer' : 'number' };
  if (rule.min !== undefined) s.minimum = rule.min;
  if (rule.above !== undefined) s.exclusiveMinimum = rule.above;
  if (rule.max !== undefined) s.maximum = rule.max;
  if (rule.below !== undefined) s.exclusiveMaximum = rule.below;
  return s;
}

function specSchema(spec: Spec, defs: Map<string, JsonSchema>, required: boolean): JsonSchema {
  switch (spec.kind) {
    case 'number':
      return numberSchema(spec.rule);
    case 'text': {
      const s: JsonSchema = spec.nonEmpty ? { type: 'string', pattern: '\\S' } : { type: 'string' };
      return required ? s : { ...s, type: ['string', 'null'] };
    }
    case 'choice':
      return { enum: [...spec.values] };
    case 'boolean':
      return { type: 'boolean' };
    case 'object':
      return { $ref: `#/$defs/${objectSchema(spec, defs)}` };
    case 'map':
      return { type: 'object', propertyNames: { enum: [...spec.keys] }, additionalProperties: numberSchema(spec.value.rule) };
    case 'points':
      return {
        type: 'array',
        minItems: 2,
        items: { type: 'array', prefixItems: [{ type: 'number', exclusiveMinimum: 0 }, { type: 'number', exclusiveMinimum: 0 }], minItems: 2, maxItems: 2 },
        description: '[current A, time s] points; current must rise and time fall from point to point (checked by the loader)',
      };
  }
}

function properties(fields: readonly Field[], defs: Map<string, JsonSchema>): { properties: JsonSchema; required: string[] } {
  const props: JsonSchema = {};
  const required: string[] = [];
  for (const f of fields) {
    props[f.key] = { description: f.doc, ...specSchema(f.spec, defs, f.required === true) };
    if (f.required) required.push(f.key);
  }
  return { properties: props, required };
}

function objectSchema(spec: ObjectSpec, defs: Map<string, JsonSchema>): string {
  if (defs.has(spec.name)) return spec.name;
  defs.set(spec.name, {});
  const { properties: props, required } = properties(spec.fields, defs);
  const s: JsonSchema = { type: 'object', properties: props };
  if (required.length) s.required = required;
  if (spec.variant) {
    const on = spec.variant.on;
    s.allOf = Object.entries(spec.variant.cases).map(([tag, fields]) => {
      const then = properties(fields, defs);
      const body: JsonSchema = { properties: then.properties };
      if (then.required.length) body.required = then.required;
      return { if: { properties: { [on]: { const: tag } }, required: [on] }, then: body };
    });
  }
  s.description = 'Keys not listed here are kept as they are when the file is read and written.';
  defs.set(spec.name, s);
  return spec.name;
}

/** The JSON Schema of the job file (format version 2; version 1 files are read and migrated). */
export function jobSchema(): JsonSchema {
  const defs = new Map<string, JsonSchema>();
  const details = objectSchema(DETAILS, defs);
  const rules = objectSchema(RULES, defs);
  const node = objectSchema(NODE, defs);
  const link = objectSchema(LINK, defs);
  return {
    $schema: 'https://json-schema.org/draft/2020-12/schema',
    $id: 'https://loopwright.invalid/schema/job.schema.json',
    title: 'Loopwright job file',
    description:
      `A Loopwright job (${FORMAT_NAME}, format version ${CURRENT_VERSION}). Generated from engine/model/schema.ts. ` +
      'Beyond this schema the loader also requires: ids unique across nodes and links; every link joining two nodes of the job; ' +
      'every node fed by at most one link and no supply fed; no cycles; phases that a feed can carry; and at most 200,000 list ' +
      'items, 8 levels of nesting and 50 MiB. Version 1 files are read and migrated (a board diversity of 0 is dropped).',
    type: 'object',
    required: ['format', 'version', 'nodes', 'links'],
    properties: {
      format: { const: FORMAT_NAME },
      version: { description: `${CURRENT_VERSION} for files this program writes; 1 is read and migrated`, enum: [1, CURRENT_VERSION] },
      job: { $ref: `#/$defs/${details}` },
      rules: { $ref: `#/$defs/${rules}` },
      nodes: { type: 'array', items: { $ref: `#/$defs/${node}` } },
      links: { type: 'array', items: { $ref: `#/$defs/${link}` } },
    },
    $defs: Object.fromEntries(defs),
  };
}

// ---------------------------------------------------------------------------------------------
// The results document

function resultSchema(spec: ResultSpec, defs: Map<string, JsonSchema>): JsonSchema {
  switch (spec.kind) {
    case 'number':
      return numberSchema(spec.rule);
    case 'text':
      return { type: 'string' };
    case 'choice':
      return { enum: [...spec.values] };
    case 'boolean':
      return { type: 'boolean' };
    case 'const':
      return { const: spec.value };
    case 'nullable': {
      const inner = resultSchema(spec.spec, defs);
      return { anyOf: [inner, { type: 'null' }] };
    }
    case 'list':
      return { type: 'array', items: resultSchema(spec.item, defs) };
    case 'record': {
      if (!defs.has(spec.name)) {
        defs.set(spec.name, {});
        const props: JsonSchema = {};
        for (const f of spec.fields) props[f.key] = { description: f.doc, ...resultSchema(f.spec, defs) };
        defs.set(spec.name, { type: 'object', properties: props, required: spec.fields.filter((f) => !f.optional).map((f) => f.key), additionalProperties: false });
      }
      return { $ref: `#/$defs/${spec.name}` };
    }
    case 'oneOf':
      return { oneOf: spec.options.map((o) => resultSchema(o, defs)) };
  }
}

/** The JSON Schema of the results document (`check --json`). */
export function resultsSchema(): JsonSchema {
  const defs = new Map<string, JsonSchema>();
  const top = resultSchema(RESULTS, defs);
  return {
    $schema: 'https://json-schema.org/draft/2020-12/schema',
    $id: 'https://loopwright.invalid/schema/results.schema.json',
    title: 'Loopwright results document',
    description: 'What `loopwright check --json` prints and analyse(job) returns (format loopwright.results, version 2). Generated from engine/model/schema-results.ts. Results are a design aid: installations must be verified by testing, and local wiring rules and licensed practice govern.',
    ...top,
    $defs: Object.fromEntries(defs),
  };
}
