// Loading a job: parse the text, check the envelope, refuse a newer version, migrate, validate
// strictly, and return every problem with where it is. Never throws.

import type { Job, JobNode, Link } from './types.js';
import { CURRENT_VERSION, FORMAT_NAME } from './types.js';
import { showValue, type Problem } from './problems.js';
import { isObject, Site, type Json } from './fields.js';
import { migrate, MIGRATIONS, type Migration } from './migrations.js';
import { validateDetails } from './job-details.js';
import { validateRules } from './rules.js';
import { validateNode } from './nodes.js';
import { validateLink } from './links.js';
import { checkGraph } from './graph-rules.js';
import { shareIds } from '../analysis/order.js';
import { checkPhases } from './phase-rules.js';
import { sizeWarnings } from './sizes.js';
import { checkLimits, checkValueLimits, jsonSyntaxError, LimitCount } from './limits.js';

export type LoadResult =
  | { ok: true; job: Job; warnings: Problem[]; migratedFrom: number | null }
  | { ok: false; problems: Problem[] };

const KNOWN_KEYS = new Set(['format', 'version', 'job', 'rules', 'nodes', 'links']);

function fileProblem(message: string): LoadResult {
  return { ok: false, problems: [{ severity: 'error', where: 'file', field: '', message }] };
}

/** Read a job from the text of a `.lwj` file. */
export function parseJob(text: string): LoadResult {
  const source = text.charCodeAt(0) === 0xfeff ? text.slice(1) : text;
  // Limits (limits.ts): size and a bound on what JSON.parse could build, on the text; nesting and
  // elements on the parsed value, before anything walks it.
  const limit = checkLimits(source);
  if (limit !== null) return { ok: false, problems: [limit] };
  let value: unknown;
  try {
    value = JSON.parse(source);
  } catch (e) {
    const detail = e instanceof Error ? e.message : String(e);
    return fileProblem(`the file is not valid JSON (${jsonSyntaxError(source) ?? `${detail.replace(/[\u0000-\u001f\u007f-\u009f]+/g, ' ')}${lineAndColumn(source, detail)}`})`);
  }
  if (!isCurrentFile(value)) {
    const deep = checkValueLimits(value, source);
    if (deep !== null) return { ok: false, problems: [deep] };
    return loadJob(value);
  }
  // A file of the current version: its records are counted against the depth and element
  // limits as the loader reads them, each before anything else looks at it (LimitCount), so a
  // valid file is walked once, not twice. A limit passed stops the reading.
  const limits = new LimitCount();
  if (!limits.file(value, RECORD_LISTS)) return { ok: false, problems: [limits.problem(source)] };
  const loaded = loadJob(value, MIGRATIONS, limits);
  return limits.passed ? { ok: false, problems: [limits.problem(source)] } : loaded;
}

const RECORD_LISTS = ['nodes', 'links'];

/** A job file of the current version with lists of nodes and links (parseJob's counted path). */
function isCurrentFile(value: unknown): value is Json {
  return isObject(value) && value.format === FORMAT_NAME && value.version === CURRENT_VERSION && Array.isArray(value.nodes) && Array.isArray(value.links);
}

/** ", line 3 column 7" for a JSON error message that gives a character position. */
function lineAndColumn(text: string, message: string): string {
  const m = /position (\d+)/.exec(message);
  if (!m || /line \d+/.test(message)) return '';
  const before = text.slice(0, Number(m[1]));
  const line = before.split('\n').length;
  const column = before.length - before.lastIndexOf('\n');
  return `, line ${line} column ${column}`;
}

/**
 * Read a job from an already-parsed file object (or anything else). `limits`, from parseJob
 * only, counts a current-version file's records against the limits as they are read (the rest
 * of the file already counted); once it has passed one the result is to be thrown away.
 */
export function loadJob(value: unknown, chain: readonly Migration[] = MIGRATIONS, limits?: LimitCount): LoadResult {
  if (!isObject(value)) return fileProblem('the file is not a Loopwright job: expected a JSON object');
  if (value.format !== FORMAT_NAME) {
    return fileProblem(`the file is not a Loopwright job: format must be "${FORMAT_NAME}", got ${showValue(value.format)}`);
  }
  const version = value.version;
  if (typeof version !== 'number' || !Number.isInteger(version) || version < 1) {
    return fileProblem(`version must be a whole number ≥ 1, got ${showValue(version)}`);
  }
  if (version > CURRENT_VERSION) {
    return fileProblem(
      `the file has format version ${version}, newer than this program reads (up to version ${CURRENT_VERSION}); open it with a newer Loopwright. Nothing was read.`,
    );
  }
  const migrated = migrate(value, version, CURRENT_VERSION, chain);
  if (!migrated.ok) return fileProblem(migrated.message);
  return validateFile(migrated.file, migrated.migratedFrom, migrated.migratedFrom === null ? limits : undefined);
}

/**
 * The records of a list that pass their own checks (each is the parsed object itself), and the
 * place of each in the file once one has not (null while every record passed, so positions are
 * places). While every record passes, the list is the file's own list, not a copy.
 */
function keptRecords<R>(
  raw: unknown[],
  validate: (value: unknown, index: number, problems: Problem[], limits?: LimitCount) => R | undefined,
  problems: Problem[],
  limits: LimitCount | undefined,
): { records: R[]; at: number[] | null } {
  let records: R[] | null = null; // null: so far every record passed, and raw is the list
  let at: number[] | null = null;
  for (let index = 0; index < raw.length; index++) {
    // A hole in a sparse list is skipped, as forEach would (the editor checks only the records
    // an edit touched, each at its own index in otherwise empty lists).
    const present = index in raw;
    if (limits?.passed) break; // a limit passed: the reading stops (parseJob reports it)
    const record = present ? validate(raw[index], index, problems, limits) : undefined;
    if (records === null) {
      if (record !== undefined) continue;
      // The first record left out: the ones before it are kept, each at its own place.
      records = raw.slice(0, index) as R[];
      at = records.map((_, i) => i);
      continue;
    }
    if (record !== undefined) {
      records.push(record);
      at!.push(index);
    }
  }
  return records === null ? { records: raw as R[], at: null } : { records, at };
}

function validateFile(file: Json, migratedFrom: number | null, limits?: LimitCount): LoadResult {
  const problems: Problem[] = [];
  const top = new Site(problems, 'file');
  const details = validateDetails(file.job, new Site(problems, 'job'));
  const rules = validateRules(file.rules, new Site(problems, 'rules'));

  // The records that pass their own checks, and (only once one has not) the place of each.
  let nodes: JobNode[] = [];
  let links: Link[] = [];
  let nodeAt: number[] | null = null;
  let linkAt: number[] | null = null;
  if (!Array.isArray(file.nodes)) top.bad('nodes', 'a list of nodes (use [] for none)', file.nodes);
  else ({ records: nodes, at: nodeAt } = keptRecords(file.nodes, validateNode, problems, limits));
  if (!Array.isArray(file.links)) top.bad('links', 'a list of links (use [] for none)', file.links);
  else ({ records: links, at: linkAt } = keptRecords(file.links, validateLink, problems, limits));
  if (limits?.passed) return { ok: false, problems: [] }; // parseJob gives the limit's problem
  const graph = checkGraph(nodes, nodeAt, links, linkAt, problems);
  if (!problems.some((p) => p.severity === 'error')) checkPhases(nodes, links, graph, problems);
  const sizes = sizeWarnings(links, linkAt);
  for (let i = 0; i < sizes.length; i++) problems.push(sizes[i]!);

  const errors = problems.filter((p) => p.severity === 'error');
  if (errors.length) return { ok: false, problems: errors };

  const job: Job = {
    format: FORMAT_NAME,
    version: CURRENT_VERSION,
    job: details,
    rules,
    nodes,
    links,
  };
  let extra: Record<string, unknown> | undefined;
  for (const key of Object.keys(file)) {
    if (KNOWN_KEYS.has(key)) continue;
    extra ??= {};
    // defineProperty, so even a key named "__proto__" is kept as plain data.
    Object.defineProperty(extra, key, { value: file[key], enumerable: true, writable: true, configurable: true });
  }
  if (extra !== undefined) job.extra = extra;
  shareIds(nodes, links, graph.ids, graph.linkFrom, graph.linkTo);
  return { ok: true, job, warnings: problems, migratedFrom };
}
