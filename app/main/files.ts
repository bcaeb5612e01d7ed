// Open, Save and Save As for .lwj files, the recent-files list, and the IPC handlers for them.
// The rules themselves (parse before accepting, never write over a file that failed to load,
// atomic save) live in job-files.ts; this module is the Electron side: dialogs and windows.

import { app, BrowserWindow, dialog } from 'electron';
import path from 'node:path';
import { CHANNELS, type OpenedJob, type SavedJob } from '../shared/ipc.js';
import type { AppContext } from './context.js';
import { handle, must } from './ipc.js';
import { checkNoArgs, checkSaveArgs } from './ipc-validate.js';
import { problemLines, readJobFile, RefusedFiles, saveJobText } from './job-files.js';
import { RecentFiles } from './recent.js';
import { allJobWindows, createJobWindow, jobWindowForPath, sendJob, setWindowTitle, type JobWindow } from './window.js';

const JOB_FILTERS = [{ name: 'Loopwright job', extensions: ['lwj'] }];

export const refusedFiles = new RefusedFiles();
let recent: RecentFiles | null = null;
const recentListeners: Array<() => void> = [];

export function recentFiles(): readonly string[] {
  return recent?.files ?? [];
}

export function onRecentChanged(listener: () => void): void {
  recentListeners.push(listener);
}

async function noteRecent(file: string): Promise<void> {
  app.addRecentDocument(file);
  await recent?.add(file).catch(() => undefined);
  for (const l of recentListeners) l();
}

export async function clearRecent(): Promise<void> {
  app.clearRecentDocuments();
  await recent?.clear().catch(() => undefined);
  for (const l of recentListeners) l();
}

/** A window that can take a newly opened job: no unsaved changes and no file of its own. */
export function isReusable(jw: JobWindow): boolean {
  return !jw.win.isDestroyed() && !jw.closing && !jw.dirty && jw.path === null;
}

function opened(file: string, text: string): OpenedJob {
  return { path: file, name: path.basename(file), text };
}

async function showRefusal(parent: BrowserWindow | null, message: string, detail: string): Promise<void> {
  const options = { type: 'error' as const, title: 'Loopwright', message, detail, buttons: ['OK'], noLink: true };
  if (parent && !parent.isDestroyed()) await dialog.showMessageBox(parent, options);
  else await dialog.showMessageBox(options);
}

/** Reads `file` and shows it: in the window that already has it, in `into` when that window can
 *  take it (then the job is returned, for an invoke's answer), else in a new window. A file that
 *  fails to load is refused with its problems in a message box. */
export async function openJobFile(file: string, into: JobWindow | null, answer: boolean): Promise<OpenedJob | null> {
  const full = path.resolve(file);
  const existing = jobWindowForPath(full);
  if (existing) {
    existing.win.show();
    existing.win.focus();
    return null;
  }
  const result = await readJobFile(full, refusedFiles);
  if (!result.ok) {
    const detail = result.problems.length > 0 ? problemLines(result.problems) : '';
    await showRefusal(into?.win ?? BrowserWindow.getFocusedWindow(), result.message, detail);
    if (result.problems.length === 0) await recent?.remove(full).catch(() => undefined);
    return null;
  }
  const job = opened(full, result.text);
  void noteRecent(full);
  if (into && isReusable(into)) {
    if (answer) {
      into.path = full;
      into.dirty = false;
      setWindowTitle(into, job.name);
      return job;
    }
    sendJob(into, job);
    return null;
  }
  createJobWindow(job);
  return null;
}

/** A job pushed from outside a window (command line, file association, Open Recent): goes into
 *  the focused window when it can take it, else into any window that can, else a new one. */
export async function openFromOutside(file: string): Promise<void> {
  const focused = allJobWindows().find((jw) => jw.win.isFocused() && isReusable(jw));
  const target = focused ?? allJobWindows().find(isReusable) ?? null;
  await openJobFile(file, target, false);
}

/** The shipped demo opens untitled, so Save asks for a new place and the demo is never changed. */
export async function openDemo(ctx: AppContext, into: JobWindow | null): Promise<void> {
  const result = await readJobFile(ctx.demoPath, new RefusedFiles());
  if (!result.ok) {
    await showRefusal(null, `The demo job could not be opened: ${result.message}`, problemLines(result.problems));
    if (!into) createJobWindow(null);
    return;
  }
  const job: OpenedJob = { path: null, name: 'Demo (untitled)', text: result.text };
  if (into) {
    sendJob(into, job);
    into.path = null;
  } else createJobWindow(job);
}

async function askSavePath(jw: JobWindow): Promise<string | null> {
  const choice = await dialog.showSaveDialog(jw.win, {
    title: 'Save job',
    defaultPath: jw.path ?? path.join(app.getPath('documents'), 'Untitled.lwj'),
    filters: JOB_FILTERS,
    properties: ['createDirectory', 'showOverwriteConfirmation'],
  });
  if (choice.canceled || !choice.filePath) return null;
  return /\.lwj$/i.test(choice.filePath) ? choice.filePath : `${choice.filePath}.lwj`;
}

/** Saves `text` for window `jw`: to its file, or (Save As, or untitled) where the user chooses.
 *  Null when cancelled or refused; the reason has been shown. */
export async function saveForWindow(jw: JobWindow, text: string, saveAs: boolean): Promise<SavedJob | null> {
  const target = !saveAs && jw.path ? jw.path : await askSavePath(jw);
  if (!target) return null;
  const other = jobWindowForPath(target);
  if (other && other !== jw) {
    await showRefusal(jw.win, `${path.basename(target)} is open in another window.`, 'Close that window first, or choose another name.');
    return null;
  }
  const saved = await saveJobText(target, text, refusedFiles);
  if (!saved.ok) {
    await showRefusal(jw.win, 'The job was not saved.', saved.message);
    return null;
  }
  jw.path = target;
  jw.dirty = false;
  const name = path.basename(target);
  setWindowTitle(jw, name);
  void noteRecent(target);
  return { path: target, name };
}

export async function setupFiles(ctx: AppContext): Promise<void> {
  recent = new RecentFiles(ctx.userData);
  await recent.load();

  handle(CHANNELS.openJob, async (jw, args) => {
    must(checkNoArgs(args, 'openJob'));
    const choice = await dialog.showOpenDialog(jw.win, {
      title: 'Open job',
      filters: JOB_FILTERS,
      properties: ['openFile'],
    });
    const file = choice.canceled ? undefined : choice.filePaths[0];
    if (!file) return null;
    return openJobFile(file, jw, true);
  });

  handle(CHANNELS.saveJob, async (jw, args) => {
    const { text, path: named, saveAs } = must(checkSaveArgs(args, jw.path));
    // No path: the page's job is untitled (e.g. after New Job in this window), so the window no
    // longer stands for its old file and Save asks for a name.
    if (named === null) jw.path = null;
    return saveForWindow(jw, text, saveAs);
  });
}
