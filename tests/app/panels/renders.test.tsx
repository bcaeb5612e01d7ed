// What re-renders on a large job's busiest store changes: a drag frame (moveLive) or an edit of
// another circuit must not re-render the details form, the loop breakdown, the toolbar or an
// open context menu; a change to what they show must.
import { act, render } from '@testing-library/react';
import { Profiler, type ReactNode } from 'react';
import { beforeEach, describe, expect, it } from 'vitest';
import { BreakdownPanel, DetailsPanel, showBreakdown } from '../../../app/renderer/panels/index.js';
import { Toolbar } from '../../../app/renderer/app/Toolbar.js';
import { ContextMenu } from '../../../app/renderer/app/ContextMenu.js';
import { useUi } from '../../../app/renderer/app/ui.js';
import { useEditor } from '../../../app/renderer/store/index.js';
import { linkOf, load, sampleJob } from './fixture.js';

const s = () => useEditor.getState();

function counted(ui: ReactNode) {
  const commits = { n: 0 };
  const view = render(<Profiler id="under-test" onRender={() => { commits.n += 1; }}>{ui}</Profiler>);
  return { ...view, commits };
}

const drag = (id: string, x: number) => act(() => s().moveLive([{ id, at: { x, y: 320 } }]));
const lengthOf = (id: string, metres: number) =>
  act(() => void s().apply({ op: 'update-link', id, patch: { cable: { ...linkOf(id).cable, length: metres } } }));

describe('re-renders on a busy store', () => {
  beforeEach(() => load(sampleJob()));

  it('the details form of a link ignores drags of other nodes and edits of other links', () => {
    const { container, commits } = counted(<DetailsPanel />);
    act(() => s().select({ nodes: [], links: ['C1'] }));
    const before = commits.n;
    drag('P3', 210);
    drag('P3', 220);
    lengthOf('C2', 130);
    expect(commits.n).toBe(before);
    // Its own far end renamed, or its own length edited: shown at once.
    act(() => void s().apply({ op: 'update-node', id: 'P1', patch: { name: 'Kitchen east' } }));
    expect(container.textContent).toContain('Kitchen east');
    lengthOf('C1', 33);
    expect(container.querySelector<HTMLInputElement>('[data-field="cable.length"]')!.value).toBe('33');
  });

  it('the loop breakdown recomputes only when a record on its path changes', () => {
    const { container, commits } = counted(<BreakdownPanel />);
    act(() => showBreakdown('C2'));
    const total = () => Number(container.querySelector('[data-breakdown-total]')!.getAttribute('data-breakdown-total'));
    const first = total();
    const before = commits.n;
    drag('P3', 230);
    lengthOf('C3', 95);
    expect(commits.n).toBe(before);
    lengthOf('M1', 40); // upstream of C2: on its path
    expect(total()).toBeGreaterThan(first);
  });

  it('the toolbar re-renders only when a button changes state', () => {
    const { container, commits } = counted(<Toolbar />);
    const undo = () => container.querySelector<HTMLButtonElement>('[data-command="edit.undo"]')!;
    expect(undo().disabled).toBe(true);
    lengthOf('C2', 130);
    expect(undo().disabled).toBe(false);
    const before = commits.n;
    lengthOf('C2', 131);
    act(() => s().select({ nodes: ['P1'], links: [] }));
    act(() => s().setMessage({ kind: 'info', text: 'hello' }));
    expect(commits.n).toBe(before);
    act(() => s().undo());
    act(() => s().undo());
    expect(undo().disabled).toBe(true);
  });

  it('an open context menu follows the selection but not drags', () => {
    const { container, commits } = counted(<ContextMenu />);
    act(() => useUi.getState().set({ contextMenu: { x: 10, y: 10 } }));
    const copy = () => container.querySelector<HTMLButtonElement>('[data-command="edit.copy"]')!;
    expect(copy().disabled).toBe(true);
    act(() => s().select({ nodes: ['P1'], links: [] }));
    expect(copy().disabled).toBe(false);
    const before = commits.n;
    drag('P3', 240);
    expect(commits.n).toBe(before);
    act(() => useUi.getState().set({ contextMenu: null }));
  });
});
