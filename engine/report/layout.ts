// layoutReport: the whole printout as sheets — diagram sheets, then the circuit schedule, then
// the assumptions, then (when asked) the test sheets; or the test sheets alone — each with the
// border and title block. Pure: the same job gives the same list.

import type { Results } from '../analysis/results.js';
import { resolveRules, type ResolvedRules } from '../analysis/basis.js';
import type { Job } from '../model/types.js';
import { assumptionPages, BASIS_TITLE } from './assumptions.js';
import { diagramContext, drawTile } from './diagram.js';
import { planDiagram } from './diagram-plan.js';
import { drawPiece } from './diagram-sheet.js';
import { planSections } from './diagram-pack.js';
import { GREY, text } from './draw.js';
import { keyLine, legend } from './legend.js';
import { contentBox, paperFor, type Box, type Paper } from './paper.js';
import { schedulePages } from './schedule.js';
import { testSheetPages } from './test-sheet.js';
import { CAUTION_SHORT_HERE, titleBlock } from './title-block.js';
import type { Item, ReportOptions, Sheet, SheetKind } from './types.js';

/** Band kept free above and below the diagram for continuation marks, mm. */
const MARK_BAND = 4;

export function layoutReport(job: Job, results: Results, options: ReportOptions = {}, caution: string): Sheet[] {
  const paper = paperFor(options);
  const rules = resolveRules(job.rules);
  const content = contentBox(paper);
  const pages: Array<{ kind: SheetKind; title: string; items: Item[] }> = [];
  const tests = (): void => {
    for (const t of testSheetPages(job, results, rules, caution, content)) pages.push({ kind: 'test', title: t.title, items: t.items });
  };
  if (options.testSheet === 'only') {
    tests();
    return finish(job, rules, paper, pages);
  }

  // Diagram: the legend along the foot of the content area, the drawing above it.
  const sectionNote = (auto: boolean, sheets = 2): string =>
    `${sheets > 1 ? 'Too large for one sheet' : 'Too large for the sheet as positioned'} with text of 2 mm or more, so drawn board by board in reading order from the supply, circuits in the order ` +
    `${auto ? 'of the job file' : 'drawn (left to right)'}. A board drawn as a stub says the sheet it continues on; each board's ` +
    'own part starts with the link that feeds it, repeated.';
  // The legend's height with the longest note it may carry, so the drawing area is known first.
  const probe = legend({ x: content.x, y: 0, w: content.w, h: 0 }, [sectionNote(true)]);
  const legendTop = content.y + content.h - probe.height;
  // The one-line key a diagram sheet carries instead of the legend (split by board only).
  const keyH = keyLine({ x: content.x, y: 0, w: content.w, h: 0 }, 'sheet 99').height;
  const area = { x: content.x, y: content.y + MARK_BAND, w: content.w, h: legendTop - content.y - 2 * MARK_BAND - 2 };
  const plan = planDiagram(job, area);
  const ctx = diagramContext(job, results, plan, (t) => t + 1, rules.voltage.value);
  // Too large for one sheet at the user's positions: one section per board, packed in reading
  // order from the supply, the full legend on one sheet only; cutting the drawing into tiles
  // (the legend on every tile) is the last resort.
  const sections = plan.tiles.length > 1
    ? planSections(job, { x: content.x, y: content.y, w: content.w, h: content.h - keyH - 3 }, probe.height - keyH)
    : null;
  const count = sections !== null ? sections.sheets.length : Math.max(plan.tiles.length, 1);
  const notes = [
    sections !== null
      ? sectionNote(plan.auto, count)
      : plan.auto ? 'Positions arranged automatically (the job has nodes without a drawn position).' : 'Positions as drawn in the job.',
    sections === null && count > 1 ? `Split over ${count} sheets so that no text is smaller than 2 mm; arrows at the edges name the sheet a link continues on.` : '',
  ].filter((n) => n !== '');
  const schedule = schedulePages(job, results, content);
  const legendBox = (top: number): Box => ({ x: content.x, y: top, w: content.w, h: probe.height });
  // Split by board with no diagram sheet to spare for the legend: it follows the assumptions.
  const legendAfter = sections !== null && sections.legendSheet === null;
  const assumptions = assumptionPages(job, rules, caution, content, legendAfter
    ? { height: legend(legendBox(0), notes).height, draw: (top) => legend(legendBox(top), notes).items }
    : undefined, results);
  const legendSheetNo = sections === null ? 0 : sections.legendSheet !== null ? sections.legendSheet + 1 : count + schedule.length + assumptions.length;

  // The full legend on a tiled diagram is the same on every tile: laid out once (the items are
  // never changed afterwards, so the sheets share them).
  let tileLegend: Item[] | null = null;
  for (let t = 0; t < count; t++) {
    let items: Item[];
    let what = '';
    if (sections !== null) {
      const pieces = sections.sheets[t] ?? [];
      items = pieces.flatMap((p) => drawPiece(ctx, sections, p, t, (i) => i + 1));
      what = `: ${pieces.map((p) => `${p.section.spine.map((n) => n.id).join(', ')}${p.first ? '' : ' (cont.)'}`).join('; ')}`;
      if (t === sections.legendSheet) items.push(...legend(legendBox(legendTop), notes).items);
      else items.push(...keyLine({ x: content.x, y: content.y + content.h - keyH, w: content.w, h: keyH }, `sheet ${legendSheetNo}`).items);
    } else {
      if (plan.tiles.length === 0) {
        items = [text(area.x + area.w / 2, area.y + area.h / 2, 'The job has no nodes to draw.', 4, 'bold', 'middle', GREY)];
      } else items = drawTile(ctx, t);
      tileLegend ??= legend(legendBox(legendTop), notes).items;
      items.push(...tileLegend);
    }
    pages.push({ kind: 'diagram', title: count > 1 ? `Single-line diagram, part ${t + 1} of ${count}${what}` : 'Single-line diagram', items });
  }

  schedule.forEach((items, i) =>
    pages.push({ kind: 'schedule', title: schedule.length > 1 ? `Circuit schedule, part ${i + 1} of ${schedule.length}` : 'Circuit schedule', items }),
  );
  assumptions.forEach((items, i) => {
    const title = assumptions.length > 1 ? `Assumptions, part ${i + 1} of ${assumptions.length}` : 'Assumptions and caution';
    pages.push({ kind: 'assumptions', title: legendAfter && i === assumptions.length - 1 ? `${title}; legend of the diagram` : title, items });
  });
  // After the assumptions, so the sheet numbers above (the legend's) stay as they are.
  if (options.testSheet === 'include') tests();
  return finish(job, rules, paper, pages);
}

/** Every page as a sheet with its border and title block, "sheet n of m". */
function finish(job: Job, rules: ResolvedRules, paper: Paper, pages: Array<{ kind: SheetKind; title: string; items: Item[] }>): Sheet[] {
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
        ...(p.kind === 'test' ? { caution: CAUTION_SHORT_HERE } : {}),
      }),
    ],
  }));
}
