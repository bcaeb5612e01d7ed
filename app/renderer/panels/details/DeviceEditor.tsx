// The protective device of a link: none, or one of the four kinds of the job format, with
// breaking capacity and label; and the RCD (sensitivity shown in mA, stored in A).

import type { Curve, Device, DeviceType, Link } from '../../../../engine/index.js';
import { editLink } from '../actions.js';
import { CheckField, NumberField, SelectField, TextField } from '../fields/fields.js';
import { CurvePoints } from './CurvePoints.js';

type Kind = DeviceType | 'none';

const KIND_OPTIONS: ReadonlyArray<{ value: Kind; label: string }> = [
  { value: 'none', label: 'no device' },
  { value: 'mcb', label: 'breaker B/C/D' },
  { value: 'adjustable', label: 'adjustable breaker' },
  { value: 'curve', label: 'fuse or curve' },
  { value: 'fixed', label: 'stated trip current' },
];

const CURVE_OPTIONS: ReadonlyArray<{ value: Curve; label: string }> = [
  { value: 'B', label: 'B' },
  { value: 'C', label: 'C' },
  { value: 'D', label: 'D' },
];

/**
 * A device of another kind that keeps what the kinds share (rating, breaking, label).
 * The kind's own values start from the old device where it had them, else from a starting
 * value the designer is expected to replace (shown in the form straight away).
 */
export function deviceOfKind(kind: DeviceType, old: Device | undefined): Device {
  const rating = old?.rating ?? 20;
  const shared = {
    rating,
    ...(old?.breaking !== undefined ? { breaking: old.breaking } : {}),
    ...(old?.label !== undefined ? { label: old.label } : {}),
  };
  switch (kind) {
    case 'mcb':
      return { type: 'mcb', curve: old?.type === 'mcb' ? old.curve : 'C', ...shared };
    case 'adjustable':
      // Instantaneous pick-up at 10 × In is a usual factory setting (common practice).
      return { type: 'adjustable', ...shared, instantaneous: 10 * rating, tolerance: 0.2 };
    case 'curve':
      return { type: 'curve', ...shared, points: [[2 * rating, 100], [5 * rating, 5], [20 * rating, 0.1]] };
    case 'fixed':
      return { type: 'fixed', ...shared, tripCurrent: 5 * rating };
  }
}

export function DeviceEditor({ link }: { link: Link }) {
  const id = link.id;
  const device = link.device;
  const kind: Kind = device?.type ?? 'none';
  const set = (field: string) => (v: unknown) => editLink(id, field, v);

  return (
    <fieldset className="lwp-group" data-group="device">
      <legend>Protective device</legend>
      <SelectField field="device.type" label="Kind" value={kind} options={KIND_OPTIONS}
        onCommit={(k) => editLink(id, 'device', k === 'none' ? undefined : deviceOfKind(k, device), `change the device of ${id}`)} />
      {device ? (
        <>
          {device.type === 'mcb' ? (
            <SelectField field="device.curve" label="Curve" value={device.curve} options={CURVE_OPTIONS}
              onCommit={set('device.curve')} />
          ) : null}
          <NumberField field="device.rating" label="Rating In" unit="A" value={device.rating} above={0}
            onCommit={set('device.rating')} />
          {device.type === 'adjustable' ? (
            <>
              <NumberField field="device.instantaneous" label="Instantaneous pick-up Ii" unit="A"
                value={device.instantaneous} above={0} onCommit={set('device.instantaneous')} />
              <NumberField field="device.tolerance" label="Tolerance τ" value={device.tolerance} min={0} optional
                placeholder="0.2" hint="fraction: Ia = Ii × (1 + τ)" onCommit={set('device.tolerance')} />
            </>
          ) : null}
          {device.type === 'fixed' ? (
            <NumberField field="device.tripCurrent" label="Trip current Ia" unit="A" value={device.tripCurrent}
              above={0} onCommit={set('device.tripCurrent')} />
          ) : null}
          {device.type === 'curve' ? <CurvePoints linkId={id} device={device} /> : null}
          <NumberField field="device.breaking" label="Breaking capacity" unit="kA" value={device.breaking}
            above={0} optional onCommit={set('device.breaking')} />
          <TextField field="device.label" label="Label" value={device.label} placeholder="shown instead of the mark"
            onCommit={set('device.label')} />
        </>
      ) : (
        <p className="lwp-hint">Without a device this link still adds impedance, and its own check is unchecked.</p>
      )}
    </fieldset>
  );
}

export function RcdEditor({ link }: { link: Link }) {
  const id = link.id;
  return (
    <fieldset className="lwp-group" data-group="rcd">
      <legend>Residual-current device</legend>
      <CheckField field="rcd" label="RCD fitted" value={link.rcd !== undefined}
        onCommit={(on) => editLink(id, 'rcd', on ? { sensitivity: 0.03 } : undefined, on ? `add an RCD to ${id}` : `remove the RCD of ${id}`)} />
      {link.rcd ? (
        <NumberField field="rcd.sensitivity" label="Sensitivity IΔn" unit="mA" scale={1000} above={0}
          value={link.rcd.sensitivity} onCommit={(v) => editLink(id, 'rcd.sensitivity', v)} />
      ) : null}
    </fieldset>
  );
}
