// Checks on everything that arrives over IPC from a renderer, before the main process acts on it.
// Pure: no Electron, no file system, so every rule here is unit-tested (tests/main/ipc-validate.test.ts).
// A renderer is treated as untrusted: a compromised page must not be able to make the main process
// read or write a file the user did not choose, or run anything but our own commands.

import { LIMITS, type CloseReply, type MenuDescriptor, type MenuGroup, type PaperChoice } from '../shared/ipc.js';

export type Checked<T> = { ok: true; value: T } | { ok: false; error: string };

const ok = <T>(value: T): Checked<T> => ({ ok: true, value });
const bad = <T>(error: string): Checked<T> => ({ ok: false, error });

/** Where our pages come from: the built index.html (file URL) and, in development, the Vite server. */
export interface OwnOrigins {
  /** e.g. file:///opt/Loopwright/resources/app.asar/dist/renderer/index.html */
  indexUrl: string;
  /** e.g. http://127.0.0.1:5173, or null outside development. */
  devOrigin: string | null;
}

function parseUrl(text: string): URL | null {
  try {
    return new URL(text);
  } catch {
    return null;
  }
}

/** True when `url` is one of our own pages: exactly our index.html (any query or hash), or any
 *  page on the dev server's origin while developing. */
export function isOwnPageUrl(url: unknown, own: OwnOrigins): boolean {
  if (typeof url !== 'string' || url.length === 0 || url.length > 8192) return false;
  const page = parseUrl(url);
  if (!page) return false;
  if (page.protocol === 'file:') {
    const index = parseUrl(own.indexUrl);
    return index !== null && index.protocol === 'file:' && page.host === index.host && page.pathname === index.pathname;
  }
  if (own.devOrigin === null) return false;
  const dev = parseUrl(own.devOrigin);
  return dev !== null && (page.protocol === 'http:' || page.protocol === 'https:') && page.origin === dev.origin;
}

/** The sender check every handler runs: the frame must exist, be a top-level frame of one of our
 *  windows, and show one of our pages. */
export function checkSender(
  frame: { url: string; isTopLevel: boolean } | null | undefined,
  isOurWindow: boolean,
  own: OwnOrigins,
): Checked<true> {
  if (!frame) return bad('IPC refused: the sending frame is gone');
  if (!isOurWindow) return bad('IPC refused: the sender is not a Loopwright window');
  if (!frame.isTopLevel) return bad('IPC refused: the sender is a sub-frame');
  if (!isOwnPageUrl(frame.url, own)) return bad(`IPC refused: the sender page ${JSON.stringify(frame.url.slice(0, 200))} is not ours`);
  return ok(true);
}

function argCount(args: readonly unknown[], min: number, max: number, what: string): string | null {
  if (args.length < min || args.length > max) {
    const want = min === max ? `${min}` : `${min} to ${max}`;
    return `${what}: expected ${want} argument(s), got ${args.length}`;
  }
  return null;
}

/** A job's text: a string no longer than LIMITS.jobText. Its content is checked by parseJob. */
export function checkJobText(value: unknown, what = 'job text'): Checked<string> {
  if (typeof value !== 'string') return bad(`${what} must be a string, got ${typeOf(value)}`);
  if (value.length > LIMITS.jobText) return bad(`${what} is ${value.length} characters; the most accepted is ${LIMITS.jobText}`);
  return ok(value);
}

/** A file path from the renderer: absolute (POSIX or Windows), no NUL, no "..", at most
 *  LIMITS.path characters, ending in .lwj. */
export function checkJobPath(value: unknown): Checked<string> {
  if (typeof value !== 'string') return bad(`path must be a string, got ${typeOf(value)}`);
  if (value.length === 0 || value.length > LIMITS.path) return bad(`path must be 1 to ${LIMITS.path} characters long`);
  if (value.includes('\0')) return bad('path must not contain a NUL character');
  const absolute = value.startsWith('/') || /^[A-Za-z]:[\\/]/.test(value) || value.startsWith('\\\\');
  if (!absolute) return bad(`path must be absolute, got ${JSON.stringify(value.slice(0, 200))}`);
  if (value.split(/[\\/]/).includes('..')) return bad('path must not contain ".." parts');
  if (!/\.lwj$/i.test(value)) return bad(`path must end in .lwj, got ${JSON.stringify(value.slice(-40))}`);
  return ok(value);
}

export function checkPaper(value: unknown): Checked<PaperChoice | undefined> {
  if (value === undefined || value === null) return ok(undefined);
  if (!isPlainObject(value)) return bad(`paper must be an object, got ${typeOf(value)}`);
  const extra = Object.keys(value).filter((k) => k !== 'size' && k !== 'orientation');
  if (extra.length > 0) return bad(`paper has unknown field(s): ${extra.slice(0, 5).join(', ')}`);
  const { size, orientation } = value as Record<string, unknown>;
  if (size !== 'A3' && size !== 'A4') return bad(`paper.size must be "A3" or "A4", got ${show(size)}`);
  if (orientation !== 'landscape' && orientation !== 'portrait') {
    return bad(`paper.orientation must be "landscape" or "portrait", got ${show(orientation)}`);
  }
  return ok({ size, orientation });
}

export interface SaveArgs {
  text: string;
  path: string | null;
  saveAs: boolean;
}

/** saveJob(text, path, saveAs). A path, when given, must be the one this window opened or last
 *  saved to (`windowPath`): the renderer cannot point the main process at any other file. */
export function checkSaveArgs(args: readonly unknown[], windowPath: string | null): Checked<SaveArgs> {
  const count = argCount(args, 3, 3, 'saveJob');
  if (count) return bad(count);
  const text = checkJobText(args[0]);
  if (!text.ok) return text;
  const saveAs = args[2];
  if (typeof saveAs !== 'boolean') return bad(`saveJob: saveAs must be true or false, got ${show(saveAs)}`);
  if (args[1] === null) return ok({ text: text.value, path: null, saveAs });
  const path = checkJobPath(args[1]);
  if (!path.ok) return bad(`saveJob: ${path.error}`);
  if (path.value !== windowPath) return bad('saveJob: the path is not the file this window has open');
  return ok({ text: text.value, path: path.value, saveAs });
}

/** exportPdf(text, paper?) and print(text, paper?). */
export function checkPrintArgs(args: readonly unknown[], what: string): Checked<{ text: string; paper: PaperChoice | undefined }> {
  const count = argCount(args, 1, 2, what);
  if (count) return bad(count);
  const text = checkJobText(args[0]);
  if (!text.ok) return bad(`${what}: ${text.error}`);
  const paper = checkPaper(args[1]);
  if (!paper.ok) return bad(`${what}: ${paper.error}`);
  return ok({ text: text.value, paper: paper.value });
}

export function checkNoArgs(args: readonly unknown[], what: string): Checked<true> {
  const count = argCount(args, 0, 0, what);
  return count ? bad(count) : ok(true);
}

/** setDirty(dirty, title). The title may not hold control characters. */
export function checkDirtyArgs(args: readonly unknown[]): Checked<{ dirty: boolean; title: string }> {
  const count = argCount(args, 2, 2, 'setDirty');
  if (count) return bad(count);
  const [dirty, title] = args;
  if (typeof dirty !== 'boolean') return bad(`setDirty: dirty must be true or false, got ${show(dirty)}`);
  const text = checkText(title, 'setDirty: title', LIMITS.title, true);
  if (!text.ok) return text;
  return ok({ dirty, title: text.value });
}

export const COMMAND_ID = /^[a-z][A-Za-z0-9_-]*(?:[.:][A-Za-z0-9_-]+)*$/;

export function checkCommandId(value: unknown): Checked<string> {
  if (typeof value !== 'string') return bad(`command id must be a string, got ${typeOf(value)}`);
  if (value.length === 0 || value.length > LIMITS.commandId) return bad(`command id must be 1 to ${LIMITS.commandId} characters`);
  if (!COMMAND_ID.test(value)) return bad(`command id ${JSON.stringify(value)} is not of the form "group.name"`);
  return ok(value);
}

const MODIFIERS = new Set([
  'command', 'cmd', 'control', 'ctrl', 'commandorcontrol', 'cmdorctrl', 'alt', 'option', 'altgr', 'shift', 'super', 'meta',
]);
const NAMED_KEYS = new Set([
  'plus', 'space', 'tab', 'capslock', 'numlock', 'scrolllock', 'backspace', 'delete', 'insert', 'return', 'enter',
  'up', 'down', 'left', 'right', 'home', 'end', 'pageup', 'pagedown', 'escape', 'esc', 'printscreen',
  'num0', 'num1', 'num2', 'num3', 'num4', 'num5', 'num6', 'num7', 'num8', 'num9',
  'numdec', 'numadd', 'numsub', 'nummult', 'numdiv',
]);

/** An Electron accelerator: modifiers joined by "+" and exactly one key, e.g. "CmdOrCtrl+Shift+Z". */
export function checkAccelerator(value: unknown): Checked<string | null> {
  if (value === null) return ok(null);
  if (typeof value !== 'string') return bad(`accelerator must be a string or null, got ${typeOf(value)}`);
  if (value.length === 0 || value.length > LIMITS.accelerator) return bad(`accelerator must be 1 to ${LIMITS.accelerator} characters`);
  const parts = value.split('+');
  const key = parts[parts.length - 1] ?? '';
  const mods = parts.slice(0, -1).map((m) => m.toLowerCase());
  if (mods.some((m) => !MODIFIERS.has(m))) return bad(`accelerator ${JSON.stringify(value)} has an unknown modifier`);
  if (new Set(mods).size !== mods.length) return bad(`accelerator ${JSON.stringify(value)} repeats a modifier`);
  const k = key.toLowerCase();
  const keyOk = /^[a-z0-9]$/.test(k) || /^f([1-9]|1[0-9]|2[0-4])$/.test(k) || NAMED_KEYS.has(k) || /^[)!@#$%^&*(:;<>=?,\-_.`~/\\|[\]{}'"]$/.test(key);
  if (!keyOk) return bad(`accelerator ${JSON.stringify(value)} does not end in a key Electron knows`);
  return ok(value);
}

const GROUPS: readonly MenuGroup[] = ['file', 'edit', 'view', 'arrange', 'help'];

/** setMenu(items): a list of menu descriptors with unique ids and unique accelerators. */
export function checkMenuArgs(args: readonly unknown[]): Checked<MenuDescriptor[]> {
  const count = argCount(args, 1, 1, 'setMenu');
  if (count) return bad(count);
  const items = args[0];
  if (!Array.isArray(items)) return bad(`setMenu: items must be a list, got ${typeOf(items)}`);
  if (items.length > LIMITS.menuItems) return bad(`setMenu: at most ${LIMITS.menuItems} items, got ${items.length}`);
  const out: MenuDescriptor[] = [];
  const ids = new Set<string>();
  const keys = new Map<string, string>();
  for (const [i, item] of items.entries()) {
    const where = `setMenu: items[${i}]`;
    if (!isPlainObject(item)) return bad(`${where} must be an object, got ${typeOf(item)}`);
    const allowed = ['id', 'label', 'accelerator', 'enabled', 'menu', 'separatorBefore'];
    const extra = Object.keys(item).filter((k) => !allowed.includes(k));
    if (extra.length > 0) return bad(`${where} has unknown field(s): ${extra.slice(0, 5).join(', ')}`);
    const r = item as Record<string, unknown>;
    const id = checkCommandId(r.id);
    if (!id.ok) return bad(`${where}.id: ${id.error}`);
    if (ids.has(id.value)) return bad(`${where}.id: ${JSON.stringify(id.value)} appears twice`);
    ids.add(id.value);
    const label = checkText(r.label, `${where}.label`, LIMITS.label, false);
    if (!label.ok) return label;
    const accelerator = checkAccelerator(r.accelerator ?? null);
    if (!accelerator.ok) return bad(`${where}.${accelerator.error}`);
    if (accelerator.value !== null) {
      const norm = normaliseAccelerator(accelerator.value);
      const other = keys.get(norm);
      if (other) return bad(`${where}: ${accelerator.value} is already the shortcut of ${other}`);
      keys.set(norm, id.value);
    }
    if (typeof r.enabled !== 'boolean') return bad(`${where}.enabled must be true or false, got ${show(r.enabled)}`);
    if (typeof r.menu !== 'string' || !GROUPS.includes(r.menu as MenuGroup)) {
      return bad(`${where}.menu must be one of ${GROUPS.join(', ')}, got ${show(r.menu)}`);
    }
    if (r.separatorBefore !== undefined && typeof r.separatorBefore !== 'boolean') {
      return bad(`${where}.separatorBefore must be true or false when given`);
    }
    const descriptor: MenuDescriptor = {
      id: id.value,
      label: label.value,
      accelerator: accelerator.value,
      enabled: r.enabled,
      menu: r.menu as MenuGroup,
    };
    if (r.separatorBefore === true) descriptor.separatorBefore = true;
    out.push(descriptor);
  }
  return ok(out);
}

/** The same shortcut written two ways ("Ctrl+Shift+Z", "shift+control+z") compares equal. */
export function normaliseAccelerator(accelerator: string): string {
  const parts = accelerator.split('+');
  const key = (parts.pop() ?? '').toLowerCase();
  const alias: Record<string, string> = { cmd: 'command', ctrl: 'control', cmdorctrl: 'commandorcontrol', option: 'alt', esc: 'escape', return: 'enter' };
  const mods = parts.map((m) => alias[m.toLowerCase()] ?? m.toLowerCase()).sort();
  return [...mods, alias[key] ?? key].join('+');
}

/** The renderer's answer to a close request: (token, reply | null). */
export function checkCloseReplyArgs(args: readonly unknown[]): Checked<{ token: string; reply: CloseReply | null }> {
  const count = argCount(args, 2, 2, 'close reply');
  if (count) return bad(count);
  const [token, reply] = args;
  if (typeof token !== 'string' || token.length === 0 || token.length > LIMITS.closeToken || !/^[A-Za-z0-9-]+$/.test(token)) {
    return bad('close reply: the token is not one the main process issued');
  }
  if (reply === null) return ok({ token, reply: null });
  if (!isPlainObject(reply)) return bad(`close reply: the reply must be an object or null, got ${typeOf(reply)}`);
  const r = reply as Record<string, unknown>;
  if (typeof r.dirty !== 'boolean') return bad(`close reply: dirty must be true or false, got ${show(r.dirty)}`);
  const text = checkJobText(r.text, 'close reply: text');
  if (!text.ok) return text;
  return ok({ token, reply: { dirty: r.dirty, text: text.value } });
}

function checkText(value: unknown, what: string, max: number, allowEmpty: boolean): Checked<string> {
  if (typeof value !== 'string') return bad(`${what} must be a string, got ${typeOf(value)}`);
  if (!allowEmpty && value.trim().length === 0) return bad(`${what} must not be empty`);
  if (value.length > max) return bad(`${what} is ${value.length} characters; the most is ${max}`);
  if (/[\u0000-\u001f\u007f]/.test(value)) return bad(`${what} must not contain control characters`);
  return ok(value);
}

function isPlainObject(value: unknown): value is Record<string, unknown> {
  if (typeof value !== 'object' || value === null || Array.isArray(value)) return false;
  const proto = Object.getPrototypeOf(value) as unknown;
  return proto === Object.prototype || proto === null;
}

function typeOf(value: unknown): string {
  if (value === null) return 'null';
  if (Array.isArray(value)) return 'a list';
  return typeof value;
}

function show(value: unknown): string {
  if (typeof value === 'string') return JSON.stringify(value.slice(0, 60));
  if (typeof value === 'number' || typeof value === 'boolean' || value === null || value === undefined) return String(value);
  return typeOf(value);
}
