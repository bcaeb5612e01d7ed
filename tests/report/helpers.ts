// Shared helpers for the printout tests: the demo job, text boxes of a sheet, poppler tools.

import { spawnSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { parseJob, type Job } from '../../engine/index.js';
import { expect } from 'vitest';
import { MIN_TEXT_MM, textWidth, type Sheet, type TextItem } from '../../engine/report/index.js';

export const ROOT = fileURLToPath(new URL('../../', import.meta.url));

export function demoJob(): Job {
  const loaded = parseJob(readFileSync(`${ROOT}assets/demo.lwj`, 'utf8'));
  if (!loaded.ok) throw new Error('assets/demo.lwj does not load');
  return loaded.job;
}

export function texts(sheet: Sheet): TextItem[] {
  return sheet.items.filter((i): i is TextItem => i.kind === 'text');
}

/** The box a text item covers on paper (ascender to descender of DejaVu Sans, about 0.76 / 0.24 em). */
export function textBox(t: TextItem): { x0: number; x1: number; y0: number; y1: number } {
  const w = textWidth(t.text, t.font, t.size);
  const x0 = t.anchor === 'start' ? t.x : t.anchor === 'middle' ? t.x - w / 2 : t.x - w;
  return { x0, x1: x0 + w, y0: t.y - t.size * 0.76, y1: t.y + t.size * 0.24 };
}

/** Pairs of text items on one sheet whose boxes overlap by more than `slack` mm. */
export function overlappingTexts(sheet: Sheet, slack = 0.15): Array<[string, string]> {
  const boxes = texts(sheet).filter((t) => t.text.trim() !== '').map((t) => ({ t, b: textBox(t) }));
  boxes.sort((a, b) => a.b.x0 - b.b.x0);
  const out: Array<[string, string]> = [];
  for (let i = 0; i < boxes.length; i++) {
    const a = boxes[i];
    if (a === undefined) continue;
    for (let j = i + 1; j < boxes.length; j++) {
      const b = boxes[j];
      if (b === undefined) continue;
      if (b.b.x0 >= a.b.x1 - slack) break;
      const ox = Math.min(a.b.x1, b.b.x1) - Math.max(a.b.x0, b.b.x0);
      const oy = Math.min(a.b.y1, b.b.y1) - Math.max(a.b.y0, b.b.y0);
      if (ox > slack && oy > slack) out.push([a.t.text, b.t.text]);
    }
  }
  return out;
}

export function tool(cmd: string, args: string[]): { status: number | null; stdout: string; stderr: string } {
  const r = spawnSync(cmd, args, { encoding: 'utf8', maxBuffer: 64 * 1024 * 1024 });
  if (r.error !== undefined) throw r.error;
  return { status: r.status, stdout: r.stdout, stderr: r.stderr };
}

/** Every text of a sheet at 2 mm or more, inside the 10 mm frame, and no two texts overlapping. */
export function expectReadable(sheet: Sheet): void {
  for (const t of texts(sheet)) {
    expect(t.size).toBeGreaterThanOrEqual(MIN_TEXT_MM);
    const b = textBox(t);
    expect(b.x0).toBeGreaterThanOrEqual(9.9);
    expect(b.x1).toBeLessThanOrEqual(sheet.widthMm - 9.9);
    expect(b.y0).toBeGreaterThanOrEqual(9.9);
    expect(b.y1).toBeLessThanOrEqual(sheet.heightMm - 9.9);
  }
  expect(overlappingTexts(sheet), sheet.title).toEqual([]);
}
