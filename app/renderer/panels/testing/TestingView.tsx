// The schedule made for testing on site: one row per circuit with its test limit, the reading
// (Zs, temperature, date, instrument) typed in place, and the measured result. Quick with the
// keyboard: Enter (or ↓) goes to the same cell of the next row, Shift+Enter (or ↑) the row above,
// Tab and Shift+Tab the next and previous cell. Every committed cell is one undoable edit.

import { createContext, memo, useCallback, useContext, useEffect, useLayoutEffect, useMemo, useRef, useState, type KeyboardEvent } from 'react';
import { CAUTION, resolveRules, type LinkReading, type SupplyNode } from '../../../../engine/index.js';
import { runCommand } from '../../commands/context.js';
import { selectLink, selectResult, useEditor } from '../../store/index.js';
import { editLink, editNode } from '../actions.js';
import { StatusBadge } from '../details/CircuitResults.js';
import { parseNumber, showNumber, type NumberRule } from '../fields/parse.js';
import type { Outcome } from '../fields/fields.js';
import { STATUS_LOOK, ohmsValue, percentValue } from '../format.js';
import { readingChange, READING_FIELDS, type ReadingField } from './readings.js';
import { useTestingView, type ScheduleView } from './view.js';
import { useShallow } from 'zustand/react/shallow';
import './testing.css';

const RULES: Record<'zs' | 'temperature', NumberRule> = {
  zs: { label: 'Zs', unit: 'Ω', above: 0, optional: true },
  temperature: { label: 'Temperature', unit: '°C', min: -30, max: 60, optional: true },
};

const FIELD_WORD: Record<ReadingField, string> = { zs: 'reading Zs', temperature: 'temperature', date: 'date', instrument: 'instrument' };

/** Design schedule or testing view: the two buttons at the head of either. */
export function ScheduleViewSwitch() {
  const view = useTestingView((s) => s.view);
  const choose = (v: ScheduleView) => useTestingView.getState().setView(v);
  return (
    <div className="lwt-switch" role="group" aria-label="Schedule view">
      <button type="button" className={`lwp-button${view === 'design' ? ' lwt-on' : ''}`} aria-pressed={view === 'design'}
        data-schedule-view="design" title="The circuit schedule of the design" onClick={() => choose('design')}>Design</button>
      <button type="button" className={`lwp-button${view === 'testing' ? ' lwt-on' : ''}`} aria-pressed={view === 'testing'}
        data-schedule-view="testing" title="Enter the readings taken on site, circuit after circuit, against their test limits"
        onClick={() => choose('testing')}>Testing</button>
    </div>
  );
}

function cellSelector(row: number, col: number): string {
  return `[data-tcell="${row}:${col}"]`;
}

/** Above this many circuits only the rows in view are rendered (as in the design schedule). */
export const TESTING_WINDOW_THRESHOLD = 300;
export const TESTING_ROW_HEIGHT = 34;
const OVERSCAN = 10;
const FALLBACK_VIEW_HEIGHT = 600;

/** Rows in view for a scroll position: [first, last) plus overscan. */
export function testingWindow(count: number, scrollTop: number, viewHeight: number): [number, number] {
  const first = Math.max(0, Math.floor(scrollTop / TESTING_ROW_HEIGHT) - OVERSCAN);
  const last = Math.min(count, Math.ceil((scrollTop + viewHeight) / TESTING_ROW_HEIGHT) + OVERSCAN);
  return [first, last];
}

/** The grid's way to reach a row that is not rendered yet (scrolled out of a windowed view). */
const GridContext = createContext<{ count: number; reveal(row: number, col: number): void }>({ count: 0, reveal: () => undefined });

/** Moves the focus to another cell of the grid; false when there is no such row. */
function focusCell(from: HTMLElement, row: number, col: number, grid: { count: number; reveal(row: number, col: number): void }): boolean {
  if (row < 0 || row >= grid.count) return false;
  const target = from.closest('[data-testing-grid]')?.querySelector<HTMLInputElement>(cellSelector(row, col));
  if (!target) {
    grid.reveal(row, col);
    return true;
  }
  target.focus();
  target.select();
  return true;
}

interface CellProps {
  row: number;
  col: number;
  link: string;
  field: ReadingField;
  shown: string;
  placeholder?: string;
  /** What the cell shows is typed ahead of the Zs (kept, not yet in the job). */
  draft?: boolean;
  commit(text: string): Outcome;
}

/** One input of the grid: local text, committed on Enter, Tab, arrows or leaving it. */
function Cell({ row, col, link, field, shown, placeholder, draft, commit }: CellProps) {
  const grid = useContext(GridContext);
  const [text, setText] = useState(shown);
  const [error, setError] = useState<string | null>(null);
  // The text last committed (or refused), so the blur that follows a keyboard move does not commit it again.
  const tried = useRef<string | null>(null);
  useEffect(() => {
    setText(shown);
    setError(null);
    tried.current = null;
  }, [shown]);

  /** Commits the text; false when refused. A key that moves on from an unchanged cell clears an old refusal. */
  const run = (moving: boolean): boolean => {
    if (text === shown) {
      if (moving && error) setError(null);
      return true;
    }
    if (text === tried.current) return true;
    tried.current = text;
    const outcome = commit(text);
    if (outcome.ok) {
      setError(null);
      return true;
    }
    setError(outcome.reason);
    setText(shown);
    return false;
  };

  const onKeyDown = (e: KeyboardEvent<HTMLInputElement>) => {
    const el = e.currentTarget;
    let to: [number, number] | null = null;
    if (e.key === 'Enter' || e.key === 'ArrowDown' || e.key === 'ArrowUp') {
      const up = e.key === 'ArrowUp' || (e.key === 'Enter' && e.shiftKey);
      to = [row + (up ? -1 : 1), col];
    } else if (e.key === 'Tab') {
      const last = READING_FIELDS.length - 1;
      to = e.shiftKey ? (col > 0 ? [row, col - 1] : [row - 1, last]) : col < last ? [row, col + 1] : [row + 1, 0];
    } else if (e.key === 'Escape') {
      setText(shown);
      setError(null);
      return;
    } else return;
    const ok = run(true);
    if (!ok) {
      e.preventDefault(); // stay on the refused cell, its reason beside it
      return;
    }
    if (focusCell(el, to[0], to[1], grid)) e.preventDefault();
    else if (e.key === 'Enter') e.preventDefault();
  };

  const label = `${FIELD_WORD[field]} of ${link}`;
  return (
    <span className="lwt-cell-wrap">
      <input
        type="text"
        inputMode={field === 'zs' || field === 'temperature' ? 'decimal' : 'text'}
        className={`lwp-input lwt-input lwt-input-${field}${draft ? ' lwt-draft' : ''}`}
        aria-label={field === 'zs' ? `${label} (Ω)` : field === 'temperature' ? `${label} (°C)` : label}
        aria-invalid={error ? true : undefined}
        title={draft ? 'Kept for this row; recorded with the reading when its Zs is entered' : undefined}
        data-tcell={`${row}:${col}`}
        data-testing-cell={field}
        data-testing-link={link}
        value={text}
        placeholder={placeholder}
        onChange={(e) => setText(e.target.value)}
        onBlur={() => void run(false)}
        onKeyDown={onKeyDown}
      />
      {error ? (
        <span className="lwp-field-error lwt-error" role="alert" data-testing-error={`${link}:${field}`}>
          {error}
        </span>
      ) : null}
    </span>
  );
}

/** Commits one cell of a link's reading through the store (one undoable edit), or keeps a draft. */
function commitReading(link: string, field: ReadingField, text: string): Outcome {
  let value: number | string | undefined;
  if (field === 'zs' || field === 'temperature') {
    const parsed = parseNumber(text, RULES[field]);
    if (!parsed.ok) return { ok: false, reason: parsed.reason };
    value = parsed.value;
  } else {
    value = text.trim() === '' ? undefined : text.trim();
  }
  const record = useEditor.getState().job.links.find((l) => l.id === link);
  if (!record) return { ok: false, reason: `There is no link ${link} any more` };
  const view = useTestingView.getState();
  const change = readingChange(record.measured, field, value, view.session, view.drafts[link]);
  switch (change.kind) {
    case 'none':
      return { ok: true };
    case 'draft':
      view.setDraft(link, change.draft);
      return { ok: true };
    case 'reading': {
      const label = change.measured === undefined ? `remove the reading of ${link}` : `reading of ${link}: ${FIELD_WORD[field]}`;
      const outcome = editLink(link, 'measured', change.measured, label);
      if (outcome.ok && record.measured === undefined) view.setDraft(link, undefined);
      if (outcome.ok && change.measured === undefined) {
        useEditor.getState().setMessage({ kind: 'info', text: `Removed the reading of ${link} (Undo puts it back)` });
      }
      return outcome;
    }
  }
}

function shownOf(reading: LinkReading | undefined, field: ReadingField, extras: Record<string, unknown> | undefined): { text: string; draft: boolean } {
  const own = reading?.[field];
  if (own !== undefined) return { text: typeof own === 'number' ? showNumber(own) : own, draft: false };
  const typed = reading ? undefined : extras?.[field];
  if (typed !== undefined) return { text: typeof typed === 'number' ? showNumber(typed) : String(typed), draft: true };
  return { text: '', draft: false };
}

const TestingRow = memo(function TestingRow({ id, row, fixedFactor }: { id: string; row: number; fixedFactor: boolean }) {
  const link = useEditor(selectLink(id));
  const r = useEditor(selectResult(id));
  const draft = useTestingView((s) => s.drafts[id]);
  const session = useTestingView((s) => s.session);
  if (!link) return null;
  const m = r?.measured ?? null;
  const reading = link.measured;
  const temperature = reading?.temperature ?? 20;
  const cell = (field: ReadingField, col: number, placeholder?: string) => {
    const { text, draft: isDraft } = shownOf(reading, field, draft);
    return (
      <td className={`lwt-cell lwt-cell-${field}`}>
        <Cell row={row} col={col} link={id} field={field} shown={text} draft={isDraft} placeholder={placeholder}
          commit={(t) => commitReading(id, field, t)} />
      </td>
    );
  };
  const sessionTemp = session.temperature !== undefined ? showNumber(session.temperature) : '20';
  return (
    <tr className="lwp-row lwt-row" data-testing-row={id} style={{ height: TESTING_ROW_HEIGHT }}>
      <th scope="row" className="lwt-circuit" title={link.name ? `${id} — ${link.name}` : id}>
        <span className="lwt-id">{id}</span>
        {link.name ? <span className="lwt-name">{link.name}</span> : null}
      </th>
      <td className="lwp-num lwt-limit" data-testing-limit={id}>
        {ohmsValue(r?.testLimit)}
        {r?.testLimit != null ? (
          <span className="lwp-sub"> {fixedFactor ? 'fixed factor' : `at ${showNumber(temperature)} °C`}</span>
        ) : null}
      </td>
      {cell('zs', 0, 'Zs')}
      {cell('temperature', 1, reading ? '20' : sessionTemp)}
      {cell('date', 2, reading ? '' : session.date ?? '')}
      {cell('instrument', 3, reading ? '' : session.instrument ?? '')}
      <td className="lwp-num" data-testing-corrected={id}>{m ? ohmsValue(m.corrected) : '—'}</td>
      <td className="lwp-num" data-testing-ratio={id}>{m ? percentValue(m.ratio) : '—'}</td>
      <td className="lwt-status" data-testing-status={id}>
        {m ? <StatusBadge status={m.status} /> : reading ? <span className="lwp-muted">result to come</span> : <span className="lwp-muted">no reading</span>}
      </td>
    </tr>
  );
});

/** Commits a supply's measured Ze (empty removes the reading): one undoable edit. */
function commitZe(supply: SupplyNode, text: string): Outcome {
  const parsed = parseNumber(text, { label: 'Measured Ze', unit: 'Ω', above: 0, optional: true });
  if (!parsed.ok) return { ok: false, reason: parsed.reason };
  const session = useTestingView.getState().session;
  const measured = parsed.value === undefined
    ? undefined
    : {
        ze: parsed.value,
        ...(supply.measured
          ? { ...(supply.measured.date ? { date: supply.measured.date } : {}), ...(supply.measured.instrument ? { instrument: supply.measured.instrument } : {}) }
          : { ...(session.date ? { date: session.date } : {}), ...(session.instrument ? { instrument: session.instrument } : {}) }),
      };
  return editNode(supply.id, 'measured', measured, measured ? `measured Ze of ${supply.id}` : `remove the measured Ze of ${supply.id}`);
}

/** Each supply's measured Ze: the readings of its circuits are corrected with it. */
function SupplyReadings() {
  const supplies = useEditor(useShallow((s) => s.job.nodes.filter((n): n is SupplyNode => n.kind === 'supply')));
  if (supplies.length === 0) return null;
  return (
    <div className="lwt-supplies" data-testing-supplies>
      {supplies.map((n) => (
        <SupplyZe key={n.id} supply={n} />
      ))}
    </div>
  );
}

function SupplyZe({ supply }: { supply: SupplyNode }) {
  const shown = supply.measured ? showNumber(supply.measured.ze) : '';
  const [text, setText] = useState(shown);
  const [error, setError] = useState<string | null>(null);
  useEffect(() => {
    setText(shown);
    setError(null);
  }, [shown]);
  const run = () => {
    if (text === shown) return;
    const outcome = commitZe(supply, text);
    setError(outcome.ok ? null : outcome.reason);
    if (!outcome.ok) setText(shown);
  };
  return (
    <label className="lwt-supply">
      Measured Ze of {supply.id}{supply.name ? ` (${supply.name})` : ''}
      <input className="lwp-input lwt-input-zs" inputMode="decimal" data-testing-ze={supply.id} value={text} placeholder="not measured"
        aria-label={`Measured Ze of ${supply.id} (Ω)`} aria-invalid={error ? true : undefined}
        onChange={(e) => setText(e.target.value)} onBlur={run}
        onKeyDown={(e) => {
          if (e.key === 'Enter') run();
          else if (e.key === 'Escape') setText(shown);
        }} /> Ω
      {error ? <span className="lwp-field-error" role="alert" data-testing-error={`${supply.id}:ze`}>{error}</span> : null}
    </label>
  );
}

/** The day's defaults for new readings. */
function SessionDefaults() {
  const session = useTestingView((s) => s.session);
  const [error, setError] = useState<string | null>(null);
  const set = useTestingView.getState().setSession;
  return (
    <fieldset className="lwt-session" aria-label="For new readings">
      <legend>For new readings</legend>
      <label>
        Temperature
        <input className="lwp-input lwt-session-input" data-testing-session="temperature" inputMode="decimal"
          defaultValue={showNumber(session.temperature)} placeholder="20" aria-label="Temperature of new readings (°C)"
          onBlur={(e) => {
            const parsed = parseNumber(e.currentTarget.value, RULES.temperature);
            if (!parsed.ok) {
              setError(parsed.reason);
              return;
            }
            setError(null);
            set({ temperature: parsed.value });
          }} /> °C
      </label>
      <label>
        Date
        <input className="lwp-input lwt-session-input" data-testing-session="date" defaultValue={session.date ?? ''}
          placeholder="e.g. 2026-12-02" aria-label="Date of new readings"
          onBlur={(e) => set({ date: e.currentTarget.value.trim() || undefined })} />
      </label>
      <label>
        Instrument
        <input className="lwp-input lwt-session-input" data-testing-session="instrument" defaultValue={session.instrument ?? ''}
          aria-label="Instrument of new readings" onBlur={(e) => set({ instrument: e.currentTarget.value.trim() || undefined })} />
      </label>
      {error ? <span className="lwp-field-error" role="alert" data-testing-session-error>{error}</span> : null}
    </fieldset>
  );
}

export function TestingView() {
  const links = useEditor((s) => s.job.links);
  const rulesInput = useEditor((s) => s.job.rules);
  const counts = useEditor((s) => s.results.summary.checks.measured);
  const fixedFactor = useMemo(() => resolveRules(rulesInput).measuredRule.value === 'fixed-factor', [rulesInput]);
  const withReading = useMemo(() => links.filter((l) => l.measured !== undefined).length, [links]);
  const body = useRef<HTMLDivElement>(null);
  const [scrollTop, setScrollTop] = useState(0);
  const [viewHeight, setViewHeight] = useState(FALLBACK_VIEW_HEIGHT);
  const pending = useRef<[number, number] | null>(null);
  const windowed = links.length > TESTING_WINDOW_THRESHOLD;
  useLayoutEffect(() => {
    const el = body.current;
    if (!el) return;
    const measure = () => setViewHeight(el.clientHeight > 0 ? el.clientHeight : FALLBACK_VIEW_HEIGHT);
    measure();
    if (typeof ResizeObserver === 'undefined') return;
    const ro = new ResizeObserver(measure);
    ro.observe(el);
    return () => ro.disconnect();
  }, []);
  const [first, last] = windowed ? testingWindow(links.length, scrollTop, viewHeight) : [0, links.length];
  // A keyboard move to a row outside the window: scroll it into view, then focus it once drawn.
  const reveal = useCallback((row: number, col: number) => {
    const el = body.current;
    pending.current = [row, col];
    const top = Math.max(0, row * TESTING_ROW_HEIGHT - (el?.clientHeight || FALLBACK_VIEW_HEIGHT) / 2);
    if (el) el.scrollTop = top;
    setScrollTop(top);
  }, []);
  useLayoutEffect(() => {
    const want = pending.current;
    if (!want) return;
    const target = body.current?.querySelector<HTMLInputElement>(cellSelector(want[0], want[1]));
    if (!target) return;
    pending.current = null;
    target.focus();
    target.select();
  });
  const grid = useMemo(() => ({ count: links.length, reveal }), [links.length, reveal]);
  const columns = 9;
  return (
    <section className="lwp-panel lwp-schedule lwt-testing" data-panel="testing" aria-label="Testing: readings on site">
      <header className="lwp-panel-head">
        <h2 className="lwp-panel-title">Testing</h2>
        <ScheduleViewSwitch />
        <p className="lwt-counts" data-testing-counts>
          {withReading} of {links.length} with a reading
          {(['fail', 'rcd', 'pass', 'unchecked'] as const).map((k) =>
            counts[k] > 0 ? (
              <span key={k} className={`lwp-status ${STATUS_LOOK[k].className}`}>
                <span aria-hidden="true">{STATUS_LOOK[k].symbol}</span> {counts[k]} {STATUS_LOOK[k].word}
              </span>
            ) : null,
          )}
        </p>
        <button type="button" className="lwp-button" data-action="import-readings" onClick={() => runCommand('readings.import')}>
          Import readings…
        </button>
      </header>
      <SessionDefaults />
      <SupplyReadings />
      <GridContext.Provider value={grid}>
      <div className="lwp-schedule-body" data-testing-grid ref={body} data-windowed={windowed ? 'true' : 'false'}
        onScroll={(e) => setScrollTop(e.currentTarget.scrollTop)}>
        <table className="lwp-schedule-table lwt-table">
          <thead>
            <tr>
              <th scope="col">Circuit</th>
              <th scope="col" className="lwp-num-head" title={fixedFactor
                ? 'The largest reading that passes (the limit times the fixed factor of the rules)'
                : 'The largest reading that passes at the temperature of the reading (20 °C when none is given)'}>
                Test limit <span className="lwp-col-unit">Ω</span>
              </th>
              <th scope="col" title="The loop impedance measured at the far end">Reading Zs <span className="lwp-col-unit">Ω</span></th>
              <th scope="col" title="Temperature of the conductors at the test (20 °C when empty)">Temp. <span className="lwp-col-unit">°C</span></th>
              <th scope="col">Date</th>
              <th scope="col">Instrument</th>
              <th scope="col" className="lwp-num-head" title="The reading corrected to the conductors at fault temperature">
                Corr. <span className="lwp-col-unit">Ω</span>
              </th>
              <th scope="col" className="lwp-num-head" title="Corrected reading as a share of the loop limit">
                Ratio <span className="lwp-col-unit">%</span>
              </th>
              <th scope="col">Result</th>
            </tr>
          </thead>
          <tbody>
            {first > 0 ? (
              <tr aria-hidden="true" className="lwp-spacer" style={{ height: first * TESTING_ROW_HEIGHT }}><td colSpan={columns} /></tr>
            ) : null}
            {links.slice(first, last).map((l, i) => (
              <TestingRow key={l.id} id={l.id} row={first + i} fixedFactor={fixedFactor} />
            ))}
            {last < links.length ? (
              <tr aria-hidden="true" className="lwp-spacer" style={{ height: (links.length - last) * TESTING_ROW_HEIGHT }}><td colSpan={columns} /></tr>
            ) : null}
          </tbody>
        </table>
        {links.length === 0 ? <p className="lwp-empty">No circuits yet: connect two nodes on the sheet.</p> : null}
        <p className="lwt-help">
          Enter or ↓: the same cell of the next circuit; Shift+Enter or ↑: the one above; Tab: the next cell.
          An empty Zs removes the reading. {fixedFactor ? 'Readings are judged by the fixed factor of the rules.' : 'Readings are corrected from their temperature to fault temperature.'}{' '}
          A circuit without a protective device has no test limit (—).
        </p>
        <p className="lwt-caution" data-caution>{CAUTION}</p>
      </div>
      </GridContext.Provider>
    </section>
  );
}
