// The time–current view of the selected circuit: a log–log plot (our own SVG) of its protecting
// device's characteristic, with the earth-fault current If, the trip current Ia, the required
// time and the clearing time marked, and the upstream device (the one protecting the link that
// feeds this circuit's origin board) beside it, flagged "may not discriminate" where it would
// operate at the maximum fault current within this device's time. A flag, not a verdict.

import { useMemo } from 'react';
import { CAUTION, deviceMark, resolveRules, type CircuitResult, type Device, type Job } from '../../../../engine/index.js';
import { useShallow } from 'zustand/react/shallow';
import { useEditor, type EditorState } from '../../store/index.js';
import { STATUS_LOOK, amps, seconds } from '../format.js';
import { characteristic, discrimination, INSTANT, TIME_MAX, TIME_MIN, type Characteristic, type Discrimination } from './characteristic.js';
import { decadeDomain, decadeLabel, decades, logPosition, type LogAxis } from './scale.js';
import './tcc.css';

/** Drawing units of the plot (the SVG scales to the panel's width). */
export const PLOT = { width: 340, height: 290, left: 44, right: 16, top: 12, bottom: 40 } as const;

export interface TccModel {
  link: string;
  result: CircuitResult;
  /** The protecting link and its device. */
  down: { link: string; device: Device; mark: string; c: Characteristic } | null;
  up: { link: string; device: Device; mark: string; c: Characteristic } | null;
  /** Imax at the protecting link's origin (its faultLevel), A. */
  imax: number | null;
  flag: Discrimination;
}

/** Everything the view draws, from the job and its results (pure; the tests use it too). */
export function tccModel(job: Job, resultById: Record<string, CircuitResult>, linkId: string): TccModel | null {
  const result = resultById[linkId];
  if (!result) return null;
  const rules = resolveRules(job.rules);
  const linkOf = (id: string | null) => (id ? job.links.find((l) => l.id === id) : undefined);
  const protecting = linkOf(result.protectedBy);
  const down = protecting?.device
    ? { link: protecting.id, device: protecting.device, mark: deviceMark(protecting.device), c: characteristic(protecting.device, rules) }
    : null;
  // Upstream: the device that protects the link feeding the protecting link's origin.
  const feeder = protecting ? job.links.find((l) => l.to === protecting.from) : undefined;
  const upLink = feeder ? linkOf(resultById[feeder.id]?.protectedBy ?? null) : undefined;
  const up = upLink?.device
    ? { link: upLink.id, device: upLink.device, mark: deviceMark(upLink.device), c: characteristic(upLink.device, rules) }
    : null;
  const imax = protecting ? (resultById[protecting.id]?.faultLevel ?? null) : null;
  const flag = down ? discrimination(down.c, up?.c ?? null, imax, protecting!.id) : { kind: 'unknown' as const, reason: 'no protecting device' };
  return { link: linkId, result, down, up, imax, flag };
}

/** The current axis of a model: whole decades holding every line and mark. */
export function currentAxis(m: TccModel): LogAxis {
  const values: number[] = [];
  for (const d of [m.down, m.up]) if (d) for (const [i] of d.c.points) values.push(i * 0.8, i * 1.25);
  for (const v of [m.result.faultCurrent, m.result.tripCurrent, m.imax]) if (v !== null) values.push(v * 0.8, v * 1.25);
  const { lo, hi } = decadeDomain(values, 2);
  return { lo, hi, from: PLOT.left, to: PLOT.width - PLOT.right };
}

export const TIME_AXIS: LogAxis = { lo: TIME_MIN, hi: TIME_MAX, from: PLOT.height - PLOT.bottom, to: PLOT.top };

function path(c: Characteristic, x: LogAxis): string {
  const pts = c.points.map(([i, t]) => [logPosition(x, i), logPosition(TIME_AXIS, Math.min(Math.max(t, TIME_MIN), TIME_MAX))]);
  // The last time holds for every larger current: carry it to the right edge.
  const last = c.points[c.points.length - 1]!;
  pts.push([x.to, logPosition(TIME_AXIS, last[1])]);
  return pts.map(([px, py], k) => `${k === 0 ? 'M' : 'L'}${px!.toFixed(2)},${py!.toFixed(2)}`).join(' ');
}

const FLAG_LOOK = {
  flag: { symbol: '⚠', word: 'may not discriminate', className: 'lwt-flag-warn' },
  clear: { symbol: '○', word: 'no overlap at Imax', className: 'lwt-flag-clear' },
  unknown: { symbol: '?', word: 'discrimination not assessed', className: 'lwt-flag-unknown' },
} as const;

function flagText(m: TccModel): string {
  const f = m.flag;
  const up = m.up ? `${m.up.mark} on ${m.up.link}` : '';
  if (f.kind === 'unknown') return f.reason;
  if (f.kind === 'flag') {
    return `at Imax ${amps(f.current)} the upstream ${up} operates in ${seconds(f.upstreamTime)}, within this device's ${seconds(f.downstreamTime)}`;
  }
  return `at Imax ${amps(f.current)} the upstream ${up} ${f.upstreamTime === null ? 'is not taken to operate' : `takes ${seconds(f.upstreamTime)}`}, this device ${seconds(f.downstreamTime)}`;
}

/**
 * The store records the view depends on (rules, this result, the protecting link and its
 * result, the feeder of its origin, the upstream protecting link): a drag or an edit elsewhere
 * leaves them all the same, so the plot is not redrawn.
 */
function tccInputs(linkId: string) {
  return (s: EditorState): unknown[] => {
    const result = s.resultById[linkId];
    const protecting = result?.protectedBy ? s.job.links.find((l) => l.id === result.protectedBy) : undefined;
    const feeder = protecting ? s.job.links.find((l) => l.to === protecting.from) : undefined;
    const feederResult = feeder ? s.resultById[feeder.id] : undefined;
    const upLink = feederResult?.protectedBy ? s.job.links.find((l) => l.id === feederResult.protectedBy) : undefined;
    return [s.job.rules, result, protecting, protecting ? s.resultById[protecting.id] : undefined, feeder, feederResult, upLink];
  };
}

export function TccView({ linkId }: { linkId: string }) {
  const inputs = useEditor(useShallow(tccInputs(linkId)));
  const m = useMemo(() => {
    const s = useEditor.getState();
    return tccModel(s.job, s.resultById, linkId);
    // The model is a function of exactly these records (tccInputs).
  }, [linkId, ...inputs]);
  if (!m) return null;
  if (!m.down) {
    return (
      <section className="lwt" aria-label={`Time–current view for ${linkId}`} data-tcc={linkId}>
        <h4>Time–current view</h4>
        <p className="lwp-hint" data-tcc-empty="">No protecting device: there is no characteristic to plot.</p>
        <p className="lwt-caution">{CAUTION}</p>
      </section>
    );
  }
  const x = currentAxis(m);
  const r = m.result;
  const look = STATUS_LOOK[r.status];
  const flag = FLAG_LOOK[m.flag.kind];
  const X = (v: number) => logPosition(x, v);
  const Y = (t: number) => logPosition(TIME_AXIS, Math.min(Math.max(t, TIME_MIN), TIME_MAX));
  const top = PLOT.top;
  const bottom = PLOT.height - PLOT.bottom;
  const stylised = [m.down, m.up].filter((d) => d?.c.stylised).map((d) => d!.mark);
  const clipId = `lwt-clip-${linkId.replace(/[^A-Za-z0-9_-]/g, '_')}`;

  return (
    <section className="lwt" aria-label={`Time–current view for ${linkId}`} data-tcc={linkId}>
      <h4>Time–current view</h4>
      <p className="lwt-status">
        <span className="lwt-status-name">Loop check</span>
        <span className={`lwp-status ${look.className}`} data-tcc-status={r.status}>
          <span aria-hidden="true">{look.symbol}</span> {look.word}
        </span>{' '}
        <span className={`lwt-flag ${flag.className}`} data-discrimination={m.flag.kind}>
          <span aria-hidden="true">{flag.symbol}</span> {flag.word}
        </span>
      </p>
      <p className="lwt-flag-detail">
        {flagText(m)}{m.flag.kind === 'unknown' ? '.' : ' (a flag for the designer, not a verdict).'}
      </p>
      <svg className="lwt-plot" viewBox={`0 0 ${PLOT.width} ${PLOT.height}`} role="img"
        aria-label={`Time against current, log–log: ${m.down.mark} on ${m.down.link}${m.up ? `, upstream ${m.up.mark} on ${m.up.link}` : ''}`}
        data-axis-current={`${x.lo}-${x.hi}`}>
        <defs>
          <clipPath id={clipId}>
            <rect x={PLOT.left} y={top} width={x.to - x.from} height={bottom - top} />
          </clipPath>
        </defs>
        <rect x={PLOT.left} y={top} width={x.to - x.from} height={bottom - top} className="lwt-frame" />
        {decades(x.lo, x.hi).map((v) => (
          <g key={`x${v}`} data-tick-current={v}>
            <line x1={X(v)} x2={X(v)} y1={top} y2={bottom} className="lwt-grid" />
            <text x={X(v)} y={bottom + 13} textAnchor="middle" className="lwt-tick">{decadeLabel(v)}</text>
          </g>
        ))}
        {decades(TIME_AXIS.lo, TIME_AXIS.hi).map((v) => (
          <g key={`y${v}`} data-tick-time={v}>
            <line x1={x.from} x2={x.to} y1={Y(v)} y2={Y(v)} className="lwt-grid" />
            <text x={PLOT.left - 4} y={Y(v) + 4} textAnchor="end" className="lwt-tick">{decadeLabel(v)}</text>
          </g>
        ))}
        <text x={(x.from + x.to) / 2} y={PLOT.height - 6} textAnchor="middle" className="lwt-axis">current (A)</text>
        <text x={12} y={(top + bottom) / 2} textAnchor="middle" className="lwt-axis"
          transform={`rotate(-90 12 ${(top + bottom) / 2})`}>time (s)</text>
        <g clipPath={`url(#${clipId})`}>
          {m.up ? <path d={path(m.up.c, x)} className="lwt-up" data-tcc-curve="upstream" /> : null}
          <path d={path(m.down.c, x)} className="lwt-down" data-tcc-curve="device" />
          {r.requiredTime !== null ? (
            <line x1={x.from} x2={x.to} y1={Y(r.requiredTime)} y2={Y(r.requiredTime)} className="lwt-treq" data-tcc-mark="requiredTime" />
          ) : null}
          {r.tripCurrent !== null ? (
            <line x1={X(r.tripCurrent)} x2={X(r.tripCurrent)} y1={top} y2={bottom} className="lwt-ia" data-tcc-mark="tripCurrent" />
          ) : null}
          {r.faultCurrent !== null ? (
            <line x1={X(r.faultCurrent)} x2={X(r.faultCurrent)} y1={top} y2={bottom} className="lwt-if" data-tcc-mark="faultCurrent" />
          ) : null}
          {m.imax !== null ? (
            <line x1={X(m.imax)} x2={X(m.imax)} y1={top} y2={bottom} className="lwt-imax" data-tcc-mark="faultLevel" />
          ) : null}
          {r.faultCurrent !== null && r.clearingTime !== null ? (
            <g data-tcc-mark="clearingTime" data-x={X(r.faultCurrent)} data-y={Y(r.clearingTime)}>
              <circle cx={X(r.faultCurrent)} cy={Y(r.clearingTime)} r={3.5} className="lwt-clear" />
            </g>
          ) : null}
        </g>
        {/* Short names at the marks, staggered so that close marks stay readable. */}
        {r.faultCurrent !== null ? <MarkLabel x={X(r.faultCurrent)} y={top + 11} edge={x.to} text="If" /> : null}
        {r.tripCurrent !== null ? <MarkLabel x={X(r.tripCurrent)} y={top + 23} edge={x.to} text="Ia" /> : null}
        {m.imax !== null ? <MarkLabel x={X(m.imax)} y={top + 35} edge={x.to} text="Imax" /> : null}
        {r.requiredTime !== null ? <text x={x.from + 3} y={Y(r.requiredTime) - 3} className="lwt-label lwt-label-treq">t req</text> : null}
      </svg>
      <table className="lwt-key">
        <tbody>
          <Key swatch="lwt-down" label={`${m.down.mark} on ${m.down.link}${m.down.c.stylised ? ' (stylised)' : ''}`} value="this circuit's device" />
          {m.up ? <Key swatch="lwt-up" label={`${m.up.mark} on ${m.up.link}${m.up.c.stylised ? ' (stylised)' : ''}`} value="upstream device" /> : null}
          <Key swatch="lwt-if" label="If, earth-fault current" value={amps(r.faultCurrent)} />
          <Key swatch="lwt-ia" label="Ia, trip current" value={amps(r.tripCurrent)} />
          <Key swatch="lwt-treq" label="required time" value={seconds(r.requiredTime)} />
          <Key swatch="lwt-clear" dot label="clearing time at If" value={seconds(r.clearingTime)} />
          <Key swatch="lwt-imax" label={`Imax at the origin of ${m.down.link}`} value={amps(m.imax)} />
        </tbody>
      </table>
      {r.faultCurrent === null ? (
        <p className="lwp-hint">If and the clearing time need the source impedance Ze (they are not found with the source unknown).</p>
      ) : null}
      {stylised.length > 0 ? (
        <p className="lwp-hint" data-tcc-stylised="">
          Stylised: {stylised.join(', ')} drawn by rule (instantaneous step at Ia down to {INSTANT} s
          {[m.down, m.up].some((d) => d?.device.type === 'mcb') ? '; a breaker\'s overload part through 1.45 In at 1 h and 2.55 In at 60 s' : ''}),
          not the maker's curve.
        </p>
      ) : null}
      <p className="lwt-caution">{CAUTION}</p>
    </section>
  );
}

/** A mark's short name beside its line, on the left of it near the right edge. */
function MarkLabel({ x, y, edge, text }: { x: number; y: number; edge: number; text: string }) {
  const left = x > edge - 8 * text.length;
  return (
    <text x={left ? x - 2 : x + 2} y={y} textAnchor={left ? 'end' : 'start'} className="lwt-label">{text}</text>
  );
}

function Key({ swatch, label, value, dot }: { swatch: string; label: string; value: string; dot?: boolean }) {
  return (
    <tr>
      <td>
        <svg width="26" height="10" aria-hidden="true" className="lwt-swatch">
          {dot ? <circle cx="13" cy="5" r="3.5" className={swatch} /> : <line x1="1" x2="25" y1="5" y2="5" className={swatch} />}
        </svg>
      </td>
      <th scope="row">{label}</th>
      <td>{value}</td>
    </tr>
  );
}
