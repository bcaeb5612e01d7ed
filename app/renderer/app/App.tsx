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
import { RestoreBanner } from './RestoreBanner.js';
import { Splitter } from './Splitter.js';
import { useUi } from './ui.js';

export const RIGHT_DEFAULT = 340;
export const RIGHT_LIMITS = { min: 260, max: 640 };
export const BOTTOM_LIMITS = { min: 120, max: 700 };
const bottomDefault = () => Math.round((typeof window === 'undefined' ? 800 : window.innerHeight) * 0.34);

function RightColumn() {
  const tab = useUi((s) => s.rightTab);
  return (
    <aside className="lw-right" aria-label="Details">
      <div className="lw-tabs" role="tablist">
        <button type="button" role="tab" aria-selected={tab === 'details'} data-tab="details"
          onClick={() => useUi.getState().set({ rightTab: 'details' })}>Selection</button>
        <button type="button" role="tab" aria-selected={tab === 'job'} data-tab="job"
          onClick={() => useUi.getState().set({ rightTab: 'job' })}>Job &amp; rules</button>
      </div>
      <div className="lw-right-body">{tab === 'details' ? <DetailsPanel /> : <JobPanel />}</div>
    </aside>
  );
}

/** The sheet, with the loop breakdown in a drawer over its lower right (it never squeezes the schedule). */
function SheetArea({ onContextMenu }: { onContextMenu(at: { x: number; y: number }): void }) {
  const breakdown = useEditor((s) => s.breakdownLink);
  const collapsed = useBreakdownView((v) => v.collapsed);
  return (
    <div className={`lw-sheet-area${breakdown ? ' has-breakdown' : ''}${collapsed ? ' breakdown-collapsed' : ''}`}>
      <Sheet onContextMenu={onContextMenu} />
      {breakdown && <div className="lw-breakdown-box" data-breakdown-box><BreakdownPanel /></div>}
    </div>
  );
}

export function App() {
  useShortcuts();
  useBreakdownFollowsSelection();
  const layout = useUi((s) => s.layout);
  const onContextMenu = useCallback((at: { x: number; y: number }) => useUi.getState().set({ contextMenu: at }), []);
  const right = layout.rightWidth ?? RIGHT_DEFAULT;
  const bottom = layout.bottomHeight ?? bottomDefault();
  const style = { '--lw-right-width': `${right}px`, '--lw-bottom-height': `${bottom}px` } as CSSProperties;
  return (
    <ReactFlowProvider>
      <div className="lw-app" style={style}>
        <Toolbar />
        <RestoreBanner />
        <div className="lw-main">
          <Palette />
          <div className="lw-centre">
            <SheetArea onContextMenu={onContextMenu} />
            <Splitter orientation="horizontal" label="Height of the circuit schedule" hook="schedule" grow={-1}
              size={bottom} {...BOTTOM_LIMITS} onSize={(h) => useUi.getState().setLayout({ bottomHeight: h })} />
            <section className="lw-bottom" aria-label="Schedule">
              <SchedulePanel />
            </section>
          </div>
          <Splitter orientation="vertical" label="Width of the details column" hook="right" grow={-1}
            size={right} {...RIGHT_LIMITS} onSize={(w) => useUi.getState().setLayout({ rightWidth: w })} />
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
    </ReactFlowProvider>
  );
}
