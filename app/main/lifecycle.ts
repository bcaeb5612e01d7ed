// Start-up, files handed to the app, and closing.
// - A file on the command line, from the file association (macOS `open-file`) or from a second
//   launch (`second-instance`, one app process at a time) opens in a window of its own, or in a
//   window that has no unsaved changes and no file.
// - With no file, the shipped demo opens, untitled (so it is never written over).
// - Closing a window with unsaved changes asks: Save, Don't Save or Cancel. The renderer is asked
//   for its dirty state and the job text at that moment, so the answer is never stale.

import { app, dialog } from 'electron';
import { randomUUID } from 'node:crypto';
import path from 'node:path';
import { CHANNELS, type CloseReply } from '../shared/ipc.js';
import type { AppContext } from './context.js';
import { openDemo, openFromOutside, saveForWindow } from './files.js';
import { listen, must } from './ipc.js';
import { checkCloseReplyArgs, checkDirtyArgs } from './ipc-validate.js';
import { allJobWindows, createJobWindow, onWindowCreated, setWindowTitle, type JobWindow } from './window.js';

/** Job files among a process's arguments: anything ending in .lwj that is not a switch,
 *  resolved against the directory the launch came from. */
export function jobFilesFromArgv(argv: readonly string[], cwd: string): string[] {
  return argv
    .slice(1)
    .filter((a) => !a.startsWith('-') && /\.lwj$/i.test(a))
    .map((a) => path.resolve(cwd, a));
}

export type CloseChoice = 'save' | 'discard' | 'cancel';

/** The buttons of the close prompt, in order, and what each means. */
export function closePromptButtons(canSave: boolean): Array<{ label: string; choice: CloseChoice }> {
  return canSave
    ? [{ label: 'Save', choice: 'save' }, { label: "Don't Save", choice: 'discard' }, { label: 'Cancel', choice: 'cancel' }]
    : [{ label: 'Close Without Saving', choice: 'discard' }, { label: 'Cancel', choice: 'cancel' }];
}

const CLOSE_REPLY_WAIT_MS = 3000;
const pendingReplies = new Map<string, { jw: JobWindow; resolve: (reply: CloseReply | null) => void }>();
const asking = new WeakSet<JobWindow>();
let quitting = false;

/** Asks the window's renderer for its dirty state and text; null when it does not answer. */
function askRenderer(jw: JobWindow): Promise<CloseReply | null> {
  if (jw.win.webContents.isCrashed()) return Promise.resolve(null);
  return new Promise((resolve) => {
    const token = randomUUID();
    const timer = setTimeout(() => finish(null), CLOSE_REPLY_WAIT_MS);
    function finish(reply: CloseReply | null): void {
      clearTimeout(timer);
      pendingReplies.delete(token);
      resolve(reply);
    }
    pendingReplies.set(token, { jw, resolve: finish });
    jw.win.webContents.send(CHANNELS.closeRequest, token);
  });
}

async function confirmClose(jw: JobWindow): Promise<void> {
  if (asking.has(jw)) return;
  asking.add(jw);
  try {
    const reply = await askRenderer(jw);
    const dirty = reply ? reply.dirty : jw.dirty;
    if (dirty) {
      const buttons = closePromptButtons(reply !== null);
      const name = jw.path ? path.basename(jw.path) : 'this job';
      const answer = await dialog.showMessageBox(jw.win, {
        type: 'warning',
        title: 'Unsaved changes',
        message: `Save the changes to ${name} before closing?`,
        detail: reply ? 'Your changes will be lost if you do not save them.' : 'The window is not responding, so its changes cannot be saved.',
        buttons: buttons.map((b) => b.label),
        defaultId: 0,
        cancelId: buttons.length - 1,
        noLink: true,
      });
      const choice = buttons[answer.response]?.choice ?? 'cancel';
      if (choice === 'cancel') {
        quitting = false;
        return;
      }
      if (choice === 'save' && reply) {
        const saved = await saveForWindow(jw, reply.text, false);
        if (!saved) {
          quitting = false;
          return;
        }
      }
    }
    jw.closing = true;
    if (!jw.win.isDestroyed()) jw.win.close();
    if (quitting) setImmediate(() => app.quit());
  } finally {
    asking.delete(jw);
  }
}

/** Once, before the app is ready (so no `open-file` is missed). Returns `start`, to call once the
 *  app is ready: it opens the files the app was given, or the demo. */
export function setupLifecycle(ctx: AppContext): { start(): Promise<void> } {
  const early: string[] = [];
  let started = false;
  app.on('open-file', (event, file) => {
    event.preventDefault();
    if (started) void openFromOutside(file);
    else early.push(file);
  });
  app.on('second-instance', (_event, argv, workingDirectory) => {
    const files = jobFilesFromArgv(argv, workingDirectory);
    if (files.length > 0) for (const f of files) void openFromOutside(f);
    else allJobWindows()[0]?.win.focus();
  });
  app.on('before-quit', () => {
    quitting = true;
  });
  app.on('window-all-closed', () => {
    if (ctx.platform !== 'darwin') app.quit();
  });
  app.on('activate', () => {
    if (allJobWindows().length === 0) createJobWindow(null);
  });

  onWindowCreated((jw) => {
    jw.win.on('close', (event) => {
      if (jw.closing) return;
      event.preventDefault();
      void confirmClose(jw);
    });
  });

  listen(CHANNELS.setDirty, (jw, args) => {
    const { dirty, title } = must(checkDirtyArgs(args));
    jw.dirty = dirty;
    setWindowTitle(jw, title);
  });
  listen(CHANNELS.closeReply, (jw, args) => {
    const { token, reply } = must(checkCloseReplyArgs(args));
    const pending = pendingReplies.get(token);
    if (pending && pending.jw === jw) pending.resolve(reply);
  });

  const start = async (): Promise<void> => {
    const files = [...jobFilesFromArgv(process.argv, process.cwd()), ...early];
    started = true;
    const demo = path.resolve(ctx.demoPath);
    const wanted = files.filter((f) => path.resolve(f) !== demo);
    if (wanted.length === 0) {
      await openDemo(ctx, null);
      return;
    }
    for (const f of wanted) await openFromOutside(f);
    if (allJobWindows().length === 0) createJobWindow(null);
  };
  return { start };
}
