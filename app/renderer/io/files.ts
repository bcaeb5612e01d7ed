// Opening and saving jobs. Desktop: through window.loopwright (the main process shows the
// dialogs). Browser: a file input to open, and the File System Access API or a download to save.
import { formatProblem, LIMITS, parseJob, serialiseJob } from '../../../engine/index.js';
import { useEditor } from '../store/editor.js';
import { useUi } from '../app/ui.js';
import { rememberSaved } from './autosave.js';

/** Asks before replacing a job with unsaved changes; asks nothing when there are none. */
export function confirmDiscard(action: string): boolean {
  if (!useEditor.getState().dirty) return true;
  return window.confirm(`The job has unsaved changes. ${action} and lose them?`);
}

/** Reads a job's text into the editor, or shows every problem (nothing is replaced then). */
export function openText(text: string, name: string, path: string | null = null): boolean {
  const loaded = parseJob(text);
  if (!loaded.ok) {
    useUi.getState().showProblems(`${name} could not be opened`, loaded.problems.map(formatProblem));
    useEditor.getState().setMessage({ kind: 'error', text: `${name} could not be opened: ${loaded.problems.length} problem(s)` });
    return false;
  }
  useEditor.getState().loadJob(loaded.job, { name, path });
  const notes: string[] = [];
  if (loaded.migratedFrom !== null) notes.push(`migrated from format version ${loaded.migratedFrom}`);
  if (loaded.warnings.length > 0) notes.push(`${loaded.warnings.length} warning(s): ${loaded.warnings.map(formatProblem).slice(0, 3).join('; ')}`);
  useEditor.getState().setMessage({ kind: 'info', text: `Opened ${name}${notes.length ? ` (${notes.join('; ')})` : ''}` });
  return true;
}

const megabytes = (bytes: number): string => `${(bytes / (1024 * 1024)).toFixed(1)} MB`;

/**
 * A file over the size limit is refused from its size, before any of it is read (the loader's
 * limit, engine/model/limits.ts, and the same words); the open job stays as it was.
 */
export function refuseLarge(file: Pick<File, 'name' | 'size'>): boolean {
  if (file.size <= LIMITS.size) return false;
  const line = formatProblem({
    severity: 'error',
    where: 'file',
    field: '',
    message: `the file is ${megabytes(file.size)}, over the limit of ${megabytes(LIMITS.size)} for a job file; nothing was read`,
  });
  useUi.getState().showProblems(`${file.name} could not be opened`, [line]);
  useEditor.getState().setMessage({ kind: 'error', text: `${file.name} could not be opened: it is larger than ${megabytes(LIMITS.size)}, the limit for a job file` });
  return true;
}

/** The file input's change handler. */
export async function openFromInput(input: HTMLInputElement): Promise<void> {
  const file = input.files?.[0];
  input.value = '';
  if (!file) return;
  if (refuseLarge(file)) return;
  if (!confirmDiscard(`Open ${file.name}`)) return;
  openText(await file.text(), file.name);
}

export async function openJob(): Promise<void> {
  const api = window.loopwright;
  if (api) {
    // The main process opens the file in a window of its own when this one has changes or a
    // file (app/shared/ipc.ts), so nothing here is replaced without asking.
    const opened = await api.openJob();
    if (opened) openText(opened.text, opened.name, opened.path);
    return;
  }
  document.querySelector<HTMLInputElement>('input[data-open-job]')?.click();
}

function suggestedName(): string {
  const s = useEditor.getState();
  if (s.fileName) return s.fileName.endsWith('.lwj') ? s.fileName : `${s.fileName}.lwj`;
  const title = s.job.job.title.trim().replace(/[^\w\- ]+/g, '').slice(0, 60).trim();
  return `${title || 'job'}.lwj`;
}

interface WritableHandle {
  name: string;
  createWritable(): Promise<{ write(data: string): Promise<void>; close(): Promise<void> }>;
}
type SavePicker = (o: { suggestedName: string; types: Array<{ description: string; accept: Record<string, string[]> }> }) => Promise<WritableHandle>;

let handle: WritableHandle | null = null;
useEditor.subscribe((s, prev) => {
  if (s.fileName !== prev.fileName && s.fileName !== handle?.name) handle = null;
});

export async function saveJob(saveAs: boolean): Promise<void> {
  const s = useEditor.getState();
  const text = serialiseJob(s.job);
  const api = window.loopwright;
  try {
    if (api) {
      const saved = await api.saveJob(text, s.filePath, saveAs);
      if (saved) finish(s.job, saved.name, saved.path);
      return;
    }
    const picker = savePicker();
    if (picker) {
      if (saveAs || !handle) {
        handle = await picker({ suggestedName: suggestedName(), types: [{ description: 'Loopwright job', accept: { 'application/json': ['.lwj'] } }] });
      }
      const w = await handle.createWritable();
      await w.write(text);
      await w.close();
      finish(s.job, handle.name, null);
      rememberSaved(text, handle.name);
      return;
    }
    const name = suggestedName();
    download(text, name);
    finish(s.job, name, null);
    rememberSaved(text, name);
  } catch (e) {
    if (e instanceof DOMException && e.name === 'AbortError') return; // the user cancelled the picker
    useEditor.getState().setMessage({ kind: 'error', text: `Could not save: ${e instanceof Error ? e.message : String(e)}` });
  }
}

function finish(job: unknown, name: string, path: string | null) {
  const s = useEditor.getState();
  // Only what was written counts as saved (an edit made while saving stays unsaved).
  if (s.job === job) s.markSaved({ name, path });
  else useEditor.setState({ fileName: name, filePath: path });
  s.setMessage({ kind: 'info', text: `Saved ${name}` });
}

/**
 * The File System Access save picker, when the browser has one a person can answer. A browser
 * driven by automation (navigator.webdriver) gets the download instead: its picker is a native
 * dialog no test driver can see, so Save would wait for ever and nothing would be written.
 */
export function savePicker(): SavePicker | null {
  const picker = (window as unknown as { showSaveFilePicker?: SavePicker }).showSaveFilePicker;
  if (typeof picker !== 'function' || navigator.webdriver) return null;
  return picker.bind(window);
}

export function download(text: string, name: string): void {
  const url = URL.createObjectURL(new Blob([text], { type: 'application/json' }));
  const a = document.createElement('a');
  a.href = url;
  a.download = name;
  document.body.append(a);
  a.click();
  a.remove();
  setTimeout(() => URL.revokeObjectURL(url), 10_000);
}
