// The printout, pure: sheets as display lists in millimetres, their SVG, and the schedule as CSV.
// app/report/pdf.ts renders the same sheets to PDF; the desktop app prints the same SVG.

import type { Results } from '../analysis/results.js';
import type { Job } from '../model/types.js';
import { CAUTION } from '../caution.js';
import { layoutReport as layout } from './layout.js';
import type { ReportOptions, Sheet } from './types.js';

export type {
  Anchor, CircleItem, FontWeight, Item, LineItem, PolylineItem, RectItem, ReportOptions, Sheet, SheetKind, Stroke, TextItem,
} from './types.js';
export { FONT_FAMILY, MIN_TEXT_MM } from './types.js';
export { sheetToSvg } from './svg.js';
export { scheduleCsv, CSV_HEADER } from './csv.js';
export { textWidth } from './text.js';
export { CAUTION_SHORT } from './title-block.js';
export {
  ROLE_SHORT, ROLE_LONG, CHECK_NAME, fmtFix, fmtFixes, otherFailures, verdictNote, verdictOrder,
} from './format.js';
export { describeFaultSource, describeHeadroomLong, describeHeadroomShort } from './sources.js';

/** Every sheet of the printout: diagram sheet(s), circuit schedule, assumptions. */
export function layoutReport(job: Job, results: Results, options: ReportOptions = {}): Sheet[] {
  return layout(job, results, options, CAUTION);
}
