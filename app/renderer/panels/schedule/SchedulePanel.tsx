// The circuit schedule: one row per link, sortable by any column (ratio, worst first, by
// default), filtered by status; a row click selects the link and asks the sheet to centre it.
// Above WINDOW_THRESHOLD rows only the rows in view are rendered.

import { useLayoutEffect, useMemo, useRef, useState, type KeyboardEvent } from 'react';
import { useEditor } from '../../store/index.js';
import { SizeList } from '../details/LinkDetails.js';
import { STATUS_LOOK } from '../format.js';
import {
  COLUMN_BY_KEY, COLUMN_SETS, COLUMN_SET_TITLE, DEFAULT_SORT, PINNED_WIDTH, SET_COLUMNS, STATUS_FILTERS, countByVerdict, filterRows,
  nextSort, pinnedOffsets, sortRows, type ColumnSet, type ScheduleRowData, type SortState, type StatusFilter,
} from './columns.js';
import { ROW_HEIGHT, ScheduleRow } from './ScheduleRow.js';
import { ScheduleViewSwitch, TestingView } from '../testing/TestingView.js';
import { useTestingView } from '../testing/view.js';

export const WINDOW_THRESHOLD = 300;
const OVERSCAN = 10;
/** Used until the body has been measured (and under test environments that do no layout). */
const FALLBACK_VIEW_HEIGHT = 600;
const SIZES_ID = 'lwp-sizes-schedule';
/** Ratio, loop status and verdict stay in view at the right edge while the table scrolls sideways. */
const STICKY: Partial<Record<string, string>> = { ratio: 'lwp-sticky-ratio', status: 'lwp-sticky-status', verdict: 'lwp-sticky-verdict' };
/** Columns of bare numbers, right-aligned under a right-aligned head. */
const NUMERIC = new Set([
  'rcd', 'loop', 'limit', 'ia', 'treq', 'maxLength', 'ratio', 'phases', 'pf', 'vdOwn', 'vdTotal', 'vdLimit',
  'breaking', 'fault', 'earthMin', 'testLimit', 'measured',
]);

function filterLabel(f: StatusFilter): string {
  return f === 'all' ? 'all' : `${STATUS_LOOK[f].symbol} ${STATUS_LOOK[f].word}`;
}

/** Rows in view for a scroll position: [first, last) plus overscan. */
export function windowRange(count: number, scrollTop: number, viewHeight: number): [number, number] {
  const first = Math.max(0, Math.floor(scrollTop / ROW_HEIGHT) - OVERSCAN);
  const last = Math.min(count, Math.ceil((scrollTop + viewHeight) / ROW_HEIGHT) + OVERSCAN);
  return [first, last];
}

/** Up and down arrows on a focused row move the selection to the row above or below. */
function moveByKey(e: KeyboardEvent<HTMLTableSectionElement>, shown: readonly ScheduleRowData[]) {
  if (e.key !== 'ArrowDown' && e.key !== 'ArrowUp') return;
  const row = e.target instanceof HTMLElement ? e.target : null;
  const id = row?.getAttribute('data-schedule-row');
  if (!row || !id) return; // inside a cell the arrows stay with the input
  const at = shown.findIndex((r) => r.link.id === id);
  const next = shown[at + (e.key === 'ArrowDown' ? 1 : -1)];
  if (at < 0 || !next) return;
  e.preventDefault();
  const s = useEditor.getState();
  s.select({ nodes: [], links: [next.link.id] });
  s.requestFocus([next.link.id]);
  const body = row.closest('tbody');
  requestAnimationFrame(() => {
    const rows = body ? [...body.querySelectorAll<HTMLElement>('[data-schedule-row]')] : [];
    rows.find((r) => r.getAttribute('data-schedule-row') === next.link.id)?.focus();
  });
}

/** The design schedule, or the testing view (readings on site) when that is chosen. */
export function SchedulePanel() {
  const view = useTestingView((s) => s.view);
  return view === 'testing' ? <TestingView /> : <DesignSchedule />;
}

function DesignSchedule() {
  const links = useEditor((s) => s.job.links);
  const resultById = useEditor((s) => s.resultById);
  const selectedLinks = useEditor((s) => s.selection.links);
  const [sort, setSort] = useState<SortState>(DEFAULT_SORT);
  const [filter, setFilter] = useState<StatusFilter>('all');
  const [columnSet, setColumnSet] = useState<ColumnSet>('loop');
  const columns = SET_COLUMNS[columnSet];
  const offsets = useMemo(() => pinnedOffsets(columns), [columns]);
  const [scrollTop, setScrollTop] = useState(0);
  const [viewHeight, setViewHeight] = useState(FALLBACK_VIEW_HEIGHT);
  const bodyRef = useRef<HTMLDivElement>(null);
  // The body's scroll position and height as last seen (scroll events, resizes), so keeping the
  // selected row in view after an edit reads no layout (a forced layout on every edit).
  const seen = useRef({ top: 0, height: 0 });

  const rows: ScheduleRowData[] = useMemo(
    () => links.map((link, index) => ({ link, result: resultById[link.id], index })),
    [links, resultById],
  );
  const counts = useMemo(() => countByVerdict(rows), [rows]);
  const shown = useMemo(() => sortRows(filterRows(rows, filter), sort), [rows, filter, sort]);
  const selected = useMemo(() => new Set(selectedLinks), [selectedLinks]);

  const windowed = shown.length > WINDOW_THRESHOLD;
  useLayoutEffect(() => {
    const el = bodyRef.current;
    if (!el) return;
    const measure = () => {
      const height = el.clientHeight;
      seen.current.height = height;
      seen.current.top = el.scrollTop;
      setViewHeight(height > 0 ? height : FALLBACK_VIEW_HEIGHT);
    };
    measure();
    if (typeof ResizeObserver === 'undefined') return;
    const ro = new ResizeObserver(measure);
    ro.observe(el);
    return () => ro.disconnect();
  }, []);

  // Keep the selected row in view when the selection comes from elsewhere (the sheet).
  const firstSelected = selectedLinks[0];
  useLayoutEffect(() => {
    const el = bodyRef.current;
    if (!el || firstSelected === undefined) return;
    const at = shown.findIndex((row) => row.link.id === firstSelected);
    if (at < 0) return;
    const top = at * ROW_HEIGHT;
    const { top: scrolled, height } = seen.current;
    if (top < scrolled || top + ROW_HEIGHT > scrolled + height) {
      if (windowed || height > 0) {
        const to = Math.max(0, top - height / 2);
        seen.current.top = to;
        // At the next frame: writing scrollTop lays the page out at once, and an edit's new
        // statuses (the sheet, the row) should not wait for that.
        const scroll = () => {
          el.scrollTop = to;
        };
        if (typeof requestAnimationFrame !== 'function') return void scroll();
        const frame = requestAnimationFrame(scroll);
        return () => cancelAnimationFrame(frame);
      }
    }
    return undefined;
  }, [firstSelected, shown, windowed]);

  const [first, last] = windowed ? windowRange(shown.length, scrollTop, viewHeight) : [0, shown.length];
  const visible = shown.slice(first, last);

  return (
    <section className="lwp-panel lwp-schedule" data-panel="schedule" aria-label="Circuit schedule">
      <header className="lwp-panel-head">
        <h2 className="lwp-panel-title">Circuit schedule</h2>
        <ScheduleViewSwitch />
        <div className="lwp-filters" role="group" aria-label="Columns">
          <span className="lwp-filters-label" aria-hidden="true">Columns</span>
          {COLUMN_SETS.map((set) => (
            <button key={set} type="button" data-column-set={set} aria-pressed={columnSet === set} title={COLUMN_SET_TITLE[set]}
              className={columnSet === set ? 'lwp-button lwp-filter lwp-filter-on' : 'lwp-button lwp-filter'}
              onClick={() => setColumnSet(set)}>
              {set}
            </button>
          ))}
        </div>
        <div className="lwp-filters" role="group" aria-label="Filter by verdict">
          <span className="lwp-filters-label" aria-hidden="true">Verdict</span>
          {STATUS_FILTERS.map((f) => (
            <button key={f} type="button" data-verdict-filter={f} aria-pressed={filter === f}
              className={filter === f ? 'lwp-button lwp-filter lwp-filter-on' : 'lwp-button lwp-filter'}
              onClick={() => setFilter(f)}>
              {filterLabel(f)} <span className="lwp-count">({counts[f]})</span>
            </button>
          ))}
        </div>
      </header>
      <SizeList id={SIZES_ID} />
      <div className="lwp-schedule-body" ref={bodyRef} data-windowed={windowed ? 'true' : 'false'}
        onScroll={(e) => {
          seen.current.top = e.currentTarget.scrollTop;
          setScrollTop(seen.current.top);
        }}>
        <table className="lwp-schedule-table">
          <thead>
            <tr>
              {columns.map((key) => COLUMN_BY_KEY[key]).map((c) => (
                <th key={c.key} scope="col" data-col={c.key}
                  className={`${c.group === 'result' ? 'lwp-col-result' : 'lwp-col-input'}${STICKY[c.key] ? ` ${STICKY[c.key]}` : ''}${NUMERIC.has(c.key) ? ' lwp-num-head' : ''}`}
                  style={offsets[c.key] !== undefined ? { right: offsets[c.key], width: PINNED_WIDTH[c.key], minWidth: PINNED_WIDTH[c.key] } : undefined}
                  aria-sort={sort.key === c.key ? (sort.direction === 'asc' ? 'ascending' : 'descending') : 'none'}>
                  <button type="button" className="lwp-sort" data-sort={c.key} title={`${c.title}. Click to sort.`}
                    onClick={() => setSort((s) => nextSort(s, c.key))}>
                    <span className="lwp-sort-label">
                      {c.label}
                      <span aria-hidden="true" className="lwp-sort-mark">
                        {sort.key === c.key ? (sort.direction === 'asc' ? ' ▲' : ' ▼') : ''}
                      </span>
                    </span>
                    <span className="lwp-col-unit" data-unit={c.key}>{c.unit ?? '\u00a0'}</span>
                  </button>
                </th>
              ))}
            </tr>
          </thead>
          <tbody onKeyDown={(e) => moveByKey(e, shown)}>
            {first > 0 ? (
              <tr aria-hidden="true" className="lwp-spacer" style={{ height: first * ROW_HEIGHT }}>
                <td colSpan={columns.length} />
              </tr>
            ) : null}
            {visible.map((row) => (
              <ScheduleRow key={row.link.id} id={row.link.id} selected={selected.has(row.link.id)} sizesId={SIZES_ID}
                columns={columns} offsets={offsets} />
            ))}
            {last < shown.length ? (
              <tr aria-hidden="true" className="lwp-spacer" style={{ height: (shown.length - last) * ROW_HEIGHT }}>
                <td colSpan={columns.length} />
              </tr>
            ) : null}
          </tbody>
        </table>
        {shown.length === 0 ? (
          <p className="lwp-empty">{rows.length === 0 ? 'No links yet: connect two nodes on the sheet.' : `No circuits with the verdict ${filterLabel(filter)}.`}</p>
        ) : null}
      </div>
    </section>
  );
}
