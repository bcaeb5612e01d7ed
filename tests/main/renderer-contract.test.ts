// The renderer and the main process meet at app/shared/ipc.ts. These check that what the
// renderer actually sends passes the main process's validators, so a change on either side that
// breaks the desktop app fails here rather than silently in a window nobody can run in CI.
import { describe, expect, it } from 'vitest';
import { menuItems } from '../../app/renderer/app/desktop.js';
import { useEditor } from '../../app/renderer/store/editor.js';
import { checkCloseReplyArgs, checkMenuArgs } from '../../app/main/ipc-validate.js';
import { serialiseJob } from '../../engine/index.js';

describe('renderer → main contract', () => {
  it('the command registry\'s menu descriptors pass the main process\'s checks', () => {
    const items = menuItems(useEditor.getState());
    const checked = checkMenuArgs([items]);
    expect(checked.ok ? 'ok' : checked.error).toBe('ok');
    expect(items.map((i) => i.id)).toEqual(expect.arrayContaining(['file.open', 'file.save', 'file.saveAs', 'file.exportPdf', 'file.print']));
  });

  it('the close reply the renderer would give passes', () => {
    const s = useEditor.getState();
    const checked = checkCloseReplyArgs(['0f6c2a1e-token', { dirty: s.dirty, text: serialiseJob(s.job) }]);
    expect(checked.ok).toBe(true);
  });
});
