// The sheet's context menu: registry commands marked for it, at the cursor.
import { useEffect } from 'react';
import { useShallow } from 'zustand/react/shallow';
import { useEditor } from '../store/editor.js';
import { COMMANDS } from '../commands/registry.js';
import { runCommand } from '../commands/context.js';
import { showShortcut } from '../commands/keys.js';
import { useUi } from './ui.js';

const desktop = typeof window !== 'undefined' && window.loopwright !== undefined;
const items = COMMANDS.filter((c) => c.contextMenu && (!c.desktopOnly || desktop));
const NONE: boolean[] = [];

export function ContextMenu() {
  const at = useUi((s) => s.contextMenu);
  // Whether each item is enabled, and only while the menu is open.
  const enabled = useEditor(useShallow((s) => (at ? items.map((c) => c.enabled(s, { desktop })) : NONE)));
  useEffect(() => {
    if (!at) return;
    const close = (e: Event) => {
      if (!(e.target as Element | null)?.closest?.('.lw-menu')) useUi.getState().set({ contextMenu: null });
    };
    const key = (e: KeyboardEvent) => e.key === 'Escape' && useUi.getState().set({ contextMenu: null });
    window.addEventListener('mousedown', close);
    window.addEventListener('keydown', key);
    return () => {
      window.removeEventListener('mousedown', close);
      window.removeEventListener('keydown', key);
    };
  }, [at]);
  if (!at) return null;
  return (
    <div className="lw-menu" role="menu" style={{ left: at.x, top: at.y }}>
      {items.map((c, i) => (
        <button
          key={c.id}
          type="button"
          role="menuitem"
          data-command={c.id}
          className={c.separatorBefore ? 'lw-menu-sep' : undefined}
          disabled={!enabled[i]}
          onClick={() => runCommand(c.id)}
        >
          <span>{c.label}</span>
          {c.shortcut && <kbd>{showShortcut(c.shortcut)}</kbd>}
        </button>
      ))}
    </div>
  );
}
