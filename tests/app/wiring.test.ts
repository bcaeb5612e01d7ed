// Joining parts: a cable released on a part's body connects, a supply has no input dot, and a
// link's "From" can be moved to another board, refused with the reason when it would loop.
import { beforeEach, describe, expect, it } from 'vitest';
import { useEditor } from '../../app/renderer/store/index.js';
import { connectParts, moveFeed } from '../../app/renderer/commands/wiring.js';
import { feedReason } from '../../app/renderer/sheet/connect.js';
import { connectOnRelease } from '../../app/renderer/sheet/Sheet.js';
import { toFlowNode } from '../../app/renderer/sheet/flow.js';
import { feedOptions, selectParts } from '../../app/renderer/app/FeedPicker.js';
import type { JobNode } from '../../engine/index.js';
import { smallJob } from './fixture.js';

function withSecondBoard() {
  const job = smallJob();
  return {
    ...job,
    nodes: [...job.nodes, { id: 'DB2', kind: 'board' as const, name: 'Workshop', at: { x: 400, y: 160 } }],
    links: [...job.links, { id: 'SM1', from: 'MSB', to: 'DB2', cable: { length: 30, material: 'Cu' as const, active: 16, earth: 6 } }],
  };
}

/** Pretends the element under the pointer is the drawn node `id` (jsdom does no layout). */
function pointerOver(id: string | null) {
  const el = document.createElement('div');
  if (id) {
    el.className = 'react-flow__node';
    el.setAttribute('data-id', id);
  }
  document.body.append(el);
  (document as unknown as { elementsFromPoint: () => Element[] }).elementsFromPoint = () => [el];
}

describe('connecting', () => {
  beforeEach(() => useEditor.getState().loadJob(withSecondBoard()));

  it('a cable from an output dot released on a part body connects it, with the role defaults', () => {
    useEditor.getState().apply({ op: 'add-node', node: { id: 'P9', kind: 'point', name: 'Bench', use: 'socket-outlets', at: { x: 400, y: 320 } } });
    pointerOver('P9');
    connectOnRelease({ isValid: false, fromNode: { id: 'DB2' }, fromHandle: { type: 'source' } }, { x: 10, y: 10 });
    const link = useEditor.getState().job.links.find((l) => l.to === 'P9');
    expect(link?.from).toBe('DB2');
    expect(link?.device).toEqual({ type: 'mcb', curve: 'C', rating: 20 });
    expect(useEditor.getState().selection.links).toEqual([link!.id]);
  });

  it('a cable drawn from an input dot and dropped on a body is fed by that part', () => {
    useEditor.getState().apply({ op: 'add-node', node: { id: 'P9', kind: 'point', name: 'Bench', use: 'lighting', at: { x: 400, y: 320 } } });
    pointerOver('DB2');
    connectOnRelease({ isValid: null, fromNode: { id: 'P9' }, fromHandle: { type: 'target' } }, { x: 10, y: 10 });
    expect(useEditor.getState().job.links.find((l) => l.to === 'P9')?.from).toBe('DB2');
  });

  it('a release on empty sheet says how to connect, and changes nothing', () => {
    const before = useEditor.getState().job;
    pointerOver(null);
    connectOnRelease({ isValid: false, fromNode: { id: 'DB2' }, fromHandle: { type: 'source' } }, { x: 10, y: 10 });
    expect(useEditor.getState().job).toBe(before);
    expect(useEditor.getState().message?.text).toMatch(/release the cable from DB2 on a part/);
  });

  it('a release React Flow already connected (snapped to a dot) is left to onConnect', () => {
    const before = useEditor.getState().job;
    pointerOver('P1');
    connectOnRelease({ isValid: true, fromNode: { id: 'DB2' }, fromHandle: { type: 'source' } }, { x: 10, y: 10 });
    expect(useEditor.getState().job).toBe(before);
  });

  it('refuses a second feeder naming the part and the link that feeds it, in plain words', () => {
    const out = connectParts('DB2', 'P1');
    expect(out.ok).toBe(false);
    expect(useEditor.getState().message?.text).toBe(
      'Link from DB2 to P1 refused: point P1 "Sockets" is already fed by link C1 from MSB; every part has one feeding cable (to move it to another board, change that link\'s "From" in the details panel)',
    );
    expect(useEditor.getState().message?.text).not.toMatch(/links\[/);
  });

  it('refuses a link into a supply, and a loop, with the reason', () => {
    expect(feedReason(useEditor.getState().job, 'P1', 'S1')).toMatch(/supply S1 "Supply" is where the network starts/);
    expect(feedReason(useEditor.getState().job, 'DB2', 'MSB')).toMatch(/already fed by link M1/);
    expect(feedReason(useEditor.getState().job, 'DB2', 'DB2')).toMatch(/back to itself/);
  });

  it('a supply is drawn with an output dot only; boards and points have both', () => {
    const job = useEditor.getState().job;
    const types = (id: string) => toFlowNode(job.nodes.find((n) => n.id === id)!, false).handles!.map((h) => h.type);
    expect(types('S1')).toEqual(['source']);
    expect(types('MSB')).toEqual(['target', 'source']);
    expect(types('P1')).toEqual(['target', 'source']);
  });
});

describe('moving a circuit to another board', () => {
  beforeEach(() => useEditor.getState().loadJob(withSecondBoard()));

  it('re-points the link in one undo step, keeping its cable and device', () => {
    const before = useEditor.getState().job.links.find((l) => l.id === 'C1')!;
    expect(moveFeed('C1', 'DB2')).toEqual({ ok: true });
    const after = useEditor.getState().job.links.find((l) => l.id === 'C1')!;
    expect(after.from).toBe('DB2');
    expect(after.cable).toEqual(before.cable);
    expect(after.device).toEqual(before.device);
    useEditor.getState().undo();
    expect(useEditor.getState().job.links.find((l) => l.id === 'C1')!.from).toBe('MSB');
  });

  it('refuses a feeder below the link itself (a loop), naming the links, and changes nothing', () => {
    const before = useEditor.getState().job;
    const out = moveFeed('SM1', 'DB2');
    expect(out.ok).toBe(false);
    const loop = moveFeed('M1', 'DB2');
    expect(loop).toEqual({ ok: false, reason: expect.stringMatching(/^M1 cannot be fed from DB2: "MSB" already feeds "DB2" \(through link SM1\)/) as unknown as string });
    expect(useEditor.getState().job).toBe(before);
  });

  it('offers every other part, supplies and boards first, with their names', () => {
    const opts = feedOptions(useEditor.getState().job.nodes, 'P1');
    expect(opts.map((o) => o.value)).toEqual(['S1', 'DB2', 'MSB', 'P2']);
    expect(opts[1]!.label).toBe('DB2 — Workshop (board)');
  });
});

describe('the feed choice’s list of parts', () => {
  it('stays the same array while no part is added, removed or renamed (a drag moves parts only)', () => {
    const nodes = [
      { id: 'S1', kind: 'supply', at: { x: 0, y: 0 } },
      { id: 'DB1', kind: 'board', name: 'Board one', at: { x: 0, y: 100 } },
    ] as unknown as JobNode[];
    const first = selectParts({ job: { nodes } });
    expect(first).toEqual(['supply\u0000S1\u0000', 'board\u0000DB1\u0000Board one']);
    expect(selectParts({ job: { nodes } })).toBe(first);
    const moved = nodes.map((n) => ({ ...n, at: { x: 5, y: 5 } })) as JobNode[];
    expect(selectParts({ job: { nodes: moved } })).toBe(first);
    const renamed = moved.map((n) => (n.id === 'DB1' ? { ...n, name: 'Board two' } : n)) as JobNode[];
    const next = selectParts({ job: { nodes: renamed } });
    expect(next).not.toBe(first);
    expect(next[1]).toBe('board\u0000DB1\u0000Board two');
    // One record moved among the rest (a drag frame): the same array; a node added: a new one.
    const oneMoved = renamed.map((n) => (n.id === 'S1' ? { ...n, at: { x: 9, y: 9 } } : n)) as JobNode[];
    expect(selectParts({ job: { nodes: oneMoved } })).toBe(next);
    const added = [...oneMoved, { id: 'P7', kind: 'point', at: { x: 0, y: 0 } }] as unknown as JobNode[];
    expect(selectParts({ job: { nodes: added } })).toEqual([...next, 'point\u0000P7\u0000']);
  });
});
