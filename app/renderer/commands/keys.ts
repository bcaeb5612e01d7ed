// Shortcuts as text ('Mod+Shift+Z') and matching them against key events.

export interface KeyChord {
  mod: boolean;
  shift: boolean;
  alt: boolean;
  key: string; // lower-case key name: 'z', 'delete', '1', 'f2'
}

export function parseShortcut(text: string): KeyChord {
  const parts = text.split('+');
  const key = parts.pop()!;
  const chord: KeyChord = { mod: false, shift: false, alt: false, key: key.toLowerCase() };
  for (const p of parts) {
    if (p === 'Mod') chord.mod = true;
    else if (p === 'Shift') chord.shift = true;
    else if (p === 'Alt') chord.alt = true;
    else throw new Error(`unknown modifier ${p} in shortcut ${text}`);
  }
  return chord;
}

/** One canonical text per physical chord, so two spellings of one key compare equal. */
export function chordKey(c: KeyChord): string {
  return `${c.mod ? 'Mod+' : ''}${c.alt ? 'Alt+' : ''}${c.shift ? 'Shift+' : ''}${c.key}`;
}

export function isMac(platform: string = typeof navigator === 'undefined' ? '' : navigator.platform): boolean {
  return /mac|darwin/i.test(platform);
}

export function chordOf(e: Pick<KeyboardEvent, 'key' | 'ctrlKey' | 'metaKey' | 'shiftKey' | 'altKey' | 'code'>, mac = isMac()): KeyChord {
  // Digits and letters by their physical key, so Shift+1 is '1' (not '!') and Alt+S is 's' on a Mac.
  const physical = /^(?:Digit|Key)([0-9A-Z])$/.exec(e.code ?? '');
  const key = physical ? physical[1]!.toLowerCase() : e.key.toLowerCase();
  return { mod: mac ? e.metaKey : e.ctrlKey, shift: e.shiftKey, alt: e.altKey, key };
}

/** Electron accelerator for a shortcut; only chords with a modifier (plain keys stay in the page). */
export function accelerator(shortcut: string | null): string | null {
  if (!shortcut) return null;
  const c = parseShortcut(shortcut);
  if (!c.mod && !c.alt) return null;
  const key = c.key.length === 1 ? c.key.toUpperCase() : c.key[0]!.toUpperCase() + c.key.slice(1);
  return `${c.mod ? 'CmdOrCtrl+' : ''}${c.alt ? 'Alt+' : ''}${c.shift ? 'Shift+' : ''}${key}`;
}

/** How a shortcut is shown in tooltips and menus. */
export function showShortcut(shortcut: string, mac = isMac()): string {
  return shortcut.replace('Mod', mac ? '⌘' : 'Ctrl');
}
