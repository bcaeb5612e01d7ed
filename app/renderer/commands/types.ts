// What a command is, and what it may reach when it runs.
import type { MenuGroup } from '../../shared/ipc.js';
import type { EditorState } from '../store/editor.js';
import type { useEditor } from '../store/editor.js';

export type { MenuGroup };

/** The sheet's imperative side, registered by the sheet when it mounts. */
export interface SheetHandle {
  fit(): void;
  centre(ids: string[]): void;
  /** Where a new part goes: the last cursor position on the sheet, else the middle of the view. */
  cursor(): { x: number; y: number };
}

/** Everything a command may need to do its work. */
export interface CommandContext {
  store: typeof useEditor;
  sheet: SheetHandle | null;
  /** Opens the file chooser (browser) or the Open dialog (desktop). */
  open(): Promise<void>;
  save(saveAs: boolean): Promise<void>;
  print(): Promise<void>;
  exportPdf(): Promise<void>;
  newJob(): void;
  openFind(): void;
  openAbout(): void;
  /** True when the keyboard focus is in a text field (text commands then act on the field). */
  typing(): boolean;
  desktop: boolean;
}

export interface Command {
  id: string;
  label: string;
  /** e.g. 'Mod+Z', 'Mod+Shift+Z', 'Delete'; Mod is Ctrl, or ⌘ on a Mac. */
  shortcut: string | null;
  /** Further keys for the same command (never shown in menus). */
  alternates?: string[];
  group: MenuGroup;
  /** Shown on the toolbar with this short text. */
  toolbar?: string;
  /** Shown in the sheet's context menu. */
  contextMenu?: boolean;
  separatorBefore?: boolean;
  /** Only in the desktop app: left out of the browser's toolbar, menus and key list (its key does nothing there). */
  desktopOnly?: boolean;
  enabled(state: EditorState, ctx: { desktop: boolean }): boolean;
  run(ctx: CommandContext): void | Promise<void>;
}
