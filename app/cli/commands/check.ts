// `check JOB.lwj [--json]`: analyse every circuit of a job and report it.
// Exit 0 when every checked circuit passes, 1 when any fails or relies on an RCD,
// 2 when the job cannot be read.

import { analyse, formatProblem, type Results } from '../../../engine/index.js';
import { scheduleCsv } from '../../../engine/report/index.js';
import type { OptionSpec } from '../args.js';
import { EXIT, type Command } from '../command.js';
import { loadJobFile } from '../io.js';
import { renderCheck } from '../table.js';

const options: OptionSpec[] = [
  { name: 'json', summary: 'print only the results document (JSON) on standard output' },
  { name: 'csv', summary: 'print only the circuit schedule as CSV (RFC 4180, units in the header) on standard output' },
];

/** 0 when nothing failed, 1 when any circuit fails or relies on an RCD. */
export function exitFor(results: Results): number {
  return results.summary.fail > 0 || results.summary.rcd > 0 ? EXIT.findings : EXIT.ok;
}

export const check: Command = {
  summary: 'check every circuit of a job: fault-loop impedance against its protective device',
  usage: 'check JOB.lwj [--json] [--csv]',
  details: [
    'Reads the job file (it is never written to), sums the earth-fault loop along every path',
    'from the supply and checks that each protective device disconnects in the required time.',
    'Prints an aligned table with units, the notes, the worst fault path and a summary.',
    '',
    'Exit status: 0 every checked circuit passes; 1 any circuit fails or relies on an RCD;',
    '2 the job could not be read or the command was used wrongly (problems on standard error).',
  ],
  options,
  positionals: { min: 1, max: 1 },
  run({ args, out, err }) {
    const path = args.positionals[0] ?? '';
    if (args.options.json === true && args.options.csv === true) {
      err('check: choose one of --json and --csv\n');
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
      out(`${JSON.stringify(results, null, 2)}\n`);
    } else if (args.options.csv === true) {
      out(scheduleCsv(job, results));
    } else {
      if (warnings.length > 0) err(`${warnings.map((w) => `warning: ${formatProblem(w)}`).join('\n')}\n`);
      out(renderCheck(job, results));
    }
    return exitFor(results);
  },
};
