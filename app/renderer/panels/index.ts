// The renderer's panels. Each reads the shared store; none needs props.
//   DetailsPanel  – every field of the selected node or link, with the circuit's results
//   JobPanel      – job details and the rules (basis and overrides)
//   SchedulePanel – one row per link, sortable, filterable, editable in place
//   BreakdownPanel – the loop breakdown of store.breakdownLink (renders nothing when unset);
//                    it follows the selected link unless pinned (breakdown/follow.ts)
import './panels.css';

export { DetailsPanel } from './details/DetailsPanel.js';
export { JobPanel } from './job/JobPanel.js';
export { SchedulePanel } from './schedule/SchedulePanel.js';
export { BreakdownPanel } from './breakdown/BreakdownPanel.js';
export { useBreakdownFollowsSelection, useBreakdownView, followTarget } from './breakdown/follow.js';
export { showBreakdown, closeBreakdown } from './actions.js';
export { STATUS_LOOK } from './format.js';
