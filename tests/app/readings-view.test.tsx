// The testing view of the schedule: readings typed row after row with the keyboard, each one
// undoable edit, with the test limit and the measured result beside them. Invented test data.
import { act, fireEvent, render } from '@testing-library/react';
import { beforeEach, describe, expect, it } from 'vitest';
import { SchedulePanel } from '../../app/renderer/panels/index.js';
import { readingChange } from '../../app/renderer/panels/testing/readings.js';
import { useTestingView } from '../../app/renderer/panels/testing/view.js';
import { getCommand } from '../../app/renderer/commands/registry.js';
import { useEditor } from '../../app/renderer/store/index.js';
import { largeJob, linkOf, load, sampleJob } from './panels/fixture.js';

function cell(container: ParentNode, link: string, field: string): HTMLInputElement {
  const el = container.querySelector<HTMLInputElement>(`[data-testing-link="${link}"][data-testing-cell="${field}"]`);
  if (!el) throw new Error(`no ${field} cell for ${link}`);
  return el;
}

/** Types into a cell that has the focus and presses a key, as a user does. */
function typeAndPress(input: HTMLInputElement, text: string, key: string, shiftKey = false) {
  act(() => input.focus());
  fireEvent.change(input, { target: { value: text } });
  act(() => {
    fireEvent.keyDown(input, { key, shiftKey });
  });
}

function openTesting() {
  const view = render(<SchedulePanel />);
  act(() => fireEvent.click(view.container.querySelector('[data-schedule-view="testing"]')!));
  return view;
}

describe('testing view', () => {
  beforeEach(() => {
    load(sampleJob());
    useTestingView.setState({ view: 'design', session: {}, drafts: {} });
  });

  it('is a view of the schedule: a row per circuit with its test limit at 20 °C when no reading gives another', () => {
    const { container } = openTesting();
    expect(container.querySelector('[data-panel="testing"]')).not.toBeNull();
    const rows = [...container.querySelectorAll('[data-testing-row]')].map((r) => r.getAttribute('data-testing-row'));
    expect(rows).toEqual(['M1', 'C1', 'C2', 'C3', 'C4']);
    const limit = useEditor.getState().resultById.C1!.testLimit!;
    expect(limit).toBeGreaterThan(0);
    expect(container.querySelector('[data-testing-limit="C1"]')!.textContent).toBe(`${limit.toFixed(3)} at 20 °C`);
    // No protective device, no test limit.
    expect(container.querySelector('[data-testing-limit="C4"]')!.textContent).toBe('—');
    expect(container.querySelector('[data-caution]')!.textContent).toMatch(/design aid/);
    // And back.
    act(() => fireEvent.click(container.querySelector('[data-schedule-view="design"]')!));
    expect(container.querySelector('[data-panel="schedule"]')).not.toBeNull();
  });

  it('a Zs typed and entered is one undoable edit, shows its result, and Enter goes on to the next circuit', () => {
    const { container } = openTesting();
    const zs = cell(container, 'C1', 'zs');
    typeAndPress(zs, '0.61', 'Enter');
    expect(linkOf('C1').measured).toEqual({ zs: 0.61 });
    expect(document.activeElement).toBe(cell(container, 'C2', 'zs'));
    const m = useEditor.getState().resultById.C1!.measured!;
    expect(m.zs).toBe(0.61);
    expect(container.querySelector('[data-testing-status="C1"] [data-status-badge]')!.getAttribute('data-status-badge')).toBe(m.status);
    expect(container.querySelector('[data-testing-corrected="C1"]')!.textContent).toBe(m.corrected.toFixed(3));
    // Leaving the cell (the focus moved on) did not make a second edit: one undo clears it.
    expect(useEditor.getState().undoLabel).toBe('reading of C1: reading Zs');
    act(() => useEditor.getState().undo());
    expect(linkOf('C1').measured).toBeUndefined();
    expect(useEditor.getState().canUndo).toBe(false);
    expect(cell(container, 'C1', 'zs').value).toBe('');
    expect(container.querySelector('[data-testing-status="C1"]')!.textContent).toBe('no reading');
  });

  it('fills in row after row: Enter moves down, Shift+Enter up, Tab across to the next cell and on to the next row', () => {
    const { container } = openTesting();
    typeAndPress(cell(container, 'C1', 'zs'), '0.6', 'Enter');
    typeAndPress(cell(container, 'C2', 'zs'), '2.1', 'Enter');
    expect(document.activeElement).toBe(cell(container, 'C3', 'zs'));
    typeAndPress(cell(container, 'C3', 'zs'), '1.4', 'Tab');
    expect(document.activeElement).toBe(cell(container, 'C3', 'temperature'));
    typeAndPress(cell(container, 'C3', 'temperature'), '12', 'Tab');
    typeAndPress(cell(container, 'C3', 'date'), '2026-12-02', 'Tab');
    typeAndPress(cell(container, 'C3', 'instrument'), 'Meter A', 'Tab');
    expect(document.activeElement).toBe(cell(container, 'C4', 'zs'));
    typeAndPress(cell(container, 'C4', 'zs'), '', 'Enter', true);
    expect(document.activeElement).toBe(cell(container, 'C3', 'zs'));
    expect(linkOf('C3').measured).toEqual({ zs: 1.4, temperature: 12, date: '2026-12-02', instrument: 'Meter A' });
    expect(container.querySelector('[data-testing-limit="C3"]')!.textContent).toMatch(/ at 12 °C$/);
    // Six entries, six undo steps.
    for (let i = 0; i < 6; i++) act(() => useEditor.getState().undo());
    expect(useEditor.getState().canUndo).toBe(false);
    expect(linkOf('C1').measured).toBeUndefined();
  });

  it('refuses a bad value with its reason beside the cell, changes nothing and keeps the focus there', () => {
    const { container } = openTesting();
    typeAndPress(cell(container, 'C1', 'zs'), '0', 'Enter');
    expect(linkOf('C1').measured).toBeUndefined();
    expect(container.querySelector('[data-testing-error="C1:zs"]')!.textContent).toBe('Zs must be greater than 0 Ω, got 0');
    expect(document.activeElement).toBe(cell(container, 'C1', 'zs'));
    // The last good value is back in the cell; Enter on it moves on and clears the message.
    expect(cell(container, 'C1', 'zs').value).toBe('');
    act(() => void fireEvent.keyDown(cell(container, 'C1', 'zs'), { key: 'Enter' }));
    expect(document.activeElement).toBe(cell(container, 'C2', 'zs'));
    expect(container.querySelector('[data-testing-error="C1:zs"]')).toBeNull();
    typeAndPress(cell(container, 'C1', 'zs'), '0.7', 'Enter');
    typeAndPress(cell(container, 'C1', 'temperature'), '75', 'Enter');
    expect(container.querySelector('[data-testing-error="C1:temperature"]')!.textContent).toBe('Temperature must be ≤ 60 °C, got 75');
    expect(linkOf('C1').measured).toEqual({ zs: 0.7 });
  });

  it('keeps a temperature typed before the Zs for that row, and the day’s defaults, in the reading made with the Zs', () => {
    const { container } = openTesting();
    act(() => useTestingView.getState().setSession({ date: '2026-12-02', instrument: 'Meter A' }));
    typeAndPress(cell(container, 'C2', 'temperature'), '9', 'Tab');
    expect(linkOf('C2').measured).toBeUndefined();
    expect(cell(container, 'C2', 'temperature').value).toBe('9');
    expect(cell(container, 'C2', 'temperature').className).toContain('lwt-draft');
    typeAndPress(cell(container, 'C2', 'zs'), '1.8', 'Enter');
    expect(linkOf('C2').measured).toEqual({ zs: 1.8, temperature: 9, date: '2026-12-02', instrument: 'Meter A' });
    expect(useTestingView.getState().drafts.C2).toBeUndefined();
    act(() => useEditor.getState().undo());
    expect(linkOf('C2').measured).toBeUndefined();
  });

  it('takes the day’s date and instrument from the fields above the table', () => {
    const { container } = openTesting();
    const date = container.querySelector<HTMLInputElement>('[data-testing-session="date"]')!;
    fireEvent.change(date, { target: { value: ' 2026-12-03 ' } });
    act(() => void fireEvent.blur(date));
    const temp = container.querySelector<HTMLInputElement>('[data-testing-session="temperature"]')!;
    fireEvent.change(temp, { target: { value: '99' } });
    act(() => void fireEvent.blur(temp));
    expect(container.querySelector('[data-testing-session-error]')!.textContent).toBe('Temperature must be ≤ 60 °C, got 99');
    fireEvent.change(temp, { target: { value: '11' } });
    act(() => void fireEvent.blur(temp));
    expect(container.querySelector('[data-testing-session-error]')).toBeNull();
    typeAndPress(cell(container, 'C1', 'zs'), '0.5', 'Enter');
    expect(linkOf('C1').measured).toEqual({ zs: 0.5, temperature: 11, date: '2026-12-03' });
  });

  it('an emptied Zs removes the reading (one undoable edit) and says so', () => {
    const job = sampleJob();
    load({ ...job, links: job.links.map((l) => (l.id === 'C3' ? { ...l, measured: { zs: 1.2, temperature: 15 } } : l)) });
    const { container } = openTesting();
    expect(cell(container, 'C3', 'temperature').value).toBe('15');
    typeAndPress(cell(container, 'C3', 'zs'), '', 'Enter');
    expect(linkOf('C3').measured).toBeUndefined();
    expect(useEditor.getState().message?.text).toBe('Removed the reading of C3 (Undo puts it back)');
    act(() => useEditor.getState().undo());
    expect(linkOf('C3').measured).toEqual({ zs: 1.2, temperature: 15 });
  });

  it('takes each supply’s measured Ze, with which the circuits’ readings are corrected, as one undoable edit', () => {
    load(sampleJob('known'));
    const { container } = openTesting();
    typeAndPress(cell(container, 'C1', 'zs'), '0.7', 'Enter');
    const before = useEditor.getState().resultById.C1!.measured!.corrected;
    const ze = container.querySelector<HTMLInputElement>('[data-testing-ze="S1"]')!;
    typeAndPress(ze, '0.25', 'Enter');
    const supply = useEditor.getState().job.nodes.find((n) => n.id === 'S1')!;
    expect(supply.kind === 'supply' && supply.measured).toEqual({ ze: 0.25 });
    // method-depth.md section 7: corrected = Zem + (Zsm − Zem)·F, so a measured Ze changes it.
    expect(useEditor.getState().resultById.C1!.measured!.corrected).not.toBe(before);
    typeAndPress(ze, '-1', 'Enter');
    expect(container.querySelector('[data-testing-error="S1:ze"]')!.textContent).toBe('Measured Ze must be greater than 0 Ω, got -1');
    act(() => useEditor.getState().undo());
    const after = useEditor.getState().job.nodes.find((n) => n.id === 'S1')!;
    expect(after.kind === 'supply' && after.measured).toBeUndefined();
    expect(useEditor.getState().resultById.C1!.measured!.corrected).toBe(before);
  });

  it('on a large job renders only the rows in view, and Enter on the last one drawn brings the next into view and into focus', () => {
    load(largeJob(1000));
    const { container } = openTesting();
    const drawn = () => [...container.querySelectorAll('[data-testing-row]')].map((r) => r.getAttribute('data-testing-row')!);
    expect(container.querySelector('[data-testing-grid]')!.getAttribute('data-windowed')).toBe('true');
    const rows = drawn();
    expect(rows.length).toBeLessThan(100);
    const last = rows.at(-1)!;
    const next = useEditor.getState().job.links[rows.length]!.id;
    expect(drawn()).not.toContain(next);
    typeAndPress(cell(container, last, 'zs'), '0.9', 'Enter');
    expect(linkOf(last).measured).toEqual({ zs: 0.9 });
    expect(drawn()).toContain(next);
    expect(document.activeElement).toBe(cell(container, next, 'zs'));
  });

  it('is a command on the View menu', () => {
    const command = getCommand('view.testing')!;
    expect(command.group).toBe('view');
    act(() => void command.run({} as never));
    expect(useTestingView.getState().view).toBe('testing');
    act(() => void command.run({} as never));
    expect(useTestingView.getState().view).toBe('design');
  });
});

describe('what a cell does to a reading', () => {
  it('starts a reading from the defaults and the row’s draft; edits one key of an existing one', () => {
    expect(readingChange(undefined, 'zs', 0.5, { date: 'd', temperature: 20 }, { temperature: 8 }))
      .toEqual({ kind: 'reading', measured: { zs: 0.5, temperature: 8, date: 'd' } });
    expect(readingChange({ zs: 0.5, date: 'd' }, 'zs', 0.6, { instrument: 'x' }, undefined))
      .toEqual({ kind: 'reading', measured: { zs: 0.6, date: 'd' } });
    expect(readingChange({ zs: 0.5, date: 'd' }, 'date', undefined, {}, undefined)).toEqual({ kind: 'reading', measured: { zs: 0.5 } });
    expect(readingChange({ zs: 0.5 }, 'zs', undefined, {}, undefined)).toEqual({ kind: 'reading', measured: undefined });
    expect(readingChange(undefined, 'zs', undefined, {}, undefined)).toEqual({ kind: 'none' });
    expect(readingChange(undefined, 'instrument', 'M', {}, { temperature: 3 })).toEqual({ kind: 'draft', draft: { temperature: 3, instrument: 'M' } });
  });
});
