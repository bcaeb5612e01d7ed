// A stand-in for the parts of Electron the main process uses, for running app/main in Vitest
// without the Electron binary. It records what the app does (windows made, messages sent, menus
// set, dialogs shown) and lets a test answer dialogs and send IPC as a page would.

import { EventEmitter } from 'node:events';
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';

type Handler = (event: unknown, ...args: unknown[]) => unknown;

export interface Sent {
  channel: string;
  args: unknown[];
}

let nextId = 1;

export class FakeWebContents extends EventEmitter {
  readonly id = nextId++;
  readonly sent: Sent[] = [];
  url = '';
  loading = true;
  openHandler: ((details: { url: string }) => unknown) | null = null;
  readonly mainFrame: { url: string; parent: null };
  printed: unknown[] = [];
  constructor() {
    super();
    const self = this;
    this.mainFrame = {
      get url() {
        return self.url;
      },
      parent: null,
    };
  }
  send(channel: string, ...args: unknown[]): void {
    this.sent.push({ channel, args });
  }
  setWindowOpenHandler(fn: (details: { url: string }) => unknown): void {
    this.openHandler = fn;
  }
  isLoading(): boolean {
    return this.loading;
  }
  isCrashed(): boolean {
    return false;
  }
  finishLoad(url: string): void {
    this.url = url;
    this.loading = false;
    this.emit('did-finish-load');
  }
  print(options: unknown, callback: (ok: boolean, reason: string) => void): void {
    this.printed.push(options);
    callback(true, '');
  }
}

export class BrowserWindow extends EventEmitter {
  static all: BrowserWindow[] = [];
  static focused: BrowserWindow | null = null;
  static getAllWindows(): BrowserWindow[] {
    return BrowserWindow.all.filter((w) => !w.destroyed);
  }
  static getFocusedWindow(): BrowserWindow | null {
    return BrowserWindow.focused;
  }
  readonly webContents = new FakeWebContents();
  title = '';
  destroyed = false;
  loaded: string | null = null;
  documentEdited = false;
  constructor(readonly options: Record<string, unknown>) {
    super();
    BrowserWindow.all.push(this);
  }
  async loadFile(file: string): Promise<void> {
    this.loaded = `file://${file}`;
  }
  /** The text of a file:// page when it was loaded (the print page is deleted afterwards). */
  loadedText: string | null = null;
  async loadURL(url: string): Promise<void> {
    this.loaded = url;
    if (url.startsWith('file:')) this.loadedText = readFileSync(fileURLToPath(url), 'utf8');
    this.webContents.finishLoad(url);
  }
  setTitle(t: string): void {
    this.title = t;
  }
  setDocumentEdited(v: boolean): void {
    this.documentEdited = v;
  }
  setRepresentedFilename(): void {}
  isDestroyed(): boolean {
    return this.destroyed;
  }
  isFocused(): boolean {
    return BrowserWindow.focused === this;
  }
  isMaximized(): boolean {
    return false;
  }
  maximize(): void {}
  show(): void {}
  focus(): void {
    BrowserWindow.focused = this;
  }
  getNormalBounds(): { x: number; y: number; width: number; height: number } {
    const o = this.options as { x: number; y: number; width: number; height: number };
    return { x: o.x, y: o.y, width: o.width, height: o.height };
  }
  /** Asks to close, as the user clicking the close box: listeners may prevent it. */
  close(): void {
    let prevented = false;
    this.emit('close', { preventDefault: () => (prevented = true) });
    if (!prevented) this.destroy();
  }
  destroy(): void {
    if (this.destroyed) return;
    this.destroyed = true;
    if (BrowserWindow.focused === this) BrowserWindow.focused = null;
    this.emit('closed');
  }
}

class FakeApp extends EventEmitter {
  userData = '';
  appPath = '';
  documents = '';
  recentDocuments: string[] = [];
  quitCalls = 0;
  private readyResolve: (() => void) | null = null;
  private readonly ready = new Promise<void>((r) => (this.readyResolve = r));
  isPackaged = false;
  setName(): void {}
  enableSandbox(): void {}
  requestSingleInstanceLock(): boolean {
    return true;
  }
  whenReady(): Promise<void> {
    return this.ready;
  }
  makeReady(): void {
    this.readyResolve?.();
  }
  getPath(name: string): string {
    if (name === 'userData') return this.userData;
    if (name === 'documents') return this.documents;
    throw new Error(`getPath(${name}) is not faked`);
  }
  getAppPath(): string {
    return this.appPath;
  }
  getVersion(): string {
    return '0.0.0-test';
  }
  addRecentDocument(file: string): void {
    this.recentDocuments.push(file);
  }
  clearRecentDocuments(): void {
    this.recentDocuments = [];
  }
  quit(): void {
    this.quitCalls++;
  }
  exit(): void {}
}

export const app = new FakeApp();

export const ipcMain = {
  handlers: new Map<string, Handler>(),
  listeners: new Map<string, Handler>(),
  handle(channel: string, fn: Handler): void {
    ipcMain.handlers.set(channel, fn);
  },
  on(channel: string, fn: Handler): void {
    ipcMain.listeners.set(channel, fn);
  },
};

/** Answers the next dialogs in order; each dialog call takes the first answer. */
export const dialog = {
  openAnswers: [] as Array<{ canceled: boolean; filePaths: string[] }>,
  saveAnswers: [] as Array<{ canceled: boolean; filePath?: string }>,
  messageAnswers: [] as number[],
  messages: [] as Array<Record<string, unknown>>,
  async showOpenDialog(): Promise<{ canceled: boolean; filePaths: string[] }> {
    return dialog.openAnswers.shift() ?? { canceled: true, filePaths: [] };
  },
  async showSaveDialog(): Promise<{ canceled: boolean; filePath?: string }> {
    return dialog.saveAnswers.shift() ?? { canceled: true };
  },
  async showMessageBox(...args: unknown[]): Promise<{ response: number }> {
    const options = (args.length > 1 ? args[1] : args[0]) as Record<string, unknown>;
    dialog.messages.push(options);
    return { response: dialog.messageAnswers.shift() ?? 0 };
  },
};

export const Menu = {
  current: null as unknown[] | null,
  buildFromTemplate(template: unknown[]): unknown[] {
    return template;
  },
  setApplicationMenu(menu: unknown[]): void {
    Menu.current = menu;
  },
};

const display = { id: 1, workArea: { x: 0, y: 0, width: 1920, height: 1040 } };
export const screen = {
  getPrimaryDisplay: () => display,
  getAllDisplays: () => [display],
};

export const session = {
  defaultSession: {
    headerHook: null as null | ((details: unknown, cb: (r: unknown) => void) => void),
    permissionHandler: null as null | ((...a: unknown[]) => void),
    webRequest: {
      onHeadersReceived(fn: (details: unknown, cb: (r: unknown) => void) => void): void {
        session.defaultSession.headerHook = fn;
      },
    },
    setPermissionRequestHandler(fn: (...a: unknown[]) => void): void {
      session.defaultSession.permissionHandler = fn;
    },
    setPermissionCheckHandler(): void {},
  },
};

export const contextBridge = {};
export const ipcRenderer = {};

/** An IPC event as Electron gives it for a message from the top frame of `win`'s page. */
export function eventFrom(win: BrowserWindow): unknown {
  return { sender: win.webContents, senderFrame: win.webContents.mainFrame };
}
