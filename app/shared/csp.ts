// The renderer's Content-Security-Policy, in one place. The main process sends it as a response
// header for every page it loads (app/main/window.ts) and the renderer's index.html carries the
// same policy in a <meta http-equiv="Content-Security-Policy"> tag (vite.config.ts injects it), so
// the page is protected even where headers do not apply (file:// in some set-ups, the browser build).
//
// No 'unsafe-eval' and no 'unsafe-inline' in production: every script and style comes from the
// app's own files. `frame-ancestors` is left out because a <meta> policy ignores it.

type Directives = Record<string, string[]>;

const PRODUCTION: Directives = {
  'default-src': ["'self'"],
  'script-src': ["'self'"],
  'style-src': ["'self'"],
  'img-src': ["'self'", 'data:', 'blob:'],
  'font-src': ["'self'", 'data:'],
  'connect-src': ["'self'"],
  'worker-src': ["'self'", 'blob:'],
  'object-src': ["'none'"],
  'base-uri': ["'none'"],
  'form-action': ["'none'"],
};

function render(directives: Directives): string {
  return Object.entries(directives)
    .map(([name, values]) => `${name} ${values.join(' ')}`)
    .join('; ');
}

/** The policy for the built app (desktop file:// pages and the browser build). */
export const CSP: string = render(PRODUCTION);

/**
 * The policy while developing against the Vite dev server: Vite injects its CSS as <style>
 * elements and the React plugin adds an inline refresh preamble, and hot reload talks over a
 * WebSocket to the dev server. Still no 'unsafe-eval' and object-src 'none'.
 */
export function devCsp(devOrigin: string): string {
  const ws = devOrigin.replace(/^http/, 'ws');
  return render({
    ...PRODUCTION,
    'script-src': ["'self'", "'unsafe-inline'"],
    'style-src': ["'self'", "'unsafe-inline'"],
    'connect-src': ["'self'", devOrigin, ws],
  });
}
