// The store checks only what an edit replaced when the edit keeps every id, end and kind; these
// tests hold that check to the engine's full validation of the whole job.
import { describe, expect, it } from 'vitest';
import { formatProblem, loadJob, toFileObject, type Job } from '../../engine/index.js';
import { applyEdit, type Edit } from '../../app/renderer/store/edits.js';
import { firstError, validationInput } from '../../app/renderer/store/derive.js';
import { generateJob } from '../bench/generate.js';
import { smallJob } from './fixture.js';

function fullErrors(job: Job): string[] {
  const loaded = loadJob(toFileObject(job));
  return loaded.ok ? [] : loaded.problems.filter((p) => p.severity === 'error').map(formatProblem);
}

function partErrors(base: Job, next: Job): string[] {
  const loaded = loadJob(validationInput(base, next));
  return loaded.ok ? [] : loaded.problems.filter((p) => p.severity === 'error').map(formatProblem);
}

const job = generateJob(40);
const cable = (length: number, active = 2.5) => ({ length, material: 'Cu', active, earth: active });

// Each edit, good or bad, on the generated job (invented data).
const edits: Array<[string, Edit]> = [
  ['a good length', { op: 'update-link', id: 'C17', patch: { cable: cable(30) } }],
  ['a negative length', { op: 'update-link', id: 'C17', patch: { cable: cable(-5) } }],
  ['a zero conductor size', { op: 'update-link', id: 'C3', patch: { cable: cable(10, 0) } }],
  ['a device rating of zero', { op: 'update-link', id: 'C8', patch: { device: { type: 'mcb', curve: 'C', rating: 0 } } }],
  ['an unknown curve', { op: 'update-link', id: 'C8', patch: { device: { type: 'mcb', curve: 'Q', rating: 20 } } }],
  ['a bad RCD sensitivity', { op: 'update-link', id: 'C9', patch: { rcd: { sensitivity: -1 } } }],
  ['a link name', { op: 'update-link', id: 'SM1', patch: { name: 'Riser' } }],
  ['a point use that does not exist', { op: 'update-node', id: 'P4', patch: { use: 'toaster' } }],
  ['a bad supply fault current', { op: 'update-node', id: 'S1', patch: { source: { type: 'fault-current', current: -1 } } }],
  ['a move', { op: 'move', moves: [{ id: 'P5', at: { x: 10, y: 20 } }] }],
  ['a move to nowhere', { op: 'move', moves: [{ id: 'P5', at: { x: Number.NaN, y: 20 } }] }],
  ['two links at once', { op: 'batch', edits: [
    { op: 'update-link', id: 'C1', patch: { cable: cable(12) } },
    { op: 'update-link', id: 'C40', patch: { cable: cable(-1) } },
  ] }],
  // These change ids, ends or kinds, or add and remove: the whole job is checked.
  ['a second feeder', { op: 'update-link', id: 'C2', patch: { to: 'P1' } }],
  ['a point turned into a supply', { op: 'update-node', id: 'P3', patch: { kind: 'supply', source: { type: 'unknown' } } }],
  ['a renamed link', { op: 'update-link', id: 'C2', patch: { id: 'C2a' } }],
  ['a link moved to another board', { op: 'update-link', id: 'C2', patch: { from: 'DB1' } }],
  ['a removal', { op: 'remove', ids: ['P7'] }],
];

describe('store: checking only what an edit replaced', () => {
  it.each(edits)('finds exactly the errors full validation finds: %s', (_what, edit) => {
    const next = applyEdit(job, edit);
    expect(partErrors(job, next)).toEqual(fullErrors(next));
  });

  it('some of those edits are refused, so the comparison is not vacuous', () => {
    const refused = edits.filter(([, e]) => fullErrors(applyEdit(job, e)).length > 0).map(([what]) => what);
    expect(refused).toEqual(expect.arrayContaining(['a negative length', 'a zero conductor size', 'a second feeder', 'a point turned into a supply']));
  });

  it('names the link by its true place in the job', () => {
    const index = job.links.findIndex((l) => l.id === 'C17');
    const next = applyEdit(job, { op: 'update-link', id: 'C17', patch: { cable: cable(-5) } });
    const problem = firstError(next, ['C17'], job);
    expect(problem?.where).toBe(`links[${index}] (C17)`);
    expect(problem?.field).toBe('cable.length');
  });

  it('sends only the replaced records (and the nodes their links join) for a field edit', () => {
    const next = applyEdit(job, { op: 'update-link', id: 'C17', patch: { cable: cable(30) } });
    const input = validationInput(job, next) as { nodes: unknown[]; links: unknown[] };
    expect(input.links.filter(() => true)).toHaveLength(1);
    const link = next.links.find((l) => l.id === 'C17')!;
    expect(input.nodes.filter(() => true).map((n) => (n as { id: string }).id).sort()).toEqual([link.from, link.to].sort());
  });

  it('sends the whole job when the edit changes what the rules across records depend on', () => {
    const base = smallJob();
    const next = applyEdit(base, { op: 'update-link', id: 'C2', patch: { from: 'S1' } });
    expect(validationInput(base, next)).toEqual(toFileObject(next));
    expect(validationInput(null, next)).toEqual(toFileObject(next));
  });
});
