// Registering IPC handlers: every message is checked against its sender before the handler sees
// it. A handler then validates its own arguments (ipc-validate.ts) and throws on anything else,
// which rejects the renderer's promise with the reason.

import { ipcMain, type IpcMainEvent, type IpcMainInvokeEvent } from 'electron';
import type { Channel } from '../shared/ipc.js';
import { checkSender } from './ipc-validate.js';
import { context, jobWindowOf, type JobWindow } from './window.js';

type AnyEvent = IpcMainEvent | IpcMainInvokeEvent;

/** The job window that sent `event`, or an error when the sender is not one of ours. */
export function senderWindow(event: AnyEvent): JobWindow {
  const jw = jobWindowOf(event.sender);
  const frame = event.senderFrame;
  const verdict = checkSender(
    frame ? { url: frame.url, isTopLevel: frame.parent === null } : null,
    jw !== null && !jw.win.isDestroyed(),
    context().own,
  );
  if (!verdict.ok || !jw) throw new Error(verdict.ok ? 'IPC refused: unknown window' : verdict.error);
  return jw;
}

/** An invoke channel: `fn` gets the sending window and the raw arguments. */
export function handle<T>(channel: Channel, fn: (jw: JobWindow, args: unknown[]) => Promise<T> | T): void {
  ipcMain.handle(channel, async (event, ...args: unknown[]) => fn(senderWindow(event), args));
}

/** A one-way channel. A refused message is dropped (and logged): there is no one to answer. */
export function listen(channel: Channel, fn: (jw: JobWindow, args: unknown[]) => void): void {
  ipcMain.on(channel, (event, ...args: unknown[]) => {
    try {
      fn(senderWindow(event), args);
    } catch (error) {
      console.warn(`[loopwright] ${channel}: ${error instanceof Error ? error.message : String(error)}`);
    }
  });
}

/** Unwraps a validator's answer or throws its message. */
export function must<T>(checked: { ok: true; value: T } | { ok: false; error: string }): T {
  if (!checked.ok) throw new Error(checked.error);
  return checked.value;
}
