// The File commands the native menu shows before the renderer has sent its own list (and keeps
// if it never does). Their ids are the renderer registry's ids for the same commands: a click
// sends the id on the `command` channel and the renderer runs it, calling window.loopwright.
// Once a window's renderer has called setMenu, its own list is used instead of this one.

import type { MenuDescriptor } from './ipc.js';

export const FILE_COMMANDS: readonly MenuDescriptor[] = [
  { id: 'file.new', label: 'New Job', accelerator: 'CmdOrCtrl+N', enabled: true, menu: 'file' },
  { id: 'file.open', label: 'Open…', accelerator: 'CmdOrCtrl+O', enabled: true, menu: 'file' },
  { id: 'file.save', label: 'Save', accelerator: 'CmdOrCtrl+S', enabled: true, menu: 'file', separatorBefore: true },
  { id: 'file.saveAs', label: 'Save As…', accelerator: 'CmdOrCtrl+Shift+S', enabled: true, menu: 'file' },
  { id: 'file.exportPdf', label: 'Export PDF…', accelerator: 'CmdOrCtrl+E', enabled: true, menu: 'file', separatorBefore: true },
  { id: 'file.print', label: 'Print…', accelerator: 'CmdOrCtrl+P', enabled: true, menu: 'file' },
];
