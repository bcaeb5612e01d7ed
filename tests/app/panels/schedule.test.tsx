import { act, fireEvent, render } from '@testing-library/react';
import { beforeEach, describe, expect, it } from 'vitest';
import { SchedulePanel } from '../../../app/renderer/panels/index.js';
import { sortRows, type ScheduleRowData } from '../../../app/renderer/panels/schedule/columns.js';
import { useEditor } from '../../../app/renderer/store/index.js';
import { byHook, typeAndEnter } from './dom.js';
import { largeJob, linkOf, load, sampleJob } from './fixture.js';

function rowIds(container: HTMLElement): string[] {
  return [...container.querySelectorAll('[data-schedule-row]')].map((r) => r.getAttribute('data-schedule-row')!);
}

describe('circuit schedule', () => {
  beforeEach(() => load(sampleJob()));

  it('has one row per link, sorted by ratio, worst first, with unchecked links last', () => {
    const { container } = render(<SchedulePanel />);
    const ratios = useEditor.getState().resultById;
    // C2 176 %, C3 132 %, C1 47 %; M1 and C4 have no ratio (unchecked), kept in file order.
    expect(ratios.C2!.ratio!).toBeGreaterThan(ratios.C3!.ratio!);
    expect(ratios.C3!.ratio!).toBeGreaterThan(ratios.C1!.ratio!);
    expect(rowIds(container)).toEqual(['C2', 'C3', 'C1', 'M1', 'C4']);
    expect(byHook(container, 'data-sort', 'ratio').closest('th')!.getAttribute('aria-sort')).toBe('descending');
  });

  it('shows status by symbol and word in every row', () => {
    const { container } = render(<SchedulePanel />);
    const row = byHook<HTMLElement>(container, 'data-schedule-row', 'C2');
    expect(row.textContent).toContain('✗');
    expect(row.textContent).toContain('FAIL');
    expect(row.querySelector('[data-status-badge="fail"]')).not.toBeNull();
    // Bare numbers in the cells; the unit is in the column head.
    const ratio = byHook<HTMLElement>(container, 'data-schedule-row', 'C1').querySelector('.lwp-cell-ratio')!;
    expect(ratio.textContent).toBe('47.0');
    expect(byHook(container, 'data-unit', 'ratio').textContent).toBe('%');
  });

  it('with the source unknown, shows own loop and upstream part, and a bare dash for an unchecked link', () => {
    const { container } = render(<SchedulePanel />);
    const loopCell = (id: string) => {
      const row = byHook<HTMLElement>(container, 'data-schedule-row', id);
      const col = [...container.querySelectorAll('thead th')].findIndex((th) => th.querySelector('[data-unit="loop"]'));
      return row.querySelectorAll('td')[col]!.textContent!.trim();
    };
    expect(loopCell('C1')).toMatch(/^\d+\.\d{3} ↑\d+\.\d{3}$/);
    expect(useEditor.getState().resultById.M1!.upstream).toBeNull();
    expect(loopCell('M1')).toBe('—');
    expect(loopCell('C4')).toBe('—');
  });

  it('gives every column of numbers its unit in the head', () => {
    const { container } = render(<SchedulePanel />);
    fireEvent.click(byHook(container, 'data-column-set', 'all'));
    const units = Object.fromEntries(
      [...container.querySelectorAll('[data-unit]')].map((el) => [el.getAttribute('data-unit'), el.textContent!.trim()]),
    );
    expect(units).toMatchObject({
      cable: 'mm²', length: 'm', device: 'In A', rcd: 'mA', loop: 'Ω', limit: 'Ω', ia: 'A', treq: 's', maxLength: 'm', ratio: '%',
    });
    // Text columns carry none.
    for (const key of ['id', 'name', 'from', 'to', 'role', 'status']) expect(units[key]).toBe('');
    // C1 has a 30 mA RCD: the cell says 30 under "mA".
    const row = byHook<HTMLElement>(container, 'data-schedule-row', 'C1');
    const rcdCell = row.children[[...container.querySelectorAll('thead th')].findIndex((th) => th.querySelector('[data-sort="rcd"]'))]!;
    expect(rcdCell.textContent).toBe('30');
  });

  it('shows the id as text, not as an input (ids are renamed in the details panel)', () => {
    const { container } = render(<SchedulePanel />);
    const row = byHook<HTMLElement>(container, 'data-schedule-row', 'C1');
    const id = byHook<HTMLElement>(row, 'data-cell', 'id');
    expect(id.tagName).toBe('TD');
    expect(id.textContent).toBe('C1');
    expect(id.querySelector('input')).toBeNull();
    expect(id.getAttribute('title')).toMatch(/details panel/);
    // A click on it selects the row, and changes nothing.
    fireEvent.click(id);
    expect(useEditor.getState().selection.links).toEqual(['C1']);
    expect(useEditor.getState().canUndo).toBe(false);
  });

  it('gives the full name and the node names on hover', () => {
    const { container } = render(<SchedulePanel />);
    fireEvent.click(byHook(container, 'data-column-set', 'all'));
    const row = byHook<HTMLElement>(container, 'data-schedule-row', 'C1');
    expect(byHook(row, 'data-cell', 'name').getAttribute('title')).toBe('Kitchen power');
    const nodes = [...row.querySelectorAll('.lwp-cell-node')].map((td) => td.getAttribute('title'));
    expect(nodes).toEqual(['MSB — Main switchboard', 'P1 — Kitchen']);
  });

  it('sorts by another column on a click of its head, and flips on a second click', () => {
    const { container } = render(<SchedulePanel />);
    fireEvent.click(byHook(container, 'data-sort', 'length'));
    // Lengths: C2 120, C3 90, C1 32, M1 18, C4 10 (longest first on the first click).
    expect(rowIds(container)).toEqual(['C2', 'C3', 'C1', 'M1', 'C4']);
    fireEvent.click(byHook(container, 'data-sort', 'length'));
    expect(rowIds(container)).toEqual(['C4', 'M1', 'C1', 'C3', 'C2']);
    fireEvent.click(byHook(container, 'data-sort', 'name'));
    // Names A→Z; M1 and C4 have none, so they go last.
    expect(rowIds(container)).toEqual(['C3', 'C1', 'C2', 'M1', 'C4']);
    fireEvent.click(byHook(container, 'data-sort', 'status'));
    expect(rowIds(container)).toEqual(['C2', 'C3', 'C1', 'M1', 'C4']);
  });

  it('keeps nulls last whichever way a column is sorted', () => {
    const rows: ScheduleRowData[] = useEditor.getState().job.links.map((link, index) => ({
      link, result: useEditor.getState().resultById[link.id], index,
    }));
    const asc = sortRows(rows, { key: 'ratio', direction: 'asc' }).map((r) => r.link.id);
    expect(asc).toEqual(['C1', 'C3', 'C2', 'M1', 'C4']);
  });

  it('filters by verdict (here the loop decides each verdict), with counts', () => {
    const { container } = render(<SchedulePanel />);
    expect(byHook(container, 'data-verdict-filter', 'all').textContent).toContain('(5)');
    expect(byHook(container, 'data-verdict-filter', 'unchecked').textContent).toContain('(2)');
    fireEvent.click(byHook(container, 'data-verdict-filter', 'fail'));
    expect(rowIds(container)).toEqual(['C2']);
    fireEvent.click(byHook(container, 'data-verdict-filter', 'rcd'));
    expect(rowIds(container)).toEqual(['C3']);
    fireEvent.click(byHook(container, 'data-verdict-filter', 'pass'));
    expect(rowIds(container)).toEqual(['C1']);
    fireEvent.click(byHook(container, 'data-verdict-filter', 'unchecked'));
    expect(rowIds(container)).toEqual(['M1', 'C4']);
    expect(byHook(container, 'data-verdict-filter', 'unchecked').getAttribute('aria-pressed')).toBe('true');
    fireEvent.click(byHook(container, 'data-verdict-filter', 'all'));
    expect(rowIds(container)).toHaveLength(5);
  });

  it('selects the link on a row click and asks the sheet to centre it', () => {
    const { container } = render(<SchedulePanel />);
    const seq = useEditor.getState().focus?.seq ?? 0;
    fireEvent.click(byHook<HTMLElement>(container, 'data-schedule-row', 'C3').querySelector('td:nth-child(3)')!);
    const s = useEditor.getState();
    expect(s.selection).toEqual({ nodes: [], links: ['C3'] });
    expect(s.focus?.ids).toEqual(['C3']);
    expect(s.focus!.seq).toBeGreaterThan(seq);
    expect(byHook(container, 'data-schedule-row', 'C3').getAttribute('aria-selected')).toBe('true');
  });

  it('moves the selection with the up and down arrows on a focused row', () => {
    const { container } = render(<SchedulePanel />);
    const c3 = byHook<HTMLElement>(container, 'data-schedule-row', 'C3'); // second in the ratio order
    fireEvent.keyDown(c3, { key: 'ArrowDown' });
    expect(useEditor.getState().selection.links).toEqual(['C1']);
    fireEvent.keyDown(byHook<HTMLElement>(container, 'data-schedule-row', 'C1'), { key: 'ArrowUp' });
    fireEvent.keyDown(byHook<HTMLElement>(container, 'data-schedule-row', 'C3'), { key: 'ArrowUp' });
    expect(useEditor.getState().selection.links).toEqual(['C2']);
    // Inside a cell the arrows belong to the input.
    fireEvent.keyDown(byHook(c3, 'data-cell', 'name'), { key: 'ArrowDown' });
    expect(useEditor.getState().selection.links).toEqual(['C2']);
  });

  it('does not re-centre the sheet on a click into a cell of the row already selected', () => {
    const { container } = render(<SchedulePanel />);
    const row = byHook<HTMLElement>(container, 'data-schedule-row', 'C1');
    fireEvent.click(byHook(row, 'data-cell', 'cable.length'));
    const seq = useEditor.getState().focus!.seq;
    expect(useEditor.getState().selection.links).toEqual(['C1']);
    fireEvent.click(byHook(row, 'data-cell', 'name'));
    expect(useEditor.getState().focus!.seq).toBe(seq);
    fireEvent.click(row.querySelector('td:nth-child(4)')!);
    expect(useEditor.getState().focus!.seq).toBe(seq + 1);
  });

  it('edits cells in place and refuses a bad value with its reason, keeping the old one', () => {
    const { container } = render(<SchedulePanel />);
    const row = byHook<HTMLElement>(container, 'data-schedule-row', 'C1');
    typeAndEnter(byHook(row, 'data-cell', 'cable.length'), '-1');
    expect(row.querySelector('[data-cell-error="cable.length"]')?.textContent).toMatch(/≥ 0 m, got -1/);
    expect(byHook<HTMLInputElement>(row, 'data-cell', 'cable.length').value).toBe('32');
    expect(linkOf('C1').cable.length).toBe(32);

    typeAndEnter(byHook(row, 'data-cell', 'cable.length'), '100');
    expect(linkOf('C1').cable.length).toBe(100);
    // Now over its maximum length of about 68 m: it relies on its RCD.
    expect(useEditor.getState().resultById.C1!.status).toBe('rcd');

    typeAndEnter(byHook(row, 'data-cell', 'cable.active'), '4');
    typeAndEnter(byHook(row, 'data-cell', 'cable.earth'), '4');
    typeAndEnter(byHook(row, 'data-cell', 'device.rating'), '16');
    typeAndEnter(byHook(row, 'data-cell', 'name'), 'Kitchen power 2');
    expect(linkOf('C1')).toMatchObject({ name: 'Kitchen power 2', cable: { active: 4, earth: 4 }, device: { rating: 16 } });
  });

  it('renders only the rows in view for a large job, and all of them for a small one', () => {
    const { container, unmount } = render(<SchedulePanel />);
    expect(byHook(container, 'data-windowed', 'false')).toBeTruthy();
    unmount();
    load(largeJob(2000));
    const big = render(<SchedulePanel />);
    expect(byHook(big.container, 'data-windowed', 'true')).toBeTruthy();
    const rendered = rowIds(big.container).length;
    expect(rendered).toBeGreaterThan(10);
    expect(rendered).toBeLessThan(100);
    expect(byHook(big.container, 'data-verdict-filter', 'all').textContent).toContain('(2001)');
    // Scrolling to the end brings the last rows in.
    const body = big.container.querySelector('.lwp-schedule-body') as HTMLElement;
    fireEvent.scroll(body, { target: { scrollTop: 2001 * 34 } });
    const ids = rowIds(big.container);
    expect(ids.length).toBeLessThan(100);
    expect(ids).toContain('M1'); // unchecked, so last in the ratio order
  });

  it('scrolls to a row selected elsewhere (the sheet), at the next frame', async () => {
    load(largeJob(2000));
    const { container } = render(<SchedulePanel />);
    const body = container.querySelector('.lwp-schedule-body') as HTMLElement;
    expect(body.scrollTop).toBe(0);
    const order = rowIds(container); // the first rows drawn, ratio order
    expect(order.length).toBeGreaterThan(10);
    // The last row in the ratio order (unchecked M1), far below the rows drawn.
    act(() => useEditor.getState().select({ nodes: [], links: ['M1'] }));
    expect(body.scrollTop).toBe(0); // not yet: at the next frame
    await act(() => new Promise<void>((ok) => requestAnimationFrame(() => ok())));
    expect(body.scrollTop).toBe(2000 * 34); // row 2001 of 2001, no view height in jsdom
    fireEvent.scroll(body, { target: { scrollTop: 2000 * 34 } });
    expect(rowIds(container)).toContain('M1');
  });
});
