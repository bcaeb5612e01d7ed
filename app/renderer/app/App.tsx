// The layout: toolbar at top, parts on the left, the sheet in the middle with the loop breakdown
// as a drawer over its lower right, the circuit schedule below the sheet, the details panel on
// the right, the status bar last. The schedule's height and the right column's width can be
// dragged (or set with the arrow keys on the bars between them).
import { useCallback, type CSSProperties } from 'react';
import { ReactFlowProvider } from '@xyflow/react';
import { BreakdownPanel, DetailsPanel, JobPanel, SchedulePanel, useBreakdownFollowsSelection, useBreakdownView } from '../panels/index.js';
import { Sheet } from '../sheet/Sheet.js';
import { useEditor } from '../store/editor.js';
import { useShortcuts } from '../commands/keyboard.js';
import { Toolbar } from './Toolbar.js';
import { Palette } from './Palette.js';
import { StatusBar } from './StatusBar.js';
import { AboutDialog, ProblemsDialog } from './dialogs.js';
import { FindDialog } from './FindDialog.js';
import { AddCircuitsDialog, ConnectDialog } from './WorkDialogs.js';
import { ContextMenu } from './ContextMenu.js';
import { FeedList } from './FeedPicker.js';
import { RestoreBanner } from './RestoreBanner.js';
import { Splitter } from './Splitter.js';
import { useUi, type UiState } from './ui.js';

export const RIGHT_DEFAULT = 340;
export const RIGHT_LIMITS = { min: 260, max: 640 };
export const BOTTOM_LIMITS = { min: 120, max: 700 };
const bottomDefault = () => Math.round((typeof window === 'undefined' ? 800 : window.innerHeight) * 0.34);

const TABS = [
  { id: 'details', label: 'Selection' },
  { id: 'job', label: 'Job & rules' },
] as const;

/** The Selection and Job tabs: a tab list (arrow keys, Home, End) over one tab panel. */
function RightColumn() {
  const tab = useUi((s) => s.rightTab);
  const collapsed = useUi((s) => s.layout.rightCollapsed === true);
  const choose = (id: UiState['rightTab'], focus = false) => {
    useUi.getState().set({ rightTab: id });
    if (focus) requestAnimationFrame(() => document.getElementById(`lw-tab-${id}`)?.focus());
  };
  if (collapsed) {
    return (
      <aside className="lw-right lw-right--collapsed" aria-label="Details (folded)">
        <button type="button" className="lw-unfold" data-action="unfold-right" aria-expanded="false" title="Show the details column"
          onClick={() => useUi.getState().setLayout({ rightCollapsed: false })}>◀ <span>Details</span></button>
      </aside>
    );
  }
  return (
    <aside className="lw-right" aria-label="Details">
      <div className="lw-tabs" role="tablist" aria-label="Details column">
        {TABS.map((t, i) => (
          <button key={t.id} type="button" role="tab" id={`lw-tab-${t.id}`} aria-selected={tab === t.id}
            aria-controls={`lw-tabpanel-${t.id}`} tabIndex={tab === t.id ? 0 : -1} data-tab={t.id}
            onClick={() => choose(t.id)}
            onKeyDown={(e) => {
              const move = e.key === 'ArrowRight' ? 1 : e.key === 'ArrowLeft' ? -1 : 0;
              if (move !== 0) choose(TABS[(i + move + TABS.length) % TABS.length]!.id, true);
              else if (e.key === 'Home') choose(TABS[0].id, true);
              else if (e.key === 'End') choose(TABS[TABS.length - 1]!.id, true);
              else return;
              e.preventDefault();
            }}>{t.label}</button>
        ))}
        <button type="button" className="lw-fold" data-action="fold-right" aria-expanded="true" title="Fold the details column away"
          aria-label="Fold the details column" onClick={() => useUi.getState().setLayout({ rightCollapsed: true })}>▶</button>
      </div>
      <div className="lw-right-body" role="tabpanel" id={`lw-tabpanel-${tab}`} aria-labelledby={`lw-tab-${tab}`} tabIndex={0}>
        {tab === 'details' ? <DetailsPanel /> : <JobPanel />}
      </div>
    </aside>
  );
}

/** The loop breakdown, with the choice of where it sits: over the sheet, or docked beside the schedule. */
function BreakdownBox() {
  const docked = useUi((s) => s.layout.breakdownDock === 'schedule');
  return (
    <div className={`lw-breakdown-box${docked ? ' lw-breakdown-box--docked' : ''}`} data-breakdown-box data-dock={docked ? 'schedule' : 'sheet'}>
      <div className="lw-dock-bar">
        <button type="button" className="lw-link-button" data-action="dock-breakdown"
          title={docked ? 'Float the breakdown over the sheet again' : 'Dock the breakdown beside the schedule, clear of the sheet'}
          onClick={() => useUi.getState().setLayout({ breakdownDock: docked ? 'sheet' : 'schedule' })}>
          {docked ? '⇱ Float over the sheet' : '⇲ Dock beside the schedule'}
        </button>
      </div>
      <BreakdownPanel />
    </div>
  );
}

/** The sheet, with the loop breakdown in a drawer over its lower right unless it is docked by the schedule. */
function SheetArea({ onContextMenu }: { onContextMenu(at: { x: number; y: number }): void }) {
  const breakdown = useEditor((s) => s.breakdownLink);
  const collapsed = useBreakdownView((v) => v.collapsed);
  const docked = useUi((s) => s.layout.breakdownDock === 'schedule');
  const floating = breakdown && !docked;
  return (
    <div className={`lw-sheet-area${floating ? ' has-breakdown' : ''}${collapsed ? ' breakdown-collapsed' : ''}`}>
      <Sheet onContextMenu={onContextMenu} />
      {floating && <BreakdownBox />}
    </div>
  );
}

function Bottom() {
  const breakdown = useEditor((s) => s.breakdownLink);
  const docked = useUi((s) => s.layout.breakdownDock === 'schedule');
  return (
    <section className={`lw-bottom${breakdown && docked ? ' lw-bottom--docked' : ''}`} aria-label="Schedule" id="lw-schedule" tabIndex={-1}>
      <SchedulePanel />
      {breakdown && docked && <BreakdownBox />}
    </section>
  );
}

function PaletteColumn() {
  const collapsed = useUi((s) => s.layout.paletteCollapsed === true);
  if (collapsed) {
    return (
      <aside className="lw-palette lw-palette--collapsed" aria-label="Parts (folded)">
        <button type="button" className="lw-unfold" data-action="unfold-palette" aria-expanded="false" title="Show the parts and legend"
          onClick={() => useUi.getState().setLayout({ paletteCollapsed: false })}>▶ <span>Parts</span></button>
      </aside>
    );
  }
  return <Palette />;
}

export function App() {
  useShortcuts();
  useBreakdownFollowsSelection();
  const layout = useUi((s) => s.layout);
  const onContextMenu = useCallback((at: { x: number; y: number }) => useUi.getState().set({ contextMenu: at }), []);
  const right = layout.rightWidth ?? RIGHT_DEFAULT;
  const bottom = layout.bottomHeight ?? bottomDefault();
  const style = { '--lw-right-width': `${right}px`, '--lw-bottom-height': `${bottom}px` } as CSSProperties;
  const folded = `${layout.paletteCollapsed ? ' lw-main--palette-folded' : ''}${layout.rightCollapsed ? ' lw-main--right-folded' : ''}`;
  return (
    <ReactFlowProvider>
      <div className="lw-app" style={style}>
        <a className="lw-skip" href="#lw-schedule" data-skip-schedule
          onClick={(e) => {
            e.preventDefault();
            const first = document.querySelector<HTMLElement>('#lw-schedule [data-schedule-row]') ?? document.getElementById('lw-schedule');
            first?.focus();
          }}>Skip to the circuit schedule</a>
        <Toolbar />
        <RestoreBanner />
        <div className={`lw-main${folded}`}>
          <PaletteColumn />
          <div className="lw-centre">
            <SheetArea onContextMenu={onContextMenu} />
            <Splitter orientation="horizontal" label="Height of the circuit schedule" hook="schedule" grow={-1}
              size={bottom} {...BOTTOM_LIMITS} onSize={(h) => useUi.getState().setLayout({ bottomHeight: h })} />
            <Bottom />
          </div>
          {!layout.rightCollapsed && (
            <Splitter orientation="vertical" label="Width of the details column" hook="right" grow={-1}
              size={right} {...RIGHT_LIMITS} onSize={(w) => useUi.getState().setLayout({ rightWidth: w })} />
          )}
          <RightColumn />
        </div>
        <StatusBar />
      </div>
      <ContextMenu />
      <FindDialog />
      <AddCircuitsDialog />
      <ConnectDialog />
      <AboutDialog />
      <ProblemsDialog />
      <FeedList />
    </ReactFlowProvider>
  );
}
