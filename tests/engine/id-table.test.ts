// The loader's and the tree order's index of ids (engine/model/id-table.ts): the same answers as
// a Map, and still bounded when ids collide (the entries move into a Map).
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { IdTable } from '../../engine/model/id-table.js';

/** Apply the same sets to an IdTable and a Map, then compare every answer. */
function sameAsMap(table: IdTable, ops: Array<[string, number]>, probes: string[]): void {
  const map = new Map<string, number>();
  for (const [id, v] of ops) {
    table.set(id, v);
    map.set(id, v);
    expect(table.size).toBe(map.size);
  }
  for (const id of [...map.keys(), ...probes]) {
    expect(table.get(id)).toBe(map.get(id));
    expect(table.has(id)).toBe(map.has(id));
  }
}

describe('IdTable', () => {
  it('answers as a Map does, through growth, for any ids (also empty, long and odd ones)', () => {
    fc.assert(
      fc.property(
        fc.array(fc.tuple(fc.oneof(fc.string({ maxLength: 4 }), fc.string({ unit: 'grapheme', maxLength: 40 })), fc.integer({ min: -1e6, max: 1e6 })), { maxLength: 300 }),
        fc.array(fc.string({ maxLength: 6 }), { maxLength: 20 }),
        fc.integer({ min: 0, max: 64 }),
        (ops, probes, expected) => sameAsMap(new IdTable(expected), ops, probes),
      ),
      { numRuns: 300 },
    );
  });

  it('20,000 ids of a generated job: every one found, a missing one not', () => {
    const table = new IdTable(10);
    for (let i = 0; i < 20_000; i++) table.set(i % 2 === 0 ? `C${i}` : `DB${i}`, i);
    for (let i = 0; i < 20_000; i++) expect(table.get(i % 2 === 0 ? `C${i}` : `DB${i}`)).toBe(i);
    expect(table.get('C1')).toBeUndefined();
    expect(table.size).toBe(20_000);
    expect(table.degraded).toBe(false);
  });

  it('ids that all collide move the table into a Map, which still answers rightly', () => {
    const table = new IdTable(8, () => 7);
    const ops: Array<[string, number]> = Array.from({ length: 500 }, (_, i) => [`n${i}`, i]);
    sameAsMap(table, [...ops, ['n3', -4]], ['x', 'n500']);
    expect(table.degraded).toBe(true);
  });
});
