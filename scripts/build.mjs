// `npm run build`: the desktop app into dist/.
//   dist/main/main.cjs        the main process (app/main/main.ts), esbuild, Node/CommonJS
//   dist/preload/preload.cjs  the sandboxed preload (app/preload/preload.ts), esbuild, CommonJS
//   dist/renderer/            the React app, `vite build` with the project's vite.config.ts
//   dist/fonts/               the printout's fonts (DejaVu Sans), for Print and Export PDF
//   dist/cli/loopwright.mjs   the command line (app/cli/main.ts), esbuild, Node/ESM, run by
//                             bin/loopwright.mjs; its chunks in dist/cli/chunks/
// Flags: --no-renderer builds main, preload and the command line only (quick rebuilds while
// working on the shell); --cli-only builds the command line alone (the `prepare` script, run
// by `npm ci` and `npm install`, so `npx loopwright` works on a fresh clone).
import { copyFileSync, existsSync, mkdirSync, renameSync, rmSync } from 'node:fs';
import { createRequire } from 'node:module';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';

const root = fileURLToPath(new URL('..', import.meta.url));

/** esbuild, loaded when something is built (bin/loopwright.mjs imports this file to rebuild a
 *  missing bundle, and must get a plain failure, not a crash, where esbuild is not installed). */
async function esbuild(options) {
  const { build } = await import('esbuild');
  return build(options);
}

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

/** esbuild options for the command line, written into `outDir` (tests build a copy elsewhere).
 *  ESM with code splitting, so that the dynamic imports stay dynamic: the entry loads only the
 *  dispatcher at start, and the PDF writer (app/report/pdf.ts, with pdfkit) only when `report`
 *  runs. pdfkit stays external: it reads its own data files from its package folder. */
export function cliOptions(outDir = resolve(root, 'dist/cli')) {
  return {
    entryPoints: { loopwright: 'app/cli/main.ts' },
    bundle: true,
    splitting: true,
    platform: 'node',
    format: 'esm',
    target: 'node20',
    external: ['pdfkit'],
    outdir: outDir,
    outExtension: { '.js': '.mjs' },
    chunkNames: 'chunks/[name]-[hash]',
    sourcemap: 'linked',
    metafile: true,
    logLevel: 'warning',
    absWorkingDir: root,
    legalComments: 'none',
  };
}

/** The command line as one entry file and its chunks in `outDir` (default dist/cli). Built beside
 *  it first and then moved into place, so a program running from the old bundle never meets a
 *  half-written one and no stale chunks are left behind. Returns the folder and esbuild's
 *  metafile (the tests read which module imports which). */
export async function buildCli(outDir = resolve(root, 'dist/cli')) {
  const parent = dirname(outDir);
  mkdirSync(parent, { recursive: true });
  const unique = `${process.pid}-${Date.now().toString(36)}-${Math.random().toString(36).slice(2, 8)}`;
  const fresh = join(parent, `.cli-new-${unique}`);
  const stale = join(parent, `.cli-old-${unique}`);
  let result;
  try {
    result = await esbuild(cliOptions(fresh));
  } catch (error) {
    rmSync(fresh, { recursive: true, force: true });
    throw error;
  }
  if (existsSync(outDir)) renameSync(outDir, stale);
  try {
    renameSync(fresh, outDir);
  } catch (error) {
    // Another build put its (equivalent) bundle in place between the two renames: keep that one.
    rmSync(fresh, { recursive: true, force: true });
    if (!existsSync(outDir)) throw error;
  }
  rmSync(stale, { recursive: true, force: true });
  return { outDir, metafile: result.metafile };
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
  await buildCli();
  copyFonts();
  if (renderer) await buildRenderer();
}

if (process.argv[1] && resolve(process.argv[1]) === fileURLToPath(import.meta.url)) {
  const cliOnly = process.argv.includes('--cli-only');
  const renderer = !cliOnly && !process.argv.includes('--no-renderer');
  const work = cliOnly ? buildCli() : buildAll({ renderer });
  work.then(
    () => console.log(cliOnly ? 'Built dist/cli' : `Built dist/main, dist/preload, dist/cli${renderer ? ', dist/renderer' : ''}`),
    (error) => {
      // `npm ci --omit=dev` has no esbuild: the install goes on, and bin/loopwright.mjs says how
      // to build the command line when it is run.
      if (cliOnly && error?.code === 'ERR_MODULE_NOT_FOUND' && /'esbuild'/.test(String(error.message))) {
        console.warn('dist/cli not built: esbuild is not installed (a development dependency); run `npm install`, then `npm run build:cli`');
        return;
      }
      console.error(`Build failed: ${error instanceof Error ? error.message : String(error)}`);
      process.exit(1);
    },
  );
}
