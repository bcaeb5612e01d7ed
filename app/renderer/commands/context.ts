// The context every command runs with, and running a command by id (for every caller).
import { newJob as emptyJob, serialiseJob } from '../../../engine/index.js';
import { useEditor } from '../store/editor.js';
import { getSheetHandle } from '../sheet/handle.js';
import { confirmDiscard, openJob, saveJob } from '../io/files.js';
import { useUi } from '../app/ui.js';
import { printInBrowser } from '../io/print.js';
import { getCommand } from './registry.js';
import type { CommandContext } from './types.js';

export function isTyping(el: Element | null = typeof document === 'undefined' ? null : document.activeElement): boolean {
  if (!el) return false;
  if (el instanceof HTMLTextAreaElement || el instanceof HTMLSelectElement) return true;
  if (el instanceof HTMLInputElement) return !['button', 'checkbox', 'radio', 'file', 'submit', 'reset', 'range', 'color'].includes(el.type);
  return (el as HTMLElement).isContentEditable === true;
}

export function makeContext(): CommandContext {
  const api = typeof window === 'undefined' ? undefined : window.loopwright;
  return {
    store: useEditor,
    get sheet() {
      return getSheetHandle();
    },
    desktop: api !== undefined,
    open: openJob,
    save: saveJob,
    async print() {
      const text = serialiseJob(useEditor.getState().job);
      if (api) {
        await api.print(text);
        return;
      }
      await printInBrowser();
    },
    async exportPdf() {
      if (!api) {
        useEditor.getState().setMessage({ kind: 'info', text: 'PDF export is in the desktop app; in the browser use Print and choose “Save as PDF”' });
        return;
      }
      const saved = await api.exportPdf(serialiseJob(useEditor.getState().job));
      if (saved) useEditor.getState().setMessage({ kind: 'info', text: `Exported ${saved.name}` });
    },
    newJob() {
      if (!confirmDiscard('Start a new job')) return;
      useEditor.getState().loadJob(emptyJob());
    },
    openFind: () => useUi.getState().set({ findOpen: true }),
    openAbout: () => useUi.getState().set({ aboutOpen: true }),
    typing: () => isTyping(),
  };
}

let shared: CommandContext | null = null;

/** Runs a command if it exists and is enabled; says so in the status bar otherwise. */
export function runCommand(id: string): boolean {
  const command = getCommand(id);
  shared ??= makeContext();
  const s = useEditor.getState();
  if (!command) {
    s.setMessage({ kind: 'error', text: `There is no command ${id}` });
    return false;
  }
  if (!command.enabled(s, { desktop: shared.desktop })) return false;
  useUi.getState().set({ contextMenu: null });
  void Promise.resolve(command.run(shared)).catch((e: unknown) => {
    useEditor.getState().setMessage({ kind: 'error', text: `${command.label} failed: ${e instanceof Error ? e.message : String(e)}` });
  });
  return true;
}
