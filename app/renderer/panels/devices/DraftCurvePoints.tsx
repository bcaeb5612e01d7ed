// The time–current points of a curve device still being entered: rows start empty, and the
// draft becomes the link's device once there are at least two complete rows (and a rating)
// that the engine accepts (current rising, time falling).

import type { DeviceDraft, DraftPoint } from './drafts.js';
import { editDraft } from './drafts.js';
import { NumberField } from '../fields/fields.js';

export function DraftCurvePoints({ linkId, draft }: { linkId: string; draft: DeviceDraft }) {
  const points = draft.points;
  const setPoints = (next: DraftPoint[]) => editDraft(linkId, { points: next });
  const cell = (i: number, j: 0 | 1) => (v: number | undefined) => {
    const next = points.map((p) => [...p] as DraftPoint);
    next[i]![j] = v;
    return setPoints(next);
  };
  return (
    <div className="lwp-curve" data-curve-points="draft">
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
                  value={p[0]} above={0} optional placeholder="A" onCommit={cell(i, 0)} />
              </td>
              <td>
                <NumberField compact field={`device.points.${i}.1`} label={`Point ${i + 1} time`} unit="s"
                  value={p[1]} above={0} optional placeholder="s" onCommit={cell(i, 1)} />
              </td>
              <td>
                <button type="button" className="lwp-button lwp-button-small" data-action="remove-point"
                  aria-label={`Remove point ${i + 1}`} onClick={() => setPoints(points.filter((_, k) => k !== i))}>
                  ✕
                </button>
              </td>
            </tr>
          ))}
        </tbody>
      </table>
      <button type="button" className="lwp-button" data-action="add-point"
        onClick={() => setPoints([...points, [undefined, undefined]])}>
        + Add point
      </button>
      <p className="lwp-hint">
        Enter the points of the device's published time–current curve, current rising, time falling, or pick a fuse
        from the library below.
      </p>
    </div>
  );
}
