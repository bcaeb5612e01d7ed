// The renderer's build: root app/renderer, output dist/renderer, relative base so the Electron
// file:// load works. The Content-Security-Policy meta tag comes from app/shared/csp.ts.
import { defineConfig, type Plugin } from 'vite';
import react from '@vitejs/plugin-react';
import { fileURLToPath } from 'node:url';
import { CSP, devCsp } from './app/shared/csp.js';

const root = fileURLToPath(new URL('./app/renderer', import.meta.url));
const outDir = fileURLToPath(new URL('./dist/renderer', import.meta.url));

function csp(): Plugin {
  let policy = CSP;
  return {
    name: 'loopwright-csp',
    configResolved(config) {
      if (config.command === 'serve') policy = devCsp(`http://${config.server.host ?? '127.0.0.1'}:${config.server.port}`);
    },
    transformIndexHtml: {
      order: 'pre',
      handler: (html) => html.replace('%LOOPWRIGHT_CSP%', policy),
    },
  };
}

export default defineConfig({
  root,
  base: './',
  plugins: [react(), csp()],
  build: {
    outDir,
    emptyOutDir: true,
    chunkSizeWarningLimit: 3000,
    sourcemap: false,
    // The plugin-timing note is about build speed, not the build; keep the output quiet.
    rolldownOptions: { checks: { pluginTimings: false } },
  },
  server: { host: '127.0.0.1', port: 5173, strictPort: false, fs: { allow: [fileURLToPath(new URL('.', import.meta.url))] } },
});
