// Printing in the browser: the printout's own sheets (engine/report, the same sheets the PDF and
// the desktop print use), drawn as SVG images into a print view, then the browser's print dialog.
import { layoutReport, sheetToSvg } from '../../../engine/report/index.js';
import { useEditor } from '../store/editor.js';

/** Builds the print view; resolves once every sheet image has loaded. Returns a clean-up function. */
export async function buildPrintView(): Promise<() => void> {
  const { job, results } = useEditor.getState();
  const sheets = layoutReport(job, results, { paper: 'A3', orientation: 'landscape' });
  const view = document.createElement('div');
  view.className = 'lw-print-view';
  view.setAttribute('data-print-view', '');
  const urls: string[] = [];
  const loads: Array<Promise<void>> = [];
  for (const sheet of sheets) {
    const url = URL.createObjectURL(new Blob([sheetToSvg(sheet)], { type: 'image/svg+xml' }));
    urls.push(url);
    const img = document.createElement('img');
    img.alt = sheet.title;
    img.className = 'lw-print-sheet';
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

export async function printInBrowser(): Promise<void> {
  const cleanUp = await buildPrintView();
  document.body.classList.add('lw-printing');
  try {
    window.print();
  } finally {
    document.body.classList.remove('lw-printing');
    cleanUp();
  }
}
