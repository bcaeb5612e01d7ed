// Find on a busy store: what it searches (ids, kinds, names, ends) keeps its identity through
// moves and edits of other fields, so an open Find does not re-run its search or re-render on a
// drag frame; a rename shows at once, and with no query it does not read the job at all.
import { act, render } from '@testing-library/react';
import { Profiler } from 'react';
import { beforeEach, describe, expect, it } from 'vitest';
import { FindDialog } from '../../app/renderer/app/FindDialog.js';
import { useUi } from '../../app/renderer/app/ui.js';
import { useEditor } from '../../app/renderer/store/index.js';
import { selectSearchable } from '../../app/renderer/store/selectors.js';
import { smallJob } from './fixture.js';

const s = () => useEditor.getState();
const c1Cable = () => s().job.links.find((l) => l.id === 'C1')!.cable;

describe('selectSearchable', () => {
  beforeEach(() => s().loadJob(smallJob(), { name: 'test.lwj' }));

  it('stays the same object through moves and cable edits, and changes on a rename, an added node or new ends', () => {
    const first = selectSearchable(s());
    s().moveLive([{ id: 'P1', at: { x: -180, y: 330 } }]);
    s().apply({ op: 'move', moves: [{ id: 'P1', at: { x: -180, y: 330 } }] });
    s().apply({ op: 'update-link', id: 'C1', patch: { cable: { ...c1Cable(), length: 44 } } });
    expect(selectSearchable(s())).toBe(first);
    s().apply({ op: 'update-node', id: 'P2', patch: { name: 'Porch lights' } });
    const renamed = selectSearchable(s());
    expect(renamed).not.toBe(first);
    expect(renamed.nodes.find((n) => n.id === 'P2')?.name).toBe('Porch lights');
    s().apply({ op: 'update-link', id: 'C1', patch: { name: 'Kitchen power' } });
    const linkRenamed = selectSearchable(s());
    expect(linkRenamed).not.toBe(renamed);
    s().apply({ op: 'add-node', node: { id: 'P3', kind: 'point', name: 'Shed', use: 'lighting', at: { x: 400, y: 320 } } });
    expect(selectSearchable(s())).not.toBe(linkRenamed);
    expect(selectSearchable(s()).nodes.map((n) => n.id)).toContain('P3');
  });
});

describe('Find while the job changes', () => {
  beforeEach(() => {
    s().loadJob(smallJob(), { name: 'test.lwj' });
    useUi.getState().set({ findOpen: true });
  });

  function openFind() {
    const commits = { n: 0 };
    const view = render(<Profiler id="find" onRender={() => { commits.n += 1; }}><FindDialog /></Profiler>);
    return { ...view, commits };
  }

  const type = (input: HTMLInputElement, text: string) => act(() => {
    Object.getOwnPropertyDescriptor(HTMLInputElement.prototype, 'value')!.set!.call(input, text);
    input.dispatchEvent(new Event('input', { bubbles: true }));
  });

  it('does not re-render for a drag or a cable edit, and shows a rename at once', () => {
    const { container, commits } = openFind();
    const input = container.querySelector<HTMLInputElement>('[data-find]')!;
    // No query: nothing of the job is read, so no change re-renders it.
    let before = commits.n;
    act(() => s().moveLive([{ id: 'P1', at: { x: -170, y: 300 } }]));
    act(() => void s().apply({ op: 'update-node', id: 'P2', patch: { name: 'Porch' } }));
    expect(commits.n).toBe(before);
    type(input, 'p');
    const hits = () => [...container.querySelectorAll('[data-find-hit]')].map((b) => b.textContent);
    expect(hits()).toContain('P2 · point · Porch');
    before = commits.n;
    act(() => s().moveLive([{ id: 'P1', at: { x: -160, y: 290 } }]));
    act(() => void s().apply({ op: 'move', moves: [{ id: 'P1', at: { x: -160, y: 290 } }] }));
    act(() => void s().apply({ op: 'update-link', id: 'C1', patch: { cable: { ...c1Cable(), length: 30 } } }));
    expect(commits.n).toBe(before);
    act(() => void s().apply({ op: 'update-node', id: 'P2', patch: { name: 'Garden' } }));
    expect(hits()).toContain('P2 · point · Garden');
  });
});
