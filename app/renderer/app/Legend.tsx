// The legend: what the status symbols and the line styles on the sheet mean. The line samples
// use the sheet's own classes (lw-link, lw-status--*, is-traced), so they cannot drift from it.
import type { Status } from '../../../engine/index.js';
import { STATUS_SYMBOL, STATUS_WORD } from '../sheet/labels.js';

const STATUS_MEANING: Record<Status, string> = {
  pass: 'disconnects in time',
  fail: 'does not disconnect in time',
  rcd: 'only the RCD disconnects in time',
  unchecked: 'not checked: no device, or no supply reaches it',
};

const STATUSES: Status[] = ['pass', 'fail', 'rcd', 'unchecked'];

function Line({ className }: { className: string }) {
  return (
    <svg className="lw-legend-line" viewBox="0 0 40 12" aria-hidden="true">
      <g className={className}>
        <path className="react-flow__edge-path" d="M2 6 H38" fill="none" />
      </g>
    </svg>
  );
}

const LINES: Array<{ className: string; text: string; short: string; hook: string }> = [
  { className: 'lw-link lw-status--pass', text: 'solid: a checked link that passes', short: 'pass', hook: 'pass' },
  { className: 'lw-link lw-status--fail', text: 'solid red: a link that fails', short: 'fail', hook: 'fail' },
  { className: 'lw-link lw-status--rcd', text: 'solid amber: a link relying on its RCD', short: 'RCD-reliant', hook: 'rcd' },
  { className: 'lw-link lw-status--unchecked', text: 'dotted: unchecked, e.g. unprotected (no device)', short: 'dotted: unchecked / unprotected', hook: 'unchecked' },
  { className: 'lw-link is-traced', text: 'thick dashed: the traced fault path (worst or selected loop)', short: 'dashed: traced fault path', hook: 'traced' },
  { className: 'lw-link is-selected', text: 'thick blue: selected', short: 'selected', hook: 'selected' },
];

export function Legend({ compact }: { compact?: boolean }) {
  return (
    <div className={`lw-legend-box${compact ? ' lw-legend-box--compact' : ''}`} data-legend>
      <ul className="lw-legend" aria-label="Status symbols">
        {STATUSES.map((s) => (
          <li key={s} className={`lw-status--${s}`} data-legend-status={s} title={STATUS_MEANING[s]}>
            <span aria-hidden="true">{STATUS_SYMBOL[s]}</span> {STATUS_WORD[s]}
            {compact ? null : <span className="lw-legend-meaning"> — {STATUS_MEANING[s]}</span>}
          </li>
        ))}
      </ul>
      <ul className="lw-legend-lines" aria-label="Line styles">
        {LINES.map((l) => (
          <li key={l.hook} data-legend-line={l.hook} title={l.text}>
            <Line className={l.className} />
            <span>{compact ? l.short : l.text}</span>
          </li>
        ))}
      </ul>
      {compact ? null : <p className="lw-legend-note">A label gives the device, the cable (active/earth mm², material, length m) and Zs (or the own loop) against its limit in Ω, and the ratio in %.</p>}
    </div>
  );
}
