import { spawnSync } from 'node:child_process';
import path from 'node:path';
import { describe, expect, it } from 'vitest';

const START = path.resolve('scripts/start.mjs');

describe('npm start without the Electron runtime', () => {
  it('says in one line what is missing and how to use the browser build, then checks the demo job', () => {
    const run = spawnSync(process.execPath, [START], {
      env: { ...process.env, LOOPWRIGHT_NO_ELECTRON: '1' },
      encoding: 'utf8',
    });
    expect(run.status).toBe(0);
    // The main job still runs: the command-line check of the demo (worst path, summary, caution).
    expect(run.stdout).toMatch(/Worst fault path: S1 → /);
    expect(run.stdout).toMatch(/\d+ pass, 1 fail, 1 RCD-reliant/);
    expect(run.stdout).toMatch(/design aid/);
    expect(run.stderr).toBe(
      'Electron runtime is missing (could not download it); run "npm run web" to use Loopwright in your browser at http://127.0.0.1:5173\n',
    );
  });
});
