// Loading goes through the migration chain (engine/model/migrations.ts). Version 2 adds only
// optional fields, so the one step v1 → v2 changes the version alone; these tests pin it with a
// before/after fixture pair and exercise the chain mechanics with a chain of our own.

import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { analyse, CURRENT_VERSION, loadJob, parseJob, serialiseJob, toFileObject } from '../../engine/index.js';
import { MIGRATIONS, migrate } from '../../engine/model/migrations.js';
import type { Migration } from '../../engine/model/migrations.js';
import { circuit, expectRel } from './helpers.js';

const fixture = (name: string) => readFileSync(fileURLToPath(new URL(`../fixtures/${name}`, import.meta.url)), 'utf8');

describe('the v1 fixture pair', () => {
  const text = fixture('v1-minimal.lwj');
  const expected = JSON.parse(fixture('v1-minimal.expected.json')) as unknown;
  const loaded = parseJob(text);

  it('loads through the chain, migrated from version 1', () => {
    expect(loaded.ok).toBe(true);
    if (!loaded.ok) return;
    expect(loaded.migratedFrom).toBe(1);
    expect(loaded.job.version).toBe(CURRENT_VERSION);
  });

  it('parses to the expected file object, unknown key kept', () => {
    if (!loaded.ok) throw new Error('fixture refused');
    expect(toFileObject(loaded.job)).toEqual(expected);
    expect(JSON.parse(serialiseJob(loaded.job))).toEqual(expected);
  });

  it('the fixture’s numbers, by hand', () => {
    if (!loaded.ok) throw new Error('fixture refused');
    const r = analyse(loaded.job);
    // Ipf 1500 A, X/R 1: |Ze| = 230/1500 = 0.153333, R = X = 0.153333/√2 = 0.1084230
    // M1 15 m 25/16: R = 0.0225·15·(1/25 + 1/16) = 0.3375·0.1025 = 0.0345938, X = 0.0024
    // C1 25 m 1.5/1.5: R = 0.0225·25·(2/1.5) = 0.75, X = 0.004
    // at MSB: |0.1430168 + j0.1108230| = 0.1809297; at P1: |0.8930168 + j0.1148230| = 0.9003684
    // B16 au-nz: Ia = 64, B = 230/64 = 3.59375; ratio 0.9003684/3.59375 = 0.2505373; If = 255.451 A
    expectRel(circuit(r, 'M1').zs, 0.18092968);
    const c = circuit(r, 'C1');
    expectRel(c.zs, 0.90036843);
    expectRel(c.faultCurrent, 255.45098);
    expectRel(c.ratio, 0.2505373);
    expect(c.requiredTime).toBe(5);
    expect(c.status).toBe('pass');
    expectRel(c.maxLength, 114.946983, 1e-6);
  });

  it('a UTF-8 byte-order mark in front of the file is tolerated', () => {
    expect(parseJob(`\ufeff${text}`).ok).toBe(true);
  });
});

describe('versions the loader refuses', () => {
  const withVersion = (version: unknown) => {
    const file = JSON.parse(fixture('v1-minimal.lwj')) as Record<string, unknown>;
    if (version === undefined) delete file.version;
    else file.version = version;
    return loadJob(file);
  };
  for (const v of [0, -1, 1.5, '1', undefined, null]) {
    it(`version ${JSON.stringify(v) ?? '(missing)'} is refused with a message about the version`, () => {
      const r = withVersion(v);
      expect(r.ok).toBe(false);
      if (r.ok) return;
      expect(r.problems.map((p) => p.message).join(' ')).toMatch(/version/i);
    });
  }
  it('a newer version is refused', () => {
    const r = withVersion(CURRENT_VERSION + 1);
    expect(r.ok).toBe(false);
  });
});

describe('the chain', () => {
  it('every registered step lifts one version and the chain reaches the current version', () => {
    for (const m of MIGRATIONS) expect(m.to).toBe(m.from + 1);
    const r = migrate({ version: 1 }, 1, CURRENT_VERSION);
    expect(r.ok).toBe(true);
    if (r.ok) expect(r.migratedFrom).toBe(1);
    const same = migrate({ version: CURRENT_VERSION }, CURRENT_VERSION, CURRENT_VERSION);
    if (same.ok) expect(same.migratedFrom).toBeNull();
  });

  // A chain of our own: v1 → v2 renames a field, v2 → v3 adds one.
  const chain: Migration[] = [
    {
      from: 1,
      to: 2,
      summary: 'rename title to heading',
      up: (f) => {
        const { title, ...rest } = f;
        return { ...rest, heading: title };
      },
    },
    { from: 2, to: 3, summary: 'add units', up: (f) => ({ ...f, units: 'SI' }) },
  ];

  it('runs every step in order, sets the version and reports each step', () => {
    const before = { version: 1, title: 'Old' };
    const r = migrate(before, 1, 3, chain);
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.file).toEqual({ version: 3, heading: 'Old', units: 'SI' });
    expect(r.migratedFrom).toBe(1);
    expect(r.steps).toHaveLength(2);
    expect(before).toEqual({ version: 1, title: 'Old' }); // the input is not changed
  });

  it('starts part-way along the chain', () => {
    const r = migrate({ version: 2, heading: 'Mid' }, 2, 3, chain);
    expect(r.ok && r.file).toEqual({ version: 3, heading: 'Mid', units: 'SI' });
  });

  it('a gap in the chain is refused with a message naming the version', () => {
    const first = chain[0] as Migration;
    const r = migrate({ version: 1 }, 1, 3, [first]);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.message).toMatch(/version 2/);
  });
});
