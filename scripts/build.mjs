// `npm run build`: the desktop app into dist/.
//   dist/main/main.cjs        the main process (app/main/main.ts), esbuild, Node/CommonJS
//   dist/preload/preload.cjs  the sandboxed preload (app/preload/preload.ts), esbuild, CommonJS
//   dist/renderer/            the React app, `vite build` with the project's vite.config.ts
//   dist/fonts/               the printout's fonts (DejaVu Sans), for Print and Export PDF
// Flags: --no-renderer builds main and preload only (quick rebuilds while working on the shell).
import { build as esbuild } from 'esbuild';
import { copyFileSync, existsSync, mkdirSync } from 'node:fs';
import { createRequire } from 'node:module';
import { resolve } from 'node:path';
import { fileURLToPath } from 'node:url';

const root = fileURLToPath(new URL('..', import.meta.url));

/** esbuild options for main and preload, written under `outRoot` (tests build a copy elsewhere). */
export function shellOptions(outRoot = resolve(root, 'dist')) {
  const common = {
    bundle: true,
    platform: 'node',
    format: 'cjs',
    target: 'node20',
    external: ['electron'],
    sourcemap: 'linked',
    logLevel: 'warning',
    absWorkingDir: root,
    legalComments: 'none',
    // app/report/fonts.ts checks for import.meta itself and uses require() in a CommonJS bundle.
    logOverride: { 'empty-import-meta': 'silent' },
  };
  return {
    // pdfkit reads its own data files from its package folder, so it stays a runtime dependency.
    main: { ...common, external: ['electron', 'pdfkit'], entryPoints: ['app/main/main.ts'], outfile: resolve(outRoot, 'main/main.cjs') },
    // The sandboxed preload may only require('electron') and a few built-ins: nothing else is external.
    preload: { ...common, entryPoints: ['app/preload/preload.ts'], outfile: resolve(outRoot, 'preload/preload.cjs') },
  };
}

/** Main and preload, bundled with their share of the engine; `electron` is provided at run time. */
export async function buildShell(outRoot) {
  const options = shellOptions(outRoot);
  await esbuild(options.main);
  await esbuild(options.preload);
}

/** The printout fonts go with the app (the font package is a development dependency). */
export function copyFonts() {
  const require = createRequire(import.meta.url);
  const out = resolve(root, 'dist/fonts');
  mkdirSync(out, { recursive: true });
  for (const file of ['DejaVuSans.ttf', 'DejaVuSans-Bold.ttf']) {
    copyFileSync(require.resolve(`dejavu-fonts-ttf/ttf/${file}`), resolve(out, file));
  }
}

export async function buildRenderer() {
  const configFile = resolve(root, 'vite.config.ts');
  if (!existsSync(configFile)) throw new Error(`vite.config.ts is missing at ${configFile}`);
  const { build } = await import('vite');
  await build({ configFile, root: resolve(root, 'app/renderer'), base: './', logLevel: 'warn' });
}

export async function buildAll({ renderer = true } = {}) {
  await buildShell();
  copyFonts();
  if (renderer) await buildRenderer();
}

if (process.argv[1] && resolve(process.argv[1]) === fileURLToPath(import.meta.url)) {
  const renderer = !process.argv.includes('--no-renderer');
  buildAll({ renderer }).then(
    () => console.log(`Built dist/main, dist/preload${renderer ? ', dist/renderer' : ''}`),
    (error) => {
      console.error(`Build failed: ${error instanceof Error ? error.message : String(error)}`);
      process.exit(1);
    },
  );
}
