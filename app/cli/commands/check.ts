// `check JOB.lwj [--json | --csv | --checks]`: analyse every circuit of a job and report it.
// Exit status by the verdicts (every check, job-format.md "Results document, version 2"): 0 when
// no verdict is fail or rcd, 1 otherwise, 2 when the job cannot be read.

import { analyse, formatProblem, type Results } from '../../../engine/index.js';
import { scheduleCsv } from '../../../engine/report/index.js';
import type { OptionSpec } from '../args.js';
import { EXIT, type Command } from '../command.js';
import { loadJobFile } from '../io.js';
import { renderCheck } from '../table.js';

const options: OptionSpec[] = [
  { name: 'json', summary: 'print only the results document (JSON) on standard output' },
  { name: 'csv', summary: 'print only the circuit schedule as CSV (RFC 4180, units in the header) on standard output' },
  {
    name: 'checks',
    summary: 'print the table of the other checks instead of the loop: phases, Ib, drop, capacity, fault level, withstand, test limit, readings, verdict, fixes',
  },
];

/**
 * 0 when no verdict is fail or rcd, 1 otherwise. The verdict covers the loop (a failing or
 * RCD-reliant loop is a failing or RCD-reliant verdict), so the loop counts are read as well.
 */
export function exitFor(results: Results): number {
  const v = results.summary.verdict;
  const s = results.summary;
  return v.fail > 0 || v.rcd > 0 || s.fail > 0 || s.rcd > 0 ? EXIT.findings : EXIT.ok;
}

/**
 * DEL, the C1 controls and the bidirectional embeddings, overrides and isolates (U+007F–U+009F,
 * U+202A–U+202E, U+2066–U+2069), which JSON.stringify leaves raw: written as \uXXXX, so that no
 * name or id from the job can act on a terminal or reorder what it shows. JSON has these only
 * inside strings, so a replace over the whole text is safe; a parser reads back the same text.
 */
const RAW_IN_JSON = /[\u007f-\u009f\u202a-\u202e\u2066-\u2069]/g;

/** The results document as `check --json` prints it (ending with a newline). */
export function resultsJson(results: Results): string {
  const text = JSON.stringify(results, null, 2).replace(RAW_IN_JSON, (c) => `\\u${c.charCodeAt(0).toString(16).padStart(4, '0')}`);
  return `${text}\n`;
}

export const check: Command = {
  summary: 'check every circuit of a job: fault loop, voltage drop, capacity, breaking, withstand, readings',
  usage: 'check JOB.lwj [--json] [--csv] [--checks]',
  details: [
    'Reads the job file (it is never written to), sums the earth-fault loop along every path',
    'from the supply and checks that each protective device disconnects in the required time;',
    'then the voltage drop, Ib ≤ In ≤ Iz, breaking capacity against the fault level, the',
    'protective conductor\'s withstand and any measured reading, and gives each link one verdict.',
    '',
    'The default table shows the loop (it stays within 160 columns); --checks shows instead, per',
    'link: phases, Ib (A), cos φ, own drop (%), total drop / limit (%), voltage status, Iz (A),',
    'capacity status, fault level at the origin (kA), breaking status, minimum earth area (mm²),',
    'withstand status, test limit (Ω), reading → corrected (Ω), measured status and the',
    'verdict, then the fixes in words. Both print the notes (naming the limit that fails), each',
    'supply\'s fault level and headroom (for an unknown source, the figure to ask the distributor',
    'for), the worst fault path and the counts of the loop, the verdicts and every check.',
    '',
    'Exit status: 0 no verdict fails or relies on an RCD; 1 any link\'s verdict is fail or',
    'RCD-reliant (the loop or any other check); 2 the job could not be read or the command was',
    'used wrongly (problems on standard error).',
  ],
  options,
  positionals: { min: 1, max: 1 },
  run({ args, out, err }) {
    const path = args.positionals[0] ?? '';
    const chosen = (['json', 'csv', 'checks'] as const).filter((o) => args.options[o] === true);
    if (chosen.length > 1) {
      err(`check: choose one of --json, --csv and --checks (got ${chosen.map((o) => `--${o}`).join(' and ')})\n`);
      return EXIT.unusable;
    }
    const loaded = loadJobFile(path);
    if (!loaded.ok) {
      err(`${loaded.lines.join('\n')}\n`);
      return EXIT.unusable;
    }
    const { job, warnings } = loaded.load;
    const results = analyse(job);
    if (args.options.json === true) {
      out(resultsJson(results));
    } else if (args.options.csv === true) {
      out(scheduleCsv(job, results));
    } else {
      if (warnings.length > 0) err(`${warnings.map((w) => `warning: ${formatProblem(w)}`).join('\n')}\n`);
      out(renderCheck(job, results, args.options.checks === true ? 'checks' : 'loop'));
    }
    return exitFor(results);
  },
};
