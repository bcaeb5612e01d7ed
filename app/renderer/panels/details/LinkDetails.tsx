// Every field of one link: identity, cable, device, RCD and required time; its results beside.

import { useMemo } from 'react';
import { roleOfEnds, resolveRules, STANDARD_SIZES, type Link, type Material, type NodeKind } from '../../../../engine/index.js';
import { selectNode, useEditor } from '../../store/index.js';
import { editLink } from '../actions.js';
import { NumberField, Readout, SelectField, TextField } from '../fields/fields.js';
import { ROLE_LONG, num } from '../format.js';
import { CircuitResults } from './CircuitResults.js';
import { DeviceEditor, RcdEditor } from './DeviceEditor.js';
import { LinkCableCapacityFields, LinkLoadFields, LinkReadingFields } from './LinkDesignFields.js';
import { selectResult } from '../../store/index.js';
import { FixList } from '../fixes/FixButtons.js';
import { TccView } from '../tcc/TccView.js';
import { FeedPicker } from '../../app/FeedPicker.js';

const MATERIALS: ReadonlyArray<{ value: Material; label: string }> = [
  { value: 'Cu', label: 'copper (Cu)' },
  { value: 'Al', label: 'aluminium (Al)' },
];

const EARTH_MATERIALS: ReadonlyArray<{ value: Material | 'same'; label: string }> = [
  { value: 'same', label: 'same as active' },
  ...MATERIALS,
];

/** The <datalist> of standard conductor sizes that size inputs offer first (IEC 60228). */
export function SizeList({ id }: { id: string }) {
  return (
    <datalist id={id}>
      {STANDARD_SIZES.map((s) => (
        <option key={s} value={String(s)} />
      ))}
    </datalist>
  );
}

export function sizeHint(size: number): string | undefined {
  return STANDARD_SIZES.includes(size) ? undefined : `${size} mm² is not a standard size (IEC 60228)`;
}

const SIZES_ID = 'lwp-sizes-details';

/** The role word of a link, from the kinds of its two ends alone (engine roleOfEnds): nothing
 *  the size of the job is worked out on an edit. */
function roleWord(fromKind: NodeKind | undefined, toKind: NodeKind | undefined): string {
  return ROLE_LONG[roleOfEnds(fromKind, toKind)] ?? '';
}

// Only this link's record, its rules and the names and kinds of its two ends are subscribed:
// a drag elsewhere, or an edit of another link, does not re-render the form.
export function LinkDetails({ link }: { link: Link }) {
  const id = link.id;
  const set = (field: string) => (v: unknown) => editLink(id, field, v);
  const cable = link.cable;
  const rulesInput = useEditor((s) => s.job.rules);
  const rules = useMemo(() => resolveRules(rulesInput), [rulesInput]);
  const fromName = useEditor((s) => selectNode(link.from)(s)?.name);
  const toName = useEditor((s) => selectNode(link.to)(s)?.name);
  const fromKind = useEditor((s) => selectNode(link.from)(s)?.kind);
  const toKind = useEditor((s) => selectNode(link.to)(s)?.kind);
  const role = roleWord(fromKind, toKind);
  const result = useEditor(selectResult(id));
  // In of the device that protects this link (its own, or the one upstream that protects it).
  const protectingRating = useEditor((s) => {
    const by = result?.protectedBy;
    return by ? (s.job.links.find((l) => l.id === by)?.device?.rating ?? null) : null;
  });

  return (
    <div className="lwp-details-body" data-details-link={id}>
      <div className="lwp-details-inputs">
        <h3 className="lwp-details-title">Link {id}{link.name ? ` — ${link.name}` : ''}</h3>
        <SizeList id={SIZES_ID} />
        <fieldset className="lwp-group" data-group="identity">
          <legend>Link</legend>
          <TextField field="id" label="Id" value={id} emptyAs="empty" onCommit={(v) => editLink(id, 'id', v ?? '', `rename ${id}`)} />
          <FeedPicker link={link} />
          <Readout label="Role">{role || '—'}</Readout>
          <TextField field="name" label="Name" value={link.name} onCommit={set('name')} />
          <TextField field="notes" label="Notes" value={link.notes} multiline onCommit={set('notes')} />
        </fieldset>
        <fieldset className="lwp-group" data-group="cable">
          <legend>Cable</legend>
          <NumberField field="cable.length" label="Length" unit="m" value={cable.length} min={0} onCommit={set('cable.length')} />
          <SelectField field="cable.material" label="Material" value={cable.material} options={MATERIALS}
            onCommit={set('cable.material')} />
          <NumberField field="cable.active" label="Active conductor" unit="mm²" value={cable.active} above={0}
            list={SIZES_ID} hint={sizeHint(cable.active)} onCommit={set('cable.active')} />
          <NumberField field="cable.earth" label="Earth conductor" unit="mm²" value={cable.earth} above={0}
            list={SIZES_ID} hint={sizeHint(cable.earth)} onCommit={set('cable.earth')} />
          <SelectField field="cable.earthMaterial" label="Earth material" value={cable.earthMaterial ?? 'same'}
            options={EARTH_MATERIALS} onCommit={(m) => editLink(id, 'cable.earthMaterial', m === 'same' ? undefined : m)} />
          <NumberField field="cable.parallel" label="Sets in parallel" value={cable.parallel} min={1} integer optional
            placeholder="1" onCommit={set('cable.parallel')} />
          <NumberField field="cable.reactance" label="Reactance per conductor" unit="Ω/m" value={cable.reactance}
            min={0} optional placeholder={`${num(rules.reactance.value, 6)} (rules)`} onCommit={set('cable.reactance')} />
        </fieldset>
        <LinkCableCapacityFields link={link} result={result} protectingRating={protectingRating} />
        <LinkLoadFields link={link} result={result} />
        <DeviceEditor link={link} />
        <RcdEditor link={link} />
        <fieldset className="lwp-group" data-group="time">
          <legend>Disconnection time</legend>
          <NumberField field="requiredTime" label="Required time override" unit="s" value={link.requiredTime}
            above={0} optional placeholder="from the basis" onCommit={set('requiredTime')} />
        </fieldset>
        <LinkReadingFields link={link} result={result} />
      </div>
      <CircuitResults linkId={id} />
      <FixList linkId={id} />
      <TccView linkId={id} />
    </div>
  );
}
