import { fireEvent, render } from '@testing-library/react';
import { beforeEach, describe, expect, it } from 'vitest';
import { JobPanel } from '../../../app/renderer/panels/index.js';
import { withOverride } from '../../../app/renderer/panels/job/JobPanel.js';
import { useEditor } from '../../../app/renderer/store/index.js';
import { choose, field, fieldError, typeAndBlur, typeAndEnter } from './dom.js';
import { load, sampleJob } from './fixture.js';

const rules = () => useEditor.getState().job.rules;

describe('job panel', () => {
  beforeEach(() => load(sampleJob()));

  it('edits the job details', () => {
    const { container } = render(<JobPanel />);
    expect(field(container, 'job.title').value).toBe('Panel test');
    typeAndBlur(field(container, 'job.title'), 'Bakery fit-out');
    typeAndEnter(field(container, 'job.revision'), 'B');
    typeAndBlur(field<HTMLTextAreaElement>(container, 'job.notes'), 'Two lines\nof notes');
    typeAndEnter(field(container, 'job.client'), '');
    expect(useEditor.getState().job.job).toMatchObject({ title: 'Bakery fit-out', revision: 'B', notes: 'Two lines\nof notes', client: '' });
  });

  it('shows the effective basis values as placeholders', () => {
    const { container } = render(<JobPanel />);
    // au-nz: U0 230 V, multiples 4 / 7.5 / 12.5, ρ Cu 0.0225 (AS/NZS 3000:2018 B5.2.2 and Table B5.1 note).
    expect(field(container, 'rules.voltage').placeholder).toBe('230 (au-nz)');
    expect(field(container, 'rules.multiples.C').placeholder).toBe('7.5 (au-nz)');
    expect(field(container, 'rules.resistivity.Cu').placeholder).toBe('0.0225 (au-nz)');
    choose(field<HTMLSelectElement>(container, 'rules.basis'), 'iec');
    expect(rules().basis).toBe('iec');
    // iec: curve C at 10 × In (IEC 60898-1, upper end of the range, from memory).
    expect(field(container, 'rules.multiples.C').placeholder).toBe('10 (iec)');
  });

  it('sets an override, which changes the results, and resets it to the basis', () => {
    const { container } = render(<JobPanel />);
    const before = useEditor.getState().resultById.C1!.limit!;
    typeAndEnter(field(container, 'rules.voltage'), '240');
    expect(rules().voltage).toBe(240);
    expect(useEditor.getState().resultById.C1!.limit!).toBeCloseTo((before * 240) / 230, 9);
    fireEvent.click(container.querySelector('[data-reset="rules.voltage"]')!);
    expect('voltage' in rules()).toBe(false);
    expect(container.querySelector('[data-reset="rules.voltage"]')).toBeNull();
  });

  it('resets a grouped override and drops the emptied group', () => {
    const { container } = render(<JobPanel />);
    typeAndEnter(field(container, 'rules.resistivity.Cu'), '0.02');
    expect(rules().resistivity).toEqual({ Cu: 0.02 });
    fireEvent.click(container.querySelector('[data-reset="rules.resistivity.Cu"]')!);
    expect(rules()).toEqual({ basis: 'au-nz' });
    expect(withOverride({ basis: 'au-nz', multiples: { B: 5, C: 8 } }, ['multiples', 'B'], undefined)).toEqual({ basis: 'au-nz', multiples: { C: 8 } });
  });

  it('refuses a bad override with the reason beside it', () => {
    const { container } = render(<JobPanel />);
    typeAndEnter(field(container, 'rules.voltage'), '-230');
    expect(fieldError(container, 'rules.voltage')?.textContent).toMatch(/greater than 0 V, got -230/);
    typeAndEnter(field(container, 'rules.unknownSourceShare'), '1.2');
    expect(fieldError(container, 'rules.unknownSourceShare')?.textContent).toMatch(/≤ 1/);
    expect(rules()).toEqual({ basis: 'au-nz' });
    expect(field(container, 'rules.voltage').value).toBe('');
  });
});
