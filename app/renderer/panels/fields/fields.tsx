// The editing fields every panel uses. Each one commits on change, blur or Enter through an
// `onCommit` that returns the store's outcome; when the edit is refused (locally or by the
// store), the reason is shown beside the field (role=alert) and the last good value comes back.

import { memo, useEffect, useId, useRef, useState, type ReactNode, type RefObject } from 'react';
import { parseNumber, showNumber, type NumberRule } from './parse.js';
import { useEditor } from '../../store/editor.js';
import { practiceWarning } from '../../store/practice.js';

/**
 * A refusal shown beside a field goes when an undo or redo happens, on Escape, and (in a schedule
 * row) when the focus or a click leaves the row: it never stays behind to cover another row.
 */
function useDismiss(error: string | null, clear: () => void, anchor: RefObject<HTMLElement | null>) {
  const historySeq = useEditor((s) => s.historySeq);
  const first = useRef(true);
  useEffect(() => {
    if (first.current) first.current = false;
    else clear();
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [historySeq]);
  useEffect(() => {
    if (!error) return;
    const scope = () => anchor.current?.closest('tr') ?? anchor.current?.closest('.lwp-field') ?? null;
    const away = (e: Event) => {
      const box = scope();
      if (box && e.target instanceof Node && !box.contains(e.target)) clear();
    };
    const key = (e: KeyboardEvent) => {
      if (e.key === 'Escape') clear();
    };
    document.addEventListener('focusin', away);
    document.addEventListener('mousedown', away);
    document.addEventListener('keydown', key);
    return () => {
      document.removeEventListener('focusin', away);
      document.removeEventListener('mousedown', away);
      document.removeEventListener('keydown', key);
    };
  }, [error, clear, anchor]);
}

export type Outcome = { ok: true } | { ok: false; reason: string; field?: string };

/** `data-field` for the details and job panels; `data-cell` inside schedule rows. */
export type HookAttr = 'data-field' | 'data-cell';

interface Common {
  /** Dotted path in the job format, e.g. `cable.length`; used for the test hook. */
  field: string;
  label: string;
  /** Hide the visible label (still the input's accessible name). */
  compact?: boolean;
  attr?: HookAttr;
  hint?: ReactNode;
  disabled?: boolean;
  /** Tooltip on the input, e.g. the full text where the box is too narrow to show it. */
  title?: string;
}

function hook(attr: HookAttr, field: string): Record<string, string> {
  return { [attr]: field };
}

function errorHook(attr: HookAttr, field: string): Record<string, string> {
  return { [`${attr}-error`]: field };
}

export function FieldError({ attr = 'data-field', field, error }: { attr?: HookAttr; field: string; error: string | null }) {
  if (!error) return null;
  return (
    <span className="lwp-field-error" role="alert" title={error} {...errorHook(attr, field)}>
      {error}
    </span>
  );
}

function Shell(props: { label: string; compact?: boolean; inputId: string; unit?: string; hint?: ReactNode; children: ReactNode; error: ReactNode }) {
  return (
    <div className={props.compact ? 'lwp-field lwp-field-compact' : 'lwp-field'}>
      {props.compact ? null : (
        <label className="lwp-label" htmlFor={props.inputId}>
          {props.label}
        </label>
      )}
      <span className="lwp-input-wrap">
        {props.children}
        {props.unit && !props.compact ? <span className="lwp-unit">{props.unit}</span> : null}
      </span>
      {props.hint ? <span className="lwp-hint">{props.hint}</span> : null}
      {props.error}
    </div>
  );
}

/** Text editing shared by number and text fields: local text, commit on blur/Enter, revert on refusal. */
function useTextCommit(shown: string, commit: (text: string) => Outcome) {
  const [text, setText] = useState(shown);
  const [error, setError] = useState<string | null>(null);
  // A change from elsewhere (undo, another panel, a drag moving the node) replaces the text and
  // any stale message. Adopted while rendering (React renders again at once, before committing),
  // not in an effect: an effect would commit the field twice for every change, and a drag
  // changes the position fields on every frame.
  const [adopted, setAdopted] = useState(shown);
  if (adopted !== shown) {
    setAdopted(shown);
    setText(shown);
    setError(null);
  }
  const run = () => {
    // The value as it stands is a valid one: a refusal of an earlier try goes.
    if (text === shown) {
      setError(null);
      return;
    }
    const outcome = commit(text);
    if (outcome.ok) setError(null);
    else {
      setError(outcome.reason);
      setText(shown); // the last good value is kept
    }
  };
  const revert = () => {
    setText(shown);
    setError(null);
  };
  const anchor = useRef<HTMLElement | null>(null);
  const [clear] = useState(() => () => setError(null));
  useDismiss(error, clear, anchor);
  return { text, setText, error, run, revert, anchor };
}

export interface NumberFieldProps extends Common, NumberRule {
  value: number | undefined;
  onCommit(value: number | undefined): Outcome;
  placeholder?: string;
  /** id of a <datalist> offering values first (standard sizes). */
  list?: string;
}

function NumberFieldView(props: NumberFieldProps) {
  const { field, label, unit, value, onCommit, attr = 'data-field' } = props;
  const inputId = useId();
  const shown = showNumber(value, props.scale);
  const { text, setText, error, run, revert, anchor } = useTextCommit(shown, (t) => {
    const parsed = parseNumber(t, props);
    if (!parsed.ok) return { ok: false, reason: parsed.reason };
    return onCommit(parsed.value);
  });
  // Accepted, but far outside practice: a warning beside the field for as long as the value stands.
  const warning = practiceWarning(field, value === undefined ? undefined : value);
  const warn = warning ? (
    <span className="lwp-field-warning" role="status" title={warning} {...{ [`${attr}-warning`]: field }}>
      {props.compact ? '⚠' : `⚠ ${warning}`}
      {props.compact ? <span className="lwp-visually-hidden">{warning}</span> : null}
    </span>
  ) : null;
  return (
    <Shell label={label} compact={props.compact} inputId={inputId} unit={unit} hint={props.hint}
      error={<>{warn}<FieldError attr={attr} field={field} error={error} /></>}>
      <input
        ref={(el) => { anchor.current = el; }}
        id={inputId}
        type="text"
        inputMode="decimal"
        className="lwp-input lwp-input-number"
        aria-label={unit ? `${label} (${unit})` : label}
        aria-invalid={error ? true : undefined}
        value={text}
        placeholder={props.placeholder}
        title={props.title}
        list={props.list}
        disabled={props.disabled}
        {...hook(attr, field)}
        onChange={(e) => setText(e.target.value)}
        onBlur={run}
        onKeyDown={(e) => {
          if (e.key === 'Enter') run();
          else if (e.key === 'Escape') revert();
        }}
      />
    </Shell>
  );
}

export interface TextFieldProps extends Common {
  value: string | undefined;
  onCommit(value: string | undefined): Outcome;
  /** Empty text clears the key (optional fields) or stores '' (job details). */
  emptyAs?: 'undefined' | 'empty';
  multiline?: boolean;
  placeholder?: string;
  /** id of a <datalist> offering values (single-line fields). */
  list?: string;
}

function TextFieldView(props: TextFieldProps) {
  const { field, label, value, onCommit, attr = 'data-field' } = props;
  const inputId = useId();
  const { text, setText, error, run, revert, anchor } = useTextCommit(value ?? '', (t) =>
    onCommit(t === '' && props.emptyAs !== 'empty' ? undefined : t),
  );
  const common = {
    id: inputId,
    className: 'lwp-input',
    'aria-label': label,
    'aria-invalid': error ? true : undefined,
    value: text,
    placeholder: props.placeholder,
    title: props.title,
    disabled: props.disabled,
    onBlur: run,
    ref: (el: HTMLInputElement | HTMLTextAreaElement | null) => { anchor.current = el; },
    ...hook(attr, field),
  };
  return (
    <Shell label={label} compact={props.compact} inputId={inputId} hint={props.hint}
      error={<FieldError attr={attr} field={field} error={error} />}>
      {props.multiline ? (
        <textarea {...common} rows={3} onChange={(e) => setText(e.target.value)}
          onKeyDown={(e) => e.key === 'Escape' && revert()} />
      ) : (
        <input {...common} type="text" list={props.list} onChange={(e) => setText(e.target.value)}
          onKeyDown={(e) => {
            if (e.key === 'Enter') run();
            else if (e.key === 'Escape') revert();
          }} />
      )}
    </Shell>
  );
}

export interface SelectFieldProps<T extends string> extends Common {
  value: T;
  options: ReadonlyArray<{ value: T; label: string }>;
  onCommit(value: T): Outcome;
}

function SelectFieldView<T extends string>(props: SelectFieldProps<T>) {
  const { field, label, value, options, onCommit, attr = 'data-field' } = props;
  const inputId = useId();
  const [error, setError] = useState<string | null>(null);
  const anchor = useRef<HTMLSelectElement | null>(null);
  const [clear] = useState(() => () => setError(null));
  useDismiss(error, clear, anchor);
  return (
    <Shell label={label} compact={props.compact} inputId={inputId} hint={props.hint}
      error={<FieldError attr={attr} field={field} error={error} />}>
      <select
        ref={anchor}
        id={inputId}
        className="lwp-input lwp-select"
        aria-label={label}
        value={value}
        disabled={props.disabled}
        {...hook(attr, field)}
        onChange={(e) => {
          const outcome = onCommit(e.target.value as T);
          setError(outcome.ok ? null : outcome.reason);
        }}
      >
        {options.map((o) => (
          <option key={o.value} value={o.value}>
            {o.label}
          </option>
        ))}
      </select>
    </Shell>
  );
}

export interface CheckFieldProps extends Common {
  value: boolean;
  onCommit(value: boolean): Outcome;
}

function CheckFieldView(props: CheckFieldProps) {
  const { field, label, value, onCommit, attr = 'data-field' } = props;
  const inputId = useId();
  const [error, setError] = useState<string | null>(null);
  const anchor = useRef<HTMLInputElement | null>(null);
  const [clear] = useState(() => () => setError(null));
  useDismiss(error, clear, anchor);
  return (
    <div className="lwp-field lwp-field-check">
      <input
        ref={anchor}
        id={inputId}
        type="checkbox"
        checked={value}
        disabled={props.disabled}
        {...hook(attr, field)}
        onChange={(e) => {
          const outcome = onCommit(e.target.checked);
          setError(outcome.ok ? null : outcome.reason);
        }}
      />
      <label htmlFor={inputId} className="lwp-label-check">
        {label}
      </label>
      {props.hint ? <span className="lwp-hint">{props.hint}</span> : null}
      <FieldError attr={attr} field={field} error={error} />
    </div>
  );
}

/**
 * A field that renders again only when a value it shows changes. The panels hand every field a
 * fresh `onCommit` closure on each render; each function prop is passed on as a stable one that
 * calls the latest, so a panel re-rendered by an edit elsewhere (a length typed into the next
 * field, a drag on the sheet) does not re-render its other fields.
 */
function stableField<P extends object>(View: (props: P) => ReactNode): (props: P) => ReactNode {
  const Memo = memo(View as (props: P) => ReactNode) as unknown as (props: P) => ReactNode;
  function Field(props: P) {
    const latest = useRef(props);
    latest.current = props;
    const stable = useRef(new Map<string, (...args: unknown[]) => unknown>());
    const passed: Record<string, unknown> = {};
    for (const [key, value] of Object.entries(props)) {
      if (typeof value !== 'function') {
        passed[key] = value;
        continue;
      }
      let call = stable.current.get(key);
      if (call === undefined) {
        call = (...args: unknown[]) => (latest.current as Record<string, (...a: unknown[]) => unknown>)[key]!(...args);
        stable.current.set(key, call);
      }
      passed[key] = call;
    }
    return <Memo {...(passed as P)} />;
  }
  Field.displayName = View.name.replace(/View$/, '');
  return Field;
}

export const NumberField = stableField(NumberFieldView);
export const TextField = stableField(TextFieldView);
export const SelectField = stableField(SelectFieldView) as <T extends string>(props: SelectFieldProps<T>) => ReactNode;
export const CheckField = stableField(CheckFieldView);

/** A read-only value in the same layout as the fields. */
export function Readout({ label, children }: { label: string; children: ReactNode }) {
  return (
    <div className="lwp-field lwp-readout">
      <span className="lwp-label">{label}</span>
      <span className="lwp-readout-value">{children}</span>
    </div>
  );
}
