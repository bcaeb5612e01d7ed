import { describe, expect, it, vi } from 'vitest';

vi.mock('electron', () => ({ BrowserWindow: class {}, screen: {}, session: {} }));

const { cspFor, documentName, guardContents, navigationAllowed, webPreferencesFor, windowOpenDecision, windowOptions, windowTitle } = await import('../../app/main/window.js');
const { CSP, devCsp } = await import('../../app/shared/csp.js');

const own = { indexUrl: 'file:///app/dist/renderer/index.html', devOrigin: null };

function directives(policy: string): Map<string, string[]> {
  return new Map(
    policy
      .split(';')
      .map((d) => d.trim().split(/\s+/))
      .filter((parts) => parts[0])
      .map(([name, ...values]) => [name as string, values]),
  );
}

describe('window security settings', () => {
  it('turns on isolation, the sandbox and web security and keeps Node out of the page', () => {
    const prefs = webPreferencesFor('/app/dist/preload/preload.cjs');
    expect(prefs.contextIsolation).toBe(true);
    expect(prefs.sandbox).toBe(true);
    expect(prefs.nodeIntegration).toBe(false);
    expect(prefs.nodeIntegrationInWorker).toBe(false);
    expect(prefs.nodeIntegrationInSubFrames).toBe(false);
    expect(prefs.webSecurity).toBe(true);
    expect(prefs.allowRunningInsecureContent).toBe(false);
    expect(prefs.webviewTag).toBe(false);
    expect(prefs.preload).toBe('/app/dist/preload/preload.cjs');
  });

  it('every window gets those settings, at the bounds given', () => {
    const options = windowOptions('/p.cjs', { x: 10, y: 20, width: 1000, height: 700 }, 'linux');
    expect(options).toMatchObject({ x: 10, y: 20, width: 1000, height: 700, show: false });
    expect(options.webPreferences).toEqual(webPreferencesFor('/p.cjs'));
  });

  it('denies every new window', () => {
    expect(windowOpenDecision()).toEqual({ action: 'deny' });
  });

  it('allows navigation to our own page only', () => {
    expect(navigationAllowed('file:///app/dist/renderer/index.html', own)).toBe(true);
    expect(navigationAllowed('file:///app/dist/renderer/index.html#x', own)).toBe(true);
    expect(navigationAllowed('https://example.com/', own)).toBe(false);
    expect(navigationAllowed('file:///home/ana/jobs/a.lwj', own)).toBe(false);
  });
});

describe('window title', () => {
  it('shows the name, the unsaved mark and the app once, whatever the page sends', () => {
    expect(windowTitle('Yard.lwj', false)).toBe('Yard.lwj — Loopwright');
    expect(windowTitle('Yard.lwj', true)).toBe('● Yard.lwj — Loopwright');
    expect(windowTitle('● Yard.lwj — Loopwright', true)).toBe('● Yard.lwj — Loopwright');
    expect(documentName('   ')).toBe('Untitled');
    expect(documentName('Pump-house - Loopwright')).toBe('Pump-house');
  });
});

describe('guards on a window\'s contents', () => {
  type Handler = (event: { preventDefault(): void; isMainFrame?: boolean }, url?: string) => void;
  function fakeContents() {
    const handlers = new Map<string, Handler>();
    let openHandler: ((details: { url: string }) => unknown) | null = null;
    const contents = {
      on: (name: string, fn: Handler) => {
        handlers.set(name, fn);
        return contents;
      },
      setWindowOpenHandler: (fn: (details: { url: string }) => unknown) => {
        openHandler = fn;
      },
    };
    guardContents(contents as never, own);
    const fire = (name: string, url: string, extra: Record<string, unknown> = {}): boolean => {
      let prevented = false;
      const handler = handlers.get(name);
      if (!handler) throw new Error(`no ${name} handler`);
      handler({ preventDefault: () => (prevented = true), ...extra }, url);
      return prevented;
    };
    return { fire, open: (url: string) => openHandler?.({ url }) };
  }

  it('prevents navigation and redirects away from our page', () => {
    const c = fakeContents();
    expect(c.fire('will-navigate', 'https://evil.example/')).toBe(true);
    expect(c.fire('will-navigate', 'file:///etc/passwd')).toBe(true);
    expect(c.fire('will-redirect', 'https://evil.example/')).toBe(true);
    expect(c.fire('will-navigate', own.indexUrl)).toBe(false);
  });

  it('prevents sub-frame navigation and web views', () => {
    const c = fakeContents();
    expect(c.fire('will-frame-navigate', 'https://evil.example/', { isMainFrame: false })).toBe(true);
    expect(c.fire('will-attach-webview', 'https://evil.example/')).toBe(true);
  });

  it('denies window.open for any URL', () => {
    const c = fakeContents();
    expect(c.open('https://example.com/')).toEqual({ action: 'deny' });
    expect(c.open(own.indexUrl)).toEqual({ action: 'deny' });
  });
});

describe('Content-Security-Policy', () => {
  it('is strict: default-src self, object-src none, no eval and no inline code', () => {
    const d = directives(CSP);
    expect(d.get('default-src')).toEqual(["'self'"]);
    expect(d.get('object-src')).toEqual(["'none'"]);
    expect(d.get('script-src')).toEqual(["'self'"]);
    expect(d.get('base-uri')).toEqual(["'none'"]);
    expect(CSP).not.toContain('unsafe-eval');
    expect(CSP).not.toContain('unsafe-inline');
    expect(CSP).not.toMatch(/\*/);
  });

  it('the development policy allows the dev server but still no eval', () => {
    const policy = devCsp('http://127.0.0.1:5173');
    const d = directives(policy);
    expect(d.get('default-src')).toEqual(["'self'"]);
    expect(d.get('object-src')).toEqual(["'none'"]);
    expect(d.get('connect-src')).toContain('ws://127.0.0.1:5173');
    expect(policy).not.toContain('unsafe-eval');
  });

  it('is sent for our file pages, the dev policy for the dev server, nothing for others', () => {
    expect(cspFor('file:///app/dist/renderer/index.html', own)).toBe(CSP);
    const withDev = { ...own, devOrigin: 'http://127.0.0.1:5173' };
    expect(cspFor('http://127.0.0.1:5173/src/main.tsx', withDev)).toBe(devCsp('http://127.0.0.1:5173'));
    expect(cspFor('https://example.com/', withDev)).toBeNull();
  });
});
