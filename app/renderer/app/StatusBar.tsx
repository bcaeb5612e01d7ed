// The status bar: the last message, the summary of results and the caution.
import { CAUTION } from '../../../engine/index.js';
import { useEditor } from '../store/editor.js';
import { useUi } from './ui.js';

/** The caution, shortened for the bar; the full text is in the About dialog. */
export const SHORT_CAUTION = 'Design aid only: verify by testing; local wiring rules govern.';

export function StatusBar() {
  const message = useEditor((s) => s.message);
  const summary = useEditor((s) => s.results.summary);
  const basis = useEditor((s) => s.results.basis);
  return (
    <footer className="lw-statusbar">
      <span className={`lw-message${message?.kind === 'error' ? ' lw-message--error' : ''}`} role="status" data-message>
        {message ? `${message.kind === 'error' ? '✗ ' : ''}${message.text}` : 'Ready'}
      </span>
      <span className="lw-summary" data-summary>
        basis {basis} · <span className="lw-status--pass">✓ {summary.pass} pass</span> ·{' '}
        <span className="lw-status--fail">✗ {summary.fail} FAIL</span> ·{' '}
        <span className="lw-status--rcd">⚠ {summary.rcd} RCD</span> ·{' '}
        <span className="lw-status--unchecked">○ {summary.unchecked} unchecked</span>
      </span>
      <button type="button" className="lw-caution" title={CAUTION} data-caution onClick={() => useUi.getState().set({ aboutOpen: true })}>
        ⚠ {SHORT_CAUTION}
      </button>
    </footer>
  );
}
