import { spawnSync } from 'node:child_process';
import path from 'node:path';
import { describe, expect, it } from 'vitest';

const START = path.resolve('scripts/start.mjs');

describe('npm start without the Electron runtime', () => {
  it('says in one line what is missing and how to use the browser build, and exits 1', () => {
    const run = spawnSync(process.execPath, [START], {
      env: { ...process.env, LOOPWRIGHT_NO_ELECTRON: '1' },
      encoding: 'utf8',
    });
    expect(run.status).toBe(1);
    expect(run.stdout).toBe('');
    expect(run.stderr).toBe(
      'Electron runtime is missing (could not download it); run "npm run web" to use Loopwright in your browser at http://127.0.0.1:5173\n',
    );
  });
});
