// The schedule's column sets, its verdict filter and the version 2 cells edited in place.
import { act, fireEvent, render } from '@testing-library/react';
import { beforeEach, describe, expect, it } from 'vitest';
import { analyse } from '../../../engine/index.js';
import { SchedulePanel } from '../../../app/renderer/panels/index.js';
import {
  COLUMN_SETS, PINNED_WIDTH, SET_COLUMNS, countByVerdict, pinnedOffsets, type ScheduleRowData,
} from '../../../app/renderer/panels/schedule/columns.js';
import { useEditor } from '../../../app/renderer/store/index.js';
import { byHook, typeAndEnter } from './dom.js';
import { linkOf, load, loadsJob } from './fixture.js';

const heads = (root: ParentNode) => [...root.querySelectorAll('thead th')].map((th) => th.getAttribute('data-col'));
const rowIds = (root: ParentNode) => [...root.querySelectorAll('[data-schedule-row]')].map((r) => r.getAttribute('data-schedule-row'));

describe('schedule column sets', () => {
  beforeEach(() => load(loadsJob()));

  it('starts on the loop set and shows exactly the columns of the set chosen', () => {
    const { container } = render(<SchedulePanel />);
    expect(byHook(container, 'data-column-set', 'loop').getAttribute('aria-pressed')).toBe('true');
    expect(heads(container)).toEqual(SET_COLUMNS.loop);
    for (const set of COLUMN_SETS) {
      fireEvent.click(byHook(container, 'data-column-set', set));
      expect(heads(container), set).toEqual(SET_COLUMNS[set]);
      expect(byHook(container, 'data-column-set', set).getAttribute('aria-pressed')).toBe('true');
      // Every row has one cell per column.
      const row = byHook<HTMLElement>(container, 'data-schedule-row', 'C2');
      expect([...row.children].map((td) => td.getAttribute('data-col')), set).toEqual(SET_COLUMNS[set]);
    }
  });

  it('holds the verdict in every set, and every column in "all"', () => {
    for (const set of COLUMN_SETS) expect(SET_COLUMNS[set], set).toContain('verdict');
    // 'rating' (In alone, for the loads set) is in 'all' as part of the device column.
    const everyColumn = new Set(COLUMN_SETS.flatMap((set) => SET_COLUMNS[set]).filter((k) => k !== 'rating'));
    expect(new Set(SET_COLUMNS.all)).toEqual(everyColumn);
    expect(SET_COLUMNS.all).toContain('device');
    for (const key of ['phases', 'ib', 'pf', 'vdOwn', 'vdTotal', 'vdLimit', 'iz', 'fault', 'earthMin', 'testLimit', 'measured',
      'vStatus', 'izStatus', 'bStatus', 'wStatus', 'mStatus', 'status']) {
      expect(SET_COLUMNS.all, key).toContain(key);
    }
  });

  it('pins the ratio, loop status and verdict at the right edge, side by side without covering each other', () => {
    const offsets = pinnedOffsets(SET_COLUMNS.loop);
    expect(offsets).toEqual({ verdict: 0, status: PINNED_WIDTH.verdict, ratio: PINNED_WIDTH.verdict! + PINNED_WIDTH.status! });
    // A set that ends with the verdict alone pins only that.
    expect(pinnedOffsets(SET_COLUMNS.loads)).toEqual({ verdict: 0 });
    const { container } = render(<SchedulePanel />);
    const th = (key: string) => container.querySelector<HTMLElement>(`thead th[data-col="${key}"]`)!;
    expect(th('verdict').style.right).toBe('0px');
    expect(th('status').style.right).toBe(`${PINNED_WIDTH.verdict}px`);
    expect(th('ratio').style.right).toBe(`${PINNED_WIDTH.verdict! + PINNED_WIDTH.status!}px`);
    expect(th('status').style.width).toBe(`${PINNED_WIDTH.status}px`);
  });
});

describe('schedule verdict filter', () => {
  beforeEach(() => load(loadsJob()));

  it('counts each verdict and shows only the rows with the one chosen, as analyse() gives them', () => {
    const { container } = render(<SchedulePanel />);
    const results = analyse(useEditor.getState().job);
    const rows: ScheduleRowData[] = useEditor.getState().job.links.map((link, index) => ({ link, result: useEditor.getState().resultById[link.id], index }));
    const counts = countByVerdict(rows);
    // By the contract the summary's verdict counts are the same counts.
    expect({ pass: counts.pass, fail: counts.fail, rcd: counts.rcd, unchecked: counts.unchecked }).toEqual(results.summary.verdict);
    for (const f of ['fail', 'rcd', 'pass', 'unchecked'] as const) {
      const button = byHook(container, 'data-verdict-filter', f);
      expect(button.textContent, f).toContain(`(${results.summary.verdict[f]})`);
      fireEvent.click(button);
      expect(button.getAttribute('aria-pressed')).toBe('true');
      expect(rowIds(container).sort(), f).toEqual(results.circuits.filter((c) => c.verdict === f).map((c) => c.link).sort());
    }
    fireEvent.click(byHook(container, 'data-verdict-filter', 'all'));
    expect(rowIds(container)).toHaveLength(results.circuits.length);
  });

  it('filters a circuit whose loop passes but whose voltage drop fails under FAIL', () => {
    const { container } = render(<SchedulePanel />);
    const c2 = useEditor.getState().resultById.C2!;
    // C2: 20 A over 120 m of 2.5 mm² Cu at cos φ 1: 100·2·20·120·(0.0225/2.5)/230 = 18.8 % (method-depth.md section 3).
    expect(c2.voltageStatus).toBe('fail');
    expect(c2.verdict).toBe('fail');
    fireEvent.click(byHook(container, 'data-verdict-filter', 'fail'));
    expect(rowIds(container)).toContain('C2');
    const row = byHook<HTMLElement>(container, 'data-schedule-row', 'C2');
    expect(row.getAttribute('data-verdict')).toBe('fail');
    expect(row.querySelector('[data-verdict-cell]')?.textContent).toMatch(/✗\s*FAIL/);
    expect(row.querySelector('[data-verdict-cell] [title]')?.getAttribute('title')).toMatch(/fails: voltage drop/);
  });

  it('says which verdict has no circuits', () => {
    const { container } = render(<SchedulePanel />);
    // No circuit of this job relies on an RCD: C2 has one, but its loop passes without it.
    expect(useEditor.getState().results.summary.verdict.rcd).toBe(0);
    fireEvent.click(byHook(container, 'data-verdict-filter', 'rcd'));
    expect(rowIds(container)).toEqual([]);
    expect(container.querySelector('.lwp-empty')?.textContent).toMatch(/No circuits with the verdict ⚠ RCD-reliant/);
  });
});

describe('schedule cells of the loads set', () => {
  beforeEach(() => load(loadsJob()));

  it('shows Ib, the total drop against its limit, Iz and each check as the engine gives them', () => {
    const { container } = render(<SchedulePanel />);
    fireEvent.click(byHook(container, 'data-column-set', 'loads'));
    const r = useEditor.getState().resultById.C2!;
    const row = byHook<HTMLElement>(container, 'data-schedule-row', 'C2');
    const cell = (key: string) => row.querySelector<HTMLElement>(`td[data-col="${key}"]`)!;
    // Ib from the loads shows as the placeholder of the override input.
    expect(cell('ib').querySelector('input')!.placeholder).toBe(String(Number(r.designCurrent!.toFixed(1))));
    expect(cell('vdTotal').textContent).toBe(String(Number(r.voltageDropTotal!.toFixed(2))));
    expect(cell('vdLimit').textContent).toBe(String(r.voltageDropLimit));
    expect(cell('vStatus').querySelector('[data-status-badge]')?.getAttribute('data-status-badge')).toBe(r.voltageStatus);
    expect(cell('vStatus').textContent).toMatch(/FAIL/);
    expect(cell('izStatus').querySelector('[data-status-badge]')?.getAttribute('data-status-badge')).toBe(r.capacityStatus);
  });

  it('edits the design current and the capacity in place, one undo step each', () => {
    const { container } = render(<SchedulePanel />);
    fireEvent.click(byHook(container, 'data-column-set', 'loads'));
    const row = () => byHook<HTMLElement>(container, 'data-schedule-row', 'C1');
    typeAndEnter(byHook(row(), 'data-cell', 'designCurrent'), '9');
    expect(linkOf('C1').designCurrent).toBe(9);
    expect(useEditor.getState().resultById.C1!.designCurrent).toBe(9);
    typeAndEnter(byHook(row(), 'data-cell', 'cable.capacity'), '8');
    expect(linkOf('C1').cable.capacity).toBe(8);
    // Ib 9 A > In 10 A? No: 9 ≤ 10, but In 10 A > Iz 8 A fails (method-depth.md section 4).
    expect(useEditor.getState().resultById.C1!.capacityStatus).toBe('fail');
    typeAndEnter(byHook(row(), 'data-cell', 'cable.capacity'), '-3');
    expect(container.querySelector('[data-cell-error="cable.capacity"]')?.textContent).toMatch(/greater than 0 A, got -3/);
    expect(linkOf('C1').cable.capacity).toBe(8);
    act(() => useEditor.getState().undo());
    expect(linkOf('C1').cable.capacity).toBeUndefined();
    act(() => useEditor.getState().undo());
    expect(linkOf('C1').designCurrent).toBeUndefined();
  });
});
