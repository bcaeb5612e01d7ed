import { beforeEach, describe, expect, it } from 'vitest';
import { COMMANDS, getCommand } from '../../app/renderer/commands/registry.js';
import { chordKey, parseShortcut, accelerator, chordOf } from '../../app/renderer/commands/keys.js';
import { shortcutTable } from '../../app/renderer/commands/keyboard.js';
import { collectSubtree, pasteEdit } from '../../app/renderer/commands/clipboard.js';
import { runCommand } from '../../app/renderer/commands/context.js';
import { menuItems } from '../../app/renderer/app/desktop.js';
import { useEditor } from '../../app/renderer/store/index.js';
import { FILE_COMMANDS } from '../../app/shared/commands-menu.js';
import { smallJob } from './fixture.js';

const s = () => useEditor.getState();
beforeEach(() => s().loadJob(smallJob(), { name: 'test.lwj' }));

describe('command registry', () => {
  it('has unique ids', () => {
    const ids = COMMANDS.map((c) => c.id);
    expect(new Set(ids).size).toBe(ids.length);
  });

  it('refuses two commands on one key (shortcuts and alternates, in canonical form)', () => {
    const owner = new Map<string, string>();
    const clashes: string[] = [];
    for (const c of COMMANDS) {
      for (const key of [c.shortcut, ...(c.alternates ?? [])]) {
        if (!key) continue;
        const k = chordKey(parseShortcut(key));
        if (owner.has(k) && owner.get(k) !== c.id) clashes.push(`${key}: ${owner.get(k)} and ${c.id}`);
        owner.set(k, c.id);
      }
    }
    expect(clashes).toEqual([]);
    // In the browser (no desktop API here) a desktop-only command's key is left to the browser.
    const desktopOnly = COMMANDS.filter((c) => c.desktopOnly).flatMap((c) => [c.shortcut, ...(c.alternates ?? [])]).filter(Boolean);
    expect(desktopOnly).toEqual(['Mod+E']);
    expect(shortcutTable().size).toBe(owner.size - desktopOnly.length);
    expect(shortcutTable().has('Mod+e')).toBe(false);
  });

  it('the check itself catches a clash (two spellings of one chord)', () => {
    expect(chordKey(parseShortcut('Shift+Mod+Z'))).toBe(chordKey(parseShortcut('Mod+Shift+Z')));
  });

  it('has the commands the editor needs', () => {
    for (const id of ['file.new', 'file.open', 'file.save', 'file.saveAs', 'file.print', 'file.exportPdf', 'edit.undo', 'edit.redo', 'edit.delete',
      'edit.copy', 'edit.paste', 'edit.selectAll', 'edit.find', 'view.fit', 'arrange.auto', 'view.traceWorst', 'insert.supply', 'insert.board', 'insert.point']) {
      expect(getCommand(id), id).toBeDefined();
    }
  });

  it('uses the shell’s ids for the file commands', () => {
    for (const f of FILE_COMMANDS) expect(getCommand(f.id)?.id).toBe(f.id);
  });

  it('builds native menu items with Electron accelerators only for modifier chords', () => {
    const items = menuItems(s());
    expect(items.find((i) => i.id === 'edit.undo')).toMatchObject({ accelerator: 'CmdOrCtrl+Z', enabled: false, menu: 'edit' });
    expect(items.find((i) => i.id === 'edit.delete')?.accelerator).toBeNull();
    expect(accelerator('Mod+Shift+S')).toBe('CmdOrCtrl+Shift+S');
    for (const i of items) expect(i.label.length).toBeLessThanOrEqual(80);
  });

  it('matches key events by physical key', () => {
    const e = { key: '!', code: 'Digit1', ctrlKey: false, metaKey: false, shiftKey: true, altKey: false };
    expect(chordKey(chordOf(e, false))).toBe(chordKey(parseShortcut('Shift+1')));
  });

  it('undo, select all, delete and trace run through the registry', () => {
    runCommand('edit.selectAll');
    expect(s().selection.nodes).toHaveLength(4);
    expect(s().selection.links).toHaveLength(3);
    s().select({ nodes: ['P2'], links: [] });
    runCommand('edit.delete');
    expect(s().job.nodes.map((n) => n.id)).not.toContain('P2');
    expect(s().job.links.map((l) => l.id)).not.toContain('C2');
    runCommand('edit.undo');
    expect(s().job.links.map((l) => l.id)).toContain('C2');
    runCommand('view.traceWorst');
    const worst = s().results.worst!;
    expect(s().highlightPath).toEqual(worst.path);
    expect(s().breakdownLink).toBe(worst.link);
  });
});

describe('copy and paste with the subtree', () => {
  it('copying a board copies the links and nodes below it', () => {
    const clip = collectSubtree(s().job, { nodes: ['MSB'], links: [] });
    expect(clip.nodes.map((n) => n.id).sort()).toEqual(['MSB', 'P1', 'P2']);
    expect(clip.links.map((l) => l.id).sort()).toEqual(['C1', 'C2']);
  });

  it('pastes with fresh ids, re-pointed links and an offset, as one undo step', () => {
    const clip = collectSubtree(s().job, { nodes: ['MSB'], links: [] });
    const { edit, ids } = pasteEdit(s().job, clip, { x: 40, y: 40 });
    expect(s().apply(edit, 'paste').ok).toBe(true);
    expect(ids.nodes).toEqual(['MSB1', 'P3', 'P4']);
    expect(ids.links).toEqual(['C3', 'C4']);
    const job = s().job;
    expect(job.links.find((l) => l.id === 'C3')).toMatchObject({ from: 'MSB1', to: 'P3' });
    expect(job.nodes.find((n) => n.id === 'P3')?.at).toEqual({ x: -160, y: 360 });
    // The pasted board is not fed (a warning, not an error); its circuits are unchecked.
    expect(s().resultById.C3?.status).toBe('unchecked');
    s().undo();
    expect(s().job.nodes).toHaveLength(4);
  });

  it('copy and paste commands select what was pasted', () => {
    s().select({ nodes: ['MSB'], links: [] });
    runCommand('edit.copy');
    runCommand('edit.paste');
    expect(s().selection.nodes.sort()).toEqual(['MSB1', 'P3', 'P4']);
    runCommand('edit.paste');
    expect(s().job.nodes.find((n) => n.id === 'MSB2')?.at).toEqual({ x: 80, y: 240 });
  });

  it('says what was copied, then what was pasted', () => {
    s().select({ nodes: ['MSB'], links: [] });
    runCommand('edit.copy');
    expect(s().message?.text).toBe('Copied 3 nodes and 2 links');
    runCommand('edit.paste');
    expect(s().message).toEqual({ kind: 'info', text: 'Pasted 5 elements (3 nodes, 2 links)' });
  });
});

describe('tracing a selected loop', () => {
  it('highlights the path from the supply, and refuses a link no supply reaches', () => {
    s().select({ nodes: [], links: ['C2'] });
    runCommand('view.traceSelected');
    expect(s().highlightPath).toEqual(['S1', 'M1', 'MSB', 'C2', 'P2']);
    expect(s().breakdownLink).toBe('C2');
    s().setHighlight(null, null);
    s().apply({ op: 'remove', ids: ['M1'] });
    s().select({ nodes: [], links: ['C1'] });
    runCommand('view.traceSelected');
    expect(s().highlightPath).toBeNull();
    expect(s().message).toEqual({ kind: 'error', text: 'C1 is not fed from a supply, so it has no fault loop to trace' });
  });
});
