// The IPC contract between the Electron main process, the preload and the renderer.
// The preload exposes exactly one object, `window.loopwright`, of type LoopwrightApi; nothing
// else crosses. In the browser build `window.loopwright` is undefined and the renderer uses a
// file input and downloads instead.
//
// Every channel that the renderer can reach is listed in CHANNELS; the main process checks the
// sender frame and validates every argument (app/main/ipc-validate.ts) before acting.

/** A job file handed to the renderer: its text exactly as read, for the renderer's parseJob. */
export interface OpenedJob {
  /** Absolute path of the file, or null for an untitled job (the shipped demo opens untitled,
   *  so Save asks where to put it and the demo itself is never written over). */
  path: string | null;
  /** What to show in the title bar: the file's base name, e.g. "Warehouse.lwj". */
  name: string;
  /** The file's text (UTF-8). */
  text: string;
}

export interface SavedJob {
  /** Where the job now lives. */
  path: string;
  /** Its base name, for the title bar. */
  name: string;
}

/** Paper for the printout. The report's default is A3 landscape. */
export interface PaperChoice {
  size: 'A3' | 'A4';
  orientation: 'landscape' | 'portrait';
}

/** Top-level menus the renderer may place commands in (File is shared with the main process,
 *  which adds Open Recent, Close and Quit itself). */
export type MenuGroup = 'file' | 'edit' | 'view' | 'arrange' | 'help';

/** One command as the native menu shows it. The renderer's command registry sends these. */
export interface MenuDescriptor {
  /** Command id from the renderer's registry, e.g. "edit.undo": starts with a lower-case letter,
   *  then letters, digits, "_" or "-", in parts joined by "." or ":"; at most 64 characters; unique
   *  in the list. A click sends this id back on the `command` channel. */
  id: string;
  /** Label as shown, at most 80 characters; "…" for commands that ask something first. */
  label: string;
  /** Electron accelerator, e.g. "CmdOrCtrl+Shift+Z", or null for none. */
  accelerator: string | null;
  enabled: boolean;
  menu: MenuGroup;
  /** Draw a separator above this item. */
  separatorBefore?: boolean;
}

/** The renderer's answer when the window is about to close. */
export interface CloseReply {
  /** True when the job has changes that are not saved. */
  dirty: boolean;
  /** The job's current text (serialiseJob), used if the user chooses Save. */
  text: string;
}

/** The one object the preload exposes as `window.loopwright`. */
export interface LoopwrightApi {
  /** 'darwin' | 'win32' | 'linux': lets the renderer show ⌘ or Ctrl in shortcut hints. */
  readonly platform: string;
  /** Shows the Open dialog. Resolves with the job when it is to replace this window's job (this
   *  window has no unsaved changes and no file yet); null when cancelled, when the file was refused
   *  (the main process shows its problems in a message box) or when it opened in a window of its own. */
  openJob(): Promise<OpenedJob | null>;
  /** Saves `text`. With saveAs false and a path, writes to that path (it must be the path this
   *  window opened or last saved to); otherwise shows the Save dialog. Resolves null when
   *  cancelled or refused (the main process says why in a message box). */
  saveJob(text: string, path: string | null, saveAs: boolean): Promise<SavedJob | null>;
  /** Builds the printout from `text` and writes it where the user chooses. */
  exportPdf(text: string, paper?: PaperChoice): Promise<SavedJob | null>;
  /** Prints the printout's sheets through the system print dialog. True when sent to a printer. */
  print(text: string, paper?: PaperChoice): Promise<boolean>;
  /** Prints the test sheets alone (one per board, as `report --test-sheet` writes them) through the
   *  system print dialog. True when sent to a printer. */
  printTestSheets(text: string, paper?: PaperChoice): Promise<boolean>;
  /** Builds the native menu from the registry's commands. Send once at start and again whenever
   *  labels, shortcuts or enabled states change. */
  setMenu(items: MenuDescriptor[]): void;
  /** Tells the main process whether there are unsaved changes (used for the close prompt and the
   *  reuse of windows) and the job's name for the title bar, e.g. "Warehouse.lwj" or the job's title;
   *  the main process adds the unsaved mark and " — Loopwright" (and strips them if sent). Call on
   *  every change of either. */
  setDirty(dirty: boolean, title: string): void;
  /** A menu item was chosen: `id` is one of the ids from setMenu (or the fallback file commands
   *  in app/shared/commands-menu.ts before the first setMenu). Returns an unsubscribe function. */
  onCommand(listener: (id: string) => void): () => void;
  /** A job to load into this window (at start, from the command line, the file association,
   *  Open Recent). Messages that arrive before the first listener are kept and delivered to it. */
  onOpenFile(listener: (job: OpenedJob) => void): () => void;
  /** Called when the window is about to close; answer with the dirty state and the job text.
   *  Only the latest handler counts. Returns an unsubscribe function. */
  onCloseRequest(handler: () => CloseReply | Promise<CloseReply>): () => void;
}

/** Channel names. `invoke` channels answer; `send` channels do not; `push` go main → renderer. */
export const CHANNELS = {
  openJob: 'loopwright:open-job', // invoke () → OpenedJob | null
  saveJob: 'loopwright:save-job', // invoke (text, path, saveAs) → SavedJob | null
  exportPdf: 'loopwright:export-pdf', // invoke (text, paper?) → SavedJob | null
  print: 'loopwright:print', // invoke (text, paper?) → boolean
  printTestSheets: 'loopwright:print-test-sheets', // invoke (text, paper?) → boolean
  setMenu: 'loopwright:set-menu', // send (items)
  setDirty: 'loopwright:set-dirty', // send (dirty, title)
  closeReply: 'loopwright:close-reply', // send (token, CloseReply | null)
  command: 'command', // push (id)
  openFile: 'loopwright:open-file', // push (OpenedJob)
  closeRequest: 'loopwright:close-request', // push (token)
} as const;

export type Channel = (typeof CHANNELS)[keyof typeof CHANNELS];

/** Limits the main process enforces on what the renderer sends. */
export const LIMITS = {
  /** Largest job text accepted over IPC (characters). A 2,000-circuit job is well under 5 MB. */
  jobText: 50 * 1024 * 1024,
  path: 4096,
  title: 200,
  label: 80,
  commandId: 64,
  accelerator: 60,
  menuItems: 300,
  closeToken: 64,
} as const;

declare global {
  interface Window {
    /** Present in the desktop app only. */
    loopwright?: LoopwrightApi;
  }
}
