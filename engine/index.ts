// Loopwright's engine: the public surface. Everything else under engine/ is internal.
// Pure TypeScript: no DOM, React, Electron or Node built-ins (tests/engine/boundary.test.ts).

export type * from './model/types.js';
export type * from './analysis/results.js';
export type { Problem, Severity } from './model/problems.js';
export { formatProblem } from './model/problems.js';
export { CURRENT_VERSION, FORMAT_NAME } from './model/types.js';
export type { LoadResult } from './model/load.js';
export { parseJob, loadJob } from './model/load.js';
export { LIMITS } from './model/limits.js';
export { serialiseJob, toFileObject } from './model/serialise.js';
export { newJob, defaultLinkFor, STANDARD_SIZES } from './model/defaults.js';
export type { Analysis } from './analysis/analyse.js';
export { analyse, createAnalysis, reanalyse, rehearseLengthEdit } from './analysis/analyse.js';
export type { Breakdown, Segment } from './analysis/breakdown.js';
export { loopBreakdown } from './analysis/breakdown.js';
export type { ResolvedRules, RuleValue } from './analysis/basis.js';
export { resolveRules } from './analysis/basis.js';
export { linkRole, faultPath } from './analysis/network.js';
export { roleOfEnds } from './analysis/order.js';
export { deviceMark } from './analysis/devices.js';
export { CAUTION } from './caution.js';
export type { ReportOptions, Sheet } from './report/index.js';
export { layoutReport, sheetToSvg, scheduleCsv } from './report/index.js';
export { csvCell, plainText, terminalText, xmlText } from './report/sanitise.js';
export { CAPACITY_TABLE_SOURCE, CAPACITY_ROWS } from './analysis/capacity-table.js';
export { K_TABLE, K_TABLE_SOURCE, kFactor } from './analysis/k-table.js';
export { MEASURED_SOURCE } from './analysis/basis.js';
