// The loop breakdown of one circuit: a bar per segment (the source's Ze when known, then each
// link from the supply) with its ohms and share of the limit, the part before the protecting
// device marked upstream, and the total against the limit with the verdict.

import { useMemo } from 'react';
import { loopBreakdown, resolveRules, type Breakdown, type Job } from '../../../../engine/index.js';
import { useShallow } from 'zustand/react/shallow';
import { selectLink, selectLoopInputs, selectResult, useEditor } from '../../store/index.js';
import { closeBreakdown } from '../actions.js';
import { useBreakdownView } from './follow.js';
import { StatusBadge } from '../details/CircuitResults.js';
import { ohms, percent } from '../format.js';

function safeBreakdown(job: Job, id: string): Breakdown | null {
  try {
    return loopBreakdown(job, id);
  } catch {
    return null;
  }
}

/** One part of the loop against its own limit (unknown-source method). */
function Against(props: { label: string; z: number | null; limit: number | null; scale: number; field: string }) {
  const { z, limit, scale } = props;
  const over = z !== null && limit !== null && z > limit;
  return (
    <div className={over ? 'lwp-bar lwp-bar-total lwp-bar-over' : 'lwp-bar lwp-bar-total'} data-breakdown-part={props.field}>
      <span className="lwp-bar-label">{props.label}</span>
      <span className="lwp-bar-track" aria-hidden="true">
        <span className="lwp-bar-fill" style={{ width: `${Math.min(100, ((z ?? 0) / scale) * 100)}%` }} />
        {limit !== null ? <span className="lwp-bar-limit" style={{ left: `${Math.min(100, (limit / scale) * 100)}%` }} /> : null}
      </span>
      <span className="lwp-bar-value">
        {ohms(z)} against {ohms(limit)}{z !== null && limit ? ` (${percent(z / limit)})` : ''}{over ? ' — over' : ''}
      </span>
    </div>
  );
}

export function BreakdownView({ linkId }: { linkId: string }) {
  // Recomputed only when a record on this link's path (or the rules) changes, not on every edit.
  const inputs = useEditor(useShallow(selectLoopInputs(linkId)));
  const rules = useEditor((s) => s.job.rules);
  const result = useEditor(selectResult(linkId));
  const breakdown = useMemo(() => safeBreakdown(useEditor.getState().job, linkId), [inputs, linkId]);
  if (!breakdown) return <p className="lwp-empty">No loop breakdown for {linkId}: no supply reaches it.</p>;
  const { limit, total, segments, method } = breakdown;
  const known = method === 'known-source';
  const share = resolveRules(rules).unknownSourceShare.value;
  // Bars share one scale: the larger of the limit and the total fills the track.
  const scale = Math.max(limit ?? 0, total, ...segments.map((s) => s.z)) || 1;
  const over = known && limit !== null && total > limit;
  return (
    <div className="lwp-breakdown-body" data-breakdown={linkId}>
      <p className="lwp-breakdown-method">
        {known
          ? 'Source impedance known: the whole loop Zs against the limit.'
          : `Source unknown: the circuit from its device may use ${percent(share)} of the limit; the drawn links before the device are tested against the rest.`}
      </p>
      <ol className="lwp-bars">
        {segments.map((s) => (
          <li key={`${s.kind}-${s.id}`} className={s.upstream ? 'lwp-bar lwp-bar-upstream' : 'lwp-bar'}
            data-segment={s.id} data-segment-kind={s.kind} data-upstream={s.upstream ? 'true' : 'false'}
            data-r={s.r} data-x={s.x} data-z={s.z} title={`R ${s.r.toFixed(4)} Ω, X ${s.x.toFixed(4)} Ω`}>
            <span className="lwp-bar-label" title={s.label}>
              <span className="lwp-bar-name">{s.label}</span>
              {s.upstream ? <em className="lwp-bar-tag" title="Upstream: lies before the protecting device">upstream</em> : null}
            </span>
            <span className="lwp-bar-track" aria-hidden="true">
              <span className="lwp-bar-fill" style={{ width: `${Math.min(100, (s.z / scale) * 100)}%` }} />
            </span>
            <span className="lwp-bar-value">
              {ohms(s.z)}
              {s.share !== null ? ` · ${percent(s.share)} of limit` : ''}
            </span>
          </li>
        ))}
      </ol>
      <div className={over ? 'lwp-bar lwp-bar-total lwp-bar-over' : 'lwp-bar lwp-bar-total'} data-breakdown-total={total}>
        <span className="lwp-bar-label">{known ? 'Total Zs' : 'Whole drawn loop'}</span>
        <span className="lwp-bar-track" aria-hidden="true">
          <span className="lwp-bar-fill" style={{ width: `${Math.min(100, (total / scale) * 100)}%` }} />
          {known && limit !== null ? <span className="lwp-bar-limit" style={{ left: `${Math.min(100, (limit / scale) * 100)}%` }} /> : null}
        </span>
        <span className="lwp-bar-value">
          {known ? `${ohms(total)} against limit ${ohms(limit)}${limit ? ` (${percent(total / limit)})` : ''}` : ohms(total)}
        </span>
      </div>
      {!known ? (
        <>
          <Against label="Own loop, from the device" z={breakdown.own} limit={limit} scale={scale} field="own" />
          <Against label="Upstream, before the device" z={breakdown.upstream} field="upstream" scale={scale}
            limit={limit !== null ? (limit * (1 - share)) / share : null} />
        </>
      ) : null}
      <p className="lwp-breakdown-verdict">
        Verdict: {result ? <StatusBadge status={result.status} /> : '—'}
        {result && result.ratio !== null ? ` — ratio ${percent(result.ratio)}` : ''}
      </p>
      {result && result.notes.length > 0 ? (
        <details className="lwp-breakdown-notes">
          <summary>Notes ({result.notes.length})</summary>
          <ul className="lwp-results-notes">
            {result.notes.map((n, i) => (
              <li key={i}>{n}</li>
            ))}
          </ul>
        </details>
      ) : null}
    </div>
  );
}

export function BreakdownPanel() {
  const linkId = useEditor((s) => s.breakdownLink);
  const name = useEditor((s) => (s.breakdownLink ? selectLink(s.breakdownLink)(s)?.name : undefined));
  const status = useEditor((s) => (s.breakdownLink ? s.resultById[s.breakdownLink]?.status : undefined));
  const pinned = useBreakdownView((v) => v.pinned);
  const collapsed = useBreakdownView((v) => v.collapsed);
  if (!linkId) return null;
  const title = `Loop breakdown: ${linkId}${name ? ` — ${name}` : ''}`;
  const set = useBreakdownView.getState().set;
  return (
    <section className={`lwp-panel lwp-breakdown${collapsed ? ' lwp-breakdown-collapsed' : ''}`} data-panel="breakdown"
      data-pinned={pinned ? 'true' : 'false'} data-collapsed={collapsed ? 'true' : 'false'} aria-label={`Loop breakdown of ${linkId}`}>
      <header className="lwp-panel-head lwp-breakdown-head">
        <h2 className="lwp-panel-title" title={title}>
          <span className="lwp-breakdown-kicker">Loop breakdown</span>
          <span className="lwp-breakdown-title-line">
            <span className="lwp-breakdown-title-text">{linkId}{name ? ` — ${name}` : ''}</span>
            {status ? <StatusBadge status={status} /> : null}
          </span>
        </h2>
        <div className="lwp-breakdown-actions">
          <button type="button" className={pinned ? 'lwp-button lwp-button-small lwp-button-on' : 'lwp-button lwp-button-small'}
            data-action="pin-breakdown" aria-pressed={pinned}
            title={pinned ? `Unpin: follow the selected circuit again` : `Pin: keep showing ${linkId} when another circuit is selected`}
            onClick={() => set({ pinned: !pinned })}>
            {pinned ? '📌 Pinned' : 'Pin'}
          </button>
          <button type="button" className="lwp-button lwp-button-small" data-action="collapse-breakdown" aria-expanded={!collapsed}
            title={collapsed ? 'Unfold the loop breakdown' : 'Fold the loop breakdown to its title'}
            onClick={() => set({ collapsed: !collapsed })}>
            {collapsed ? '▴ Show' : '▾ Fold'}
          </button>
          <button type="button" className="lwp-button lwp-button-small" data-action="close-breakdown"
            aria-label="Close the loop breakdown" title="Close the loop breakdown and clear the traced path (Esc)" onClick={closeBreakdown}>
            ✕
          </button>
        </div>
        <p className="lwp-breakdown-mode" data-breakdown-mode={pinned ? 'pinned' : 'follows'}>
          {pinned
            ? `📌 Pinned to ${linkId}: selecting another circuit leaves it here.`
            : 'Follows the selected circuit (sheet or schedule). Pin to keep this one.'}
        </p>
      </header>
      {collapsed ? null : <BreakdownView linkId={linkId} />}
    </section>
  );
}
