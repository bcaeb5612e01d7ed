// The assumptions sheet(s): the basis, every value the calculation used with its source, the
// source impedance of each supply (or that it is unknown and the method then used), the method
// in brief, the job's notes and the caution in full.

import type { ResolvedRules, RuleValue } from '../analysis/basis.js';
import type { Job } from '../model/types.js';
import { GREY, stroke, text } from './draw.js';
import { fmtPlain } from './format.js';
import type { Box } from './paper.js';
import { describeSourceLong } from './sources.js';
import { wrap } from './text.js';
import type { Item } from './types.js';

const T = 2.4;
const LH = 3.1;

export const BASIS_TITLE: Record<string, string> = {
  'au-nz': 'au-nz (AS/NZS 3000:2018)',
  iec: 'iec (IEC 60364-4-41)',
};

type Block =
  | { kind: 'heading'; text: string }
  | { kind: 'para'; text: string; bold?: boolean; boxed?: boolean }
  | { kind: 'row'; cells: [string, string, string]; head?: boolean };

function value(v: RuleValue, unit: string, scale = 1): string {
  return `${fmtPlain(v.value * scale)}${unit === '' ? '' : ` ${unit}`}`;
}

function source(v: RuleValue): string {
  return v.overridden ? `set in this job (${v.source})` : v.source;
}

const METHOD = [
  'Impedance of a link of route length L: R = (ρa·L/Sa + ρe·L/Se)/n and X = 2·x·L/n, summed as complex numbers along the path; magnitudes are taken only at the end.',
  'Loop budget of a protected link: B = c·U0/Ia, where Ia is the current that disconnects the device within the required time t_req (breakers: multiple × In; adjustable: Ii·(1 + tolerance); curve devices: read off the curve at t_req by log–log interpolation; fixed: the stated current).',
  'Source known: Zs = |Ze + Σ links from the supply| must not exceed B. Source unknown: the loop from the protecting device on (own) must not exceed s·B and the drawn links upstream must not exceed (1 − s)·B.',
  'Ratio is the share of the budget used; a link passes when it is at most 100 %. A failing circuit whose protecting link has an RCD is marked RCD: disconnection then relies on the RCD. Maximum length is the length at which the link alone would just meet its limit, every other length unchanged.',
];

function blocks(job: Job, rules: ResolvedRules, caution: string): Block[] {
  const out: Block[] = [];
  out.push({ kind: 'heading', text: `Basis: ${BASIS_TITLE[rules.basis] ?? rules.basis}` });
  out.push({ kind: 'row', head: true, cells: ['Quantity', 'Value used', 'Source'] });
  out.push({ kind: 'row', cells: ['U0, nominal voltage phase to earth', value(rules.voltage, 'V'), source(rules.voltage)] });
  out.push({ kind: 'row', cells: ['c, voltage factor', value(rules.voltageFactor, ''), source(rules.voltageFactor)] });
  out.push({ kind: 'row', cells: ['s, share of the budget for the circuit when the source is unknown', value(rules.unknownSourceShare, ''), source(rules.unknownSourceShare)] });
  out.push({ kind: 'row', cells: ['x, reactance per conductor', value(rules.reactance, 'mΩ/m', 1000), source(rules.reactance)] });
  out.push({ kind: 'row', cells: ['ρ copper at fault temperature', value(rules.resistivity.Cu, 'Ω·mm²/m'), source(rules.resistivity.Cu)] });
  out.push({ kind: 'row', cells: ['ρ aluminium at fault temperature', value(rules.resistivity.Al, 'Ω·mm²/m'), source(rules.resistivity.Al)] });
  for (const curve of ['B', 'C', 'D'] as const) {
    out.push({ kind: 'row', cells: [`Breaker curve ${curve}: Ia as a multiple of In`, value(rules.multiples[curve], '× In'), source(rules.multiples[curve])] });
  }
  out.push({ kind: 'row', cells: ['t_req, required disconnection time (a link\'s own requiredTime overrides it)', '0.4 s or 5 s', rules.timeSource] });
  out.push({ kind: 'row', cells: ['Clearing time of breakers and fixed-trip devices at or above Ia', '0.1 s', 'instantaneous operation only is relied on (method)'] });

  out.push({ kind: 'heading', text: 'Source impedance at each supply' });
  const supplies = job.nodes.filter((n) => n.kind === 'supply');
  if (supplies.length === 0) out.push({ kind: 'para', text: 'The job has no supply: no circuit can be checked.' });
  for (const s of supplies) {
    if (s.kind !== 'supply') continue;
    out.push({
      kind: 'para',
      text: `${s.id}${s.name !== undefined && s.name !== '' ? ` ${s.name}` : ''}: ${describeSourceLong(s.source, rules.voltage.value, rules.unknownSourceShare.value)}`,
    });
  }
  out.push({ kind: 'heading', text: 'Method in brief' });
  for (const m of METHOD) out.push({ kind: 'para', text: m });
  if (job.job.notes.trim() !== '') {
    out.push({ kind: 'heading', text: 'Job notes' });
    out.push({ kind: 'para', text: job.job.notes });
  }
  out.push({ kind: 'heading', text: 'Caution' });
  out.push({ kind: 'para', text: caution, bold: true, boxed: true });
  return out;
}

/** A block printed after the assumptions (the diagram's legend when no diagram sheet holds it). */
export interface Tail {
  height: number;
  draw: (top: number) => Item[];
}

/** The assumptions as pages of items, each filling `box`, then `tail` if given. */
export function assumptionPages(job: Job, rules: ResolvedRules, caution: string, box: Box, tail?: Tail): Item[][] {
  const pages: Item[][] = [[]];
  let page = pages[0] ?? [];
  let y = box.y;
  const colQ = box.w * 0.34;
  const colV = box.w * 0.14;
  const colS = box.w - colQ - colV;
  const need = (h: number): void => {
    if (y + h > box.y + box.h) {
      page = [];
      pages.push(page);
      y = box.y;
    }
  };
  page.push(text(box.x, y + 4, 'Assumptions: the values behind every number in this printout', 3.5, 'bold'));
  y += 7;
  for (const b of blocks(job, rules, caution)) {
    if (b.kind === 'heading') {
      need(LH * 3);
      y += LH * 0.8;
      page.push(text(box.x, y + LH, b.text, 2.8, 'bold'));
      y += LH * 1.4;
    } else if (b.kind === 'para') {
      const font = b.bold === true ? 'bold' : 'regular';
      const lines = wrap(b.text, font, T, Math.min(box.w, 260) - 4);
      need(lines.length * LH + 2);
      if (b.boxed === true) {
        page.push({ kind: 'rect', x: box.x, y, w: Math.min(box.w, 260), h: lines.length * LH + 2, stroke: stroke(0.5) });
      }
      lines.forEach((l, i) => page.push(text(box.x + 2, y + LH * (i + 0.9), l, T, font)));
      y += lines.length * LH + 2;
    } else {
      const font = b.head === true ? 'bold' : 'regular';
      const cells = [
        wrap(b.cells[0], font, T, colQ - 3),
        wrap(b.cells[1], font, T, colV - 3),
        wrap(b.cells[2], font, T, colS - 3),
      ];
      const h = Math.max(...cells.map((c) => c.length)) * LH + 1.2;
      need(h);
      if (b.head === true) page.push({ kind: 'rect', x: box.x, y, w: box.w, h, fill: '#d9d9d9' });
      const xs = [box.x, box.x + colQ, box.x + colQ + colV];
      cells.forEach((ls, c) => ls.forEach((l, i) => page.push(text((xs[c] ?? 0) + 1.5, y + 0.4 + LH * (i + 0.85), l, T, font, 'start', c === 2 && b.head !== true ? GREY : undefined))));
      y += h;
      page.push({ kind: 'line', x1: box.x, y1: y, x2: box.x + box.w, y2: y, stroke: stroke(0.15, GREY) });
    }
  }
  if (tail !== undefined) {
    need(tail.height + 5);
    page.push(...tail.draw(y + 5));
  }
  return pages;
}
