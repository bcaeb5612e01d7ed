// The Electron main process. Each concern is a module with one setup function, called once here.

import { app } from 'electron';
import { makeContext } from './context.js';
import { setupFiles } from './files.js';
import { setupLifecycle } from './lifecycle.js';
import { setupMenu } from './menu.js';
import { setupPrint } from './print.js';
import { guardContents, setupWindows } from './window.js';

app.setName('Loopwright');
// Every renderer is sandboxed, whatever a window's own options say.
app.enableSandbox();

const ctx = makeContext(app.getAppPath(), app.getPath('userData'), app.isPackaged, process.env);

if (!app.requestSingleInstanceLock()) {
  // Another Loopwright is running: it receives our arguments through `second-instance`.
  app.quit();
} else {
  // Every web contents, not only job windows (the hidden print page too), refuses navigation
  // away from our pages and never opens a window.
  app.on('web-contents-created', (_event, contents) => guardContents(contents, ctx.own));
  const lifecycle = setupLifecycle(ctx);
  app
    .whenReady()
    .then(async () => {
      await setupWindows(ctx);
      await setupFiles(ctx);
      setupMenu(ctx);
      setupPrint(ctx);
      await lifecycle.start();
    })
    .catch((error: unknown) => {
      console.error(`Loopwright could not start: ${error instanceof Error ? (error.stack ?? error.message) : String(error)}`);
      app.exit(1);
    });
}
