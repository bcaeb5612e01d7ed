// The designer's own devices (name, kind, curve points, breaking capacity, let-through), kept
// with the app in localStorage (the browser build and the desktop renderer alike). A job that
// uses one gets a full copy in the link's device, with the name as its `label`, so the job file
// never depends on this store.
//
// What is stored is never thrown away: an entry this version cannot read is kept as it was and
// reported by its place and reason; text that is not readable at all is copied aside under a
// dated key before anything new is written.

import { create } from 'zustand';
import { loadJob, newJob, type Device } from '../../../../engine/index.js';

export const STORAGE_KEY = 'loopwright.my-devices';
const FORMAT = 'loopwright.my-devices';

export interface UserDevice {
  name: string;
  /** The device as it goes into a link (its label is set to the name when used). */
  device: Device;
}

interface Stored {
  format: typeof FORMAT;
  version: 1;
  /** Readable entries and, untouched, any this version could not read. */
  devices: unknown[];
}

export interface UserDeviceState {
  devices: UserDevice[];
  /** Entries kept as stored but not offered, with why. */
  problems: string[];
}

/** Why a device cannot be used, each naming the field; empty when it is good. */
export function deviceProblems(device: unknown): string[] {
  const job = {
    ...newJob(),
    nodes: [
      { id: 'S', kind: 'supply', source: { type: 'unknown' } },
      { id: 'B', kind: 'board' },
    ],
    links: [{ id: 'L', from: 'S', to: 'B', cable: { length: 1, material: 'Cu', active: 2.5, earth: 2.5 }, device }],
  };
  const loaded = loadJob(job);
  const out = loaded.ok ? [] : loaded.problems.map((p) => p.message);
  const lt = (device as { letThrough?: unknown } | null)?.letThrough;
  if (lt !== undefined && !(typeof lt === 'number' && Number.isFinite(lt) && lt > 0)) {
    out.push(`device.letThrough must be a number > 0 (A²s), got ${JSON.stringify(lt)}`);
  }
  return out;
}

function storage(): Storage | null {
  try {
    return typeof localStorage === 'undefined' ? null : localStorage;
  } catch {
    return null;
  }
}

let rawEntries: unknown[] = [];

export function readStored(): UserDeviceState {
  rawEntries = [];
  const store = storage();
  const text = store?.getItem(STORAGE_KEY);
  if (!text) return { devices: [], problems: [] };
  let value: unknown;
  try {
    value = JSON.parse(text);
  } catch (e) {
    const aside = setAside(text);
    return { devices: [], problems: [`Your saved devices could not be read (${e instanceof Error ? e.message : String(e)}); the text was kept under "${aside}".`] };
  }
  const v = value as Partial<Stored> | null;
  if (!v || v.format !== FORMAT || !Array.isArray(v.devices)) {
    const aside = setAside(text);
    return { devices: [], problems: [`Your saved devices are not in a form this version reads; they were kept under "${aside}".`] };
  }
  rawEntries = v.devices.slice();
  const devices: UserDevice[] = [];
  const problems: string[] = [];
  v.devices.forEach((entry, i) => {
    const e = entry as Partial<UserDevice> | null;
    const where = `saved device ${i + 1}${typeof e?.name === 'string' ? ` ("${e.name}")` : ''}`;
    if (!e || typeof e.name !== 'string' || e.name.trim() === '') {
      problems.push(`${where}: it has no name; kept, not offered`);
      return;
    }
    const bad = deviceProblems(e.device);
    if (bad.length > 0) {
      problems.push(`${where}: ${bad.join('; ')}; kept, not offered`);
      return;
    }
    devices.push({ name: e.name, device: e.device as Device });
  });
  return { devices, problems };
}

function setAside(text: string): string {
  const key = `${STORAGE_KEY}.unreadable-${new Date().toISOString()}`;
  try {
    storage()?.setItem(key, text);
    storage()?.removeItem(STORAGE_KEY);
  } catch {
    // Nothing is removed when the copy could not be made.
  }
  return key;
}

export const useUserDevices = create<UserDeviceState>()(() => readStored());

/** Reads the store again (another window may have changed it). */
export function reloadUserDevices(): void {
  useUserDevices.setState(readStored());
}

export type SaveOutcome = { ok: true } | { ok: false; reason: string };

/** Adds a device under a name, or replaces the one of that name. */
export function saveUserDevice(name: string, device: Device): SaveOutcome {
  const trimmed = name.trim();
  if (trimmed === '') return { ok: false, reason: 'Give the device a name to save it under' };
  const { label: _label, ...rest } = device;
  const bad = deviceProblems(rest);
  if (bad.length > 0) return { ok: false, reason: `This device cannot be saved: ${bad.join('; ')}` };
  const store = storage();
  if (!store) return { ok: false, reason: 'This window has no storage for your devices' };
  reloadUserDevices();
  const entry: UserDevice = { name: trimmed, device: rest as Device };
  const at = rawEntries.findIndex((e) => (e as { name?: unknown } | null)?.name === trimmed);
  const entries = rawEntries.slice();
  if (at >= 0) entries[at] = entry;
  else entries.push(entry);
  const stored: Stored = { format: FORMAT, version: 1, devices: entries };
  try {
    store.setItem(STORAGE_KEY, JSON.stringify(stored));
  } catch (e) {
    return { ok: false, reason: `Your devices could not be saved (${e instanceof Error ? e.message : String(e)})` };
  }
  reloadUserDevices();
  return { ok: true };
}

/** Removes the saved device of that name (only readable entries can be removed). */
export function removeUserDevice(name: string): SaveOutcome {
  const store = storage();
  if (!store) return { ok: false, reason: 'This window has no storage for your devices' };
  reloadUserDevices();
  const entries = rawEntries.filter((e) => (e as { name?: unknown } | null)?.name !== name);
  try {
    store.setItem(STORAGE_KEY, JSON.stringify({ format: FORMAT, version: 1, devices: entries } satisfies Stored));
  } catch (e) {
    return { ok: false, reason: `Your devices could not be saved (${e instanceof Error ? e.message : String(e)})` };
  }
  reloadUserDevices();
  return { ok: true };
}

/** The copy that goes into a link: every field of the saved device, its name as the label. */
export function deviceForJob(u: UserDevice): Device {
  return { ...(JSON.parse(JSON.stringify(u.device)) as Device), label: u.name };
}
