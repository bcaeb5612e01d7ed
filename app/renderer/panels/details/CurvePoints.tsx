// The table editor for a curve device's time–current points [current A, time s]:
// add, remove and edit rows. The engine requires at least two points, current rising and
// time falling; an edit that breaks that is refused with the reason shown under the table.

import { useState } from 'react';
import type { CurveDevice } from '../../../../engine/index.js';
import { editLink } from '../actions.js';
import { FieldError, NumberField, type Outcome } from '../fields/fields.js';

export function CurvePoints({ linkId, device }: { linkId: string; device: CurveDevice }) {
  const [error, setError] = useState<string | null>(null);
  const points = device.points;
  const report = (o: Outcome) => {
    setError(o.ok ? null : o.reason);
    return o;
  };
  const add = () => {
    const last = points.at(-1);
    // A new row continues the curve: twice the current, half the time (still rising / falling).
    const next: [number, number] = last ? [last[0] * 2, last[1] / 2] : [device.rating * 2, 10];
    report(editLink(linkId, 'device.points', [...points, next], `add a curve point to ${linkId}`));
  };
  /** A cell shows its own refusal; a good edit clears the table's message. */
  const cell = (field: string, v: number | undefined): Outcome => {
    const o = editLink(linkId, field, v);
    if (o.ok) setError(null);
    return o;
  };
  const remove = (index: number) =>
    report(editLink(linkId, 'device.points', points.filter((_, i) => i !== index), `remove a curve point from ${linkId}`));

  return (
    <div className="lwp-curve" data-curve-points="">
      <table className="lwp-curve-table">
        <caption>Time–current points</caption>
        <thead>
          <tr>
            <th scope="col">#</th>
            <th scope="col">Current (A)</th>
            <th scope="col">Time (s)</th>
            <th scope="col">
              <span className="lwp-sr">Remove</span>
            </th>
          </tr>
        </thead>
        <tbody>
          {points.map((p, i) => (
            <tr key={i} data-curve-row={i}>
              <td>{i + 1}</td>
              <td>
                <NumberField compact field={`device.points.${i}.0`} label={`Point ${i + 1} current`} unit="A"
                  value={p[0]} above={0} onCommit={(v) => cell(`device.points.${i}.0`, v)} />
              </td>
              <td>
                <NumberField compact field={`device.points.${i}.1`} label={`Point ${i + 1} time`} unit="s"
                  value={p[1]} above={0} onCommit={(v) => cell(`device.points.${i}.1`, v)} />
              </td>
              <td>
                <button type="button" className="lwp-button lwp-button-small" data-action="remove-point"
                  aria-label={`Remove point ${i + 1}`} disabled={points.length <= 2}
                  title={points.length <= 2 ? 'A curve needs at least two points' : undefined}
                  onClick={() => remove(i)}>
                  ✕
                </button>
              </td>
            </tr>
          ))}
        </tbody>
      </table>
      <button type="button" className="lwp-button" data-action="add-point" onClick={add}>
        + Add point
      </button>
      <FieldError field="device.points" error={error} />
      <p className="lwp-hint">Enter the points of the device's published time–current curve, current rising, time falling.</p>
    </div>
  );
}
