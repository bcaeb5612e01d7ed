// The engine's fixes (CircuitResult.fixes, method-depth.md section 8) as store edits: one fix,
// one undoable edit. What each one changes, in words, for its button and the status message.

import type { CircuitResult, Fix, Job, Link, Status } from '../../../../engine/index.js';
import { useEditor } from '../../store/index.js';
import type { Edit } from '../../store/edits.js';
import { STATUS_LOOK } from '../format.js';
import { CHECKS, failingChecks } from '../../sheet/labels.js';

/** The loop check's word in failingChecks (the fix message names the other checks). */
const LOOP_WORD: string = CHECKS.find((c) => c.key === 'loop')!.word;

/**
 * A length rounded down to 0.1 m, so a fix that says "at most maxLength" still passes once
 * rounded (rounding to the nearest could land just above the limit).
 */
export function roundDownTenth(metres: number): number {
  const tenths = Math.floor(metres * 10 + 1e-9);
  let value = Number((tenths / 10).toFixed(1));
  if (value > metres) value = Number(((tenths - 1) / 10).toFixed(1));
  return Math.max(0, value);
}

function tidy(v: number): string {
  return String(Number(v.toPrecision(6)));
}

export interface PlannedFix {
  /** The link whose record changes (the circuit itself, or the link whose device protects it). */
  target: string;
  edit: Edit;
  /** Short text for the button. */
  label: string;
  /** A sentence saying exactly what changes (button title and status message). */
  description: string;
  /** The undo step's name. */
  undoLabel: string;
}

/** The store edit for one fix of one circuit, or a reason it cannot be made. */
export function planFix(job: Pick<Job, 'links'>, result: CircuitResult, fix: Fix): PlannedFix | { error: string } {
  const own = job.links.find((l) => l.id === result.link);
  if (!own) return { error: `there is no link ${result.link} any more` };
  const id = own.id;
  switch (fix.kind) {
    case 'length': {
      const length = roundDownTenth(fix.maxLength);
      return {
        target: id,
        edit: { op: 'update-link', id, patch: { cable: { ...own.cable, length } } },
        label: `Length ${length.toFixed(1)} m`,
        description: `set the length of ${id} to ${length.toFixed(1)} m (its maximum ${tidy(fix.maxLength)} m rounded down to 0.1 m, so it still passes)`,
        undoLabel: `fix ${id}: length ${length.toFixed(1)} m`,
      };
    }
    case 'size': {
      return {
        target: id,
        edit: { op: 'update-link', id, patch: { cable: { ...own.cable, active: fix.active, earth: fix.earth } } },
        label: `Cable ${tidy(fix.active)}/${tidy(fix.earth)} mm²`,
        description: `set the cable of ${id} to ${tidy(fix.active)} mm² active, ${tidy(fix.earth)} mm² earth (was ${tidy(own.cable.active)}/${tidy(own.cable.earth)} mm²)`,
        undoLabel: `fix ${id}: cable ${tidy(fix.active)}/${tidy(fix.earth)} mm²`,
      };
    }
    case 'device':
    case 'rcd': {
      const by = result.protectedBy;
      const protecting: Link | undefined = by === null ? undefined : job.links.find((l) => l.id === by);
      if (!protecting) return { error: `${id} has no protecting device to change` };
      const where = protecting.id === id ? `of ${id}` : `on ${protecting.id} (which protects ${id})`;
      if (fix.kind === 'device') {
        const old = protecting.device;
        // The label and let-through energy described the old device; the breaking capacity of a
        // breaker range is kept (the user can change it). Everything else is the fix.
        const kept = old && old.breaking !== undefined ? { breaking: old.breaking } : {};
        const dropped = [old?.label !== undefined ? 'its label' : null, old?.letThrough !== undefined ? 'its let-through energy' : null]
          .filter((x): x is string => x !== null);
        const mark = `${fix.curve}${tidy(fix.rating)}`;
        return {
          target: protecting.id,
          edit: { op: 'update-link', id: protecting.id, patch: { device: { type: 'mcb', curve: fix.curve, rating: fix.rating, ...kept } } },
          label: `Device ${mark}`,
          description: `set the device ${where} to a curve ${fix.curve} breaker of ${tidy(fix.rating)} A${dropped.length ? ` (${dropped.join(' and ')} cleared: they described the old device)` : ''}`,
          undoLabel: `fix ${id}: device ${mark} on ${protecting.id}`,
        };
      }
      const mA = tidy(fix.sensitivity * 1000);
      return {
        target: protecting.id,
        edit: { op: 'update-link', id: protecting.id, patch: { rcd: { sensitivity: fix.sensitivity } } },
        label: `Add ${mA} mA RCD`,
        description: `add a ${mA} mA RCD ${where}; ${id} then relies on the RCD to disconnect a fault: it is not a pass`,
        undoLabel: `fix ${id}: ${mA} mA RCD on ${protecting.id}`,
      };
    }
  }
}

function statusText(status: Status): string {
  const look = STATUS_LOOK[status];
  return `${look.symbol} ${look.word}`;
}

/** What the status bar says after a fix: what changed and the circuit's new status. */
export function fixMessage(linkId: string, fix: Fix, plan: PlannedFix, after: CircuitResult | undefined): string {
  const done = `Applied a fix to ${linkId}: ${plan.description.split('; ')[0]}.`;
  if (fix.kind === 'rcd') {
    return `${done} ${linkId} now relies on the RCD to disconnect an earth fault (${statusText(after?.status ?? 'rcd')}): it is not a pass.`;
  }
  if (!after) return done;
  const others = failingChecks(after).filter((c) => c !== LOOP_WORD);
  if (after.verdict === after.status || others.length === 0) return `${done} ${linkId} is now ${statusText(after.status)}.`;
  return `${done} ${linkId}: loop impedance now ${statusText(after.status)}; still ${statusText('fail')} on ${others.join(', ')}.`;
}

/** Applies one fix of a circuit as one undoable edit and says in the status bar what it did. */
export function applyFix(linkId: string, fix: Fix): { ok: true } | { ok: false; reason: string } {
  const s = useEditor.getState();
  const result = s.resultById[linkId];
  if (!result) return fail(`there is no result for ${linkId}`);
  const plan = planFix(s.job, result, fix);
  if ('error' in plan) return fail(plan.error);
  const outcome = s.apply(plan.edit, plan.undoLabel);
  if (!outcome.ok) return fail(outcome.reason);
  useEditor.getState().setMessage({ kind: 'info', text: fixMessage(linkId, fix, plan, useEditor.getState().resultById[linkId]) });
  return { ok: true };

  function fail(reason: string): { ok: false; reason: string } {
    useEditor.getState().setMessage({ kind: 'error', text: `The fix was not applied: ${reason}` });
    return { ok: false, reason };
  }
}
