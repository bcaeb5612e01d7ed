// One BrowserWindow per job, locked down: context isolation, the sandbox, no Node in the page,
// web security on, navigation and new windows refused, a strict Content-Security-Policy, and no
// permissions (camera, notifications, ...) granted to the page.

import { BrowserWindow, screen, session, type BrowserWindowConstructorOptions, type WebContents } from 'electron';
import { CSP, devCsp } from '../shared/csp.js';
import { CHANNELS, type OpenedJob } from '../shared/ipc.js';
import type { AppContext } from './context.js';
import { isOwnPageUrl, type OwnOrigins } from './ipc-validate.js';
import { cascade, clampBounds, loadWindowState, MIN_SIZE, saveWindowState, type Rect, type WindowState } from './window-state.js';

/** The job shown in a window, as the main process knows it. */
export interface JobWindow {
  win: BrowserWindow;
  /** The file this window opened or last saved to; null while untitled (new job, the demo). */
  path: string | null;
  /** Unsaved changes, as the page last said (setDirty). A window with none and no file of its own
   *  takes the next job opened instead of a new window being made (files.ts isReusable). */
  dirty: boolean;
  /** Set once the user has agreed to close, so the close handler lets it through. */
  closing: boolean;
}

/** The security settings of every window, as a pure function so the tests can read them. */
export function webPreferencesFor(preloadPath: string): NonNullable<BrowserWindowConstructorOptions['webPreferences']> {
  return {
    preload: preloadPath,
    contextIsolation: true,
    sandbox: true,
    nodeIntegration: false,
    nodeIntegrationInWorker: false,
    nodeIntegrationInSubFrames: false,
    webSecurity: true,
    allowRunningInsecureContent: false,
    webviewTag: false,
    experimentalFeatures: false,
    navigateOnDragDrop: false,
    spellcheck: false,
    safeDialogs: true,
  };
}

export function windowOptions(preloadPath: string, bounds: Rect, platform: NodeJS.Platform): BrowserWindowConstructorOptions {
  return {
    ...bounds,
    minWidth: MIN_SIZE.width,
    minHeight: MIN_SIZE.height,
    show: false,
    title: 'Loopwright',
    backgroundColor: '#ffffff',
    autoHideMenuBar: false,
    ...(platform === 'darwin' ? { tabbingIdentifier: 'loopwright-job' } : {}),
    webPreferences: webPreferencesFor(preloadPath),
  };
}

/** `will-navigate` and `will-redirect`: only our own page may be (re)loaded. */
export function navigationAllowed(url: string, own: OwnOrigins): boolean {
  return isOwnPageUrl(url, own);
}

/** `setWindowOpenHandler`: no page ever opens a window. */
export function windowOpenDecision(): { action: 'deny' } {
  return { action: 'deny' };
}

/** The CSP header for a response from `url`: the strict policy for our pages, the dev policy for
 *  the dev server; other responses are left alone (none should be loaded). */
export function cspFor(url: string, own: OwnOrigins): string | null {
  if (url.startsWith('file:')) return CSP;
  if (own.devOrigin && url.startsWith(own.devOrigin)) return devCsp(own.devOrigin);
  return null;
}

/** The guards on one window's web contents (exported for the tests, which pass a fake). */
export function guardContents(contents: Pick<WebContents, 'on' | 'setWindowOpenHandler'>, own: OwnOrigins): void {
  const refuse = (event: { preventDefault(): void }, url: string): void => {
    if (!navigationAllowed(url, own)) event.preventDefault();
  };
  contents.on('will-navigate', (event, url) => refuse(event, url));
  contents.on('will-redirect', (event, url) => refuse(event, url));
  contents.on('will-frame-navigate', (event) => {
    if (!event.isMainFrame) event.preventDefault();
  });
  contents.on('will-attach-webview', (event) => event.preventDefault());
  contents.setWindowOpenHandler(() => windowOpenDecision());
}

const jobWindows = new Map<number, JobWindow>();
const createdHooks: Array<(jw: JobWindow) => void> = [];
let ctx: AppContext | null = null;
let savedState: WindowState | null = null;

export function context(): AppContext {
  if (!ctx) throw new Error('setupWindows() has not run');
  return ctx;
}

export function allJobWindows(): JobWindow[] {
  return [...jobWindows.values()];
}

/** The job window whose page is `contents`, or null for anything else. */
export function jobWindowOf(contents: WebContents | null | undefined): JobWindow | null {
  if (!contents) return null;
  return jobWindows.get(contents.id) ?? null;
}

export function jobWindowForPath(file: string): JobWindow | null {
  const key = (p: string): string => (ctx?.platform === 'linux' ? p : p.toLowerCase());
  return allJobWindows().find((jw) => jw.path !== null && key(jw.path) === key(file)) ?? null;
}

/** Runs for every window made from now on (lifecycle.ts adds the close prompt this way). */
export function onWindowCreated(hook: (jw: JobWindow) => void): void {
  createdHooks.push(hook);
}

/** The document's name from a title the page sent, without an app name or unsaved mark it may
 *  have added itself ("● Yard.lwj — Loopwright" → "Yard.lwj"), so the title bar never doubles them. */
export function documentName(title: string): string {
  const name = title
    .trim()
    .replace(/\s*[—–-]\s*Loopwright$/i, '')
    .replace(/^[●•*]\s*/, '')
    .replace(/\s*[●•*]$/, '')
    .trim();
  return name || 'Untitled';
}

export function windowTitle(name: string, dirty: boolean): string {
  return `${dirty ? '● ' : ''}${documentName(name)} — Loopwright`;
}

export function setWindowTitle(jw: JobWindow, name: string): void {
  jw.win.setTitle(windowTitle(name, jw.dirty));
  if (ctx?.platform === 'darwin') {
    jw.win.setDocumentEdited(jw.dirty);
    if (jw.path) jw.win.setRepresentedFilename(jw.path);
  }
}

/** Sends a job to a window's renderer (the preload holds it until the page listens). */
export function sendJob(jw: JobWindow, job: OpenedJob, pageLoading = jw.win.webContents.isLoading()): void {
  jw.path = job.path;
  jw.dirty = false;
  setWindowTitle(jw, job.name);
  const deliver = (): void => jw.win.webContents.send(CHANNELS.openFile, job);
  if (pageLoading) jw.win.webContents.once('did-finish-load', deliver);
  else deliver();
}

function displayAreas(): Rect[] {
  const primary = screen.getPrimaryDisplay();
  const others = screen.getAllDisplays().filter((d) => d.id !== primary.id);
  return [primary, ...others].map((d) => d.workArea);
}

export function createJobWindow(job: OpenedJob | null): JobWindow {
  const c = context();
  const areas = displayAreas();
  let bounds = clampBounds(savedState?.bounds ?? null, areas);
  const open = jobWindows.size;
  if (open > 0) bounds = cascade(bounds, open, areas.find((a) => contains(a, bounds)) ?? areas[0] ?? bounds);
  const win = new BrowserWindow(windowOptions(c.preloadPath, bounds, c.platform));
  const jw: JobWindow = { win, path: null, dirty: false, closing: false };
  const id = win.webContents.id;
  jobWindows.set(id, jw);
  guardContents(win.webContents, c.own);
  win.once('ready-to-show', () => {
    if (open === 0 && savedState?.maximized) win.maximize();
    win.show();
  });
  win.on('close', () => rememberState(win));
  win.on('closed', () => jobWindows.delete(id));
  for (const hook of createdHooks) hook(jw);
  // The job goes to the page once it has loaded (the preload keeps it until the page listens).
  if (job) sendJob(jw, job, true);
  else setWindowTitle(jw, 'Untitled');
  if (c.own.devOrigin) void win.loadURL(`${c.own.devOrigin}/`);
  else void win.loadFile(c.indexPath);
  return jw;
}

function contains(area: Rect, r: Rect): boolean {
  return r.x >= area.x && r.y >= area.y && r.x + r.width <= area.x + area.width && r.y + r.height <= area.y + area.height;
}

function rememberState(win: BrowserWindow): void {
  if (!ctx) return;
  const state: WindowState = { bounds: win.getNormalBounds(), maximized: win.isMaximized() };
  savedState = state;
  void saveWindowState(ctx.userData, state).catch(() => undefined);
}

/** Once at start-up: remember the context, load the saved window state, and install the CSP and
 *  a permission policy that grants nothing on the default session. */
export async function setupWindows(appContext: AppContext): Promise<void> {
  ctx = appContext;
  savedState = await loadWindowState(appContext.userData);
  const ses = session.defaultSession;
  ses.webRequest.onHeadersReceived((details, callback) => {
    const policy = cspFor(details.url, appContext.own);
    if (!policy) {
      callback({});
      return;
    }
    const headers = { ...details.responseHeaders };
    for (const key of Object.keys(headers)) if (key.toLowerCase() === 'content-security-policy') delete headers[key];
    headers['Content-Security-Policy'] = [policy];
    callback({ responseHeaders: headers });
  });
  ses.setPermissionRequestHandler((_contents, _permission, callback) => callback(false));
  ses.setPermissionCheckHandler(() => false);
}
