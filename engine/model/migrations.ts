// The migration chain. Each step lifts a file object from one format version to the next.
// Version 2 adds only optional fields (loads, fault levels, readings; method-depth.md), so a
// version 1 file becomes version 2 by changing its version (and reading a board diversity of 0,
// which version 1 allowed to no effect, as absent). Fixtures: tests/fixtures/v1-minimal.lwj
// (before) and v1-minimal.expected.json (after).

import type { Json } from './fields.js';

export interface Migration {
  from: number;
  to: number;
  /** What changed, in one line (shown as a load note). */
  summary: string;
  up(file: Json): Json;
}

export const MIGRATIONS: readonly Migration[] = [
  {
    from: 1,
    to: 2,
    summary: 'version 2 adds optional fields only (loads, voltage drop, capacity, fault levels, readings); nothing else changes',
    // Version 1 allowed a board diversity of 0, which had no effect there; version 2 requires
    // 0 < d ≤ 1 and would otherwise zero every load below the board, so a 0 reads as absent.
    up: (file) => {
      if (Array.isArray(file.nodes)) {
        for (const node of file.nodes as unknown[]) {
          if (typeof node === 'object' && node !== null && (node as Record<string, unknown>).kind === 'board' && (node as Record<string, unknown>).diversity === 0) {
            delete (node as Record<string, unknown>).diversity;
          }
        }
      }
      return file;
    },
  },
];

export type MigrationOutcome =
  | { ok: true; file: Json; migratedFrom: number | null; steps: string[] }
  | { ok: false; message: string };

/** Lift `file` (at `version`) to `target` through the chain, one step at a time. */
export function migrate(file: Json, version: number, target: number, chain: readonly Migration[] = MIGRATIONS): MigrationOutcome {
  let current = file;
  let at = version;
  const steps: string[] = [];
  while (at < target) {
    const step = chain.find((m) => m.from === at);
    if (!step || step.to <= at) {
      return { ok: false, message: `format version ${version} cannot be read: no migration from version ${at} is known (this program reads versions 1 to ${target})` };
    }
    current = step.up(structuredClone(current));
    current.version = step.to;
    steps.push(`v${step.from} → v${step.to}: ${step.summary}`);
    at = step.to;
  }
  return { ok: true, file: current, migratedFrom: version === target ? null : version, steps };
}
