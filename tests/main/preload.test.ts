// The preload, with Electron's contextBridge and ipcRenderer stood in for: exactly one object is
// exposed, it carries only the documented API, calls go out on the contract's channels, and
// nothing from Electron (events, ipcRenderer) reaches the page.
import { describe, expect, it, vi } from 'vitest';

type Listener = (event: unknown, ...args: unknown[]) => void;
const bridge = vi.hoisted(() => ({
  exposed: [] as Array<{ key: string; api: unknown }>,
  listeners: new Map<string, Listener>(),
  sent: [] as Array<{ channel: string; args: unknown[] }>,
  invoked: [] as Array<{ channel: string; args: unknown[] }>,
}));

vi.mock('electron', () => ({
  contextBridge: {
    exposeInMainWorld: (key: string, api: unknown) => bridge.exposed.push({ key, api }),
  },
  ipcRenderer: {
    on: (channel: string, fn: Listener) => bridge.listeners.set(channel, fn),
    send: (channel: string, ...args: unknown[]) => bridge.sent.push({ channel, args }),
    invoke: async (channel: string, ...args: unknown[]) => {
      bridge.invoked.push({ channel, args });
      return null;
    },
  },
}));

await import('../../app/preload/preload.js');
const { CHANNELS } = await import('../../app/shared/ipc.js');
type Api = import('../../app/shared/ipc.js').LoopwrightApi;

const api = bridge.exposed[0]?.api as Api;
const push = (channel: string, ...args: unknown[]): void => bridge.listeners.get(channel)?.({ sender: 'secret' }, ...args);
const flush = (): Promise<void> => new Promise((r) => setImmediate(r));

describe('preload', () => {
  it('exposes one object, window.loopwright, with only the documented members', () => {
    expect(bridge.exposed).toHaveLength(1);
    expect(bridge.exposed[0]?.key).toBe('loopwright');
    expect(Object.keys(api).sort()).toEqual(
      ['exportPdf', 'onCloseRequest', 'onCommand', 'onOpenFile', 'openJob', 'platform', 'print', 'printTestSheets', 'saveJob', 'setDirty', 'setMenu'].sort(),
    );
    expect(typeof api.platform).toBe('string');
  });

  it('calls go out on the contract\'s channels with their arguments', async () => {
    await api.openJob();
    await api.saveJob('{}', null, true);
    await api.exportPdf('{}', { size: 'A4', orientation: 'portrait' });
    await api.print('{}');
    api.setDirty(true, 'Yard.lwj');
    api.setMenu([{ id: 'edit.undo', label: 'Undo', accelerator: 'CmdOrCtrl+Z', enabled: true, menu: 'edit' }]);
    expect(bridge.invoked).toEqual([
      { channel: CHANNELS.openJob, args: [] },
      { channel: CHANNELS.saveJob, args: ['{}', null, true] },
      { channel: CHANNELS.exportPdf, args: ['{}', { size: 'A4', orientation: 'portrait' }] },
      { channel: CHANNELS.print, args: ['{}'] },
    ]);
    expect(bridge.sent.map((s) => s.channel)).toEqual([CHANNELS.setDirty, CHANNELS.setMenu]);
  });

  it('keeps a job that arrives before the page listens, and passes plain values only', () => {
    push(CHANNELS.openFile, { path: null, name: 'Demo', text: '{}', extra: 'dropped' });
    push(CHANNELS.openFile, { path: 5, name: 'bad', text: '{}' }); // malformed: ignored
    const got: unknown[] = [];
    const stop = api.onOpenFile((job) => got.push(job));
    expect(got).toEqual([{ path: null, name: 'Demo', text: '{}' }]);
    push(CHANNELS.openFile, { path: '/j/a.lwj', name: 'a.lwj', text: '{"a":1}' });
    expect(got).toHaveLength(2);
    stop();
    push(CHANNELS.openFile, { path: '/j/b.lwj', name: 'b.lwj', text: '{}' });
    expect(got).toHaveLength(2);
  });

  it('menu commands reach the listener as ids, without the event', () => {
    const ids: unknown[][] = [];
    const stop = api.onCommand((...args) => ids.push(args));
    push(CHANNELS.command, 'view.fit');
    push(CHANNELS.command, { not: 'an id' });
    stop();
    push(CHANNELS.command, 'edit.undo');
    expect(ids).toEqual([['view.fit']]);
  });

  it('answers a close request with the handler\'s reply, or null without a handler', async () => {
    bridge.sent.length = 0;
    push(CHANNELS.closeRequest, 'token-1');
    const stop = api.onCloseRequest(() => ({ dirty: true, text: '{"x":1}' }));
    push(CHANNELS.closeRequest, 'token-2');
    await flush();
    stop();
    api.onCloseRequest(() => {
      throw new Error('page failed');
    });
    push(CHANNELS.closeRequest, 'token-3');
    await flush();
    expect(bridge.sent).toEqual([
      { channel: CHANNELS.closeReply, args: ['token-1', null] },
      { channel: CHANNELS.closeReply, args: ['token-2', { dirty: true, text: '{"x":1}' }] },
      { channel: CHANNELS.closeReply, args: ['token-3', null] },
    ]);
  });
});
