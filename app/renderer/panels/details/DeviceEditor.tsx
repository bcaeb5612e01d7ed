// The protective device of a link: none, or one of the four kinds of the job format, with
// breaking capacity, let-through and label; and the RCD (sensitivity shown in mA, stored in A).
//
// A kind change never fills in trip data: the old device leaves the job and the new one is a
// draft (panels/devices/drafts.ts) until every required value is entered or a device is picked
// from the library; meanwhile the circuit is unchecked and the form says what is missing.

import { deviceMark, type Curve, type Device, type DeviceType, type Link } from '../../../../engine/index.js';
import { selectResult, useEditor } from '../../store/index.js';
import { editLink } from '../actions.js';
import { CheckField, NumberField, SelectField, TextField } from '../fields/fields.js';
import { CurvePoints } from './CurvePoints.js';
import { DevicePicker, SaveMyDevice } from '../devices/DevicePicker.js';
import '../devices/devices.css';
import { DraftCurvePoints } from '../devices/DraftCurvePoints.js';
import { changeKind, editDraft, missingData, useDrafts, type DeviceDraft } from '../devices/drafts.js';

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

const DRAFT_CURVE_OPTIONS: ReadonlyArray<{ value: Curve | ''; label: string }> = [
  { value: '', label: 'choose…' },
  ...CURVE_OPTIONS,
];

const LET_THROUGH_HINT = "the maker's published I²t; caps the energy in the earth withstand check";

export function DeviceEditor({ link }: { link: Link }) {
  const id = link.id;
  const device = link.device;
  const stored = useDrafts((s) => s.drafts[id]);
  const draft = device ? undefined : stored;
  const kind: Kind = device?.type ?? draft?.type ?? 'none';
  const set = (field: string) => (v: unknown) => editLink(id, field, v);

  return (
    <fieldset className="lwp-group" data-group="device">
      <legend>Protective device</legend>
      <SelectField field="device.type" label="Kind" value={kind} options={KIND_OPTIONS}
        onCommit={(k) => changeKind(id, k, device ? deviceMark(device) : undefined)} />
      {device ? (
        <DeviceFields id={id} device={device} set={set} />
      ) : draft ? (
        <DraftFields id={id} draft={draft} />
      ) : (
        <p className="lwp-hint">Without a device this link still adds impedance, and its own check is unchecked.</p>
      )}
      <DevicePicker linkId={id} kind={kind} device={device} />
      {device ? <SaveMyDevice device={device} /> : null}
    </fieldset>
  );
}

function DeviceFields({ id, device, set }: { id: string; device: Device; set: (field: string) => (v: unknown) => ReturnType<typeof editLink> }) {
  return (
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
      <NumberField field="device.letThrough" label="Let-through I²t" unit="A²s" value={device.letThrough}
        above={0} optional hint={LET_THROUGH_HINT} onCommit={set('device.letThrough')} />
      <TextField field="device.label" label="Label" value={device.label} placeholder="shown instead of the mark"
        onCommit={set('device.label')} />
    </>
  );
}

/** The form of a device still being entered: the same fields, empty until the designer fills them. */
function DraftFields({ id, draft }: { id: string; draft: DeviceDraft }) {
  const put = (key: keyof DeviceDraft) => (v: unknown) => editDraft(id, { [key]: v } as Partial<DeviceDraft>);
  const missing = missingData(draft);
  // A leg leaving a point is protected by the device above it while its own is being entered.
  const protectedBy = useEditor((s) => selectResult(id)(s)?.protectedBy ?? null);
  return (
    <>
      <div className="lwd-missing" role="status" data-device-missing={id}>
        <span aria-hidden="true" className="lwd-missing-symbol">?</span>{' '}
        <strong>Device data missing:</strong> {missing.map((m) => m.words).join(', ')}.
        <span className="lwd-missing-more">
          {' '}Until it is entered, or a device is picked below, this link has no device in the job
          {protectedBy ? ` and its circuit is checked against the device above it, on ${protectedBy}` : ' and its circuit is unchecked'}
          {draft.replaces ? `; nothing is taken over from the ${draft.replaces} it replaces` : ''}.
        </span>
      </div>
      {draft.type === 'mcb' ? (
        <SelectField field="device.curve" label="Curve" value={draft.curve ?? ''} options={DRAFT_CURVE_OPTIONS}
          onCommit={(c) => editDraft(id, { curve: c === '' ? undefined : c })} />
      ) : null}
      <NumberField field="device.rating" label="Rating In" unit="A" value={draft.rating} above={0} optional
        placeholder="required" onCommit={put('rating')} />
      {draft.type === 'adjustable' ? (
        <>
          <NumberField field="device.instantaneous" label="Instantaneous pick-up Ii" unit="A" value={draft.instantaneous}
            above={0} optional placeholder="required" onCommit={put('instantaneous')} />
          <NumberField field="device.tolerance" label="Tolerance τ" value={draft.tolerance} min={0} max={0.99} optional
            placeholder="0.2" hint="fraction: Ia = Ii × (1 + τ)" onCommit={put('tolerance')} />
        </>
      ) : null}
      {draft.type === 'fixed' ? (
        <NumberField field="device.tripCurrent" label="Trip current Ia" unit="A" value={draft.tripCurrent}
          above={0} optional placeholder="required" onCommit={put('tripCurrent')} />
      ) : null}
      {draft.type === 'curve' ? <DraftCurvePoints linkId={id} draft={draft} /> : null}
      <NumberField field="device.breaking" label="Breaking capacity" unit="kA" value={draft.breaking}
        above={0} optional onCommit={put('breaking')} />
      <NumberField field="device.letThrough" label="Let-through I²t" unit="A²s" value={draft.letThrough}
        above={0} optional hint={LET_THROUGH_HINT} onCommit={put('letThrough')} />
      <TextField field="device.label" label="Label" value={draft.label} placeholder="shown instead of the mark"
        onCommit={put('label')} />
      {draft.refused ? (
        <p className="lwp-field-error" role="alert" data-device-refused={id}>Not taken into the job: {draft.refused}</p>
      ) : null}
    </>
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
