// Keyboard shortcuts from the registry. While the user types in a field, plain keys and the
// text shortcuts stay with the field.
import { useEffect } from 'react';
import { chordKey, chordOf, parseShortcut } from './keys.js';
import { COMMANDS } from './registry.js';
import { isTyping, runCommand } from './context.js';

/** Chord → command id, for every shortcut and alternate. */
export function shortcutTable(): Map<string, string> {
  const table = new Map<string, string>();
  const desktop = typeof window !== 'undefined' && window.loopwright !== undefined;
  for (const c of COMMANDS) {
    // A desktop-only command's key stays with the browser there (Ctrl+E is not taken for nothing).
    if (c.desktopOnly && !desktop) continue;
    for (const s of [c.shortcut, ...(c.alternates ?? [])]) {
      if (s) table.set(chordKey(parseShortcut(s)), c.id);
    }
  }
  return table;
}

const TEXT_KEYS = new Set(['Mod+z', 'Mod+Shift+z', 'Mod+y', 'Mod+c', 'Mod+x', 'Mod+v', 'Mod+a', 'delete', 'backspace', 'escape']);

export function useShortcuts(): void {
  useEffect(() => {
    const table = shortcutTable();
    const onKey = (e: KeyboardEvent) => {
      if (e.defaultPrevented || e.isComposing) return;
      const key = chordKey(chordOf(e));
      const id = table.get(key);
      if (!id) return;
      if (isTyping(e.target as Element) && (TEXT_KEYS.has(key) || !/^(Mod|Alt)\+/.test(key))) return;
      // Menus and dialogs handle their own keys.
      if ((e.target as Element | null)?.closest?.('[role="dialog"], [role="menu"]')) return;
      // A disabled command leaves the key to the browser (Ctrl+C still copies page text).
      if (runCommand(id)) e.preventDefault();
    };
    window.addEventListener('keydown', onKey);
    return () => window.removeEventListener('keydown', onKey);
  }, []);
}
