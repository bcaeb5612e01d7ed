// The desktop bridge: when window.loopwright exists, the native menu is built from the command
// registry, menu clicks run commands, files opened by the main process load here, and the main
// process learns the dirty state and the job text when the window closes.
import { serialiseJob } from '../../../engine/index.js';
import type { LoopwrightApi, MenuDescriptor } from '../../shared/ipc.js';
import { COMMANDS } from '../commands/registry.js';
import { accelerator } from '../commands/keys.js';
import { runCommand } from '../commands/context.js';
import { openText } from '../io/files.js';
import { useEditor, type EditorState } from '../store/editor.js';

export function menuItems(state: EditorState): MenuDescriptor[] {
  return COMMANDS.map((c) => ({
    id: c.id,
    label: c.label,
    accelerator: accelerator(c.shortcut),
    enabled: c.enabled(state, { desktop: true }),
    menu: c.group,
    ...(c.separatorBefore ? { separatorBefore: true } : {}),
  }));
}

function windowTitle(s: EditorState): string {
  const name = s.fileName ?? (s.job.job.title || 'Untitled job');
  return `${s.dirty ? '● ' : ''}${name} — Loopwright`;
}

export function connectDesktop(api: LoopwrightApi): () => void {
  let lastMenu = '';
  let lastTitle = '';
  const sync = () => {
    const s = useEditor.getState();
    const items = menuItems(s);
    const key = JSON.stringify(items);
    if (key !== lastMenu) {
      lastMenu = key;
      api.setMenu(items);
    }
    const title = windowTitle(s);
    if (title !== lastTitle) {
      lastTitle = title;
      api.setDirty(s.dirty, title);
    }
  };
  sync();
  let pending = false;
  const stopStore = useEditor.subscribe(() => {
    if (pending) return;
    pending = true;
    setTimeout(() => {
      pending = false;
      sync();
    }, 100);
  });
  const stopCommand = api.onCommand((id) => runCommand(id));
  const stopOpen = api.onOpenFile((job) => void openText(job.text, job.name, job.path));
  const stopClose = api.onCloseRequest(() => {
    const s = useEditor.getState();
    return { dirty: s.dirty, text: serialiseJob(s.job) };
  });
  return () => {
    stopStore();
    stopCommand();
    stopOpen();
    stopClose();
  };
}
