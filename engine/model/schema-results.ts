// The results document (`check --json`, what analyse(job) returns), declared for its published
// JSON Schema (schema/results.schema.json, written by scripts/gen-schema.ts). The TypeScript
// types are in engine/analysis/results.ts; a test checks the analysis of the demo and of
// generated jobs against the schema, whose records allow no other keys, so the two cannot drift.

import type { NumberRule } from './fields.js';

export type ResultSpec =
  | { kind: 'number'; rule: NumberRule }
  | { kind: 'text' }
  | { kind: 'choice'; values: readonly (string | number)[] }
  | { kind: 'boolean' }
  | { kind: 'const'; value: string | number }
  | { kind: 'nullable'; spec: ResultSpec }
  | { kind: 'list'; item: ResultSpec }
  | { kind: 'record'; name: string; fields: readonly ResultField[] }
  | { kind: 'oneOf'; options: readonly ResultSpec[] };

export interface ResultField {
  key: string;
  spec: ResultSpec;
  doc: string;
  optional?: boolean;
}

const num: ResultSpec = { kind: 'number', rule: {} };
const count: ResultSpec = { kind: 'number', rule: { min: 0, integer: true } };
const text: ResultSpec = { kind: 'text' };
const nullable = (spec: ResultSpec): ResultSpec => ({ kind: 'nullable', spec });
const choice = (...values: (string | number)[]): ResultSpec => ({ kind: 'choice', values });
const f = (key: string, spec: ResultSpec, doc: string): ResultField => ({ key, spec, doc });
const record = (name: string, fields: ResultField[]): ResultSpec => ({ kind: 'record', name, fields });

const STATUS = choice('pass', 'fail', 'rcd', 'unchecked');
const CHECK = choice('pass', 'fail', 'unchecked');
const numOrNull = nullable(num);

const statusCounts = record('statusCounts', [f('pass', count, ''), f('fail', count, ''), f('rcd', count, ''), f('unchecked', count, '')]);
const checkCounts = record('checkCounts', [f('pass', count, ''), f('fail', count, ''), f('unchecked', count, '')]);

const FIX: ResultSpec = {
  kind: 'oneOf',
  options: [
    record('lengthFix', [f('kind', { kind: 'const', value: 'length' }, ''), f('maxLength', num, 'the longest length that passes, m')]),
    record('sizeFix', [f('kind', { kind: 'const', value: 'size' }, ''), f('active', num, 'active area, mm²'), f('earth', num, 'earth area, mm²')]),
    record('deviceFix', [f('kind', { kind: 'const', value: 'device' }, ''), f('curve', choice('B', 'C', 'D'), ''), f('rating', num, 'A')]),
    record('rcdFix', [f('kind', { kind: 'const', value: 'rcd' }, ''), f('sensitivity', num, 'A')]),
  ],
};

const CIRCUIT = record('circuit', [
  f('link', text, 'the link id'),
  f('name', nullable(text), 'the link name'),
  f('from', text, 'origin node id'),
  f('to', text, 'far-end node id'),
  f('role', choice('consumer-mains', 'submain', 'final-subcircuit'), ''),
  f('method', nullable(choice('known-source', 'unknown-source')), 'null when no supply reaches the link'),
  f('protectedBy', nullable(text), 'id of the link whose device protects this one'),
  f('device', nullable(text), 'device label or mark such as C20'),
  f('tripCurrent', numOrNull, 'Ia, A'),
  f('requiredTime', numOrNull, 't_req, s'),
  f('zs', numOrNull, '|Ze + Σ links| at the far end, Ω (known source)'),
  f('own', numOrNull, '|Σ links from the protecting link\'s origin to the far end|, Ω'),
  f('upstream', numOrNull, '|Σ drawn links from the supply to the protecting link\'s origin|, Ω'),
  f('limit', numOrNull, 'the loop limit, Ω'),
  f('faultCurrent', numOrNull, 'c·U0/Zs, A'),
  f('clearingTime', numOrNull, 's'),
  f('ratio', numOrNull, 'loop against its limit'),
  f('maxLength', numOrNull, 'm'),
  f('status', STATUS, 'the loop check'),
  f('notes', { kind: 'list', item: text }, 'plain-words notes'),
  f('phases', choice(1, 3), ''),
  f('designCurrent', numOrNull, 'Ib, A'),
  f('powerFactor', numOrNull, 'cos φ'),
  f('voltageDrop', numOrNull, 'this link\'s drop, % of U0'),
  f('voltageDropTotal', numOrNull, 'supply to far end, % of U0'),
  f('voltageDropLimit', numOrNull, '%'),
  f('voltageStatus', CHECK, ''),
  f('capacity', numOrNull, 'Iz, A'),
  f('capacityStatus', CHECK, ''),
  f('faultLevel', numOrNull, 'maximum prospective fault current at the origin, A'),
  f('breakingStatus', CHECK, ''),
  f('earthMinArea', numOrNull, 'S_pe,min, mm²'),
  f('withstandStatus', CHECK, ''),
  f('testLimit', numOrNull, 'largest measured Zs that passes, Ω'),
  f(
    'measured',
    nullable(record('measuredResult', [f('zs', num, 'the reading, Ω'), f('corrected', num, 'Ω'), f('ratio', numOrNull, ''), f('status', STATUS, '')])),
    'the reading, when there is one',
  ),
  f('fixes', { kind: 'list', item: FIX }, 'changes that make a failing link pass'),
  f('verdict', STATUS, 'all checks together'),
]);

export const RESULTS: ResultSpec = record('results', [
  f('format', { kind: 'const', value: 'loopwright.results' }, ''),
  f('version', { kind: 'const', value: 2 }, ''),
  f('basis', choice('au-nz', 'iec'), ''),
  f('circuits', { kind: 'list', item: CIRCUIT }, 'one per link, in file order'),
  f(
    'worst',
    nullable(record('worstPath', [f('link', text, ''), f('ratio', num, ''), f('path', { kind: 'list', item: text }, 'node and link ids alternately from the supply')])),
    'the worst fault path',
  ),
  f(
    'supplies',
    {
      kind: 'list',
      item: record('supply', [
        f('node', text, ''),
        f('phases', choice(1, 3), ''),
        f('faultLevel', numOrNull, 'A'),
        f('maxZe', numOrNull, 'Ω'),
        f('minFaultCurrent', numOrNull, 'A'),
        f('setBy', nullable(text), 'the link whose loop sets maxZe'),
      ]),
    },
    'source headroom per supply',
  ),
  f(
    'summary',
    record('summary', [
      f('pass', count, ''),
      f('fail', count, ''),
      f('rcd', count, ''),
      f('unchecked', count, ''),
      f('verdict', statusCounts, ''),
      f(
        'checks',
        record('checkSummary', [
          f('voltage', checkCounts, ''),
          f('capacity', checkCounts, ''),
          f('breaking', checkCounts, ''),
          f('withstand', checkCounts, ''),
          f('measured', statusCounts, ''),
        ]),
        '',
      ),
    ]),
    '',
  ),
]);
