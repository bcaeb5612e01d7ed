// Messages that clear and make sense: a field's refusal goes when a valid value is entered, on
// undo, on Escape and when the focus leaves its schedule row; refusals name elements in the
// user's words; values far outside practice are accepted with a warning beside the field.
import { beforeEach, describe, expect, it } from 'vitest';
import { act, fireEvent, render } from '@testing-library/react';
import { useEditor } from '../../app/renderer/store/index.js';
import { describe as describeProblem } from '../../app/renderer/store/derive.js';
import { practiceWarning } from '../../app/renderer/store/practice.js';
import { NumberField } from '../../app/renderer/panels/fields/fields.js';
import { editLink } from '../../app/renderer/panels/actions.js';
import { smallJob } from './fixture.js';

const s = () => useEditor.getState();

function LengthField({ compact }: { compact?: boolean }) {
  const length = useEditor((st) => st.job.links.find((l) => l.id === 'C1')!.cable.length);
  return (
    <NumberField field="cable.length" label="Length" unit="m" min={0} value={length} compact={compact}
      attr={compact ? 'data-cell' : 'data-field'} onCommit={(v) => editLink('C1', 'cable.length', v)} />
  );
}

function type(input: HTMLInputElement, text: string) {
  fireEvent.change(input, { target: { value: text } });
  fireEvent.keyDown(input, { key: 'Enter' });
}

describe('a field refusal clears', () => {
  beforeEach(() => s().loadJob(smallJob()));

  it('when a valid value is entered, including the value it already has', () => {
    const { container } = render(<LengthField />);
    const input = container.querySelector<HTMLInputElement>('[data-field="cable.length"]')!;
    type(input, '-4');
    expect(container.querySelector('[data-field-error="cable.length"]')?.textContent).toBe('Length must be ≥ 0 m, got -4');
    type(input, '20');
    expect(container.querySelector('[data-field-error]')).toBeNull();
    type(input, 'abc');
    expect(container.querySelector('[data-field-error]')).not.toBeNull();
    type(input, '25');
    expect(container.querySelector('[data-field-error]')).toBeNull();
    expect(s().job.links.find((l) => l.id === 'C1')!.cable.length).toBe(25);
  });

  it('on undo, even when the undone edit is of another field', () => {
    const { container } = render(<LengthField />);
    act(() => void s().apply({ op: 'update-link', id: 'C2', patch: { name: 'Lights' } }, 'name C2'));
    const input = container.querySelector<HTMLInputElement>('[data-field="cable.length"]')!;
    type(input, '-1');
    expect(container.querySelector('[data-field-error]')).not.toBeNull();
    act(() => s().undo());
    expect(container.querySelector('[data-field-error]')).toBeNull();
  });

  it('in a schedule row: on Escape, and when the focus leaves the row (not when it moves within it)', () => {
    const { container } = render(
      <table><tbody>
        <tr data-row="a"><td><LengthField compact /></td><td><input data-other-in-row /></td></tr>
        <tr data-row="b"><td><input data-next-row /></td></tr>
      </tbody></table>,
    );
    const input = container.querySelector<HTMLInputElement>('[data-cell="cable.length"]')!;
    type(input, '-2');
    expect(container.querySelector('[data-cell-error="cable.length"]')?.getAttribute('title')).toBe('Length must be ≥ 0 m, got -2');
    fireEvent.focusIn(container.querySelector('[data-other-in-row]')!);
    expect(container.querySelector('[data-cell-error]')).not.toBeNull();
    fireEvent.focusIn(container.querySelector('[data-next-row]')!);
    expect(container.querySelector('[data-cell-error]')).toBeNull();
    type(input, '-3');
    expect(container.querySelector('[data-cell-error]')).not.toBeNull();
    fireEvent.keyDown(document.body, { key: 'Escape' });
    expect(container.querySelector('[data-cell-error]')).toBeNull();
  });
});

describe('refusals in the user\'s words', () => {
  beforeEach(() => s().loadJob(smallJob()));

  it('a link into the supply names the link by id and ends, not its place in the file', () => {
    const out = s().apply({ op: 'add-link', link: { id: 'SM3', from: 'MSB', to: 'S1', cable: { length: 5, material: 'Cu', active: 16, earth: 6 } } });
    expect(out.ok).toBe(false);
    if (out.ok) return;
    expect(out.reason).not.toMatch(/links\[/);
    expect(out.reason).toMatch(/^Link SM3 \(MSB → S1\): its far end is the supply "S1"/);
  });

  it('a second feeder names the other link by its id', () => {
    const job = s().job;
    const text = describeProblem({ severity: 'error', where: 'links[3] (X1)', id: 'C1', field: 'to',
      message: 'node "P1" is already fed by link "C1" (links[1]); every node is fed by exactly one link' }, job);
    expect(text).toBe('Link C1 (MSB → P1): node "P1" is already fed by link "C1"; every node is fed by exactly one link');
  });

  it('a bad cable value names the field in words', () => {
    const out = s().apply({ op: 'update-link', id: 'C2', patch: { cable: { length: 10, material: 'Cu', active: -1, earth: 1.5 } } });
    expect(out.ok).toBe(false);
    if (!out.ok) expect(out.reason).toMatch(/^Link C2 \(MSB → P2\): the active conductor size /);
  });
});

describe('values far outside practice', () => {
  beforeEach(() => s().loadJob(smallJob()));

  it('warns about a 1e9 m cable and a 0.01 mm² conductor, not about usual values', () => {
    // Common practice: LV cable runs are metres to a few km, conductors 0.5 mm² and up.
    expect(practiceWarning('cable.length', 1e9)).toBe('1.00e+9 m is far above practice for a cable run (over 5000 m): check the value and its unit');
    expect(practiceWarning('cable.active', 0.01)).toBe('0.01 mm² is far below practice for an active conductor (under 0.5 mm²): check the value and its unit');
    expect(practiceWarning('cable.length', 35)).toBeNull();
    expect(practiceWarning('cable.active', 2.5)).toBeNull();
    expect(practiceWarning('name', 1e9)).toBeNull();
  });

  it('accepts the value and shows the warning beside the field while it stands', () => {
    const { container } = render(<LengthField />);
    const input = container.querySelector<HTMLInputElement>('[data-field="cable.length"]')!;
    type(input, '1e9');
    expect(s().job.links.find((l) => l.id === 'C1')!.cable.length).toBe(1e9);
    expect(container.querySelector('[data-field-error]')).toBeNull();
    expect(container.querySelector('[data-field-warning="cable.length"]')?.textContent).toMatch(/^⚠ 1.00e\+9 m is far above practice/);
    type(input, '30');
    expect(container.querySelector('[data-field-warning]')).toBeNull();
  });
});
