// After a reload or a crash: offer the job the earlier session had not saved.
import { useEditor } from '../store/editor.js';
import { discardRecovery } from '../io/autosave.js';
import { useUi } from './ui.js';

export function RestoreBanner() {
  const recovery = useUi((s) => s.recovery);
  if (!recovery) return null;
  const when = new Date(recovery.savedAt);
  const restore = () => {
    if (useEditor.getState().dirty && !window.confirm('Replace the current job (it has unsaved changes) with the restored one?')) return;
    useEditor.getState().loadJob(recovery.job, { name: recovery.fileName ?? 'Restored job' });
    useEditor.setState({ dirty: true, message: { kind: 'info', text: 'Restored the unsaved job; save it to keep it' } });
    discardRecovery();
    useUi.getState().set({ recovery: null });
  };
  const discard = () => {
    discardRecovery();
    useUi.getState().set({ recovery: null });
  };
  return (
    <div className="lw-banner" role="alert" data-restore-banner>
      <span>
        An unsaved job from an earlier session was kept
        ({recovery.job.job.title || recovery.fileName || 'untitled'}, {recovery.job.nodes.length} nodes,{' '}
        {Number.isNaN(when.getTime()) ? 'time unknown' : when.toLocaleString()}).
      </span>
      <button type="button" data-restore onClick={restore}>Restore</button>
      <button type="button" data-discard onClick={discard}>Discard</button>
    </div>
  );
}
