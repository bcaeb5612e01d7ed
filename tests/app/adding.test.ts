// Adding circuits fast: N final subcircuits to a board in one step, a part added with a board
// selected fed from it, a copied point pasted with its feeding cable and device, a part nothing
// feeds flagged; and walking the failing circuits.
import { beforeEach, describe, expect, it } from 'vitest';
import { defaultLinkFor } from '../../engine/index.js';
import { useEditor } from '../../app/renderer/store/index.js';
import { runCommand } from '../../app/renderer/commands/context.js';
import { addCircuitsEdit, MAX_CIRCUITS } from '../../app/renderer/commands/adding.js';
import { addCircuits } from '../../app/renderer/app/WorkDialogs.js';
import { failingOrder } from '../../app/renderer/commands/work.js';
import { problemsLine } from '../../app/renderer/app/StatusBar.js';
import { sheetDecor, toFlowNode } from '../../app/renderer/sheet/flow.js';
import { useUi } from '../../app/renderer/app/ui.js';
import { smallJob } from './fixture.js';

const s = () => useEditor.getState();

describe('adding circuits to a board', () => {
  beforeEach(() => s().loadJob(smallJob()));

  it('adds N points each fed from the board with the role defaults, as one undo step', () => {
    expect(addCircuits('MSB', 4, 'lighting')).toEqual({ ok: true });
    const job = s().job;
    const added = job.links.filter((l) => !['M1', 'C1', 'C2'].includes(l.id));
    expect(added).toHaveLength(4);
    for (const l of added) {
      expect(l.from).toBe('MSB');
      const { id: _id, ...rest } = l;
      const { id: _d, ...expected } = defaultLinkFor(job, 'MSB', l.to, l.id);
      expect(rest).toEqual(expected);
      expect(job.nodes.find((n) => n.id === l.to)).toMatchObject({ kind: 'point', use: 'lighting' });
    }
    expect(s().selection.links.sort()).toEqual(added.map((l) => l.id).sort());
    // No two new points on top of each other or of an old one.
    const spots = new Set(job.nodes.map((n) => `${n.at!.x},${n.at!.y}`));
    expect(spots.size).toBe(job.nodes.length);
    s().undo();
    expect(s().job.links).toHaveLength(3);
    expect(s().job.nodes).toHaveLength(4);
  });

  it('refuses a count out of range, or a part that is not a board, saying which', () => {
    expect(addCircuitsEdit(s().job, 'MSB', 0, 'lighting')).toEqual({ error: `Number of circuits must be a whole number from 1 to ${MAX_CIRCUITS}, got 0` });
    expect(addCircuitsEdit(s().job, 'P1', 2, 'lighting')).toEqual({ error: 'P1 is not a board of this job' });
  });

  it('the command opens its dialog only with one board selected', () => {
    s().select({ nodes: ['P1'], links: [] });
    expect(runCommand('insert.circuits')).toBe(false);
    s().select({ nodes: ['MSB'], links: [] });
    expect(runCommand('insert.circuits')).toBe(true);
    expect(useUi.getState().addCircuits).toBe('MSB');
    useUi.getState().set({ addCircuits: null });
  });
});

describe('adding a part with a board selected', () => {
  beforeEach(() => s().loadJob(smallJob()));

  it('connects the new point to that board, below it, in one undo step', () => {
    s().select({ nodes: ['MSB'], links: [] });
    runCommand('insert.point');
    const p = s().selection.nodes[0]!;
    const link = s().job.links.find((l) => l.to === p);
    expect(link?.from).toBe('MSB');
    expect(link?.device).toBeDefined();
    expect(s().job.nodes.find((n) => n.id === p)!.at!.y).toBeGreaterThan(160);
    s().undo();
    expect(s().job.nodes.some((n) => n.id === p)).toBe(false);
    expect(s().job.links).toHaveLength(3);
  });

  it('with nothing (or a point) selected a new part stands alone and is flagged as not fed', () => {
    s().select({ nodes: ['P1'], links: [] });
    runCommand('insert.board');
    const b = s().selection.nodes[0]!;
    expect(s().job.links.some((l) => l.to === b)).toBe(false);
    const decor = sheetDecor(s().job, s().resultById);
    expect([...decor.unfed]).toEqual([b]);
    expect(toFlowNode(s().job.nodes.find((n) => n.id === b)!, false, decor).className).toBe('lw-unfed');
    expect(decor.label.get(b)).toMatch(/^Board B\d+ "Board B\d+": ⚠ not fed/);
    expect(toFlowNode(s().job.nodes.find((n) => n.id === 'P1')!, false, decor).className).toBeUndefined();
  });
});

describe('copy and paste of a point', () => {
  beforeEach(() => s().loadJob(smallJob()));

  it('pastes the point with its feeding cable and device, fed from the same board', () => {
    s().select({ nodes: ['P1'], links: [] });
    runCommand('edit.copy');
    expect(s().message?.text).toBe('Copied 1 node and 1 link');
    runCommand('edit.paste');
    const [p] = s().selection.nodes;
    const feed = s().job.links.find((l) => l.to === p)!;
    const original = s().job.links.find((l) => l.id === 'C1')!;
    expect(feed.from).toBe('MSB');
    expect(feed.cable).toEqual(original.cable);
    expect(feed.device).toEqual(original.device);
    expect(s().resultById[feed.id]?.status).not.toBe('unchecked');
  });

  it('with a board selected for the paste, the pasted point hangs from that board', () => {
    s().apply({ op: 'batch', edits: [
      { op: 'add-node', node: { id: 'DB2', kind: 'board', name: 'Workshop', at: { x: 600, y: 160 } } },
      { op: 'add-link', link: { id: 'SM1', from: 'S1', to: 'DB2', cable: { length: 20, material: 'Cu', active: 16, earth: 6 } } },
    ] });
    s().select({ nodes: ['P2'], links: [] });
    runCommand('edit.copy');
    s().select({ nodes: ['DB2'], links: [] });
    runCommand('edit.paste');
    const [p] = s().selection.nodes;
    expect(s().job.links.find((l) => l.to === p)?.from).toBe('DB2');
  });
});

describe('walking the failing circuits', () => {
  const verdicts = (v: Record<string, 'pass' | 'fail' | 'rcd' | 'unchecked'>) => ({
    ...s().results,
    circuits: s().results.circuits.map((c) => ({ ...c, verdict: v[c.link] ?? 'pass' })),
  });

  beforeEach(() => s().loadJob(smallJob()));

  it('orders outright failures before RCD-reliant circuits', () => {
    expect(failingOrder(verdicts({ M1: 'rcd', C1: 'fail', C2: 'fail' })).map((o) => o.link)).toEqual(['C1', 'C2', 'M1']);
  });

  it('next and previous select each in turn, framing and tracing it', () => {
    useEditor.setState({ results: verdicts({ C2: 'rcd', C1: 'fail' }) });
    runCommand('view.nextFailing');
    expect(s().selection.links).toEqual(['C1']);
    expect(s().highlightPath).toEqual(['S1', 'M1', 'MSB', 'C1', 'P1']);
    expect(s().message?.text).toMatch(/^✗ FAIL C1: failure 1 of 1$/);
    runCommand('view.nextFailing');
    expect(s().selection.links).toEqual(['C2']);
    expect(s().message?.text).toMatch(/^⚠ RCD-reliant C2: RCD-reliant 1 of 1$/);
    runCommand('view.nextFailing');
    expect(s().selection.links).toEqual(['C1']);
    runCommand('view.previousFailing');
    expect(s().selection.links).toEqual(['C2']);
  });

  it('is disabled when nothing fails or relies on an RCD', () => {
    useEditor.setState({ results: verdicts({}) });
    expect(runCommand('view.nextFailing')).toBe(false);
  });

  it('the status bar names the worst loop and the first failure when they differ', () => {
    expect(problemsLine({ link: 'W07', ratio: 1.234 }, 'C03')).toBe('worst loop W07 123 % · first ✗ FAIL C03');
    expect(problemsLine({ link: 'C03', ratio: 1.5 }, 'C03')).toBe('worst loop C03 150 %');
    expect(problemsLine(null, null)).toBeNull();
  });
});
