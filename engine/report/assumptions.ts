// The assumptions sheet(s): the basis, every value the calculation used with its source (the
// loop, the voltage drop, capacity, fault levels, withstand and the correction of readings), each
// supply's source impedance, how its fault level was found and its headroom, the method in
// brief, the job's notes and the caution in full.

import type { ResolvedRules, RuleValue } from '../analysis/basis.js';
import { MEASURED_SOURCE } from '../analysis/basis.js';
import { CAPACITY_TABLE_SOURCE } from '../analysis/capacity-table.js';
import { K_TABLE, K_TABLE_SOURCE } from '../analysis/k-table.js';
import type { Results } from '../analysis/results.js';
import type { Job } from '../model/types.js';
import { GREY, stroke, text } from './draw.js';
import { fmtPlain } from './format.js';
import type { Box } from './paper.js';
import { describeFaultSource, describeHeadroomLong, describeSourceLong } from './sources.js';
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
  'Design current Ib of a link: its stated designCurrent, else the diversity of the board it feeds times the sum of the loads and links below it. Voltage drop of a link, % of U0: 100·b·Ib·L·(ρv/Sa·cos φ + x·sin φ)/(n·U0), b = 2 for one phase and 1 for three; the total at a far end is the sum along the path from the supply, checked against the limit at links arriving at a point.',
  'Capacity: Ib ≤ In ≤ Iz, In the rating of the protecting device and Iz the cable\'s stated capacity, else (iec basis) the default table times the derating and the parallel sets.',
  'Fault level at a link\'s origin: cmax·U0/|Zsrc + Σ ρ20·L/Sa + j·x·L per set, once for three phases, twice for one|, conductors at 20 °C; a device passes when its breaking capacity is at least the fault level there. Withstand: the earth passes when n·Se ≥ √(If²·t)/k (E capped by the device\'s stated let-through), If and t those of the loop check.',
  'Test limit: the largest reading at the far end that still passes, Zem + (c·U0/Ia − Zem)/F, Zem the supply\'s measured Ze (0 when none). A reading is corrected the same way and passes when it is within c·U0/Ia.',
  'Verdict of a link: FAIL when the loop or any other check fails; else RCD-RELIANT when the loop or the reading relies on an RCD; else PASS when the loop passes; else UNCHECKED. Fixes list, each alone with everything else unchanged: the length, the smallest cable sizes, a smaller breaker, an RCD.',
];

/** `115 / 143` for one earth material: PVC / XLPE. */
function kPair(row: { pvc: { inCable: number; separate: number }; xlpe: { inCable: number; separate: number } }, where: 'inCable' | 'separate'): string {
  return `PVC ${row.pvc[where]}, XLPE ${row.xlpe[where]}`;
}

function blocks(job: Job, rules: ResolvedRules, caution: string, results?: Results): Block[] {
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

  out.push({ kind: 'heading', text: 'Load and voltage drop' });
  out.push({ kind: 'row', head: true, cells: ['Quantity', 'Value used', 'Source'] });
  out.push({ kind: 'row', cells: ['ρv copper in normal service, for the voltage drop', value(rules.voltageDropResistivity.Cu, 'Ω·mm²/m'), source(rules.voltageDropResistivity.Cu)] });
  out.push({ kind: 'row', cells: ['ρv aluminium in normal service, for the voltage drop', value(rules.voltageDropResistivity.Al, 'Ω·mm²/m'), source(rules.voltageDropResistivity.Al)] });
  if (rules.voltageDropLimit !== null) {
    out.push({ kind: 'row', cells: ['Voltage-drop limit at every point, supply to point (a link\'s own voltageDropLimit overrides it)', value(rules.voltageDropLimit, '%'), 'set in this job (overrides the basis limits by use)'] });
  } else {
    out.push({ kind: 'row', cells: ['Voltage-drop limit, supply to a lighting point (a link\'s own voltageDropLimit overrides it)', value(rules.voltageDropLimits.lighting, '%'), source(rules.voltageDropLimits.lighting)] });
    out.push({ kind: 'row', cells: ['Voltage-drop limit, supply to any other point (a link\'s own voltageDropLimit overrides it)', value(rules.voltageDropLimits.other, '%'), source(rules.voltageDropLimits.other)] });
  }
  out.push({ kind: 'row', cells: ['Power factor of a load that states none', value(rules.powerFactor, ''), source(rules.powerFactor)] });
  out.push({
    kind: 'para',
    text: 'Balanced phases: single-phase loads below a three-phase link are taken as spread evenly over its phases, each adding a third of its current to the link\'s design current. The real split of loads between phases may put more on one phase: check the phase loading separately.',
  });
  out.push({
    kind: 'para',
    text: rules.basis === 'iec'
      ? `Cable capacity Iz: a link's stated capacity, else the default table: ${CAPACITY_TABLE_SOURCE}. In short: from memory, verify before relying on it.`
      : `Cable capacity Iz: the link's stated capacity only (no built-in table under this basis; enter Iz from the local rating tables). The iec basis's default table, for reference: ${CAPACITY_TABLE_SOURCE}. In short: from memory, verify before relying on it.`,
  });

  out.push({ kind: 'heading', text: 'Fault levels and the withstand of the protective conductor' });
  out.push({ kind: 'row', head: true, cells: ['Quantity', 'Value used', 'Source'] });
  out.push({ kind: 'row', cells: ['cmax, voltage factor for maximum fault currents', value(rules.maxVoltageFactor, ''), source(rules.maxVoltageFactor)] });
  out.push({ kind: 'row', cells: ['ρ20 copper for fault levels', value(rules.shortCircuitResistivity.Cu, 'Ω·mm²/m'), source(rules.shortCircuitResistivity.Cu)] });
  out.push({ kind: 'row', cells: ['ρ20 aluminium for fault levels', value(rules.shortCircuitResistivity.Al, 'Ω·mm²/m'), source(rules.shortCircuitResistivity.Al)] });
  out.push({ kind: 'row', cells: ['k, copper earth, a core of the cable', kPair(K_TABLE.Cu, 'inCable'), K_TABLE_SOURCE] });
  out.push({ kind: 'row', cells: ['k, copper earth, a separate insulated conductor', kPair(K_TABLE.Cu, 'separate'), K_TABLE_SOURCE] });
  out.push({ kind: 'row', cells: ['k, aluminium earth, a core of the cable', kPair(K_TABLE.Al, 'inCable'), K_TABLE_SOURCE] });
  out.push({ kind: 'row', cells: ['k, aluminium earth, a separate insulated conductor', kPair(K_TABLE.Al, 'separate'), K_TABLE_SOURCE] });

  out.push({ kind: 'heading', text: 'Measured readings' });
  out.push({ kind: 'row', head: true, cells: ['Quantity', 'Value used', 'Source'] });
  if (rules.measuredRule.value === 'fixed-factor') {
    out.push({ kind: 'row', cells: ['Correction of a measured reading: fixed factor (the reading may use this share of c·U0/Ia)', value(rules.measuredFactor, ''), source(rules.measuredFactor)] });
  } else {
    out.push({ kind: 'row', cells: ['Correction of a measured reading: to fault temperature, F = ρf/ρθ at the stated temperature (20 °C when none)', 'ρθ by temperature', rules.measuredRule.overridden ? `set in this job; ${MEASURED_SOURCE}` : MEASURED_SOURCE] });
  }

  out.push({ kind: 'heading', text: 'Each supply: source impedance, fault level and headroom' });
  const supplies = job.nodes.filter((n) => n.kind === 'supply');
  if (supplies.length === 0) out.push({ kind: 'para', text: 'The job has no supply: no circuit can be checked.' });
  for (const s of supplies) {
    if (s.kind !== 'supply') continue;
    out.push({
      kind: 'para',
      text: `${s.id}${s.name !== undefined && s.name !== '' ? ` ${s.name}` : ''}: ${describeSourceLong(s.source, rules.voltage.value, rules.unknownSourceShare.value)}`,
    });
    const r = results?.supplies.find((x) => x.node === s.id);
    out.push({ kind: 'para', text: describeFaultSource(s, r, rules.voltage.value, rules.maxVoltageFactor.value) });
    if (results !== undefined) out.push({ kind: 'para', text: describeHeadroomLong(s, r, rules.voltage.value) });
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
export function assumptionPages(job: Job, rules: ResolvedRules, caution: string, box: Box, tail?: Tail, results?: Results): Item[][] {
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
  for (const b of blocks(job, rules, caution, results)) {
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
