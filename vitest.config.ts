import { defineConfig } from 'vitest/config';

// Three projects: the engine and command line (node), the renderer (jsdom),
// and end-to-end runs against the browser build in headless Chromium.
export default defineConfig({
  test: {
    projects: [
      {
        test: {
          name: 'engine',
          environment: 'node',
          include: ['tests/engine/**/*.test.ts', 'tests/cli/**/*.test.ts', 'tests/report/**/*.test.ts', 'tests/main/**/*.test.ts'],
          setupFiles: ['tests/engine/setup.ts'],
          testTimeout: 60_000,
        },
      },
      {
        test: {
          name: 'app',
          environment: 'jsdom',
          include: ['tests/app/**/*.test.{ts,tsx}'],
          setupFiles: ['tests/app/setup.ts'],
        },
      },
      {
        test: {
          name: 'e2e',
          environment: 'node',
          include: ['tests/e2e/**/*.test.ts'],
          testTimeout: 120_000,
          hookTimeout: 180_000,
          fileParallelism: false,
        },
      },
    ],
  },
});
