// The toolbar: commands from the registry that carry a toolbar text, plus the file input.
import { useShallow } from 'zustand/react/shallow';
import { useEditor } from '../store/editor.js';
import { COMMANDS } from '../commands/registry.js';
import { runCommand } from '../commands/context.js';
import { showShortcut } from '../commands/keys.js';
import { openFromInput } from '../io/files.js';

const desktop = typeof window !== 'undefined' && window.loopwright !== undefined;
const items = COMMANDS.filter((c) => c.toolbar && (!c.desktopOnly || desktop));

export function Toolbar() {
  // Only whether each button is enabled is subscribed (a drag or an edit that leaves them all as
  // they were does not re-render the toolbar).
  const enabled = useEditor(useShallow((s) => items.map((c) => c.enabled(s, { desktop }))));
  const title = useEditor((s) => s.job.job.title);
  const fileName = useEditor((s) => s.fileName);
  const dirty = useEditor((s) => s.dirty);
  return (
    <header className="lw-toolbar" role="toolbar" aria-label="Commands">
      <div className="lw-brand" aria-label="Loopwright">
        <svg viewBox="0 0 24 24" aria-hidden="true"><path d="M4 18 V6 H14 a5 5 0 0 1 0 10 H9" /><circle cx="9" cy="16" r="2" /></svg>
        Loopwright
      </div>
      <div className="lw-toolbar-buttons">
        {items.map((c, i) => (
          <button
            key={c.id}
            type="button"
            className={`lw-tool${c.separatorBefore ? ' lw-tool--sep' : ''}`}
            data-command={c.id}
            disabled={!enabled[i]}
            title={`${c.label}${c.shortcut ? ` (${showShortcut(c.shortcut)})` : ''}`}
            onClick={() => runCommand(c.id)}
          >
            {c.toolbar}
          </button>
        ))}
      </div>
      <input
        type="file"
        accept=".lwj,application/json"
        data-open-job
        hidden
        aria-label="Open a job file"
        onChange={(e) => void openFromInput(e.currentTarget)}
      />
      <div className="lw-doc-title" data-doc-title title={fileName ?? (title || 'Untitled job')}>
        {fileName ?? (title || 'Untitled job')}
        {dirty && <span className="lw-dirty" title="Unsaved changes"> ● unsaved</span>}
      </div>
    </header>
  );
}
