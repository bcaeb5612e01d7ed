// The legend: what the status symbols and the line styles on the sheet mean. The line samples
// are drawn by the same CSS rules as the sheet's links (styles.css, .lw-sample--*), so they
// cannot drift from it; they carry their own classes so that nothing mistakes them for links.
import type { Status } from '../../../engine/index.js';
import { STATUS_SYMBOL, STATUS_WORD } from '../sheet/labels.js';

const STATUS_MEANING: Record<Status, string> = {
  pass: 'disconnects in time',
  fail: 'does not disconnect in time',
  rcd: 'only the RCD disconnects in time',
  unchecked: 'not checked: no device, or no supply reaches it',
};

const STATUSES: Status[] = ['pass', 'fail', 'rcd', 'unchecked'];

function Line({ kind }: { kind: string }) {
  return (
    <svg className="lw-legend-line" viewBox="0 0 40 12" aria-hidden="true">
      <g className={`lw-sample lw-sample--${kind}`}>
        <path d="M2 6 H38" />
      </g>
    </svg>
  );
}

const LINES: Array<{ text: string; short: string; hook: string }> = [
  { text: 'solid: a checked link that passes', short: 'pass', hook: 'pass' },
  { text: 'solid red: a link that fails', short: 'fail', hook: 'fail' },
  { text: 'solid amber: a link relying on its RCD', short: 'RCD-reliant', hook: 'rcd' },
  { text: 'dotted: unchecked, e.g. unprotected (no device)', short: 'dotted: unchecked / unprotected', hook: 'unchecked' },
  { text: 'thick dashed: the traced fault path (worst or selected loop)', short: 'dashed: traced fault path', hook: 'traced' },
  { text: 'thick blue: selected', short: 'selected', hook: 'selected' },
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
            <Line kind={l.hook} />
            <span>{compact ? l.short : l.text}</span>
          </li>
        ))}
      </ul>
      {compact ? null : <p className="lw-legend-note">A label gives the device, the cable (active/earth mm², material, length m) and Zs (or the own loop) against its limit in Ω, and the ratio in %.</p>}
    </div>
  );
}
