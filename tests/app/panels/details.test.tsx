import { act, fireEvent, render, screen, within } from '@testing-library/react';
import { Profiler } from 'react';
import { beforeEach, describe, expect, it } from 'vitest';
import { STANDARD_SIZES } from '../../../engine/index.js';
import { DetailsPanel } from '../../../app/renderer/panels/index.js';
import { useEditor } from '../../../app/renderer/store/index.js';
import { choose, field, fieldError, typeAndBlur, typeAndEnter } from './dom.js';
import { largeJob, linkOf, load, sampleJob } from './fixture.js';
import { FeedList } from '../../../app/renderer/app/FeedPicker.js';

function selectLink(id: string) {
  act(() => useEditor.getState().select({ nodes: [], links: [id] }));
}

describe('details panel for a link', () => {
  beforeEach(() => load(sampleJob()));

  it('asks for a selection when nothing is selected', () => {
    render(<DetailsPanel />);
    expect(screen.getByText(/Select a supply, board, point or link/)).toBeTruthy();
  });

  it('shows every field of the link with its units', () => {
    const { container } = render(<DetailsPanel />);
    selectLink('C1');
    expect(field(container, 'id').value).toBe('C1');
    expect(field(container, 'name').value).toBe('Kitchen power');
    expect(field(container, 'cable.length').value).toBe('32');
    expect(field<HTMLSelectElement>(container, 'cable.material').value).toBe('Cu');
    expect(field(container, 'cable.active').value).toBe('2.5');
    expect(field(container, 'cable.earth').value).toBe('2.5');
    expect(field<HTMLSelectElement>(container, 'cable.earthMaterial').value).toBe('same');
    expect(field(container, 'cable.parallel').value).toBe('');
    expect(field<HTMLSelectElement>(container, 'device.type').value).toBe('mcb');
    expect(field<HTMLSelectElement>(container, 'device.curve').value).toBe('C');
    expect(field(container, 'device.rating').value).toBe('20');
    expect(field(container, 'device.breaking').value).toBe('');
    expect(field(container, 'device.label').value).toBe('');
    expect(field(container, 'rcd').checked).toBe(true);
    // Stored in A (0.03), shown in mA.
    expect(field(container, 'rcd.sensitivity').value).toBe('30');
    expect(field(container, 'requiredTime').value).toBe('');
    for (const unit of ['(m)', '(mm²)', '(A)', '(mA)', '(s)', '(kA)', '(Ω/m)']) {
      expect(container.querySelector(`input[aria-label$="${unit}"]`), unit).not.toBeNull();
    }
    // Standard sizes are offered first through the size inputs' datalist.
    const list = container.querySelector(`#${field(container, 'cable.active').getAttribute('list')}`)!;
    expect([...list.querySelectorAll('option')].map((o) => Number(o.value))).toEqual(STANDARD_SIZES);
  });

  it("shows the circuit's results beside its inputs", () => {
    const { container } = render(<DetailsPanel />);
    selectLink('C2');
    const results = container.querySelector('[data-results="C2"]') as HTMLElement;
    const r = useEditor.getState().resultById.C2!;
    expect(r.status).toBe('fail');
    // The loop's own status line (the verdict line above it comes from all the checks).
    expect(within(results.querySelector('.lwp-results-status') as HTMLElement).getByText('FAIL')).toBeTruthy();
    // Source unknown: own and upstream loops, no Zs.
    expect(results.querySelector('[data-result="own"] td')!.textContent).toBe(`${r.own!.toFixed(3)} Ω`);
    expect(results.querySelector('[data-result="upstream"] td')!.textContent).toBe(`${r.upstream!.toFixed(3)} Ω`);
    expect(results.querySelector('[data-result="zs"]')).toBeNull();
    expect(results.querySelector('[data-result="limit"] td')!.textContent).toBe(`${r.limit!.toFixed(3)} Ω`);
    expect(results.querySelector('[data-result="maxLength"] td')!.textContent).toBe(`${r.maxLength!.toFixed(1)} m`);
    expect(results.querySelector('[data-result="requiredTime"] td')!.textContent).toBe('0.4 s');
  });

  it('commits a good value through the store', () => {
    const { container } = render(<DetailsPanel />);
    selectLink('C1');
    typeAndEnter(field(container, 'cable.length'), '40');
    expect(linkOf('C1').cable.length).toBe(40);
    expect(field(container, 'cable.length').value).toBe('40');
    expect(useEditor.getState().canUndo).toBe(true);
  });

  it('refuses a negative length, shows why beside the field and keeps the last good value', () => {
    const { container } = render(<DetailsPanel />);
    selectLink('C1');
    const before = useEditor.getState().job;
    typeAndBlur(field(container, 'cable.length'), '-5');
    const error = fieldError(container, 'cable.length');
    expect(error?.getAttribute('role')).toBe('alert');
    expect(error?.textContent).toMatch(/Length must be ≥ 0 m, got -5/);
    expect(field(container, 'cable.length').value).toBe('32');
    expect(useEditor.getState().job).toBe(before);
  });

  it('refuses text that is not a number', () => {
    const { container } = render(<DetailsPanel />);
    selectLink('C1');
    typeAndEnter(field(container, 'cable.active'), '2,5');
    expect(fieldError(container, 'cable.active')?.textContent).toMatch(/"2,5" is not a number \(use a point for decimals\)/);
    expect(field(container, 'cable.active').value).toBe('2.5');
    typeAndEnter(field(container, 'cable.earth'), '0');
    expect(fieldError(container, 'cable.earth')?.textContent).toMatch(/greater than 0 mm²/);
    expect(linkOf('C1').cable.earth).toBe(2.5);
  });

  it('shows the engine’s reason when the store refuses an edit', () => {
    const { container } = render(<DetailsPanel />);
    selectLink('C1');
    typeAndEnter(field(container, 'id'), 'MSB'); // already the board's id
    expect(fieldError(container, 'id')?.textContent).toMatch(/MSB is already used/);
    expect(field(container, 'id').value).toBe('C1');
    expect(useEditor.getState().job.links.some((l) => l.id === 'C1')).toBe(true);
  });

  it('renames a link and keeps it selected', () => {
    const { container } = render(<DetailsPanel />);
    selectLink('C1');
    typeAndEnter(field(container, 'id'), 'K1');
    expect(useEditor.getState().selection.links).toEqual(['K1']);
    expect(container.querySelector('[data-details-link="K1"]')).not.toBeNull();
    expect(useEditor.getState().resultById.K1!.status).toBe('pass');
  });

  it('clears the error once a good value is committed', () => {
    const { container } = render(<DetailsPanel />);
    selectLink('C1');
    typeAndEnter(field(container, 'cable.length'), 'x');
    expect(fieldError(container, 'cable.length')).not.toBeNull();
    typeAndEnter(field(container, 'cable.length'), '12');
    expect(fieldError(container, 'cable.length')).toBeNull();
    expect(linkOf('C1').cable.length).toBe(12);
  });

  it('shows a value changed elsewhere (undo) and drops a stale message', () => {
    const { container } = render(<DetailsPanel />);
    selectLink('C1');
    typeAndEnter(field(container, 'cable.length'), '50');
    typeAndEnter(field(container, 'cable.length'), '-1');
    expect(fieldError(container, 'cable.length')).not.toBeNull();
    act(() => useEditor.getState().undo());
    expect(field(container, 'cable.length').value).toBe('32');
    expect(fieldError(container, 'cable.length')).toBeNull();
  });

  it('accepts a non-standard conductor size and says it is not standard', () => {
    const { container } = render(<DetailsPanel />);
    selectLink('C1');
    typeAndEnter(field(container, 'cable.active'), '3');
    expect(linkOf('C1').cable.active).toBe(3);
    expect(container.textContent).toContain('3 mm² is not a standard size');
  });

  it('shows the RCD sensitivity in mA and stores it in A; turning it off removes it', () => {
    const { container } = render(<DetailsPanel />);
    selectLink('C1');
    typeAndEnter(field(container, 'rcd.sensitivity'), '100');
    expect(linkOf('C1').rcd).toEqual({ sensitivity: 0.1 });
    fireEvent.click(field(container, 'rcd'));
    expect(linkOf('C1').rcd).toBeUndefined();
    expect(container.querySelector('[data-field="rcd.sensitivity"]')).toBeNull();
  });

  it('sets and clears the required-time override', () => {
    const { container } = render(<DetailsPanel />);
    selectLink('C1');
    typeAndEnter(field(container, 'requiredTime'), '5');
    expect(linkOf('C1').requiredTime).toBe(5);
    expect(useEditor.getState().resultById.C1!.requiredTime).toBe(5);
    typeAndEnter(field(container, 'requiredTime'), '');
    expect('requiredTime' in linkOf('C1')).toBe(false);
  });

  it('switches between the four device kinds and no device; a new kind starts empty until its data is entered', () => {
    const { container } = render(<DetailsPanel />);
    selectLink('C1');
    choose(field<HTMLSelectElement>(container, 'device.type'), 'adjustable');
    // Nothing made up: the old device leaves the job and the new one's fields are empty.
    expect(linkOf('C1').device).toBeUndefined();
    expect(field(container, 'device.instantaneous').value).toBe('');
    expect(container.querySelector('[data-field="device.curve"]')).toBeNull();
    typeAndEnter(field(container, 'device.rating'), '20');
    typeAndEnter(field(container, 'device.instantaneous'), '200');
    expect(linkOf('C1').device).toEqual({ type: 'adjustable', rating: 20, instantaneous: 200 });

    choose(field<HTMLSelectElement>(container, 'device.type'), 'fixed');
    expect(linkOf('C1').device).toBeUndefined();
    typeAndEnter(field(container, 'device.rating'), '20');
    typeAndEnter(field(container, 'device.tripCurrent'), '150');
    expect(linkOf('C1').device).toMatchObject({ type: 'fixed', tripCurrent: 150 });
    // A trip current of 150 A is the same as C20 under au-nz (7.5 × 20 A), so the result matches.
    expect(useEditor.getState().resultById.C1!.tripCurrent).toBe(150);

    choose(field<HTMLSelectElement>(container, 'device.type'), 'curve');
    expect(linkOf('C1').device).toBeUndefined();
    expect(container.querySelectorAll('[data-curve-row]').length).toBe(2);

    choose(field<HTMLSelectElement>(container, 'device.type'), 'none');
    expect(linkOf('C1').device).toBeUndefined();
    expect(useEditor.getState().resultById.C1!.status).toBe('unchecked');

    choose(field<HTMLSelectElement>(container, 'device.type'), 'mcb');
    choose(field<HTMLSelectElement>(container, 'device.curve'), 'C');
    typeAndEnter(field(container, 'device.rating'), '20');
    expect(linkOf('C1').device).toEqual({ type: 'mcb', curve: 'C', rating: 20 });
    choose(field<HTMLSelectElement>(container, 'device.curve'), 'B');
    expect(linkOf('C1').device).toEqual({ type: 'mcb', curve: 'B', rating: 20 });
  });

  it('edits breaking capacity and label, and refuses a negative breaking capacity', () => {
    const { container } = render(<DetailsPanel />);
    selectLink('C1');
    typeAndEnter(field(container, 'device.breaking'), '6');
    typeAndBlur(field(container, 'device.label'), 'QF1');
    expect(linkOf('C1').device).toMatchObject({ breaking: 6, label: 'QF1' });
    expect(useEditor.getState().resultById.C1!.device).toBe('QF1');
    typeAndEnter(field(container, 'device.breaking'), '-6');
    expect(fieldError(container, 'device.breaking')).not.toBeNull();
    expect(linkOf('C1').device).toMatchObject({ breaking: 6 });
  });
});

describe('curve points editor', () => {
  beforeEach(() => {
    const job = sampleJob();
    job.links[1] = { ...job.links[1]!, device: { type: 'curve', rating: 20, points: [[40, 10], [100, 1], [400, 0.01]] } };
    load(job);
  });

  it('adds, edits and removes rows', () => {
    const { container } = render(<DetailsPanel />);
    selectLink('C1');
    fireEvent.click(container.querySelector('[data-action="add-point"]')!);
    const points = () => (linkOf('C1').device as { points: Array<[number, number]> }).points;
    expect(points()).toEqual([[40, 10], [100, 1], [400, 0.01], [800, 0.005]]);
    typeAndEnter(field(container, 'device.points.1.1'), '2');
    expect(points()[1]).toEqual([100, 2]);
    const removeButtons = container.querySelectorAll<HTMLButtonElement>('[data-action="remove-point"]');
    fireEvent.click(removeButtons[3]!);
    expect(points()).toEqual([[40, 10], [100, 2], [400, 0.01]]);
  });

  it('refuses points that do not rise in current, keeping the curve', () => {
    const { container } = render(<DetailsPanel />);
    selectLink('C1');
    typeAndEnter(field(container, 'device.points.1.0'), '30'); // below the first point's 40 A
    expect(fieldError(container, 'device.points.1.0')?.textContent).toMatch(/points/);
    expect(field(container, 'device.points.1.0').value).toBe('100');
    expect((linkOf('C1').device as { points: unknown }).points).toEqual([[40, 10], [100, 1], [400, 0.01]]);
  });

  it('does not let a curve drop below two points', () => {
    const { container } = render(<DetailsPanel />);
    selectLink('C1');
    fireEvent.click(container.querySelectorAll<HTMLButtonElement>('[data-action="remove-point"]')[0]!);
    expect(container.querySelectorAll('[data-curve-row]').length).toBe(2);
    const buttons = container.querySelectorAll<HTMLButtonElement>('[data-action="remove-point"]');
    expect([...buttons].every((b) => b.disabled)).toBe(true);
  });
});

describe('a node moved while its details are shown (a drag)', () => {
  beforeEach(() => load(sampleJob()));

  it('shows each new position in one commit of the panel, and keeps the other fields untouched', () => {
    let commits = 0;
    const { container } = render(
      <Profiler id="details" onRender={() => void commits++}>
        <DetailsPanel />
      </Profiler>,
    );
    act(() => useEditor.getState().select({ nodes: ['P2'], links: [] }));
    const x = field(container, 'at.x');
    const name = field(container, 'name');
    commits = 0;
    for (let step = 1; step <= 5; step++) {
      act(() => void useEditor.getState().apply({ op: 'move', moves: [{ id: 'P2', at: { x: step * 10, y: 320 } }] }));
      expect(field(container, 'at.x').value).toBe(String(step * 10));
    }
    // One commit a move: the field takes the new value while rendering, not in a second pass.
    expect(commits).toBe(5);
    expect(field(container, 'at.x')).toBe(x);
    expect(name.value).toBe('Shed');
  });
});

describe('details panel for nodes and several elements', () => {
  beforeEach(() => load(sampleJob()));

  it('edits the supply source', () => {
    const { container } = render(<DetailsPanel />);
    act(() => useEditor.getState().select({ nodes: ['S1'], links: [] }));
    choose(field<HTMLSelectElement>(container, 'source.type'), 'impedance');
    typeAndEnter(field(container, 'source.r'), '0.25');
    typeAndEnter(field(container, 'source.x'), '0.05');
    const s1 = useEditor.getState().job.nodes[0]!;
    expect(s1).toMatchObject({ source: { type: 'impedance', r: 0.25, x: 0.05 } });
    expect(useEditor.getState().resultById.C1!.method).toBe('known-source');
    choose(field<HTMLSelectElement>(container, 'source.type'), 'fault-current');
    typeAndEnter(field(container, 'source.current'), 'lots');
    expect(fieldError(container, 'source.current')?.textContent).toMatch(/not a number/);
  });

  it('edits a point: use, hand-held, current, phases, power factor', () => {
    const { container } = render(<DetailsPanel />);
    act(() => useEditor.getState().select({ nodes: ['P4'], links: [] }));
    choose(field<HTMLSelectElement>(container, 'use'), 'fixed-equipment');
    fireEvent.click(field(container, 'handHeld'));
    typeAndEnter(field(container, 'current'), '12');
    choose(field<HTMLSelectElement>(container, 'phases'), '3');
    typeAndEnter(field(container, 'powerFactor'), '0.85');
    expect(useEditor.getState().job.nodes.find((n) => n.id === 'P4')).toMatchObject({
      use: 'fixed-equipment', handHeld: true, current: 12, phases: 3, powerFactor: 0.85,
    });
    typeAndEnter(field(container, 'powerFactor'), '1.5');
    expect(fieldError(container, 'powerFactor')?.textContent).toMatch(/≤ 1/);
  });

  it('edits board diversity', () => {
    const { container } = render(<DetailsPanel />);
    act(() => useEditor.getState().select({ nodes: ['MSB'], links: [] }));
    typeAndEnter(field(container, 'diversity'), '0.7');
    expect(useEditor.getState().job.nodes.find((n) => n.id === 'MSB')).toMatchObject({ diversity: 0.7 });
  });

  it('counts several selected elements and says how to delete them', () => {
    render(<DetailsPanel />);
    act(() => useEditor.getState().select({ nodes: ['P1', 'P2'], links: ['C1'] }));
    expect(screen.getByText('3 selected')).toBeTruthy();
    expect(screen.getByText(/Press Delete to remove them/)).toBeTruthy();
  });

  it('"Show loop breakdown" opens the breakdown and highlights the path from the supply', () => {
    const { container } = render(<DetailsPanel />);
    selectLink('C1');
    fireEvent.click(container.querySelector('[data-action="show-breakdown"]')!);
    expect(useEditor.getState().breakdownLink).toBe('C1');
    expect(useEditor.getState().highlightPath).toEqual(['S1', 'M1', 'MSB', 'C1', 'P1']);
  });
});

describe('the feed of a link on a large job', () => {
  beforeEach(() => {
    // A board of its own to move circuits to, beside the main switchboard (invented data).
    const job = largeJob(400);
    load({ ...job, nodes: [...job.nodes, { id: 'DB2', kind: 'board', name: 'Second board', at: { x: 0, y: 500 } }],
      links: [...job.links, { id: 'SM1', from: 'MSB', to: 'DB2', cable: { length: 20, material: 'Cu', active: 10, earth: 4 } }] });
  });

  it('is typed with the parts offered from one shared list, not chosen from a list box of every part', () => {
    const { container } = render(<><DetailsPanel /><FeedList /></>);
    selectLink('C7');
    const from = field(container, 'from');
    expect(from.tagName).toBe('INPUT');
    expect(from.value).toBe('MSB');
    const list = container.querySelector(`datalist#${from.getAttribute('list')}`)!;
    expect(list).toBeTruthy();
    // Every part (403 nodes: the supply, two boards, 400 points), supplies and boards first.
    const offered = [...list.querySelectorAll('option')].map((o) => o.value);
    expect(offered).toHaveLength(403);
    expect(offered.slice(0, 3)).toEqual(['S1', 'DB2', 'MSB']);
    // The list stays the one element as another link is shown.
    selectLink('C8');
    expect(container.querySelector('[data-feed-list]')).toBe(list);
  });

  it('moves the circuit when an id is typed, and refuses an id that is no part, saying why', () => {
    const { container } = render(<><DetailsPanel /><FeedList /></>);
    selectLink('C7');
    typeAndEnter(field(container, 'from'), 'NOPE');
    expect(fieldError(container, 'from')?.textContent).toMatch(/there is no node NOPE/);
    expect(linkOf('C7').from).toBe('MSB');
    typeAndEnter(field(container, 'from'), 'DB2');
    expect(linkOf('C7').from).toBe('DB2');
  });
});
