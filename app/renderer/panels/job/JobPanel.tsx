// The job panel: job details (title block) and the rules (basis and its overrides), each
// override showing the effective value as its placeholder and a reset to the basis.

import { resolveRules, type BasisName, type JobDetails, type RuleValue, type Rules } from '../../../../engine/index.js';
import { useEditor } from '../../store/index.js';
import { NumberField, SelectField, TextField, type Outcome } from '../fields/fields.js';
import { setIn } from '../patch.js';

const DETAIL_FIELDS: ReadonlyArray<{ key: keyof JobDetails; label: string; placeholder?: string; multiline?: boolean }> = [
  { key: 'title', label: 'Title' },
  { key: 'site', label: 'Site' },
  { key: 'client', label: 'Client' },
  { key: 'designer', label: 'Designer' },
  { key: 'reference', label: 'Reference' },
  { key: 'revision', label: 'Revision' },
  { key: 'date', label: 'Date', placeholder: 'YYYY-MM-DD' },
  { key: 'notes', label: 'Notes', multiline: true },
];

const BASIS_OPTIONS: ReadonlyArray<{ value: BasisName; label: string }> = [
  { value: 'au-nz', label: 'AS/NZS 3000 (au-nz)' },
  { value: 'iec', label: 'IEC 60364 (iec)' },
];

interface Override {
  /** Path inside `rules`, e.g. ['resistivity', 'Cu']. */
  path: string[];
  label: string;
  unit?: string;
  above?: number;
  min?: number;
  max?: number;
  pick(r: ReturnType<typeof resolveRules>): RuleValue;
}

const OVERRIDES: readonly Override[] = [
  { path: ['voltage'], label: 'Voltage U0', unit: 'V', above: 0, pick: (r) => r.voltage },
  { path: ['voltageFactor'], label: 'Voltage factor c', above: 0, pick: (r) => r.voltageFactor },
  { path: ['unknownSourceShare'], label: 'Unknown-source share s', above: 0, max: 1, pick: (r) => r.unknownSourceShare },
  { path: ['reactance'], label: 'Reactance per conductor', unit: 'Ω/m', min: 0, pick: (r) => r.reactance },
  { path: ['resistivity', 'Cu'], label: 'Resistivity Cu', unit: 'Ω·mm²/m', above: 0, pick: (r) => r.resistivity.Cu },
  { path: ['resistivity', 'Al'], label: 'Resistivity Al', unit: 'Ω·mm²/m', above: 0, pick: (r) => r.resistivity.Al },
  { path: ['multiples', 'B'], label: 'Multiple, curve B', unit: '× In', above: 0, pick: (r) => r.multiples.B },
  { path: ['multiples', 'C'], label: 'Multiple, curve C', unit: '× In', above: 0, pick: (r) => r.multiples.C },
  { path: ['multiples', 'D'], label: 'Multiple, curve D', unit: '× In', above: 0, pick: (r) => r.multiples.D },
];

/** The rules with one override set or (undefined) removed; an emptied group is removed too. */
export function withOverride(rules: Rules, path: readonly string[], value: number | undefined): Rules {
  let next = setIn(rules, path, value) as Record<string, unknown>;
  const group = path.length > 1 ? path[0]! : null;
  if (group !== null) {
    const inner = next[group];
    if (inner && typeof inner === 'object' && Object.keys(inner).length === 0) {
      next = { ...next };
      delete next[group];
    }
  }
  return next as unknown as Rules;
}

function setRules(rules: Rules, label: string): Outcome {
  return useEditor.getState().apply({ op: 'set-rules', rules }, label);
}

function OverrideField({ rules, o }: { rules: Rules; o: Override }) {
  const resolved = resolveRules(rules);
  const rv = o.pick(resolved);
  const field = `rules.${o.path.join('.')}`;
  let current: unknown = rules;
  for (const key of o.path) current = (current as Record<string, unknown> | undefined)?.[key];
  const value = typeof current === 'number' ? current : undefined;
  return (
    <div className="lwp-override" data-override={field}>
      <NumberField field={field} label={o.label} unit={o.unit} value={value} optional above={o.above} min={o.min} max={o.max}
        placeholder={`${Number(rv.value.toPrecision(6))} (${rules.basis})`}
        hint={<span className="lwp-source" title={rv.source}>{rv.overridden ? 'overrides the basis' : `basis: ${rv.source}`}</span>}
        onCommit={(v) => setRules(withOverride(rules, o.path, v), `set ${o.label.toLowerCase()}`)} />
      {value !== undefined ? (
        <button type="button" className="lwp-button lwp-button-small" data-action="reset-override" data-reset={field}
          onClick={() => setRules(withOverride(rules, o.path, undefined), `reset ${o.label.toLowerCase()} to the basis`)}>
          reset to basis
        </button>
      ) : null}
    </div>
  );
}

export function JobPanel() {
  const details = useEditor((s) => s.job.job);
  const rules = useEditor((s) => s.job.rules);
  const apply = useEditor((s) => s.apply);
  return (
    <section className="lwp-panel lwp-job" data-panel="job" aria-label="Job">
      <h2 className="lwp-panel-title">Job</h2>
      <fieldset className="lwp-group" data-group="job">
        <legend>Job details</legend>
        {DETAIL_FIELDS.map((f) => (
          <TextField key={f.key} field={`job.${f.key}`} label={f.label} value={details[f.key]} emptyAs="empty"
            placeholder={f.placeholder} multiline={f.multiline}
            onCommit={(v) => apply({ op: 'set-details', patch: { [f.key]: v ?? '' } }, `edit the job ${f.key}`)} />
        ))}
      </fieldset>
      <fieldset className="lwp-group" data-group="rules">
        <legend>Rules</legend>
        <SelectField field="rules.basis" label="Basis" value={rules.basis} options={BASIS_OPTIONS}
          onCommit={(b) => setRules({ ...rules, basis: b }, 'change the basis')} />
        <p className="lwp-hint">Leave an override empty to use the basis value shown in grey.</p>
        {OVERRIDES.map((o) => (
          <OverrideField key={o.path.join('.')} rules={rules} o={o} />
        ))}
      </fieldset>
    </section>
  );
}
