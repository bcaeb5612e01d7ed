// Importing readings taken on site from a CSV file (format: readings-csv.ts). The file is
// chosen with a file input, in the browser and the desktop app alike; a good file is recorded
// as one undoable edit, a bad one is refused whole with every problem listed.
import { useEditor } from '../store/editor.js';
import { useUi } from '../app/ui.js';
import { parseReadingsCsv, readingsEdit } from './readings-csv.js';
import { useTestingView } from '../panels/testing/view.js';

/** A readings file larger than this is refused before it is read (a sheet of readings is small). */
export const MAX_READINGS_BYTES = 5 * 1024 * 1024;

function plural(n: number, word: string): string {
  return `${n} ${word}${n === 1 ? '' : 's'}`;
}

/**
 * Reads a readings file's text into the job: all of it as one edit, or nothing. Returns the
 * number of readings imported (0 when the file was refused).
 */
export function importReadingsText(text: string, name: string): number {
  const s = useEditor.getState();
  const parsed = parseReadingsCsv(text, s.job);
  if (!parsed.ok) {
    useUi.getState().showProblems(`${name}: no readings imported (nothing was changed)`, parsed.problems);
    s.setMessage({ kind: 'error', text: `${name} was not imported: ${plural(parsed.problems.length, 'problem')}; nothing was changed` });
    return 0;
  }
  const n = parsed.rows.length;
  const outcome = s.apply(readingsEdit(parsed.rows), `import ${plural(n, 'reading')}`);
  if (!outcome.ok) {
    useEditor.getState().setMessage({ kind: 'error', text: `${name} was not imported (nothing was changed): ${outcome.reason}` });
    return 0;
  }
  const ignored = parsed.ignored.length > 0 ? `; columns not used: ${parsed.ignored.join(', ')}` : '';
  useEditor.getState().setMessage({
    kind: 'info',
    text: `Imported ${plural(n, 'reading')} from ${name} (one step: Undo takes them all back)${ignored}`,
  });
  return n;
}

/** Reads the chosen file of a file input (then clears the input, so the same file can be chosen again). */
export async function importReadingsFromInput(input: HTMLInputElement): Promise<void> {
  const file = input.files?.[0];
  input.value = '';
  if (!file) return;
  if (file.size > MAX_READINGS_BYTES) {
    useEditor.getState().setMessage({
      kind: 'error',
      text: `${file.name} was not imported: it is ${(file.size / 1024 / 1024).toFixed(1)} MB, more than a readings file can be (${MAX_READINGS_BYTES / 1024 / 1024} MB)`,
    });
    return;
  }
  importReadingsText(await file.text(), file.name);
}

/** The hidden file input the import command opens (made once, kept in the document). */
function readingsInput(): HTMLInputElement {
  const found = document.querySelector<HTMLInputElement>('input[data-import-readings]');
  if (found) return found;
  const input = document.createElement('input');
  input.type = 'file';
  input.accept = '.csv,text/csv,text/plain';
  input.hidden = true;
  input.setAttribute('data-import-readings', '');
  input.setAttribute('aria-label', 'Import readings from a CSV file');
  input.addEventListener('change', () => void importReadingsFromInput(input));
  document.body.append(input);
  return input;
}

/**
 * Opens the file chooser for a readings file. A browser opens it only from a click or a key
 * (user activation): a command that arrives without one (the desktop app's native menu) says
 * where to click instead of silently doing nothing.
 */
export function importReadings(): void {
  const activation = (navigator as Navigator & { userActivation?: { isActive: boolean } }).userActivation;
  if (activation && !activation.isActive) {
    useTestingView.getState().setView('testing');
    useEditor.getState().setMessage({
      kind: 'info',
      text: 'To choose a readings file, click Import readings (on the toolbar or in the testing view): the file chooser opens from a click',
    });
    return;
  }
  readingsInput().click();
}
