// The layout: toolbar at top, parts on the left, the sheet in the middle, the details panel on
// the right, the circuit schedule (and the loop breakdown) below the sheet, the status bar last.
import { useCallback } from 'react';
import { ReactFlowProvider } from '@xyflow/react';
import { BreakdownPanel, DetailsPanel, JobPanel, SchedulePanel } from '../panels/index.js';
import { Sheet } from '../sheet/Sheet.js';
import { useEditor } from '../store/editor.js';
import { useShortcuts } from '../commands/keyboard.js';
import { Toolbar } from './Toolbar.js';
import { Palette } from './Palette.js';
import { StatusBar } from './StatusBar.js';
import { AboutDialog, ProblemsDialog } from './dialogs.js';
import { FindDialog } from './FindDialog.js';
import { ContextMenu } from './ContextMenu.js';
import { RestoreBanner } from './RestoreBanner.js';
import { useUi } from './ui.js';

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

function Bottom() {
  const breakdown = useEditor((s) => s.breakdownLink);
  return (
    <section className={`lw-bottom${breakdown ? ' has-breakdown' : ''}`}>
      <div className="lw-schedule-box"><SchedulePanel /></div>
      {breakdown && <div className="lw-breakdown-box" data-breakdown-box><BreakdownPanel /></div>}
    </section>
  );
}

export function App() {
  useShortcuts();
  const onContextMenu = useCallback((at: { x: number; y: number }) => useUi.getState().set({ contextMenu: at }), []);
  return (
    <ReactFlowProvider>
      <div className="lw-app">
        <Toolbar />
        <RestoreBanner />
        <div className="lw-main">
          <Palette />
          <div className="lw-centre">
            <Sheet onContextMenu={onContextMenu} />
            <Bottom />
          </div>
          <RightColumn />
        </div>
        <StatusBar />
      </div>
      <ContextMenu />
      <FindDialog />
      <AboutDialog />
      <ProblemsDialog />
    </ReactFlowProvider>
  );
}
