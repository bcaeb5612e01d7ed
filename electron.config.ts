// Packaging for the desktop app (electron-builder): `npm run dist` builds, then packages into release/.
// Only the built app and the assets ship: dist/main, dist/preload, dist/renderer and assets/
// (demo job, icons, fonts). The .lwj association makes a double-click open the job in Loopwright
// (app/main/lifecycle.ts handles the file from argv, `open-file` and `second-instance`).

import type { Configuration } from 'electron-builder';

const config: Configuration = {
  appId: 'app.loopwright.desktop',
  productName: 'Loopwright',
  copyright: 'Copyright © Loopwright',
  directories: {
    output: 'release',
    buildResources: 'assets/build',
  },
  files: ['dist/**', 'assets/**', 'package.json', '!**/*.map', '!dist/cli/**'],
  asar: true,
  fileAssociations: [
    {
      ext: 'lwj',
      name: 'Loopwright job',
      description: 'Loopwright installation design',
      mimeType: 'application/x-loopwright-job',
      role: 'Editor',
    },
  ],
  win: {
    target: [{ target: 'nsis', arch: ['x64'] }],
  },
  nsis: {
    oneClick: false,
    perMachine: false,
    allowToChangeInstallationDirectory: true,
  },
  mac: {
    target: [{ target: 'dmg', arch: ['x64', 'arm64'] }],
    category: 'public.app-category.productivity',
    hardenedRuntime: true,
  },
  linux: {
    target: [
      { target: 'AppImage', arch: ['x64'] },
      { target: 'deb', arch: ['x64'] },
    ],
    category: 'Engineering',
    maintainer: 'Loopwright',
  },
};

export default config;
