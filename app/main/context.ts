// Where the app's parts live at run time, worked out once at start-up.
// Built layout (package.json "main" is dist/main/main.cjs):
//   <app>/dist/main/main.cjs  <app>/dist/preload/preload.cjs  <app>/dist/renderer/index.html
//   <app>/assets/demo.lwj
// LOOPWRIGHT_DEV_SERVER=http://127.0.0.1:5173 loads the renderer from the Vite dev server instead.

import path from 'node:path';
import { pathToFileURL } from 'node:url';
import type { OwnOrigins } from './ipc-validate.js';

export interface AppContext {
  appDir: string;
  userData: string;
  preloadPath: string;
  indexPath: string;
  own: OwnOrigins;
  demoPath: string;
  platform: NodeJS.Platform;
  isPackaged: boolean;
}

/** Accepts only a loopback http origin for the dev server: the dev switch must not be a way to
 *  load a remote page with our preload. */
export function devOriginFrom(value: string | undefined): string | null {
  if (!value) return null;
  try {
    const url = new URL(value);
    const loopback = url.hostname === '127.0.0.1' || url.hostname === 'localhost' || url.hostname === '[::1]';
    return url.protocol === 'http:' && loopback ? url.origin : null;
  } catch {
    return null;
  }
}

export function makeContext(appDir: string, userData: string, isPackaged: boolean, env: NodeJS.ProcessEnv): AppContext {
  const indexPath = path.join(appDir, 'dist', 'renderer', 'index.html');
  return {
    appDir,
    userData,
    preloadPath: path.join(appDir, 'dist', 'preload', 'preload.cjs'),
    indexPath,
    own: { indexUrl: pathToFileURL(indexPath).href, devOrigin: isPackaged ? null : devOriginFrom(env.LOOPWRIGHT_DEV_SERVER) },
    demoPath: path.join(appDir, 'assets', 'demo.lwj'),
    platform: process.platform,
    isPackaged,
  };
}
