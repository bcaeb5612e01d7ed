export { useEditor, HISTORY_LIMIT, type EditorState } from './editor.js';
export type { Edit, ApplyOutcome } from './edits.js';
export { applyEdit } from './edits.js';
export * from './selectors.js';
export { nextId, prefixFor, allIds } from './ids.js';
