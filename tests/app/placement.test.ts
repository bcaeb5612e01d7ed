// Where new parts go and what the first view of a job shows (pure functions of the sheet).
import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { beforeEach, describe, expect, it } from 'vitest';
import { parseJob, type JobNode } from '../../engine/index.js';
import { runCommand } from '../../app/renderer/commands/context.js';
import { NODE_SIZE, freeCentre } from '../../app/renderer/sheet/parts.js';
import { FIT_PADDING, READABLE_ZOOM, firstView, jobBounds } from '../../app/renderer/sheet/view.js';
import { useEditor } from '../../app/renderer/store/index.js';
import { smallJob } from './fixture.js';

const s = () => useEditor.getState();

function overlap(a: JobNode, b: JobNode): boolean {
  const sa = NODE_SIZE[a.kind], sb = NODE_SIZE[b.kind];
  return a.at!.x < b.at!.x + sb.width && b.at!.x < a.at!.x + sa.width && a.at!.y < b.at!.y + sb.height && b.at!.y < a.at!.y + sa.height;
}

describe('placing new parts', () => {
  beforeEach(() => s().loadJob(smallJob(), { name: 'test.lwj' }));

  it('adding parts one after another at the same spot never stacks them', () => {
    // No sheet in this test: every command asks for the same spot (0, 0), where S1 already is.
    for (const id of ['insert.point', 'insert.point', 'insert.board', 'insert.point', 'insert.supply']) runCommand(id);
    const nodes = s().job.nodes;
    expect(nodes).toHaveLength(9);
    for (let i = 0; i < nodes.length; i++) {
      for (let j = i + 1; j < nodes.length; j++) expect(overlap(nodes[i]!, nodes[j]!), `${nodes[i]!.id} on ${nodes[j]!.id}`).toBe(false);
    }
    // The newest part is the one selected.
    expect(s().selection.nodes).toEqual([nodes.at(-1)!.id]);
  });

  it('keeps the asked-for spot when it is clear, else takes the nearest clear one, right and below first', () => {
    const job = s().job;
    expect(freeCentre(job, 'point', { x: 1000, y: 1000 })).toEqual({ x: 1000, y: 1000 });
    const moved = freeCentre(job, 'point', { x: 80, y: 28 }); // the middle of S1 (MSB is below it)
    expect(moved).toEqual({ x: 280, y: 28 });
    const at = { x: moved.x - NODE_SIZE.point.width / 2, y: moved.y - NODE_SIZE.point.height / 2 };
    for (const n of job.nodes) expect(overlap({ id: 'new', kind: 'point', use: 'lighting', at }, n), n.id).toBe(false);
  });
});

describe('the first view of a job', () => {
  const box = { width: 1100, height: 560 };

  it('fits a small job whole, no larger than full size', () => {
    const view = firstView(smallJob().nodes, box);
    expect(view.whole).toBe(true);
    expect(view.zoom).toBeLessThanOrEqual(1);
    expect(view.zoom).toBeGreaterThanOrEqual(READABLE_ZOOM);
    const b = jobBounds(smallJob().nodes)!;
    // Centred: equal room left and right.
    expect(b.minX * view.zoom + view.x).toBeCloseTo(box.width - (b.maxX * view.zoom + view.x), 6);
  });

  it('shows the demo at a readable zoom from its supply, the whole job a Fit away', () => {
    const loaded = parseJob(readFileSync(resolve(import.meta.dirname, '../../assets/demo.lwj'), 'utf8'));
    if (!loaded.ok) throw new Error('demo does not load');
    const nodes = loaded.job.nodes;
    const view = firstView(nodes, box);
    expect(view.whole).toBe(false);
    expect(view.zoom).toBe(READABLE_ZOOM);
    const supply = nodes.find((n) => n.kind === 'supply')!;
    const sx = supply.at!.x * view.zoom + view.x;
    const sy = supply.at!.y * view.zoom + view.y;
    expect(sx).toBeGreaterThanOrEqual(0);
    expect(sx + NODE_SIZE.supply.width * view.zoom).toBeLessThanOrEqual(box.width);
    expect(sy).toBeGreaterThanOrEqual(0);
    expect(sy + NODE_SIZE.supply.height * view.zoom).toBeLessThanOrEqual(box.height);
    // Not so tall that it needs scrolling down: centred top to bottom.
    const top = jobBounds(nodes)!;
    expect(top.minY * view.zoom + view.y).toBeCloseTo(box.height - (top.maxY * view.zoom + view.y), 6);
    // The view never runs past the job's left or right edge.
    const b = jobBounds(nodes)!;
    expect(b.minX * view.zoom + view.x).toBeLessThanOrEqual(box.width * FIT_PADDING + 1e-9);
    expect(b.maxX * view.zoom + view.x).toBeGreaterThanOrEqual(box.width * (1 - FIT_PADDING) - 1e-9);
  });

  it('a tall job opens with its supply at the top of the view', () => {
    const nodes: JobNode[] = [{ id: 'S1', kind: 'supply', at: { x: 0, y: 0 }, source: { type: 'unknown' } }];
    for (let i = 1; i <= 40; i++) nodes.push({ id: `P${i}`, kind: 'point', use: 'lighting', at: { x: (i % 8) * 200, y: 200 * i } });
    const view = firstView(nodes, box);
    expect(view).toMatchObject({ whole: false, zoom: READABLE_ZOOM });
    expect(view.y).toBeCloseTo(box.height * FIT_PADDING, 6);
  });

  it('an empty job opens at full size', () => {
    expect(firstView([], box)).toMatchObject({ zoom: 1, whole: true });
  });
});

describe('the overview map', () => {
  const sheet = { width: 800, height: 430 };
  it('takes the top right when nothing is drawn there, else another empty corner, else none', async () => {
    const { mapCorner, MAP_BOX } = await import('../../app/renderer/sheet/view.js');
    expect(mapCorner(sheet, [])).toBe('top-right');
    const topRight = { left: sheet.width - 100, top: 20, right: sheet.width - 40, bottom: 60 };
    expect(mapCorner(sheet, [topRight])).toBe('top-left');
    const topLeft = { left: 10, top: 10, right: 200, bottom: 50 };
    expect(mapCorner(sheet, [topRight, topLeft])).toBe('bottom-right');
    const bottomRight = { left: sheet.width - 60, top: sheet.height - 60, right: sheet.width - 10, bottom: sheet.height - 20 };
    expect(mapCorner(sheet, [topRight, topLeft, bottomRight])).toBeNull();
    // A label just clear of the map's box does not move it.
    const beside = { left: sheet.width - MAP_BOX.margin - MAP_BOX.width - 20, top: 20, right: sheet.width - MAP_BOX.margin - MAP_BOX.width - 6, bottom: 60 };
    expect(mapCorner(sheet, [beside])).toBe('top-right');
  });
});
