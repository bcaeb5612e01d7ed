// `npm run gen:schema`: writes, from the record definitions in engine/model/schema.ts and
// engine/model/schema-results.ts,
//   engine/model/generated/clean.ts   the loader's quick check
//   schema/job.schema.json            the JSON Schema of the job file
//   schema/results.schema.json        the JSON Schema of the results document
// tests/engine/schema.test.ts fails when any of them is not what this writes.
import { writeFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { emitClean, jobSchema, resultsSchema } from '../engine/model/schema-emit.js';

const root = fileURLToPath(new URL('..', import.meta.url));
const out: Array<[string, string]> = [
  ['engine/model/generated/clean.ts', emitClean()],
  ['schema/job.schema.json', `${JSON.stringify(jobSchema(), null, 2)}\n`],
  ['schema/results.schema.json', `${JSON.stringify(resultsSchema(), null, 2)}\n`],
];
for (const [path, text] of out) {
  writeFileSync(root + path, text);
  process.stdout.write(`wrote ${path}\n`);
}
