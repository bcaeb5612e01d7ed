// The window's layout from the keyboard and at a laptop size: the Selection and Job tabs as a
// tab list over a tab panel, a skip link to the schedule, the breakdown docked beside the
// schedule, the side columns folded, and the browser leaving Export PDF out of its keys.
import { beforeEach, describe, expect, it } from 'vitest';
import { act, fireEvent, render } from '@testing-library/react';
import { App } from '../../app/renderer/app/App.js';
import { useUi } from '../../app/renderer/app/ui.js';
import { useEditor } from '../../app/renderer/store/index.js';
import { smallJob } from './fixture.js';

beforeEach(() => {
  localStorage.clear();
  useUi.getState().setLayout({ rightWidth: null, bottomHeight: null, breakdownDock: 'sheet', paletteCollapsed: false, rightCollapsed: false });
  useUi.getState().set({ rightTab: 'details' });
  useEditor.getState().loadJob(smallJob());
});

describe('the details column', () => {
  it('is a tab list: each tab controls its panel, arrow keys move between them', () => {
    const { container } = render(<App />);
    const tabs = [...container.querySelectorAll('[role="tab"]')];
    expect(tabs.map((t) => t.textContent)).toEqual(['Selection', 'Job & rules']);
    const panel = container.querySelector('[role="tabpanel"]')!;
    expect(tabs[0]!.getAttribute('aria-controls')).toBe(panel.id);
    expect(panel.getAttribute('aria-labelledby')).toBe(tabs[0]!.id);
    expect(tabs.map((t) => t.getAttribute('tabindex'))).toEqual(['0', '-1']);
    fireEvent.keyDown(tabs[0]!, { key: 'ArrowRight' });
    expect(useUi.getState().rightTab).toBe('job');
    expect(container.querySelector('[role="tabpanel"]')!.id).toBe('lw-tabpanel-job');
    fireEvent.keyDown(container.querySelector('[data-tab="job"]')!, { key: 'Home' });
    expect(useUi.getState().rightTab).toBe('details');
  });

  it('folds to a strip and comes back', () => {
    const { container } = render(<App />);
    fireEvent.click(container.querySelector('[data-action="fold-right"]')!);
    expect(container.querySelector('[role="tablist"]')).toBeNull();
    expect(container.querySelector('.lw-main')!.className).toContain('lw-main--right-folded');
    expect(useUi.getState().layout.rightCollapsed).toBe(true);
    expect(localStorage.getItem('loopwright.layout')).toContain('"rightCollapsed":true');
    fireEvent.click(container.querySelector('[data-action="unfold-right"]')!);
    expect(container.querySelector('[role="tablist"]')).not.toBeNull();
    fireEvent.click(container.querySelector('[data-action="fold-palette"]')!);
    expect(container.querySelector('[data-part]')).toBeNull();
    fireEvent.click(container.querySelector('[data-action="unfold-palette"]')!);
    expect(container.querySelector('[data-part]')).not.toBeNull();
  });
});

describe('the skip link and the breakdown', () => {
  it('a skip link to the schedule comes first', () => {
    const { container } = render(<App />);
    const first = container.querySelector('a, button, input, [tabindex]');
    expect(first?.hasAttribute('data-skip-schedule')).toBe(true);
    expect(container.querySelector('#lw-schedule')).not.toBeNull();
  });

  it('the breakdown docks beside the schedule and floats again', () => {
    const { container } = render(<App />);
    act(() => useEditor.getState().setHighlight(['S1', 'M1', 'MSB', 'C1', 'P1'], 'C1'));
    expect(container.querySelector('.lw-sheet-area [data-breakdown-box]')).not.toBeNull();
    fireEvent.click(container.querySelector('[data-action="dock-breakdown"]')!);
    expect(container.querySelector('.lw-sheet-area [data-breakdown-box]')).toBeNull();
    expect(container.querySelector('#lw-schedule [data-breakdown-box]')?.getAttribute('data-dock')).toBe('schedule');
    fireEvent.click(container.querySelector('[data-action="dock-breakdown"]')!);
    expect(container.querySelector('.lw-sheet-area [data-breakdown-box]')).not.toBeNull();
  });
});

describe('the browser build', () => {
  it('leaves Export PDF out of the key list and the toolbar', () => {
    useUi.getState().set({ aboutOpen: true });
    const { container } = render(<App />);
    const keys = [...container.querySelectorAll('.lw-keys td:first-child')].map((t) => t.textContent);
    expect(keys).toContain('Print…');
    expect(keys).not.toContain('Export PDF…');
    expect(keys).toContain('Next Failing Circuit');
    expect(container.querySelector('[data-command="file.exportPdf"]')).toBeNull();
    useUi.getState().set({ aboutOpen: false });
  });
});
