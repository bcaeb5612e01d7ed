// The sheet's imperative handle, registered while the sheet is mounted.
import type { SheetHandle } from '../commands/types.js';

let current: SheetHandle | null = null;

export function setSheetHandle(h: SheetHandle | null): void {
  current = h;
}

export function getSheetHandle(): SheetHandle | null {
  return current;
}
