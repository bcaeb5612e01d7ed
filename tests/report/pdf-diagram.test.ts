// The diagram pages of the demo's PDF, read back with pdftotext and compared with the command
// line's `check --json`: every circuit with its id, device, cable, length, loop against its
// limit and status word; the worst fault path; the legend; the title block on every sheet.

import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { analyse, type CircuitResult } from '../../engine/index.js';
import { layoutReport, type ReportOptions } from '../../engine/report/index.js';
import { fmtCable, fmtMetre, fmtOhm, STATUS_WORD } from '../../engine/report/format.js';
import { jobToPdf } from '../../app/report/pdf.js';
import { cli } from '../cli/run.js';
import { demoJob, ROOT, tool } from './helpers.js';

const dir = mkdtempSync(join(tmpdir(), 'lw-pdf-diagram-'));
const job = demoJob();

describe.each([
  ['A3 landscape', {}],
  ['A4 portrait', { paper: 'A4', orientation: 'portrait' }],
] as Array<[string, ReportOptions]>)('demo PDF diagram pages, %s', (name, options) => {
  const file = join(dir, `${name.replace(/\W+/g, '-')}.pdf`);
  const sheets = layoutReport(job, analyse(job), options);
  const diagramCount = sheets.filter((s) => s.kind === 'diagram').length;
  let diagram = '';
  let pages: string[] = [];
  let json: { circuits: CircuitResult[]; worst: { link: string } | null };
  beforeAll(async () => {
    writeFileSync(file, await jobToPdf(job, options));
    const out = tool('pdftotext', [file, '-']);
    expect(out.status).toBe(0);
    pages = out.stdout.split('\f');
    diagram = pages.slice(0, diagramCount).join('\n');
    const check = cli('check', join(ROOT, 'assets/demo.lwj'), '--json');
    json = JSON.parse(check.stdout) as typeof json;
  }, 60_000);

  it('labels every circuit with device, cable, length, loop against its limit and status, as check --json gives', () => {
    const flat = diagram.replace(/\s+/g, ' ');
    for (const c of json.circuits) {
      const link = job.links.find((l) => l.id === c.link)!;
      expect(diagram.split(/\s+/), c.link).toContain(c.link);
      expect(flat, `${c.link} cable`).toContain(`${fmtCable(link.cable)} · ${fmtMetre(link.cable.length)} m`);
      if (c.protectedBy === c.link && c.device !== null) expect(flat, `${c.link} device`).toContain(c.device);
      const loop = c.method === 'known-source' ? c.zs : c.own;
      if (loop !== null && c.limit !== null) {
        const label = c.method === 'known-source' ? 'Zs' : 'own';
        expect(flat, `${c.link} loop`).toContain(`${label} ${fmtOhm(loop)} ${loop <= c.limit ? '≤' : '>'} ${fmtOhm(c.limit)} Ω`);
      }
      expect(diagram.split(/\s+/)).toContain(STATUS_WORD[c.status]);
    }
  });

  it('marks the worst fault path, carries the legend and the title block on every sheet', () => {
    expect(json.worst).not.toBeNull();
    expect(diagram).toContain('worst fault path');
    expect(diagram).toContain('Legend');
    const d = job.job;
    pages.slice(0, sheets.length).forEach((page, i) => {
      const flat = page.replace(/\s+/g, ' ');
      for (const field of [d.title, d.site, d.client, d.designer, d.reference, d.revision, d.date, 'AS/NZS 3000:2018']) {
        expect(flat, `sheet ${i + 1}: ${field}`).toContain(field);
      }
      expect(flat).toContain(`${i + 1} of ${sheets.length}`);
    });
  });

  it('starts with the sheet that holds the supply, and every board is fed from a named sheet', () => {
    const first = pages[0] ?? '';
    expect(first.split(/\s+/)).toContain('S1');
    for (const board of job.nodes.filter((n) => n.kind === 'board' && n.id !== 'MSB')) {
      const page = pages.findIndex((p, i) => i < diagramCount && p.includes('fed from') && p.split(/\s+/).includes(board.id));
      expect(page, board.id).toBeGreaterThanOrEqual(0);
    }
  });
});
