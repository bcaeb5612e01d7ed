// The About dialog (with the full caution) and the list of problems when a file is refused.
import { CAUTION } from '../../../engine/index.js';
import { COMMANDS } from '../commands/registry.js';
import { showShortcut } from '../commands/keys.js';
import { Dialog } from './Dialog.js';
import { Legend } from './Legend.js';
import { useUi } from './ui.js';

const desktop = typeof window !== 'undefined' && window.loopwright !== undefined;

export function AboutDialog() {
  const open = useUi((s) => s.aboutOpen);
  if (!open) return null;
  const close = () => useUi.getState().set({ aboutOpen: false });
  return (
    <Dialog title="About Loopwright" onClose={close} wide>
      <p>Loopwright checks, for every circuit of a low-voltage installation, that an earth fault at its far end
        makes the protective device disconnect in time (fault-loop impedance).</p>
      <p className="lw-caution-full" data-caution-full><strong>Caution.</strong> {CAUTION}</p>
      <h3>Legend</h3>
      <Legend />
      <h3>Keyboard</h3>
      <table className="lw-keys">
        <tbody>
          {COMMANDS.filter((c) => c.shortcut && (!c.desktopOnly || desktop)).map((c) => (
            <tr key={c.id}><td>{c.label}</td><td><kbd>{showShortcut(c.shortcut!)}</kbd></td></tr>
          ))}
        </tbody>
      </table>
    </Dialog>
  );
}

export function ProblemsDialog() {
  const problems = useUi((s) => s.problems);
  if (!problems) return null;
  return (
    <Dialog title={problems.title} onClose={() => useUi.getState().set({ problems: null })} wide>
      <p>Nothing was changed. The file has these problems:</p>
      <ul className="lw-problems" data-problems>
        {problems.lines.map((line, i) => <li key={i}>{line}</li>)}
      </ul>
    </Dialog>
  );
}
