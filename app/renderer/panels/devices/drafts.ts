// Device drafts: what the designer has entered so far for a link's new device.
//
// A kind change never makes up trip data. The link's device leaves the job at once (one undo
// step), so the engine reports its circuit `unchecked` ("no device") and nothing half-entered
// reaches the file, the schedule or the printout; the values typed so far live here, in the
// session only, until every required field of the kind is there. Then the draft becomes the
// job's device (a second undo step) and the draft is dropped.

import { create } from 'zustand';
import type { Curve, Device, DeviceType } from '../../../../engine/index.js';
import { useEditor } from '../../store/index.js';
import { idFollower } from '../../store/renames.js';
import { editLink } from '../actions.js';
import type { Outcome } from '../fields/fields.js';

export type DraftPoint = [number | undefined, number | undefined];

export interface DeviceDraft {
  type: DeviceType;
  curve?: Curve;
  rating?: number;
  instantaneous?: number;
  tolerance?: number;
  tripCurrent?: number;
  points: DraftPoint[];
  breaking?: number;
  letThrough?: number;
  label?: string;
  /** The mark of the device it replaces, for a hint only (never copied into the new device). */
  replaces?: string;
  /** Why the last complete draft was refused by the engine, if it was. */
  refused?: string;
}

export interface Missing {
  /** The job-format field, e.g. `device.instantaneous`. */
  field: string;
  /** What the designer reads: `instantaneous pick-up Ii (A)`. */
  words: string;
}

/** The required values a draft still lacks, in the order of the form. */
export function missingData(d: DeviceDraft): Missing[] {
  const out: Missing[] = [];
  if (d.type === 'mcb' && d.curve === undefined) out.push({ field: 'device.curve', words: 'curve (B, C or D)' });
  if (d.rating === undefined) out.push({ field: 'device.rating', words: 'rating In (A)' });
  if (d.type === 'adjustable' && d.instantaneous === undefined) {
    out.push({ field: 'device.instantaneous', words: 'instantaneous pick-up Ii (A)' });
  }
  if (d.type === 'fixed' && d.tripCurrent === undefined) out.push({ field: 'device.tripCurrent', words: 'trip current Ia (A)' });
  if (d.type === 'curve') {
    d.points.forEach((p, i) => {
      if (p[0] === undefined && p[1] !== undefined) out.push({ field: `device.points.${i}.0`, words: `point ${i + 1} current (A)` });
      if (p[1] === undefined && p[0] !== undefined) out.push({ field: `device.points.${i}.1`, words: `point ${i + 1} time (s)` });
    });
    const complete = filledPoints(d).length;
    if (complete < 2) {
      out.push({ field: 'device.points', words: complete === 0 ? 'at least two time–current points (A, s)' : 'a second time–current point (A, s)' });
    }
  }
  return out;
}

/** The rows with both current and time (wholly empty rows are left out). */
function filledPoints(d: DeviceDraft): Array<[number, number]> {
  return d.points.filter((p): p is [number, number] => p[0] !== undefined && p[1] !== undefined);
}

/** The device a complete draft describes, with only what the designer entered; null while incomplete. */
export function deviceFromDraft(d: DeviceDraft): Device | null {
  if (missingData(d).length > 0 || d.rating === undefined) return null;
  const shared = {
    rating: d.rating,
    ...(d.breaking !== undefined ? { breaking: d.breaking } : {}),
    ...(d.letThrough !== undefined ? { letThrough: d.letThrough } : {}),
    ...(d.label !== undefined ? { label: d.label } : {}),
  };
  switch (d.type) {
    case 'mcb':
      return { type: 'mcb', curve: d.curve!, ...shared };
    case 'adjustable':
      return { type: 'adjustable', ...shared, instantaneous: d.instantaneous!, ...(d.tolerance !== undefined ? { tolerance: d.tolerance } : {}) };
    case 'fixed':
      return { type: 'fixed', ...shared, tripCurrent: d.tripCurrent! };
    case 'curve':
      return { type: 'curve', ...shared, points: filledPoints(d).map(([i, t]) => [i, t] as [number, number]) };
  }
}

interface DraftState {
  drafts: Record<string, DeviceDraft>;
}

export const useDrafts = create<DraftState>()(() => ({ drafts: {} }));

function setDraft(linkId: string, draft: DeviceDraft | undefined): void {
  const drafts = { ...useDrafts.getState().drafts };
  if (draft) drafts[linkId] = draft;
  else delete drafts[linkId];
  useDrafts.setState({ drafts });
}

/** The draft shown for a link: only while the link has no device in the job. */
export function draftFor(linkId: string, hasDevice: boolean): DeviceDraft | undefined {
  return hasDevice ? undefined : useDrafts.getState().drafts[linkId];
}

export function clearDrafts(): void {
  useDrafts.setState({ drafts: {} });
}

const KIND_WORD: Record<DeviceType, string> = {
  mcb: 'a breaker',
  adjustable: 'an adjustable breaker',
  curve: 'a curve device',
  fixed: 'a stated-trip device',
};

/**
 * The kind select: `none` removes the device; another kind starts an empty draft and takes the
 * old device out of the job, so neither invented values nor the replaced device can pass it.
 */
export function changeKind(linkId: string, kind: DeviceType | 'none', oldMark?: string): Outcome {
  const link = useEditor.getState().job.links.find((l) => l.id === linkId);
  if (!link) return { ok: false, reason: `There is no link ${linkId} any more` };
  if (kind === 'none') {
    setDraft(linkId, undefined);
    return link.device ? editLink(linkId, 'device', undefined, `remove the device of ${linkId}`) : { ok: true };
  }
  const current = draftFor(linkId, link.device !== undefined);
  if (link.device?.type === kind || current?.type === kind) return { ok: true };
  const outcome = link.device
    ? editLink(linkId, 'device', undefined, `change the device of ${linkId} to ${KIND_WORD[kind]} (data to enter)`)
    : { ok: true as const };
  if (!outcome.ok) return outcome;
  // What the designer typed into an earlier draft for this link (rating, breaking, let-through,
  // label) is theirs and stays; nothing is taken from the replaced device.
  const kept = current
    ? {
        ...(current.rating !== undefined ? { rating: current.rating } : {}),
        ...(current.breaking !== undefined ? { breaking: current.breaking } : {}),
        ...(current.letThrough !== undefined ? { letThrough: current.letThrough } : {}),
        ...(current.label !== undefined ? { label: current.label } : {}),
        ...(current.replaces !== undefined ? { replaces: current.replaces } : {}),
      }
    : {};
  setDraft(linkId, { type: kind, points: kind === 'curve' ? [[undefined, undefined], [undefined, undefined]] : [], ...kept, ...(oldMark ? { replaces: oldMark } : {}) });
  return { ok: true };
}

/**
 * One field of a draft. When the draft is then complete it becomes the link's device; if the
 * engine refuses it (say, points that do not rise), the draft stays, with the reason.
 */
export function editDraft(linkId: string, patch: Partial<DeviceDraft>): Outcome {
  const draft = useDrafts.getState().drafts[linkId];
  if (!draft) return { ok: false, reason: `There is no device being entered for ${linkId}` };
  const next: DeviceDraft = { ...draft, ...patch };
  delete next.refused;
  for (const key of Object.keys(patch) as Array<keyof DeviceDraft>) if (patch[key] === undefined) delete next[key];
  const device = deviceFromDraft(next);
  if (device) {
    const outcome = editLink(linkId, 'device', device, `enter the device of ${linkId}`);
    if (outcome.ok) {
      setDraft(linkId, undefined);
      return outcome;
    }
    setDraft(linkId, { ...next, refused: outcome.reason });
    return { ok: true };
  }
  setDraft(linkId, next);
  return { ok: true };
}

/** Puts a complete device (picked from the library or the user's own) on a link in one step. */
export function putDevice(linkId: string, device: Device, label: string): Outcome {
  const outcome = editLink(linkId, 'device', device, label);
  if (outcome.ok) setDraft(linkId, undefined);
  return outcome;
}

// A new document drops every draft; a renamed link keeps its own; a link that is gone drops it.
useEditor.subscribe((s, prev) => {
  if (s.documentSeq !== prev.documentSeq) {
    if (Object.keys(useDrafts.getState().drafts).length > 0) clearDrafts();
    return;
  }
  if (s.job.links === prev.job.links) return;
  const drafts = useDrafts.getState().drafts;
  const ids = Object.keys(drafts);
  if (ids.length === 0) return;
  const follow = idFollower(prev.job, s.job);
  const moved = ids.map((id) => [id, follow(id)] as const);
  if (moved.every(([id, now]) => id === now)) return;
  const next: Record<string, DeviceDraft> = {};
  for (const [id, now] of moved) if (now !== null) next[now] = drafts[id]!;
  useDrafts.setState({ drafts: next });
});
