// The sheet's React Flow input on a busy store: a drag frame (moveLive) replaces only the moved
// node's object, leaves the links' array and every callback and option as they were (new ones
// would re-render every drawn node and link wrapper), and what is drawn still matches the results.
import { act, render } from '@testing-library/react';
import { beforeEach, describe, expect, it, vi } from 'vitest';
import type { ReactFlowProps } from '@xyflow/react';
import { analyse } from '../../engine/index.js';
import { flowList, toFlowNode } from '../../app/renderer/sheet/flow.js';
import { useEditor } from '../../app/renderer/store/index.js';
import { smallJob } from './fixture.js';

// Every set of props the sheet hands React Flow, in order.
const given = vi.hoisted(() => [] as ReactFlowProps[]);
vi.mock('@xyflow/react', async (original) => {
  const real = await original<typeof import('@xyflow/react')>();
  const Recording = (props: ReactFlowProps) => {
    given.push(props);
    return <real.ReactFlow {...props} />;
  };
  return { ...real, ReactFlow: Recording };
});

const { ReactFlowProvider } = await import('@xyflow/react');
const { Sheet } = await import('../../app/renderer/sheet/Sheet.js');

const s = () => useEditor.getState();

function renderSheet() {
  return render(
    <ReactFlowProvider>
      <div style={{ width: 1000, height: 800 }}><Sheet onContextMenu={() => undefined} /></div>
    </ReactFlowProvider>,
  );
}

describe('the sheet during a drag', () => {
  beforeEach(() => {
    s().loadJob(smallJob(), { name: 'test.lwj' });
    given.length = 0;
  });

  it('a drag frame replaces only the moved node; links, callbacks and options stay the same objects', () => {
    const { container } = renderSheet();
    const before = given.at(-1)!;
    act(() => s().moveLive([{ id: 'P1', at: { x: -150, y: 340 } }]));
    const after = given.at(-1)!;
    expect(after).not.toBe(before);
    for (const key of Object.keys(before) as Array<keyof ReactFlowProps>) {
      if (key === 'nodes' || key === 'children') continue;
      expect(after[key], key).toBe(before[key]);
    }
    const moved = after.nodes!.findIndex((n) => n.id === 'P1');
    after.nodes!.forEach((n, i) => {
      if (i === moved) expect(n).not.toBe(before.nodes![i]);
      else expect(n, n.id).toBe(before.nodes![i]);
    });
    expect(after.nodes![moved]!.position).toEqual({ x: -150, y: 340 });
    // The drop commits the move: still the same links, and the statuses are the results'.
    act(() => void s().apply({ op: 'move', moves: [{ id: 'P1', at: { x: -150, y: 340 } }] }, 'move P1'));
    expect(given.at(-1)!.edges).toBe(before.edges);
    const results = analyse(s().job);
    for (const c of results.circuits) {
      expect(container.querySelector(`[data-link-id="${c.link}"]`)?.getAttribute('data-status'), c.link).toBe(c.status);
    }
  });

  it('selecting a link replaces only that edge; an edit that changes no drawn record hands over the same arrays', () => {
    renderSheet();
    const before = given.at(-1)!;
    act(() => s().select({ nodes: [], links: ['C2'] }));
    const after = given.at(-1)!;
    expect(after.nodes).toBe(before.nodes);
    after.edges!.forEach((e, i) => {
      if (e.id === 'C2') expect(e.selected).toBe(true);
      else expect(e, e.id).toBe(before.edges![i]);
    });
    act(() => void s().apply({ op: 'set-details', patch: { title: 'Renamed job' } }));
    expect(given.at(-1)!.nodes).toBe(after.nodes);
    expect(given.at(-1)!.edges).toBe(after.edges);
  });
});

describe('flowList', () => {
  const job = smallJob();

  it('returns the same array until a record or its selection changes, then replaces only those entries', () => {
    const list = flowList(toFlowNode);
    const first = list(job.nodes, []);
    expect(first.map((n) => n.id)).toEqual(['S1', 'MSB', 'P1', 'P2']);
    expect(list(job.nodes, [])).toBe(first);
    expect(list([...job.nodes], [])).toBe(first); // same records in a new array: nothing to redraw
    const moved = job.nodes.map((n) => (n.id === 'P2' ? { ...n, at: { x: 260, y: 320 } } : n));
    const second = list(moved, ['MSB']);
    expect(second).not.toBe(first);
    expect(second.map((n, i) => n === first[i])).toEqual([true, false, true, false]);
    expect(second[1]!.selected).toBe(true);
    expect(second[3]!.position).toEqual({ x: 260, y: 320 });
    const third = list(moved, []);
    expect(third.map((n, i) => n === second[i])).toEqual([true, false, true, true]);
    expect(third[1]!.selected).toBe(false);
  });

  it('rebuilds when records are added or removed, keeping the objects of records it has seen', () => {
    const list = flowList(toFlowNode);
    const first = list(job.nodes, []);
    const fewer = list(job.nodes.filter((n) => n.id !== 'P1'), []);
    expect(fewer.map((n) => n.id)).toEqual(['S1', 'MSB', 'P2']);
    expect(fewer[2]).toBe(first[3]);
  });
});
