// One-click fixes for a failing circuit: a button per fix in the details panel (FixList), and a
// compact menu of the same buttons in the schedule row (FixMenu). Each click is one undoable edit.

import { useEffect, useId, useLayoutEffect, useRef, useState } from 'react';
import { createPortal } from 'react-dom';
import { CAUTION, type CircuitResult, type Fix } from '../../../../engine/index.js';
import { selectResult, useEditor } from '../../store/index.js';
import { STATUS_LOOK } from '../format.js';
import { applyFix, planFix } from './apply.js';
import './fixes.css';

const KIND_WORD: Record<Fix['kind'], string> = {
  length: 'shorter cable (rounded down to 0.1 m, so it still passes)',
  size: 'larger cable',
  device: 'smaller or faster device',
  rcd: 'add an RCD',
};

/** Fixes are offered where the loop or the voltage check fails, or the circuit relies on an RCD. */
function needsFix(r: CircuitResult): boolean {
  return r.status === 'fail' || r.status === 'rcd' || r.voltageStatus === 'fail';
}

function useLinks() {
  return useEditor((s) => s.job.links);
}

function FixButton({ result, fix, onDone, compact }: { result: CircuitResult; fix: Fix; onDone?: () => void; compact?: boolean }) {
  const links = useLinks();
  const plan = planFix({ links }, result, fix);
  if ('error' in plan) return null;
  return (
    <button
      type="button"
      className={`lwp-button lwf-fix lwf-fix-${fix.kind}`}
      data-fix={fix.kind}
      data-fix-link={result.link}
      title={`${plan.description[0]!.toUpperCase()}${plan.description.slice(1)}. One step: Undo puts it back.`}
      onClick={(e) => {
        e.stopPropagation();
        applyFix(result.link, fix);
        onDone?.();
      }}
    >
      <span className="lwf-fix-label">{plan.label}</span>
      {compact ? null : <span className="lwf-fix-kind">{KIND_WORD[fix.kind]}{fix.kind === 'rcd' ? ' (relies on the RCD: not a pass)' : ''}</span>}
    </button>
  );
}

/** What to change by hand for a failing check the engine offers no fix for (method-depth.md §8 covers loop and drop). */
const MANUAL: ReadonlyArray<{ failing(r: CircuitResult): boolean; check: string; hint: string }> = [
  { failing: (r) => r.capacityStatus === 'fail', check: 'cable capacity (Ib ≤ In ≤ Iz)', hint: 'a larger cable, or a device rating between Ib and Iz' },
  { failing: (r) => r.breakingStatus === 'fail', check: 'breaking capacity', hint: 'a device whose breaking capacity covers the fault level at its origin' },
  { failing: (r) => r.withstandStatus === 'fail', check: 'earth withstand', hint: 'a larger protective conductor, or a device that clears the fault faster' },
  { failing: (r) => r.measured?.status === 'fail', check: 'measured reading', hint: 'the reading is above its test limit: find the cause on site (connections, the cable run) and test again' },
];

/** Failing checks with no one-click fix: said plainly, with what to change by hand. */
function ManualFixes({ r }: { r: CircuitResult }) {
  const open = MANUAL.filter((m) => m.failing(r));
  if (open.length === 0) return null;
  return (
    <section className="lwf-fixes lwf-fixes-manual" aria-label={`Failing checks of ${r.link} without a one-click fix`} data-fixes-manual={r.link}>
      <h4><span aria-hidden="true">{STATUS_LOOK.fail.symbol}</span> {STATUS_LOOK.fail.word}: no one-click fix</h4>
      <ul className="lwf-manual">
        {open.map((m) => (
          <li key={m.check} data-manual-check={m.check}><strong>{m.check}</strong>: {m.hint}.</li>
        ))}
      </ul>
    </section>
  );
}

/** The details panel's list of fixes for one circuit (nothing when it needs none). */
export function FixList({ linkId }: { linkId: string }) {
  const r = useEditor(selectResult(linkId));
  if (!r) return null;
  if (!needsFix(r)) return <ManualFixes r={r} />;
  const look = STATUS_LOOK[r.status === 'pass' ? 'fail' : r.status];
  return (
    <section className="lwf-fixes" aria-label={`Fixes for ${linkId}`} data-fixes={linkId}>
      <h4>
        <span aria-hidden="true">{look.symbol}</span> Changes that make {linkId} pass
      </h4>
      {r.fixes.length === 0 ? (
        <p className="lwf-none" data-fixes-none>
          No single change of length, cable size, device or RCD was found that makes it pass.
        </p>
      ) : (
        <>
          <p className="lwf-lead">Each is one change with everything else as it is; one click applies it (Undo puts it back).</p>
          <div className="lwf-fix-list">
            {r.fixes.map((fix, i) => (
              <FixButton key={`${fix.kind}-${i}`} result={r} fix={fix} />
            ))}
          </div>
        </>
      )}
      <ManualList r={r} />
      <p className="lwf-caution">{CAUTION}</p>
    </section>
  );
}

/** Inside the list of fixes: the failing checks no fix there addresses. */
function ManualList({ r }: { r: CircuitResult }) {
  const open = MANUAL.filter((m) => m.failing(r));
  if (open.length === 0) return null;
  return (
    <ul className="lwf-manual" data-fixes-manual={r.link}>
      {open.map((m) => (
        <li key={m.check} data-manual-check={m.check}><strong>{m.check}</strong> also fails, with no one-click fix: {m.hint}.</li>
      ))}
    </ul>
  );
}

/** The schedule row's compact menu: a "Fix" button that opens the same buttons. */
export function FixMenu({ linkId }: { linkId: string }) {
  const r = useEditor(selectResult(linkId));
  const [open, setOpen] = useState(false);
  const [at, setAt] = useState<{ left: number; top: number } | null>(null);
  const button = useRef<HTMLButtonElement>(null);
  const menu = useRef<HTMLDivElement>(null);
  const menuId = useId();
  const count = r && needsFix(r) ? r.fixes.length : 0;

  useLayoutEffect(() => {
    if (!open || !button.current) return;
    const rect = button.current.getBoundingClientRect();
    setAt({ left: Math.max(4, rect.right - 260), top: rect.bottom + 2 });
  }, [open]);

  useEffect(() => {
    if (!open) return;
    const close = (e: Event) => {
      const t = e.target as Node | null;
      if (t && (menu.current?.contains(t) || button.current?.contains(t))) return;
      setOpen(false);
    };
    // The menu is placed by the button's position on screen: a scroll of the schedule closes it.
    window.addEventListener('pointerdown', close, true);
    window.addEventListener('scroll', close, true);
    return () => {
      window.removeEventListener('pointerdown', close, true);
      window.removeEventListener('scroll', close, true);
    };
  }, [open]);

  useEffect(() => {
    if (open) menu.current?.querySelector<HTMLButtonElement>('button')?.focus();
  }, [open, at]);

  if (!r || count === 0) return null;
  const finish = () => {
    setOpen(false);
    button.current?.focus();
  };
  return (
    <span className="lwf-menu-wrap">
      <button
        ref={button}
        type="button"
        className="lwp-button lwf-menu-button"
        data-fix-menu={linkId}
        aria-expanded={open}
        aria-controls={open ? menuId : undefined}
        title={`${count} change${count === 1 ? '' : 's'} that make ${linkId} pass`}
        onClick={(e) => {
          e.stopPropagation();
          setOpen((o) => !o);
        }}
      >
        Fix ({count}) <span aria-hidden="true">▾</span>
      </button>
      {/* The menu goes to the page's body: the schedule and details bodies are layout containers
          (CSS containment), which would place a fixed menu by their corner and clip it. */}
      {open ? createPortal(
        <div
          ref={menu}
          id={menuId}
          role="group"
          aria-label={`Fixes for ${linkId}`}
          className="lwf-menu"
          data-fix-menu-list={linkId}
          style={at ? { left: at.left, top: at.top } : undefined}
          onClick={(e) => e.stopPropagation()}
          onKeyDown={(e) => {
            if (e.key === 'Escape') {
              e.stopPropagation();
              finish();
            }
          }}
          onBlur={(e) => {
            // Tabbing out of the menu closes it (it sits at the end of the page, away from its row).
            const to = e.relatedTarget as Node | null;
            if (to && !menu.current?.contains(to) && !button.current?.contains(to)) setOpen(false);
          }}
        >
          {r.fixes.map((fix, i) => (
            <FixButton key={`${fix.kind}-${i}`} result={r} fix={fix} onDone={finish} />
          ))}
        </div>,
        document.body,
      ) : null}
    </span>
  );
}
