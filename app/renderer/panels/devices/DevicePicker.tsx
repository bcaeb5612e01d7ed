// Picking a device from the built-in library or the designer's own, and saving a link's device
// as one of the designer's own. A pick fills every required field in one undo step; the source
// of a built-in entry is shown beside the picker.

import { useId, useState } from 'react';
import type { Device } from '../../../../engine/index.js';
import { LIBRARY, deviceFromEntry, libraryEntry, type LibraryEntry } from './library.js';
import { putDevice } from './drafts.js';
import { deviceForJob, saveUserDevice, useUserDevices, removeUserDevice, type UserDevice } from './userDevices.js';

const MINE = 'mine:';
const BUILT_IN = 'lib:';

function groups(entries: readonly LibraryEntry[]): Array<[string, LibraryEntry[]]> {
  const out = new Map<string, LibraryEntry[]>();
  for (const e of entries) out.set(e.group, [...(out.get(e.group) ?? []), e]);
  return [...out];
}

/** Built-in families that fit a kind first (breakers for a breaker, fuses for a curve). */
function ordered(kind: string): LibraryEntry[] {
  const fits = (e: LibraryEntry) => e.device.type === kind;
  return [...LIBRARY.filter(fits), ...LIBRARY.filter((e) => !fits(e))];
}

/** Text of a value with object keys sorted, for comparing devices field by field. */
function canonical(v: unknown): string {
  return JSON.stringify(v, (_k, x: unknown) =>
    x && typeof x === 'object' && !Array.isArray(x)
      ? Object.fromEntries(Object.entries(x as Record<string, unknown>).sort(([a], [b]) => (a < b ? -1 : 1)))
      : x);
}

/** Where a link's device comes from, when it is exactly a library entry or one of the designer's own. */
export function sourceOf(device: Device | undefined, mine: readonly UserDevice[]): { name: string; source: string } | null {
  if (!device) return null;
  const text = canonical(device);
  const entry = LIBRARY.find((e) => canonical(e.device) === text);
  if (entry) return { name: entry.name, source: entry.source };
  const own = mine.find((u) => canonical(deviceForJob(u)) === text);
  return own ? { name: own.name, source: 'your own device, copied into this job' } : null;
}

export function DevicePicker({ linkId, kind, device }: { linkId: string; kind: string; device: Device | undefined }) {
  const selectId = useId();
  const mine = useUserDevices((s) => s.devices);
  const problems = useUserDevices((s) => s.problems);
  const picked = sourceOf(device, mine);
  const [error, setError] = useState<string | null>(null);

  const pick = (value: string) => {
    if (value === '') return;
    if (value.startsWith(BUILT_IN)) {
      const entry = libraryEntry(value.slice(BUILT_IN.length));
      if (!entry) return;
      const outcome = putDevice(linkId, deviceFromEntry(entry), `use ${entry.name} on ${linkId}`);
      setError(outcome.ok ? null : outcome.reason);
    } else if (value.startsWith(MINE)) {
      const u = mine[Number(value.slice(MINE.length))];
      if (!u) return;
      const outcome = putDevice(linkId, deviceForJob(u), `use ${u.name} on ${linkId}`);
      setError(outcome.ok ? null : outcome.reason);
    }
  };

  return (
    <div className="lwd-picker" data-device-picker={linkId}>
      <div className="lwp-field">
        <label className="lwp-label" htmlFor={selectId}>From library</label>
        <span className="lwp-input-wrap">
          <select id={selectId} className="lwp-input lwp-select" aria-label="Pick a device from the library" value=""
            data-field="device.library" onChange={(e) => pick(e.target.value)}>
            <option value="">pick a device…</option>
            {mine.length > 0 ? (
              <optgroup label="My devices">
                {mine.map((u, i) => (
                  <option key={`${u.name}-${i}`} value={`${MINE}${i}`}>{u.name}</option>
                ))}
              </optgroup>
            ) : null}
            {groups(ordered(kind)).map(([group, entries]) => (
              <optgroup key={group} label={group}>
                {entries.map((e) => (
                  <option key={e.id} value={`${BUILT_IN}${e.id}`}>{e.name}</option>
                ))}
              </optgroup>
            ))}
          </select>
        </span>
      </div>
      {picked ? (
        <p className="lwp-hint" data-device-source="">
          {picked.name}: {picked.source}.
        </p>
      ) : (
        <p className="lwp-hint">A pick fills the device completely; check it against the maker's data.</p>
      )}
      {error ? <p className="lwp-field-error" role="alert">{error}</p> : null}
      {problems.length > 0 ? (
        <ul className="lwd-problems" aria-label="Saved devices not offered">
          {problems.map((p, i) => (
            <li key={i}>{p}</li>
          ))}
        </ul>
      ) : null}
    </div>
  );
}

/** Saves the link's device (kind, values, curve points, breaking, let-through) under a name. */
export function SaveMyDevice({ device }: { device: Device }) {
  const inputId = useId();
  const [name, setName] = useState(device.label ?? '');
  const [note, setNote] = useState<{ ok: boolean; text: string } | null>(null);
  const mine = useUserDevices((s) => s.devices);
  const save = () => {
    const exists = mine.some((u) => u.name === name.trim());
    const outcome = saveUserDevice(name, device);
    setNote(outcome.ok ? { ok: true, text: `${exists ? 'Replaced' : 'Saved'} "${name.trim()}" in your devices` } : { ok: false, text: outcome.reason });
  };
  const remove = () => {
    const outcome = removeUserDevice(name.trim());
    setNote(outcome.ok ? { ok: true, text: `Removed "${name.trim()}" from your devices` } : { ok: false, text: outcome.reason });
  };
  const known = mine.some((u) => u.name === name.trim());
  return (
    <details className="lwd-save" data-save-device="">
      <summary>Save as my device</summary>
      <div className="lwp-field">
        <label className="lwp-label" htmlFor={inputId}>Name</label>
        <span className="lwp-input-wrap">
          <input id={inputId} className="lwp-input" type="text" value={name} aria-label="Name of my device"
            data-field="my-device.name" onChange={(e) => setName(e.target.value)}
            onKeyDown={(e) => e.key === 'Enter' && save()} />
        </span>
      </div>
      <button type="button" className="lwp-button" data-action="save-my-device" onClick={save}>
        {known ? 'Replace' : 'Save'}
      </button>{' '}
      {known ? (
        <button type="button" className="lwp-button" data-action="remove-my-device" onClick={remove}>
          Remove
        </button>
      ) : null}
      {note ? (
        <p className={note.ok ? 'lwp-hint' : 'lwp-field-error'} role={note.ok ? 'status' : 'alert'}>{note.text}</p>
      ) : null}
      <p className="lwp-hint">Kept with the app on this computer; a job that uses it gets its own copy.</p>
    </details>
  );
}
