// The selected circuit's results from the engine, beside its inputs.

import { selectResult, useEditor } from '../../store/index.js';
import { showBreakdown } from '../actions.js';
import { verdictText } from '../../sheet/labels.js';
import { CHECKS, STATUS_LOOK, amps, checkStatuses, dropPercent, metres, ohms, percent, seconds, shownVerdict } from '../format.js';
import type { CircuitResult } from '../../../../engine/index.js';

export function StatusBadge({ status }: { status: keyof typeof STATUS_LOOK }) {
  const look = STATUS_LOOK[status];
  return (
    <span className={`lwp-status ${look.className}`} data-status-badge={status}>
      <span aria-hidden="true" className="lwp-status-symbol">{look.symbol}</span> {look.word}
    </span>
  );
}

function Row({ label, value, field }: { label: string; value: string; field: string }) {
  return (
    <tr data-result={field}>
      <th scope="row">{label}</th>
      <td>{value}</td>
    </tr>
  );
}

/** The key figure of each check beside its status. */
function checkFigure(r: CircuitResult, key: (typeof CHECKS)[number]['key']): string {
  switch (key) {
    case 'loop':
      return r.ratio !== null ? `${percent(r.ratio)} of the limit` : '';
    case 'voltage':
      return r.voltageDropTotal !== null
        ? `${dropPercent(r.voltageDropTotal)}${r.voltageDropLimit !== null ? ` of ${dropPercent(r.voltageDropLimit)}` : ' (at a board: no limit)'}`
        : r.designCurrent === null ? 'no load below' : '';
    case 'capacity':
      return r.capacity !== null ? `Ib ${amps(r.designCurrent)}, Iz ${amps(r.capacity)}` : 'Iz unknown';
    case 'breaking':
      return r.faultLevel !== null ? `fault level ${amps(r.faultLevel)}` : 'fault level unknown';
    case 'withstand':
      return r.earthMinArea !== null ? `needs ${r.earthMinArea.toFixed(2)} mm²` : '';
    case 'measured':
      return r.measured ? `${ohms(r.measured.corrected)} corrected${r.measured.ratio !== null ? `, ${percent(r.measured.ratio)}` : ''}` : 'no reading';
  }
}

/** Every check of the verdict, each by symbol, word and colour, with its key figure. */
function CheckTable({ r }: { r: CircuitResult }) {
  const s = checkStatuses(r);
  return (
    <table className="lwp-results-table lwp-checks-table" aria-label="Checks">
      <tbody>
        {CHECKS.map((c) => (
          <tr key={c.key} data-check-row={c.key} data-check-status={s[c.key]}>
            <th scope="row">{c.word}</th>
            <td className="lwp-check-figure">{checkFigure(r, c.key)}</td>
            <td><StatusBadge status={s[c.key]} /></td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}

export function CircuitResults({ linkId }: { linkId: string }) {
  const r = useEditor(selectResult(linkId));
  if (!r) return <section className="lwp-results" aria-label="Results"><p>No result yet for {linkId}.</p></section>;
  const known = r.method === 'known-source';
  return (
    <section className="lwp-results" aria-label={`Results for ${linkId}`} data-results={linkId}>
      <h4>Results</h4>
      <p className="lwp-results-verdict" data-verdict-line={r.verdict}>
        <span className="lwp-results-kicker">Verdict</span> <StatusBadge status={shownVerdict(r)} />
        <span className="lwp-results-why"> {verdictText(r).replace(/^\S+ \S+(: )?/, '')}</span>
      </p>
      <p className="lwp-results-status">
        <span className="lwp-results-kicker">Loop</span> <StatusBadge status={r.status} />
        {r.ratio !== null ? <span className="lwp-results-ratio"> {percent(r.ratio)} of the limit</span> : null}
      </p>
      <CheckTable r={r} />
      <table className="lwp-results-table">
        <tbody>
          <Row field="method" label="Method" value={r.method === null ? 'no supply reaches it' : known ? 'source known (Zs)' : 'source unknown (80 % share)'} />
          <Row field="device" label="Protected by" value={r.protectedBy ? `${r.device ?? ''} on ${r.protectedBy}` : 'no device'} />
          {known ? (
            <Row field="zs" label="Zs at far end" value={ohms(r.zs)} />
          ) : (
            <>
              <Row field="own" label="Own loop" value={ohms(r.own)} />
              <Row field="upstream" label="Upstream loop" value={ohms(r.upstream)} />
            </>
          )}
          <Row field="limit" label="Limit" value={ohms(r.limit)} />
          <Row field="tripCurrent" label="Trip current Ia" value={amps(r.tripCurrent)} />
          <Row field="requiredTime" label="Required time" value={seconds(r.requiredTime)} />
          <Row field="faultCurrent" label="Fault current" value={amps(r.faultCurrent)} />
          <Row field="clearingTime" label="Clearing time" value={seconds(r.clearingTime)} />
          <Row field="ratio" label="Ratio" value={percent(r.ratio)} />
          <Row field="maxLength" label="Maximum length" value={metres(r.maxLength)} />
          <Row field="testLimit" label="Test limit (largest passing reading)" value={ohms(r.testLimit)} />
        </tbody>
      </table>
      {r.notes.length > 0 ? (
        <ul className="lwp-results-notes" aria-label="Notes">
          {r.notes.map((n, i) => (
            <li key={i}>{n}</li>
          ))}
        </ul>
      ) : null}
      <button type="button" className="lwp-button" data-action="show-breakdown" onClick={() => showBreakdown(linkId)}>
        Show loop breakdown
      </button>
    </section>
  );
}
