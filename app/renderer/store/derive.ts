// Derived state: validation of a candidate job and its results, recomputed once per change.
import {
  createAnalysis,
  formatProblem,
  reanalyse,
  rehearseLengthEdit,
  type Analysis,
  loadJob as readJob,
  toFileObject,
  type CircuitResult,
  type Job,
  type Problem,
  type Results,
} from '../../../engine/index.js';

/**
 * What the engine's validator has to see to judge `next`, made from `base` (a job known to have
 * no errors) by an edit. Every record is checked on its own and the rules that span records
 * (ids, references, one feeder each, no cycles) depend only on ids, ends and kinds; so when an
 * edit changes no id, end or kind, and adds or removes nothing, the records it replaced (with
 * the nodes their links join) are all that can hold a new error. Those go at their own indices
 * in otherwise empty (sparse) lists, so every problem still names its true place ("links[812]
 * (C4)"). Anything else gets the whole job.
 */
export function validationInput(base: Job | null, next: Job): Record<string, unknown> {
  const file = toFileObject(next);
  if (!base || base.nodes.length !== next.nodes.length || base.links.length !== next.links.length) return file;
  if (base.extra !== next.extra) return file;
  const nodes: unknown[] = new Array(next.nodes.length);
  const links: unknown[] = new Array(next.links.length);
  const ends = new Set<string>();
  for (let i = 0; i < next.links.length; i++) {
    const a = base.links[i]!;
    const b = next.links[i]!;
    if (a === b) continue;
    // The phase rules span the whole path (method-depth.md section 1): a phases change gets the whole job.
    if (a.id !== b.id || a.from !== b.from || a.to !== b.to || a.phases !== b.phases) return file;
    links[i] = b;
    ends.add(b.from).add(b.to);
  }
  for (let i = 0; i < next.nodes.length; i++) {
    const a = base.nodes[i]!;
    const b = next.nodes[i]!;
    if (a !== b && (a.id !== b.id || a.kind !== b.kind || ('phases' in a ? a.phases : undefined) !== ('phases' in b ? b.phases : undefined))) return file;
    if (a !== b || ends.has(b.id)) nodes[i] = b;
  }
  return { ...file, nodes, links };
}

/**
 * The first error the engine's validator finds in the job, preferring one about the touched ids.
 * `base`: the error-free job the edit started from, so only what the edit changed is checked.
 */
export function firstError(job: Job, touched: string[], base: Job | null = null): Problem | null {
  const loaded = readJob(validationInput(base, job));
  if (loaded.ok) return null;
  const errors = loaded.problems.filter((p) => p.severity === 'error');
  if (errors.length === 0) return null;
  const mine = errors.find((p) => p.id !== undefined && touched.includes(p.id));
  return mine ?? errors[0]!;
}

const FIELD_WORDS: Record<string, string> = {
  to: 'its far end',
  from: 'its feeding end',
  id: 'the id',
  name: 'the name',
  'cable.length': 'the cable length',
  'cable.active': 'the active conductor size',
  'cable.earth': 'the earth conductor size',
  'cable.parallel': 'the number of sets in parallel',
  'cable.reactance': 'the reactance',
  'device.rating': 'the device rating',
  'device.curve': 'the breaker curve',
  'rcd.sensitivity': 'the RCD sensitivity',
  requiredTime: 'the required disconnection time',
};

/** A link or node as the user knows it: `link SM3 "Workshop feed" (MSB → DB2)`, `board DB2 "Workshop"`. */
function elementWords(job: Job | null, id: string): string {
  const link = job?.links.find((l) => l.id === id);
  if (link) return `link ${id}${link.name ? ` "${link.name}"` : ''} (${link.from} → ${link.to})`;
  const node = job?.nodes.find((n) => n.id === id);
  if (node) return `${node.kind} ${id}${node.name && node.name !== id ? ` "${node.name}"` : ''}`;
  return id;
}

/**
 * A problem in the user's words: the element by kind, id and name (not its place in the file's
 * lists), the field by what it is, and any other link the message points at by its id.
 */
export function describe(p: Problem, job: Job | null = null): string {
  if (!job) return formatProblem(p);
  let message = p.message
    .replace(/ \(links\[(\d+)\]\)/g, '')
    .replace(/links\[(\d+)\]/g, (_m, i: string) => `link ${job.links[Number(i)]?.id ?? `number ${Number(i) + 1}`}`)
    .replace(/nodes\[(\d+)\]/g, (_m, i: string) => `${job.nodes[Number(i)]?.kind ?? 'node'} ${job.nodes[Number(i)]?.id ?? `number ${Number(i) + 1}`}`);
  if (p.field && message.startsWith(`${p.field} `)) {
    const rest = message.slice(p.field.length + 1);
    const words = FIELD_WORDS[p.field] ?? p.field;
    message = p.field === 'to' && rest.startsWith('names the supply') ? `its far end is the supply${rest.slice('names the supply'.length)}` : `${words} ${rest}`;
  }
  const where = p.id !== undefined ? elementWords(job, p.id) : p.where === 'rules' ? 'the rules' : p.where === 'job' ? 'the job details' : p.where;
  const text = `${where}: ${message}`;
  return text.charAt(0).toUpperCase() + text.slice(1);
}

export const EMPTY_RESULTS: Results = {
  format: 'loopwright.results',
  version: 2,
  basis: 'au-nz',
  circuits: [],
  worst: null,
  supplies: [],
  summary: {
    pass: 0,
    fail: 0,
    rcd: 0,
    unchecked: 0,
    verdict: { pass: 0, fail: 0, rcd: 0, unchecked: 0 },
    checks: {
      voltage: { pass: 0, fail: 0, unchecked: 0 },
      capacity: { pass: 0, fail: 0, unchecked: 0 },
      breaking: { pass: 0, fail: 0, unchecked: 0 },
      withstand: { pass: 0, fail: 0, unchecked: 0 },
      measured: { pass: 0, fail: 0, rcd: 0, unchecked: 0 },
    },
  },
};

function sameResult(a: CircuitResult, b: CircuitResult): boolean {
  for (const key of Object.keys(a) as Array<keyof CircuitResult>) {
    if (key === 'notes') continue;
    if (key === 'measured' || key === 'fixes') {
      if (JSON.stringify(a[key]) !== JSON.stringify(b[key])) return false;
      continue;
    }
    if (a[key] !== b[key]) return false;
  }
  return a.notes.length === b.notes.length && a.notes.every((n, i) => n === b.notes[i]);
}

export interface Derived {
  results: Results;
  resultById: Record<string, CircuitResult>;
  error: string | null;
}

/**
 * analyse(job), keeping the previous object for every circuit whose result did not change,
 * so only the labels whose numbers moved re-render.
 */
let lastAnalysis: Analysis | null = null;

export function derive(job: Job, previous: Record<string, CircuitResult>): Derived {
  let results: Results;
  try {
    // After a length edit only the changed subtree is redone (the engine's reanalyse); any
    // other change is analysed afresh there.
    lastAnalysis = !lastAnalysis ? createAnalysis(job) : lastAnalysis.job === job ? lastAnalysis : reanalyse(lastAnalysis, job);
    results = lastAnalysis.results;
  } catch (e) {
    lastAnalysis = null;
    return {
      results: { ...EMPTY_RESULTS, basis: job.rules.basis },
      resultById: {},
      error: `The analysis failed: ${e instanceof Error ? e.message : String(e)}`,
    };
  }
  const resultById: Record<string, CircuitResult> = {};
  const circuits = results.circuits.map((c) => {
    const old = previous[c.link];
    // The incremental analysis hands back the very object for a circuit it did not redo.
    const kept = old === c ? c : old && sameResult(old, c) ? old : c;
    resultById[c.link] = kept;
    return kept;
  });
  return { results: { ...results, circuits }, resultById, error: null };
}

/**
 * The analysis half of a length edit rehearsed once on the job as it is (engine
 * rehearseLengthEdit), with the comparison derive makes against the results shown; nothing is
 * kept and no state changes. The editor runs it when the browser is idle after a job opens.
 */
export function rehearseDerive(job: Job, shown: Record<string, CircuitResult>): void {
  if (!lastAnalysis || lastAnalysis.job !== job) return;
  const results = rehearseLengthEdit(lastAnalysis);
  if (!results) return;
  for (const c of results.circuits) {
    const old = shown[c.link];
    if (old && old !== c) sameResult(old, c);
  }
}
