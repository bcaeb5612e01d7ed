// layoutReport: the whole printout as sheets — diagram sheets, then the circuit schedule, then
// the assumptions — each with the border and title block. Pure: the same job gives the same list.

import type { Results } from '../analysis/results.js';
import { resolveRules } from '../analysis/basis.js';
import type { Job } from '../model/types.js';
import { assumptionPages, BASIS_TITLE } from './assumptions.js';
import { diagramContext, drawTile } from './diagram.js';
import { planDiagram } from './diagram-plan.js';
import { GREY, text } from './draw.js';
import { legend } from './legend.js';
import { contentBox, paperFor } from './paper.js';
import { schedulePages } from './schedule.js';
import { titleBlock } from './title-block.js';
import type { Item, ReportOptions, Sheet, SheetKind } from './types.js';

/** Band kept free above and below the diagram for continuation marks, mm. */
const MARK_BAND = 4;

export function layoutReport(job: Job, results: Results, options: ReportOptions = {}, caution: string): Sheet[] {
  const paper = paperFor(options);
  const rules = resolveRules(job.rules);
  const content = contentBox(paper);
  const pages: Array<{ kind: SheetKind; title: string; items: Item[] }> = [];

  // Diagram: the legend along the foot of the content area, the drawing above it.
  const probe = legend({ x: content.x, y: 0, w: content.w, h: 0 }, ['']);
  const legendTop = content.y + content.h - probe.height;
  const area = { x: content.x, y: content.y + MARK_BAND, w: content.w, h: legendTop - content.y - 2 * MARK_BAND - 2 };
  const plan = planDiagram(job, area);
  const tiles = Math.max(plan.tiles.length, 1);
  const notes = [
    plan.auto ? 'Positions arranged automatically (the job has nodes without a drawn position).' : 'Positions as drawn in the job.',
    tiles > 1 ? `Split over ${tiles} sheets so that no text is smaller than 2 mm; arrows at the edges name the sheet a link continues on.` : '',
  ].filter((n) => n !== '');
  const ctx = diagramContext(job, results, plan, (t) => t + 1, rules.voltage.value);
  for (let t = 0; t < tiles; t++) {
    const items: Item[] = plan.tiles.length === 0
      ? [text(area.x + area.w / 2, area.y + area.h / 2, 'The job has no nodes to draw.', 4, 'bold', 'middle', GREY)]
      : drawTile(ctx, t);
    items.push(...legend({ x: content.x, y: legendTop, w: content.w, h: probe.height }, notes).items);
    pages.push({ kind: 'diagram', title: tiles > 1 ? `Single-line diagram, part ${t + 1} of ${tiles}` : 'Single-line diagram', items });
  }

  const schedule = schedulePages(job, results, content);
  schedule.forEach((items, i) =>
    pages.push({ kind: 'schedule', title: schedule.length > 1 ? `Circuit schedule, part ${i + 1} of ${schedule.length}` : 'Circuit schedule', items }),
  );
  const assumptions = assumptionPages(job, rules, caution, content);
  assumptions.forEach((items, i) =>
    pages.push({ kind: 'assumptions', title: assumptions.length > 1 ? `Assumptions, part ${i + 1} of ${assumptions.length}` : 'Assumptions and caution', items }),
  );

  return pages.map((p, i) => ({
    widthMm: paper.widthMm,
    heightMm: paper.heightMm,
    kind: p.kind,
    title: p.title,
    items: [
      ...p.items,
      ...titleBlock(paper, {
        details: job.job,
        basis: BASIS_TITLE[rules.basis] ?? rules.basis,
        sheetTitle: p.title,
        sheet: i + 1,
        sheets: pages.length,
      }),
    ],
  }));
}
