import { act, fireEvent, render } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { CAUTION } from '../../../engine/index.js';
import { Palette } from '../../../app/renderer/app/Palette.js';
import { AboutDialog } from '../../../app/renderer/app/dialogs.js';
import { StatusBar } from '../../../app/renderer/app/StatusBar.js';
import { useUi } from '../../../app/renderer/app/ui.js';
import { load, sampleJob } from './fixture.js';

describe('legend', () => {
  it('is in the parts column: every status by symbol and word, and the line styles', () => {
    const { container } = render(<Palette />);
    const legend = container.querySelector('[data-legend]')!;
    expect(legend).not.toBeNull();
    const statuses = [...legend.querySelectorAll('[data-legend-status]')].map((li) => [li.getAttribute('data-legend-status'), li.textContent!.trim()]);
    expect(statuses).toEqual([['pass', '✓ pass'], ['fail', '✗ FAIL'], ['rcd', '⚠ RCD-reliant'], ['unchecked', '○ unchecked']]);
    const lines = [...legend.querySelectorAll('[data-legend-line]')].map((li) => li.getAttribute('data-legend-line'));
    expect(lines).toEqual(expect.arrayContaining(['traced', 'unchecked', 'fail', 'rcd']));
    expect(legend.querySelector('[data-legend-line="traced"]')!.textContent).toMatch(/dashed/);
    expect(legend.querySelector('[data-legend-line="unchecked"]')!.textContent).toMatch(/unprotected/);
    // The samples are drawn by the sheet's rules (styles.css) but are not links: no sheet class or hook.
    expect(legend.querySelector('[data-legend-line="traced"] g')!.getAttribute('class')).toBe('lw-sample lw-sample--traced');
    expect(legend.querySelector('.lw-link, .is-traced, .is-selected, [data-link-id]')).toBeNull();
  });

  it('is in full in About, one click away, with the whole caution', () => {
    load(sampleJob());
    useUi.getState().set({ aboutOpen: false });
    const palette = render(<Palette />);
    const about = render(<AboutDialog />);
    expect(about.container.innerHTML).toBe('');
    act(() => {
      fireEvent.click(palette.container.querySelector('[data-action="open-legend"]')!);
    });
    const dialog = document.querySelector('[role="dialog"]')!;
    expect(dialog.querySelector('[data-legend]')!.textContent).toMatch(/does not disconnect in time/);
    expect(dialog.querySelector('[data-caution-full]')!.textContent).toContain(CAUTION);
    act(() => useUi.getState().set({ aboutOpen: false }));
  });

  it('leaves the caution in the status bar', () => {
    load(sampleJob());
    const { container } = render(<StatusBar />);
    const caution = container.querySelector('[data-caution]')!;
    expect(caution.textContent).toMatch(/verify by testing/);
    expect(caution.getAttribute('title')).toBe(CAUTION);
  });
});
