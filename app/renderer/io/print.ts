// Printing in the browser: the printout's own sheets (engine/report, the same sheets the PDF and
// the desktop print use), drawn as SVG images into a print view, then the browser's print dialog.
// "Print Test Sheets" prints the test sheets alone (layoutReport's `testSheet: 'only'`, the sheets
// `report --test-sheet` writes): in the desktop app through the main process, here through the
// same print view.
import { layoutReport, serialiseJob, sheetToSvg, type Sheet } from '../../../engine/index.js';
import { useEditor } from '../store/editor.js';

/** What a print holds: the whole printout, or the test sheets alone. */
export type PrintPart = 'printout' | 'test-sheets';

/** The sheets a print of `part` holds for the editor's job, on the browser's paper (A3 landscape). */
export function printSheets(part: PrintPart = 'printout'): Sheet[] {
  const { job, results } = useEditor.getState();
  return layoutReport(job, results, { paper: 'A3', orientation: 'landscape', ...(part === 'test-sheets' ? { testSheet: 'only' as const } : {}) });
}

/** Builds the print view; resolves once every sheet image has loaded. Returns a clean-up function. */
export async function buildPrintView(part: PrintPart = 'printout'): Promise<() => void> {
  const sheets = printSheets(part);
  const view = document.createElement('div');
  view.className = 'lw-print-view';
  view.setAttribute('data-print-view', part);
  const urls: string[] = [];
  const loads: Array<Promise<void>> = [];
  for (const sheet of sheets) {
    const url = URL.createObjectURL(new Blob([sheetToSvg(sheet)], { type: 'image/svg+xml' }));
    urls.push(url);
    const img = document.createElement('img');
    img.alt = sheet.title;
    img.className = 'lw-print-sheet';
    img.setAttribute('data-sheet-kind', sheet.kind);
    loads.push(new Promise((ok) => {
      img.onload = () => ok();
      img.onerror = () => ok();
    }));
    img.src = url;
    view.append(img);
  }
  document.body.append(view);
  await Promise.all(loads);
  return () => {
    view.remove();
    for (const u of urls) URL.revokeObjectURL(u);
  };
}

export async function printInBrowser(part: PrintPart = 'printout'): Promise<void> {
  const cleanUp = await buildPrintView(part);
  document.body.classList.add('lw-printing');
  try {
    window.print();
  } finally {
    document.body.classList.remove('lw-printing');
    cleanUp();
  }
}

/** File > Print Test Sheets: the desktop app prints them from the main process (which checks the
 *  job again), the browser from a print view. A job with no circuit has none: said in the status bar. */
export async function printTestSheets(): Promise<void> {
  const s = useEditor.getState();
  if (s.results.circuits.length === 0) {
    s.setMessage({ kind: 'info', text: 'No test sheets to print: the job has no circuit yet' });
    return;
  }
  const api = typeof window === 'undefined' ? undefined : window.loopwright;
  if (api) {
    await api.printTestSheets(serialiseJob(s.job));
    return;
  }
  await printInBrowser('test-sheets');
}
