// The status bar: the last message, the summary of results and the caution.
import { CAUTION } from '../../../engine/index.js';
import { useEditor } from '../store/editor.js';
import { useUi } from './ui.js';
import { firstFailure } from '../commands/work.js';

/** The worst loop (highest ratio) and, when it is another circuit, the first outright failure. */
export function problemsLine(worst: { link: string; ratio: number } | null, fail: string | null): string | null {
  const parts: string[] = [];
  if (worst) parts.push(`worst loop ${worst.link} ${Math.round(worst.ratio * 100)} %`);
  if (fail && fail !== worst?.link) parts.push(`first ✗ FAIL ${fail}`);
  return parts.length > 0 ? parts.join(' · ') : null;
}

/** The caution, shortened for the bar; the full text is in the About dialog. */
export const SHORT_CAUTION = 'Design aid only: verify by testing; local wiring rules govern.';

export function StatusBar() {
  const message = useEditor((s) => s.message);
  // The verdicts (every check together), as the labels and the schedule show them.
  const summary = useEditor((s) => s.results.summary.verdict);
  const basis = useEditor((s) => s.results.basis);
  const worst = useEditor((s) => s.results.worst);
  const fail = useEditor((s) => firstFailure(s.results));
  const problems = problemsLine(worst, fail);
  return (
    <footer className="lw-statusbar">
      <span className={`lw-message${message?.kind === 'error' ? ' lw-message--error' : ''}`} role="status" data-message>
        {message ? `${message.kind === 'error' ? '✗ ' : ''}${message.text}` : 'Ready'}
      </span>
      <span className="lw-summary" data-summary
        title={`basis ${basis}: ${summary.pass} pass, ${summary.fail} FAIL, ${summary.rcd} RCD-reliant, ${summary.unchecked} unchecked${problems ? `; ${problems}` : ''}`}>
        <span className="lw-summary-basis">basis {basis} · </span><span className="lw-status--pass">✓ {summary.pass} pass</span> ·{' '}
        <span className="lw-status--fail">✗ {summary.fail} FAIL</span> ·{' '}
        <span className="lw-status--rcd">⚠ {summary.rcd} RCD</span> ·{' '}
        <span className="lw-status--unchecked">○ {summary.unchecked} unchecked</span>
        {problems && <> · <span className="lw-worst" data-worst-line>{problems}</span></>}
      </span>
      <button type="button" className="lw-caution" title={CAUTION} data-caution onClick={() => useUi.getState().set({ aboutOpen: true })}>
        ⚠ {SHORT_CAUTION}
      </button>
    </footer>
  );
}
