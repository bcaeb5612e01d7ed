// The preload: runs sandboxed, before the page, with access to ipcRenderer. It exposes ONE object,
// `window.loopwright` (LoopwrightApi, app/shared/ipc.ts), and nothing else: no ipcRenderer, no
// event objects, no Node. Callbacks get plain values only.

import { contextBridge, ipcRenderer } from 'electron';
import { CHANNELS, type CloseReply, type LoopwrightApi, type MenuDescriptor, type OpenedJob, type PaperChoice } from '../shared/ipc.js';

type Listener<T> = (value: T) => void;

function isOpenedJob(value: unknown): value is OpenedJob {
  if (!value || typeof value !== 'object') return false;
  const v = value as Record<string, unknown>;
  return (v.path === null || typeof v.path === 'string') && typeof v.name === 'string' && typeof v.text === 'string';
}

// Jobs sent before the page has subscribed (the first one arrives as the page loads) are kept.
const jobListeners = new Set<Listener<OpenedJob>>();
const earlyJobs: OpenedJob[] = [];
ipcRenderer.on(CHANNELS.openFile, (_event, job: unknown) => {
  if (!isOpenedJob(job)) return;
  const copy: OpenedJob = { path: job.path, name: job.name, text: job.text };
  if (jobListeners.size === 0) earlyJobs.push(copy);
  else for (const l of jobListeners) l(copy);
});

const commandListeners = new Set<Listener<string>>();
ipcRenderer.on(CHANNELS.command, (_event, id: unknown) => {
  if (typeof id !== 'string') return;
  for (const l of commandListeners) l(id);
});

let closeHandler: (() => CloseReply | Promise<CloseReply>) | null = null;
ipcRenderer.on(CHANNELS.closeRequest, (_event, token: unknown) => {
  if (typeof token !== 'string') return;
  const handler = closeHandler;
  if (!handler) {
    ipcRenderer.send(CHANNELS.closeReply, token, null);
    return;
  }
  Promise.resolve()
    .then(() => handler())
    .then(
      (reply) => {
        const ok = reply && typeof reply.dirty === 'boolean' && typeof reply.text === 'string';
        ipcRenderer.send(CHANNELS.closeReply, token, ok ? { dirty: reply.dirty, text: reply.text } : null);
      },
      () => ipcRenderer.send(CHANNELS.closeReply, token, null),
    );
});

const api: LoopwrightApi = {
  platform: process.platform,
  openJob: () => ipcRenderer.invoke(CHANNELS.openJob) as Promise<OpenedJob | null>,
  saveJob: (text: string, path: string | null, saveAs: boolean) =>
    ipcRenderer.invoke(CHANNELS.saveJob, text, path, saveAs) as ReturnType<LoopwrightApi['saveJob']>,
  exportPdf: (text: string, paper?: PaperChoice) =>
    ipcRenderer.invoke(CHANNELS.exportPdf, text, ...(paper ? [paper] : [])) as ReturnType<LoopwrightApi['exportPdf']>,
  print: (text: string, paper?: PaperChoice) => ipcRenderer.invoke(CHANNELS.print, text, ...(paper ? [paper] : [])) as Promise<boolean>,
  printTestSheets: (text: string, paper?: PaperChoice) =>
    ipcRenderer.invoke(CHANNELS.printTestSheets, text, ...(paper ? [paper] : [])) as Promise<boolean>,
  setMenu: (items: MenuDescriptor[]) => ipcRenderer.send(CHANNELS.setMenu, items),
  setDirty: (dirty: boolean, title: string) => ipcRenderer.send(CHANNELS.setDirty, dirty, title),
  onCommand(listener) {
    commandListeners.add(listener);
    return () => {
      commandListeners.delete(listener);
    };
  },
  onOpenFile(listener) {
    jobListeners.add(listener);
    for (const job of earlyJobs.splice(0)) listener(job);
    return () => {
      jobListeners.delete(listener);
    };
  },
  onCloseRequest(handler) {
    closeHandler = handler;
    return () => {
      if (closeHandler === handler) closeHandler = null;
    };
  },
};

contextBridge.exposeInMainWorld('loopwright', api);
