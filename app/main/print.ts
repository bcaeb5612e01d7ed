// File > Export PDF, File > Print and File > Print Test Sheets. All start from the renderer's job
// text, checked again with parseJob here (the main process trusts nothing it is sent), and use the
// one printout layout: Export PDF writes jobToPdf's bytes (app/report/pdf.ts); Print lays the same
// sheets out with layoutReport, turns each into SVG with sheetToSvg and prints them from a hidden
// window; Print Test Sheets does the same with the test sheets alone (layoutReport's
// `testSheet: 'only'`, the sheets `report --test-sheet` writes), a document to take to site.

import { app, BrowserWindow, dialog } from 'electron';
import { promises as fs } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { pathToFileURL } from 'node:url';
import { analyse, layoutReport, parseJob, plainText, sheetToSvg, type Job, type ReportOptions } from '../../engine/index.js';
import { jobToPdf } from '../report/pdf.js';
import { loadReportFonts, type ReportFonts } from '../report/fonts.js';
import { CSP } from '../shared/csp.js';
import { CHANNELS, type PaperChoice, type SavedJob } from '../shared/ipc.js';
import type { AppContext } from './context.js';
import { handle, must } from './ipc.js';
import { checkPrintArgs } from './ipc-validate.js';
import { problemLines, reason } from './job-files.js';
import { writeFileSafely } from './safe-files.js';
import { FONT_FILES, PRINT_CSS_FILE, printCss, printHtml, printPageSize } from './print-page.js';
import { webPreferencesFor, type JobWindow } from './window.js';

let fontsDir: string | null = null;
let fonts: ReportFonts | null = null;

/** The printout fonts: copied into dist/fonts by the build (they ship with the app), else the
 *  dejavu-fonts-ttf package (running from the repository). */
async function reportFonts(): Promise<ReportFonts> {
  if (fonts) return fonts;
  if (fontsDir) {
    try {
      const [regular, bold] = await Promise.all([fs.readFile(path.join(fontsDir, FONT_FILES.regular)), fs.readFile(path.join(fontsDir, FONT_FILES.bold))]);
      fonts = { regular: new Uint8Array(regular), bold: new Uint8Array(bold) };
      return fonts;
    } catch {
      // fall through to the package
    }
  }
  fonts = loadReportFonts();
  return fonts;
}

/** What a print holds: the whole printout, or the test sheets alone. */
export type PrintPart = 'printout' | 'test-sheets';

export function reportOptions(paper: PaperChoice | undefined, part: PrintPart = 'printout'): ReportOptions {
  return {
    ...(paper ? { paper: paper.size, orientation: paper.orientation } : {}),
    ...(part === 'test-sheets' ? { testSheet: 'only' as const } : {}),
  };
}

async function refuse(jw: JobWindow, message: string, detail = ''): Promise<void> {
  await dialog.showMessageBox(jw.win, { type: 'error', title: 'Loopwright', message, detail, buttons: ['OK'], noLink: true });
}

/** The job in `text`, or null after telling the user what is wrong with it. */
async function jobFrom(jw: JobWindow, text: string, what: string): Promise<Job | null> {
  const loaded = parseJob(text);
  if (loaded.ok) return loaded.job;
  await refuse(jw, `The job has problems, so it cannot be ${what}.`, problemLines(loaded.problems));
  return null;
}

function pdfName(jw: JobWindow, job: Job): string {
  const base = jw.path ? path.basename(jw.path).replace(/\.lwj$/i, '') : plainText(job.job.title).trim() || 'Loopwright job';
  return `${base.replace(/[\\/:*?"<>|]+/g, '-').slice(0, 120)}.pdf`;
}

async function exportPdf(jw: JobWindow, text: string, paper: PaperChoice | undefined): Promise<SavedJob | null> {
  const job = await jobFrom(jw, text, 'exported');
  if (!job) return null;
  const folder = jw.path ? path.dirname(jw.path) : app.getPath('documents');
  const choice = await dialog.showSaveDialog(jw.win, {
    title: 'Export PDF',
    defaultPath: path.join(folder, pdfName(jw, job)),
    filters: [{ name: 'PDF', extensions: ['pdf'] }],
    properties: ['createDirectory', 'showOverwriteConfirmation'],
  });
  if (choice.canceled || !choice.filePath) return null;
  const target = /\.pdf$/i.test(choice.filePath) ? choice.filePath : `${choice.filePath}.pdf`;
  try {
    const bytes = await jobToPdf(job, { ...reportOptions(paper), fonts: await reportFonts() });
    await writeFileSafely(target, bytes, { backup: true });
  } catch (error) {
    await refuse(jw, 'The PDF was not written.', `${target}: ${reason(error)}`);
    return null;
  }
  return { path: target, name: path.basename(target) };
}

async function print(jw: JobWindow, text: string, paper: PaperChoice | undefined, part: PrintPart): Promise<boolean> {
  const job = await jobFrom(jw, text, 'printed');
  if (!job) return false;
  const sheets = layoutReport(job, analyse(job), reportOptions(paper, part));
  const first = sheets[0];
  if (!first) {
    // A job with no circuit has nothing to test: say so rather than print nothing.
    if (part === 'test-sheets') await refuse(jw, 'There are no test sheets to print.', 'The job has no circuit yet: add a link from the supply or a board first.');
    return false;
  }
  const title = job.job.title || 'Loopwright job';
  const dir = await fs.mkdtemp(path.join(os.tmpdir(), 'loopwright-print-'));
  const win = new BrowserWindow({
    show: false,
    parent: jw.win,
    webPreferences: { ...webPreferencesFor(''), preload: undefined, javascript: false },
  });
  try {
    const f = await reportFonts();
    const html = printHtml(
      sheets.map((s) => ({ svg: sheetToSvg(s), widthMm: s.widthMm, heightMm: s.heightMm, title: s.title })),
      part === 'test-sheets' ? `Test sheets: ${title}` : title,
      CSP,
    );
    await Promise.all([
      fs.writeFile(path.join(dir, 'index.html'), html),
      fs.writeFile(path.join(dir, PRINT_CSS_FILE), printCss(first.widthMm, first.heightMm)),
      fs.writeFile(path.join(dir, FONT_FILES.regular), f.regular),
      fs.writeFile(path.join(dir, FONT_FILES.bold), f.bold),
    ]);
    await win.loadURL(pathToFileURL(path.join(dir, 'index.html')).href);
    const size = printPageSize(first.widthMm, first.heightMm);
    return await new Promise<boolean>((resolve) => {
      win.webContents.print(
        { silent: false, printBackground: true, margins: { marginType: 'none' }, pageSize: size.pageSize, landscape: size.landscape },
        (success, failure) => {
          if (!success && failure && failure !== 'Print job canceled' && failure !== 'cancelled') {
            void refuse(jw, 'The printout was not printed.', failure);
          }
          resolve(success);
        },
      );
    });
  } catch (error) {
    await refuse(jw, 'The printout could not be prepared.', reason(error));
    return false;
  } finally {
    if (!win.isDestroyed()) win.destroy();
    await fs.rm(dir, { recursive: true, force: true }).catch(() => undefined);
  }
}

export function setupPrint(ctx: AppContext): void {
  fontsDir = path.join(ctx.appDir, 'dist', 'fonts');
  handle(CHANNELS.exportPdf, async (jw, args) => {
    const { text, paper } = must(checkPrintArgs(args, 'exportPdf'));
    return exportPdf(jw, text, paper);
  });
  handle(CHANNELS.print, async (jw, args) => {
    const { text, paper } = must(checkPrintArgs(args, 'print'));
    return print(jw, text, paper, 'printout');
  });
  handle(CHANNELS.printTestSheets, async (jw, args) => {
    const { text, paper } = must(checkPrintArgs(args, 'printTestSheets'));
    return print(jw, text, paper, 'test-sheets');
  });
}
