// The renderer's store: the job (saved), session state (selection, highlight, file) and
// derived results (analyse(job), recomputed once per change). Every edit goes through apply(),
// is validated by the engine and becomes one undo step.
import { create } from 'zustand';
import { newJob, type CircuitResult, type Job, type Results } from '../../../engine/index.js';
import { derive, rehearseDerive } from './derive.js';
import { whenIdle } from './idle.js';
import { idFollower } from './renames.js';
import { firstError, describe } from './derive.js';
import { applyEdit, EditError, onlyMoves, touchedIds, type ApplyOutcome, type Edit } from './edits.js';
import { positionsForMissing } from '../sheet/arrange.js';

export type { Edit, ApplyOutcome } from './edits.js';

/** Undo steps kept. */
export const HISTORY_LIMIT = 200;

interface Step {
  job: Job;
  label: string;
}

export interface EditorState {
  job: Job;
  results: Results;
  resultById: Record<string, CircuitResult>;
  selection: { nodes: string[]; links: string[] };
  fileName: string | null;
  filePath: string | null;
  dirty: boolean;
  canUndo: boolean;
  canRedo: boolean;
  highlightPath: string[] | null;
  breakdownLink: string | null;
  message: { kind: 'info' | 'error'; text: string } | null;
  /** A request for the sheet to centre these ids (seq changes on every request). */
  focus: { ids: string[]; seq: number } | null;
  /** Changes every time loadJob replaces the document (the sheet fits the new job into view). */
  documentSeq: number;
  /** Changes on every undo and redo (fields drop a refusal they were showing). */
  historySeq: number;
  /** Labels of the next undo and redo steps, for menus ("Undo move"). */
  undoLabel: string | null;
  redoLabel: string | null;

  apply(edit: Edit, label?: string): ApplyOutcome;
  /** Checks an edit without applying it. */
  check(edit: Edit): ApplyOutcome;
  undo(): void;
  redo(): void;
  loadJob(job: Job, file?: { name: string; path?: string | null }): void;
  select(sel: { nodes?: string[]; links?: string[] }): void;
  markSaved(file?: { name: string; path?: string | null }): void;
  setHighlight(path: string[] | null, breakdownLink?: string | null): void;
  setMessage(m: EditorState['message']): void;
  /** Live positions while dragging: no validation, no history; commit with apply({op:'move'}). */
  moveLive(moves: Array<{ id: string; at: { x: number; y: number } }>): void;
  /** Asks the sheet to centre the given ids. */
  requestFocus(ids: string[]): void;
}

// Kept outside the state: history and the last saved document.
let past: Step[] = [];
let future: Step[] = [];
let savedJob: Job | null = null;
let gestureBase: Job | null = null;
let focusSeq = 0;

/** The selection with renamed ids followed and ids that are gone dropped (same object when unchanged). */
function existing(follow: (id: string) => string | null, sel: { nodes: string[]; links: string[] }) {
  const keep = (ids: string[]) => {
    const out: string[] = [];
    const seen = new Set<string>();
    for (const id of ids) {
      const now = follow(id);
      if (now !== null && !seen.has(now)) {
        seen.add(now);
        out.push(now);
      }
    }
    return out.length === ids.length && out.every((id, i) => id === ids[i]) ? ids : out;
  };
  const nodes = keep(sel.nodes);
  const links = keep(sel.links);
  return nodes === sel.nodes && links === sel.links ? sel : { nodes, links };
}

function trial(job: Job, edit: Edit): { ok: true; next: Job } | { ok: false; reason: string; field?: string } {
  let next: Job;
  try {
    next = applyEdit(job, edit);
  } catch (e) {
    if (e instanceof EditError) return { ok: false, reason: e.message, ...(e.field ? { field: e.field } : {}) };
    throw e;
  }
  if (next === job) return { ok: true, next };
  const problem = firstError(next, touchedIds(edit), job);
  if (problem) return { ok: false, reason: describe(problem, next), ...(problem.field ? { field: problem.field } : {}) };
  return { ok: true, next };
}

/** At the latest this long after a job opens, its rehearsed edit runs even if the browser is busy. */
const REHEARSAL_TIMEOUT_MS = 2000;

const initialJob = newJob();
savedJob = initialJob;
const initial = derive(initialJob, {});

export const useEditor = create<EditorState>()((set, get) => {
  /**
   * Once the browser is idle after a job opens, a length edit is rehearsed on a copy: the checks
   * (trial), the follow-up of ids and the re-analysis with its comparison (rehearseDerive) run
   * and are thrown away, so the user's first edit of a large job does not wait while that code
   * is compiled. Nothing in the store changes, and a job replaced meanwhile is left alone.
   */
  function rehearseSoon(job: Job) {
    whenIdle(() => {
      const s = get();
      if (s.job !== job) return;
      try {
        const link = job.links.find((l) => l.cable.length > 0);
        if (link) {
          const tried = trial(job, { op: 'update-link', id: link.id, patch: { cable: { ...link.cable, length: link.cable.length * 1.5 } } });
          if (tried.ok) existing(idFollower(job, tried.next), s.selection);
        }
        rehearseDerive(job, s.resultById);
      } catch {
        // A rehearsal changes nothing, so one that fails has nothing to undo: the real edit
        // runs the same code and reports whatever went wrong there.
      }
    }, REHEARSAL_TIMEOUT_MS);
  }

  /** Moves the store to a new document state, recomputing what depends on it. */
  function become(job: Job, reanalyse: boolean, extra: Partial<EditorState> = {}) {
    const s = get();
    const derived = reanalyse ? derive(job, s.resultById) : null;
    // A renamed element keeps its place in the selection, the traced path and the breakdown.
    const follow = idFollower(s.job, job);
    let highlightPath = s.highlightPath;
    if (highlightPath) {
      const now = highlightPath.map(follow);
      if (now.some((id) => id === null)) highlightPath = null;
      else if (now.some((id, i) => id !== highlightPath![i])) highlightPath = now as string[];
    }
    const followed = s.breakdownLink ? follow(s.breakdownLink) : null;
    const breakdownLink = followed !== null && job.links.some((l) => l.id === followed) ? followed : null;
    set({
      job,
      ...(derived ? { results: derived.results, resultById: derived.resultById } : {}),
      ...(derived?.error ? { message: { kind: 'error' as const, text: derived.error } } : {}),
      selection: existing(follow, s.selection),
      highlightPath,
      breakdownLink,
      dirty: job !== savedJob,
      canUndo: past.length > 0,
      canRedo: future.length > 0,
      undoLabel: past.at(-1)?.label ?? null,
      redoLabel: future.at(-1)?.label ?? null,
      ...extra,
    });
  }

  return {
    job: initialJob,
    results: initial.results,
    resultById: initial.resultById,
    selection: { nodes: [], links: [] },
    fileName: null,
    filePath: null,
    dirty: false,
    canUndo: false,
    canRedo: false,
    highlightPath: null,
    breakdownLink: null,
    message: null,
    focus: null,
    documentSeq: 0,
    historySeq: 0,
    undoLabel: null,
    redoLabel: null,

    apply(edit, label = 'edit') {
      const base = gestureBase ?? get().job;
      const current = get().job;
      const outcome = trial(current, edit);
      if (!outcome.ok) {
        set({ message: { kind: 'error', text: outcome.reason } });
        return { ok: false, reason: outcome.reason, ...(outcome.field ? { field: outcome.field } : {}) };
      }
      gestureBase = null;
      if (outcome.next === base) {
        if (current !== base) become(base, false);
        return { ok: true };
      }
      past.push({ job: base, label });
      if (past.length > HISTORY_LIMIT) past = past.slice(past.length - HISTORY_LIMIT);
      future = [];
      const wasError = get().message?.kind === 'error';
      become(outcome.next, !onlyMoves(edit), wasError ? { message: null } : {});
      return { ok: true };
    },

    check(edit) {
      const outcome = trial(get().job, edit);
      return outcome.ok ? { ok: true } : { ok: false, reason: outcome.reason, ...(outcome.field ? { field: outcome.field } : {}) };
    },

    undo() {
      const step = past.pop();
      if (!step) {
        set({ message: { kind: 'info', text: 'Nothing to undo' } });
        return;
      }
      gestureBase = null;
      future.push({ job: get().job, label: step.label });
      become(step.job, true, { message: { kind: 'info', text: `Undid ${step.label}` }, historySeq: get().historySeq + 1 });
    },

    redo() {
      const step = future.pop();
      if (!step) {
        set({ message: { kind: 'info', text: 'Nothing to redo' } });
        return;
      }
      gestureBase = null;
      past.push({ job: get().job, label: step.label });
      become(step.job, true, { message: { kind: 'info', text: `Redid ${step.label}` }, historySeq: get().historySeq + 1 });
    },

    loadJob(job, file) {
      past = [];
      future = [];
      gestureBase = null;
      savedJob = job;
      set({ selection: { nodes: [], links: [] }, highlightPath: null, breakdownLink: null, resultById: {} });
      become(job, true, {
        fileName: file?.name ?? null,
        filePath: file?.path ?? null,
        message: null,
        documentSeq: get().documentSeq + 1,
      });
      rehearseSoon(job);
      // A job written by another tool may have no drawing positions: lay those nodes out
      // (not an edit of the user's: no undo step, and a job that was clean stays clean).
      if (job.nodes.some((n) => n.at === undefined)) {
        void positionsForMissing(job).then((moves) => {
          if (get().job !== job || moves.length === 0) return;
          const next = applyEdit(job, { op: 'move', moves });
          if (savedJob === job) savedJob = next;
          become(next, false, { documentSeq: get().documentSeq + 1 });
        });
      }
    },

    select(sel) {
      const s = get().selection;
      const job = get().job;
      set({ selection: existing(idFollower(job, job), { nodes: sel.nodes ?? s.nodes, links: sel.links ?? s.links }) });
    },

    markSaved(file) {
      savedJob = get().job;
      set({
        dirty: false,
        ...(file ? { fileName: file.name, filePath: file.path ?? null } : {}),
      });
    },

    setHighlight(path, breakdownLink) {
      set({ highlightPath: path, ...(breakdownLink !== undefined ? { breakdownLink } : {}) });
    },

    setMessage(message) {
      set({ message });
    },

    moveLive(moves) {
      const job = get().job;
      if (!gestureBase) gestureBase = job;
      const next = applyEdit(job, { op: 'move', moves });
      if (next !== job) set({ job: next, dirty: true });
    },

    requestFocus(ids) {
      focusSeq += 1;
      set({ focus: { ids, seq: focusSeq } });
    },
  };
});
