// `report JOB.lwj -o OUT.pdf [--paper A4|A3] [--portrait] [--svg DIR]`: the printout of a job
// (annotated diagram, circuit schedule, assumptions) as PDF, and optionally one SVG per sheet.
// Nothing is written until the whole printout is ready; a bad job writes nothing.

import { existsSync, mkdirSync, realpathSync, statSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { analyse, formatProblem } from '../../../engine/index.js';
import { layoutReport, sheetToSvg, type ReportOptions } from '../../../engine/report/index.js';
import type { OptionSpec } from '../args.js';
import { EXIT, type Command } from '../command.js';
import { loadJobFile, writeOutputFile, writeOutputFiles } from '../io.js';
import { exitFor } from './check.js';
import { summaryLine } from '../format.js';
import { runPrefix } from '../help.js';

const options: OptionSpec[] = [
  { name: 'output', short: 'o', value: 'OUT.pdf', summary: 'the PDF file to write (required)' },
  { name: 'paper', value: 'SIZE', choices: ['A3', 'A4', 'a3', 'a4'], summary: 'paper size, default A3' },
  { name: 'portrait', summary: 'portrait sheets (default landscape)' },
  { name: 'svg', value: 'DIR', summary: 'also write one SVG per sheet into DIR: sheet-1.svg, sheet-2.svg, ...' },
  {
    name: 'test-sheet',
    summary: 'write only the test sheets, one per board: each circuit\'s test limit, its reading and result, or blank cells to fill in on site',
  },
];

const USAGE = 'report JOB.lwj -o OUT.pdf [--paper A4|A3] [--portrait] [--svg DIR] [--test-sheet]';

/** The same file, following links, when both exist. */
function samePath(a: string, b: string): boolean {
  if (resolve(a) === resolve(b)) return true;
  try {
    return existsSync(b) && realpathSync(a) === realpathSync(b);
  } catch {
    return false;
  }
}

function why(error: unknown): string {
  return error instanceof Error ? (error.message.split('\n')[0] ?? '') : String(error);
}

export const report: Command = {
  summary: 'print a job: annotated diagram, circuit schedule and assumptions, to PDF (and SVG)',
  usage: USAGE,
  details: [
    'Reads the job file (it is never written to) and writes the printout: the single-line diagram',
    'annotated with every link\'s device, cable, Ib and voltage drop against its limit, loop impedance',
    'against its limit, status and (where it says more) the verdict naming the failed checks, each',
    'board\'s fault level and the supply\'s headroom, split over several sheets where one would make',
    'text smaller than 2 mm; the circuit schedule with every check, the verdict and the fixes,',
    'failures first by verdict; and the assumptions sheet with every value used and its source.',
    'Fonts are embedded and the same job always gives the same bytes.',
    '',
    'With --test-sheet, OUT holds the test sheets only (a document to take to site, apart from the',
    'design printout): a sheet per board listing every circuit leaving it with its test limit (the',
    'largest measured Zs that passes, at the temperature shown: the reading\'s, else 20 °C), the',
    'readings with their corrected values and results where the job has them, ruled blank columns',
    'for Zs, temperature, date, instrument and result where it has none, the method of correction',
    'and the caution. Run the command twice for both documents.',
    '',
    'Nothing is written when the job cannot be read; an existing OUT file is then left as it was.',
    'A PDF is written whole or not at all (a temporary file flushed to the disk, then renamed',
    'over OUT); an earlier OUT is kept beside it as OUT.bak, a read-only OUT is refused and a',
    'symbolic link is written through to its target.',
    'The output may not be the job file itself, nor any .lwj file.',
    '',
    'Exit status, as for check: 0 the printout was written and no verdict fails or relies on an',
    'RCD; 1 the printout was written and a verdict fails or relies on an RCD; 2 the job could not',
    'be read, the command was used wrongly or the output could not be written (nothing written).',
  ],
  options,
  positionals: { min: 1, max: 1 },
  async run({ args, out, err }) {
    const input = args.positionals[0] ?? '';
    const output = args.options.output;
    if (typeof output !== 'string' || output === '') {
      err(`report: missing -o OUT.pdf. Usage: ${runPrefix()} ${USAGE}\n`);
      return EXIT.unusable;
    }
    if (samePath(input, output) || output.toLowerCase().endsWith('.lwj')) {
      err(`report: refusing to write the PDF to ${output}: it is ${samePath(input, output) ? 'the input job file' : 'a job file name'}; choose a .pdf name\n`);
      return EXIT.unusable;
    }
    const svgDir = typeof args.options.svg === 'string' ? args.options.svg : null;
    const paper = typeof args.options.paper === 'string' ? (args.options.paper.toUpperCase() as 'A3' | 'A4') : 'A3';
    const testOnly = args.options['test-sheet'] === true;
    const reportOptions: ReportOptions = {
      paper,
      orientation: args.options.portrait === true ? 'portrait' : 'landscape',
      ...(testOnly ? { testSheet: 'only' as const } : {}),
    };

    const loaded = loadJobFile(input);
    if (!loaded.ok) {
      err(`${loaded.lines.join('\n')}\nNo printout written.\n`);
      return EXIT.unusable;
    }
    const { job, warnings } = loaded.load;
    if (warnings.length > 0) err(`${warnings.map((w) => `warning: ${formatProblem(w)}`).join('\n')}\n`);
    const results = analyse(job);
    const sheets = layoutReport(job, results, reportOptions);
    const title = job.job.title === '' ? 'Loopwright job' : job.job.title;
    let pdf: Uint8Array;
    try {
      // Loaded here, not at start-up, so other commands do not pay for pdfkit.
      const { documentDate, sheetsToPdf } = await import('../../report/pdf.js');
      const subject = `${testOnly ? 'Test sheets' : 'Fault-loop check'} ${job.job.reference}`.trim();
      pdf = await sheetsToPdf(sheets, { title, subject, date: documentDate(job) });
    } catch (error) {
      err(`report: could not make the PDF: ${why(error)}. No printout written.\n`);
      return EXIT.unusable;
    }
    try {
      if (existsSync(output) && statSync(output).isDirectory()) throw new Error(`${output} is a directory`);
      // Never half-written: temporary file flushed and renamed, folder flushed, a read-only file
      // refused, a link written through, an earlier PDF kept as OUT.bak (writeOutputFile).
      await writeOutputFile(output, pdf, { backup: true });
    } catch (error) {
      err(`report: could not write ${output}: ${why(error)}\n`);
      return EXIT.unusable;
    }
    const wrote = [`${output} (${sheets.length} sheet${sheets.length === 1 ? '' : 's'}, ${paper} ${reportOptions.orientation})`];
    if (svgDir !== null) {
      try {
        mkdirSync(svgDir, { recursive: true });
        // Each drawn as it is written, the folder flushed once at the end.
        await writeOutputFiles((function* () {
          for (const [i, sheet] of sheets.entries()) yield { path: join(svgDir, `sheet-${i + 1}.svg`), data: sheetToSvg(sheet) };
        })());
        wrote.push(`${sheets.length} SVG file${sheets.length === 1 ? '' : 's'} in ${svgDir}`);
      } catch (error) {
        err(`report: could not write the SVG sheets into ${svgDir}: ${why(error)}\n`);
        return EXIT.unusable;
      }
    }
    out(`wrote ${wrote.join('; ')}\n`);
    const s = results.summary;
    out(`Loop: ${summaryLine(s)}; verdict (every check): ${summaryLine(s.verdict)}\n`);
    return exitFor(results);
  },
};
