import { describe, expect, it, vi } from 'vitest';
import type { MenuItemConstructorOptions } from 'electron';

vi.mock('electron', () => ({ app: {}, BrowserWindow: class {}, dialog: {}, Menu: {}, screen: {}, session: {}, ipcMain: {} }));

const { menuTemplate } = await import('../../app/main/menu.js');
const { closePromptButtons, jobFilesFromArgv } = await import('../../app/main/lifecycle.js');
const { devOriginFrom, makeContext } = await import('../../app/main/context.js');
const { FILE_COMMANDS } = await import('../../app/shared/commands-menu.js');
const { inlineSvg, printCss, printHtml, printPageSize } = await import('../../app/main/print-page.js');
type MenuDescriptor = import('../../app/shared/ipc.js').MenuDescriptor;

function actions() {
  const calls: string[] = [];
  return {
    calls,
    actions: {
      command: (id: string) => calls.push(`command ${id}`),
      openRecent: (f: string) => calls.push(`recent ${f}`),
      clearRecent: () => calls.push('clear'),
      newWindow: () => calls.push('new'),
      about: () => calls.push('about'),
    },
  };
}
const flat = (items: MenuItemConstructorOptions[]): MenuItemConstructorOptions[] =>
  items.flatMap((i) => [i, ...flat(Array.isArray(i.submenu) ? i.submenu : [])]);
const click = (item: MenuItemConstructorOptions | undefined): void => (item?.click as unknown as (() => void) | undefined)?.();

const commands: MenuDescriptor[] = [
  ...FILE_COMMANDS,
  { id: 'edit.undo', label: 'Undo', accelerator: 'CmdOrCtrl+Z', enabled: true, menu: 'edit' },
  { id: 'edit.redo', label: 'Redo', accelerator: 'CmdOrCtrl+Shift+Z', enabled: false, menu: 'edit' },
  { id: 'arrange.auto', label: 'Auto-arrange', accelerator: null, enabled: true, menu: 'arrange' },
  { id: 'help.caution', label: 'About the results', accelerator: null, enabled: true, menu: 'help', separatorBefore: true },
];

describe('menu template', () => {
  it('places each command in its menu, with its label, shortcut and enabled state', () => {
    const { actions: a } = actions();
    const t = menuTemplate({ commands, recent: [], platform: 'linux', isDev: false }, a);
    expect(t.map((m) => m.label)).toEqual(['&File', '&Edit', '&View', '&Arrange', '&Help']);
    const items = flat(t);
    expect(items.find((i) => i.id === 'command:edit.redo')).toMatchObject({ label: 'Redo', accelerator: 'CmdOrCtrl+Shift+Z', enabled: false });
    expect(items.find((i) => i.id === 'command:arrange.auto')?.accelerator).toBeUndefined();
  });

  it('a click sends the command id; main-owned items do their own thing', () => {
    const { actions: a, calls } = actions();
    const items = flat(menuTemplate({ commands, recent: ['/j/yard.lwj'], platform: 'linux', isDev: false }, a));
    click(items.find((i) => i.id === 'command:file.save'));
    click(items.find((i) => i.id === 'recent:0'));
    click(items.find((i) => i.id === 'main:clear-recent'));
    click(items.find((i) => i.id === 'main:new-window'));
    click(items.find((i) => i.id === 'main:about'));
    expect(calls).toEqual(['command file.save', 'recent /j/yard.lwj', 'clear', 'new', 'about']);
    expect(items.find((i) => i.id === 'recent:0')?.label).toBe('&1 yard.lwj');
  });

  it('shows command shortcuts but leaves the keys to the page, so none runs twice', () => {
    const { actions: a } = actions();
    const undo = flat(menuTemplate({ commands, recent: [], platform: 'linux', isDev: false }, a)).find((i) => i.id === 'command:edit.undo');
    expect(undo).toMatchObject({ accelerator: 'CmdOrCtrl+Z', registerAccelerator: false });
  });

  it('uses the page\'s About command when it has one, else its own About box', () => {
    const { actions: a } = actions();
    const withAbout = [...commands, { id: 'help.about', label: 'About Loopwright', accelerator: 'F1', enabled: true, menu: 'help' as const }];
    const items = flat(menuTemplate({ commands: withAbout, recent: [], platform: 'linux', isDev: false }, a));
    expect(items.filter((i) => i.label === 'About Loopwright')).toHaveLength(1);
    expect(items.some((i) => i.id === 'main:about')).toBe(false);
    expect(flat(menuTemplate({ commands, recent: [], platform: 'linux', isDev: false }, a)).some((i) => i.id === 'main:about')).toBe(true);
  });

  it('adds text-editing roles only for shortcuts no command claims', () => {
    const { actions: a } = actions();
    const roles = flat(menuTemplate({ commands, recent: [], platform: 'linux', isDev: false }, a)).map((i) => i.role);
    expect(roles).not.toContain('undo');
    expect(roles).not.toContain('redo');
    expect(roles).toEqual(expect.arrayContaining(['cut', 'copy', 'paste', 'selectAll', 'close', 'quit']));
  });

  it('no shortcut is used twice across the whole menu', () => {
    const { actions: a } = actions();
    const keys = flat(menuTemplate({ commands, recent: ['/a.lwj'], platform: 'linux', isDev: true }, a))
      .map((i) => (typeof i.accelerator === 'string' ? i.accelerator.toLowerCase() : null))
      .filter((k): k is string => k !== null);
    expect(new Set(keys).size).toBe(keys.length);
  });

  it('with no window, only New and Open work; the recent list says when it is empty', () => {
    const { actions: a } = actions();
    const items = flat(menuTemplate({ commands: null, recent: [], platform: 'darwin', isDev: false }, a));
    expect(items.find((i) => i.id === 'command:file.open')?.enabled).toBe(true);
    expect(items.find((i) => i.id === 'command:file.new')?.enabled).toBe(true);
    expect(items.find((i) => i.id === 'command:file.save')?.enabled).toBe(false);
    expect(items.find((i) => i.label === 'No recent jobs')?.enabled).toBe(false);
    expect(items.find((i) => i.id === 'main:clear-recent')?.enabled).toBe(false);
  });

  it('on macOS has the app menu first and a Window menu', () => {
    const { actions: a } = actions();
    const t = menuTemplate({ commands, recent: [], platform: 'darwin', isDev: false }, a);
    expect(t[0]?.label).toBe('Loopwright');
    expect(t.some((m) => m.role === 'windowMenu')).toBe(true);
  });
});

describe('start-up arguments', () => {
  it('picks out job files, resolved against the launch folder', () => {
    expect(jobFilesFromArgv(['/usr/bin/electron', '.', 'jobs/yard.lwj', '--inspect', '/abs/B.LWJ'], '/home/ana')).toEqual([
      '/home/ana/jobs/yard.lwj',
      '/abs/B.LWJ',
    ]);
    expect(jobFilesFromArgv(['/opt/Loopwright/loopwright', '--no-sandbox', 'notes.txt'], '/')).toEqual([]);
    expect(jobFilesFromArgv(['/opt/Loopwright/loopwright', '-psn_0_1234'], '/')).toEqual([]);
  });

  it('the close prompt offers Save, Don\'t Save and Cancel, or no Save when the page is not answering', () => {
    expect(closePromptButtons(true).map((b) => b.choice)).toEqual(['save', 'discard', 'cancel']);
    expect(closePromptButtons(false).map((b) => b.choice)).toEqual(['discard', 'cancel']);
  });

  it('the dev server switch accepts a loopback http origin only, and never in a packaged app', () => {
    expect(devOriginFrom('http://127.0.0.1:5173/')).toBe('http://127.0.0.1:5173');
    expect(devOriginFrom('http://localhost:5173')).toBe('http://localhost:5173');
    expect(devOriginFrom('https://127.0.0.1:5173')).toBeNull();
    expect(devOriginFrom('http://example.com:5173')).toBeNull();
    expect(devOriginFrom('http://127.0.0.1.example.com/')).toBeNull();
    expect(devOriginFrom('nonsense')).toBeNull();
    expect(makeContext('/app', '/data', true, { LOOPWRIGHT_DEV_SERVER: 'http://127.0.0.1:5173' }).own.devOrigin).toBeNull();
    expect(makeContext('/app', '/data', false, { LOOPWRIGHT_DEV_SERVER: 'http://127.0.0.1:5173' }).own.devOrigin).toBe('http://127.0.0.1:5173');
    expect(makeContext('/app', '/data', false, {}).own.indexUrl).toBe('file:///app/dist/renderer/index.html');
  });
});

describe('print page', () => {
  const svg = '<?xml version="1.0" encoding="UTF-8"?>\n<svg xmlns="http://www.w3.org/2000/svg" width="420mm" height="297mm"><title>x</title></svg>\n';

  it('puts every sheet on a page of its own, with no script', () => {
    const html = printHtml(
      [
        { svg, widthMm: 420, heightMm: 297, title: 'Diagram' },
        { svg, widthMm: 420, heightMm: 297, title: 'Schedule <1>' },
      ],
      'Yard & shed',
      "default-src 'self'",
    );
    expect(html.match(/<div class="sheet"/g)).toHaveLength(2);
    expect(html).not.toContain('<?xml');
    expect(html).toContain('Sheet 2 of 2: Schedule &lt;1&gt;');
    expect(html).toContain('<title>Yard &amp; shed</title>');
    expect(html).toContain(`content="default-src 'self'"`);
    expect(html).not.toMatch(/<script/i);
  });

  it('refuses a sheet with script in it, and an empty printout', () => {
    expect(() => inlineSvg('<svg><script>alert(1)</script></svg>')).toThrow(/script/);
    expect(() => inlineSvg('<svg><rect onload="x()"/></svg>')).toThrow(/script/);
    expect(() => inlineSvg('<html></html>')).toThrow(/not an SVG/);
    expect(() => printHtml([], 't', '')).toThrow(/no sheets/);
  });

  it('page size follows the sheet: A3 landscape is 297 × 420 mm turned', () => {
    // ISO 216: A3 is 297 mm × 420 mm.
    expect(printPageSize(420, 297)).toEqual({ pageSize: { width: 297000, height: 420000 }, landscape: true });
    expect(printPageSize(210, 297)).toEqual({ pageSize: { width: 210000, height: 297000 }, landscape: false });
    expect(printCss(420, 297)).toContain('@page { size: 420mm 297mm; margin: 0; }');
  });
});
