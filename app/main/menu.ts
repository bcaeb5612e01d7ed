// The native menu, built from the command descriptors the focused window's renderer sends
// (setMenu), or the fallback File commands until it has. A click on one of those items sends its
// id on the one `command` channel; the renderer's command registry runs it. The main process adds
// only what is its own: Open Recent, New Window, Close, Quit, the About box and the standard
// text-editing roles for shortcuts the renderer does not claim.

import { app, BrowserWindow, dialog, Menu, type BaseWindow, type MenuItemConstructorOptions } from 'electron';
import path from 'node:path';
import { CAUTION } from '../../engine/index.js';
import { FILE_COMMANDS } from '../shared/commands-menu.js';
import { CHANNELS, type MenuDescriptor, type MenuGroup } from '../shared/ipc.js';
import type { AppContext } from './context.js';
import { clearRecent, onRecentChanged, openFromOutside, recentFiles } from './files.js';
import { listen, must } from './ipc.js';
import { checkMenuArgs, normaliseAccelerator } from './ipc-validate.js';
import { allJobWindows, createJobWindow, jobWindowOf, onWindowCreated, type JobWindow } from './window.js';

export interface MenuInputs {
  /** The focused window's commands, or null when no job window has focus. */
  commands: readonly MenuDescriptor[] | null;
  recent: readonly string[];
  platform: NodeJS.Platform;
  isDev: boolean;
}

export interface MenuActions {
  /** A renderer command was chosen in `win` (undefined: no window has focus). */
  command(id: string, win: BaseWindow | undefined): void;
  openRecent(file: string): void;
  clearRecent(): void;
  newWindow(): void;
  about(win: BaseWindow | undefined): void;
}

const GROUP_LABELS: Record<MenuGroup, string> = { file: '&File', edit: '&Edit', view: '&View', arrange: '&Arrange', help: '&Help' };

/** The renderer's About command, when it has one, is the About box (it shows the caution). */
const ABOUT_COMMAND = 'help.about';

/** Commands that still work with no window open (macOS keeps the app running). */
const WINDOWLESS = new Set(['file.new', 'file.open']);

/** The menu as a template: pure apart from the click callbacks, so the tests can inspect it. */
export function menuTemplate(inputs: MenuInputs, actions: MenuActions): MenuItemConstructorOptions[] {
  const commands = inputs.commands ?? FILE_COMMANDS;
  const windowless = inputs.commands === null;
  const taken = new Set(commands.flatMap((c) => (c.accelerator ? [normaliseAccelerator(c.accelerator)] : [])));
  const free = (accelerator: string): string | undefined => (taken.has(normaliseAccelerator(accelerator)) ? undefined : accelerator);
  const mac = inputs.platform === 'darwin';

  const items = (group: MenuGroup): MenuItemConstructorOptions[] => {
    const out: MenuItemConstructorOptions[] = [];
    for (const c of commands.filter((d) => d.menu === group)) {
      if (c.separatorBefore && out.length > 0) out.push({ type: 'separator' });
      out.push({
        id: `command:${c.id}`,
        label: c.label,
        // The shortcut is shown but left to the page: the renderer's own keyboard handler runs it
        // (and knows when the user is typing in a field), so a key never runs a command twice.
        ...(c.accelerator ? { accelerator: c.accelerator, registerAccelerator: false } : {}),
        enabled: c.enabled && (!windowless || WINDOWLESS.has(c.id)),
        click: (_item, win) => actions.command(c.id, win),
      });
    }
    return out;
  };
  const section = (list: MenuItemConstructorOptions[]): MenuItemConstructorOptions[] =>
    list.length > 0 ? [...list, { type: 'separator' }] : [];

  const recentMenu: MenuItemConstructorOptions[] = inputs.recent.map((file, i) => ({
    id: `recent:${i}`,
    label: `${i < 9 ? `&${i + 1} ` : ''}${path.basename(file).replace(/&/g, '&&')}`,
    toolTip: file,
    click: () => actions.openRecent(file),
  }));
  const file: MenuItemConstructorOptions[] = [
    ...section(items('file')),
    { id: 'main:new-window', label: 'New Window', accelerator: free('CmdOrCtrl+Shift+N'), click: () => actions.newWindow() },
    {
      id: 'main:recent',
      label: 'Open Recent',
      submenu: [
        ...(recentMenu.length > 0 ? recentMenu : [{ label: 'No recent jobs', enabled: false }]),
        { type: 'separator' },
        { id: 'main:clear-recent', label: 'Clear Recent', enabled: recentMenu.length > 0, click: () => actions.clearRecent() },
      ],
    },
    { type: 'separator' },
    free('CmdOrCtrl+W') ? { role: 'close', label: 'Close Window' } : { role: 'close', label: 'Close Window', accelerator: undefined, registerAccelerator: false },
    ...(mac ? [] : [{ type: 'separator' as const }, free('CmdOrCtrl+Q') ? { role: 'quit' as const } : { role: 'quit' as const, registerAccelerator: false }]),
  ];

  const textRoles: Array<[MenuItemConstructorOptions['role'], string]> = [
    ['undo', 'CmdOrCtrl+Z'], ['redo', 'Shift+CmdOrCtrl+Z'], ['cut', 'CmdOrCtrl+X'], ['copy', 'CmdOrCtrl+C'], ['paste', 'CmdOrCtrl+V'], ['selectAll', 'CmdOrCtrl+A'],
  ];
  const edit: MenuItemConstructorOptions[] = [
    ...items('edit'),
    ...textRoles.filter(([, key]) => free(key)).map(([role]): MenuItemConstructorOptions => ({ role })),
  ];
  const view: MenuItemConstructorOptions[] = [
    ...section(items('view')),
    { role: 'togglefullscreen' },
    ...(inputs.isDev ? [{ type: 'separator' as const }, { role: 'reload' as const }, { role: 'toggleDevTools' as const }] : []),
  ];
  const about: MenuItemConstructorOptions = { id: 'main:about', label: 'About Loopwright', click: (_item, win) => actions.about(win) };
  const ownAbout = commands.some((c) => c.id === ABOUT_COMMAND);
  const help: MenuItemConstructorOptions[] = ownAbout ? items('help') : [...section(items('help')), ...(mac ? [] : [about])];
  const arrange = items('arrange');

  const template: MenuItemConstructorOptions[] = [];
  if (mac) {
    template.push({
      label: 'Loopwright',
      submenu: [about, { type: 'separator' }, { role: 'services' }, { type: 'separator' }, { role: 'hide' }, { role: 'hideOthers' }, { role: 'unhide' }, { type: 'separator' }, { role: 'quit' }],
    });
  }
  template.push({ label: GROUP_LABELS.file, submenu: file });
  if (edit.length > 0) template.push({ label: GROUP_LABELS.edit, submenu: edit });
  template.push({ label: GROUP_LABELS.view, submenu: view });
  if (arrange.length > 0) template.push({ label: GROUP_LABELS.arrange, submenu: arrange });
  if (mac) template.push({ role: 'windowMenu' });
  template.push({ label: GROUP_LABELS.help, submenu: help });
  return template;
}

const menus = new WeakMap<JobWindow, MenuDescriptor[]>();
const lastSent = new WeakMap<JobWindow, string>();
let appContext: AppContext | null = null;

/** The window the menu speaks for: the focused job window, or the only one there is. */
function focusedJobWindow(): JobWindow | null {
  const focused = jobWindowOf(BrowserWindow.getFocusedWindow()?.webContents);
  if (focused) return focused;
  const all = allJobWindows();
  return all.length === 1 ? (all[0] ?? null) : null;
}

function windowOf(win: BaseWindow | undefined): JobWindow | null {
  if (!win || !(win instanceof BrowserWindow)) return focusedJobWindow();
  return jobWindowOf(win.webContents);
}

/** Rebuilds the application menu for the window that has focus now. */
export function refreshMenu(): void {
  if (!appContext) return;
  const jw = focusedJobWindow();
  const inputs: MenuInputs = {
    commands: jw ? (menus.get(jw) ?? FILE_COMMANDS) : null,
    recent: recentFiles(),
    platform: appContext.platform,
    isDev: !appContext.isPackaged,
  };
  Menu.setApplicationMenu(Menu.buildFromTemplate(menuTemplate(inputs, actions)));
}

const actions: MenuActions = {
  command(id, win) {
    const jw = windowOf(win);
    if (jw) {
      const known = (menus.get(jw) ?? FILE_COMMANDS).some((c) => c.id === id && c.enabled);
      if (known) jw.win.webContents.send(CHANNELS.command, id);
      return;
    }
    if (id === 'file.new') createJobWindow(null);
    if (id === 'file.open') void openWithoutWindow();
  },
  openRecent(file) {
    void openFromOutside(file);
  },
  clearRecent() {
    void clearRecent();
  },
  newWindow() {
    createJobWindow(null);
  },
  about(win) {
    const jw = windowOf(win);
    if (jw && (menus.get(jw) ?? []).some((c) => c.id === ABOUT_COMMAND && c.enabled)) {
      jw.win.webContents.send(CHANNELS.command, ABOUT_COMMAND);
      return;
    }
    const options = {
      type: 'info' as const,
      title: 'About Loopwright',
      message: `Loopwright ${app.getVersion()}`,
      detail: `Earth-fault loop impedance checking for low-voltage installations.\n\n${CAUTION}`,
      buttons: ['OK'],
    };
    void (jw ? dialog.showMessageBox(jw.win, options) : dialog.showMessageBox(options));
  },
};

async function openWithoutWindow(): Promise<void> {
  const choice = await dialog.showOpenDialog({ title: 'Open job', filters: [{ name: 'Loopwright job', extensions: ['lwj'] }], properties: ['openFile'] });
  const file = choice.canceled ? undefined : choice.filePaths[0];
  if (file) await openFromOutside(file);
}

export function setupMenu(ctx: AppContext): void {
  appContext = ctx;
  listen(CHANNELS.setMenu, (jw, args) => {
    const list = must(checkMenuArgs(args));
    const key = JSON.stringify(list);
    if (lastSent.get(jw) === key) return;
    lastSent.set(jw, key);
    menus.set(jw, list);
    if (focusedJobWindow() === jw) refreshMenu();
  });
  app.on('browser-window-focus', () => refreshMenu());
  onWindowCreated((jw) => jw.win.on('closed', () => setImmediate(() => refreshMenu())));
  onRecentChanged(() => refreshMenu());
  refreshMenu();
}
