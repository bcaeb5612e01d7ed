// Limits on a job file, checked before the loader looks at anything, so that a huge or deeply
// nested file is refused at once, saying which limit and where, instead of running the loader,
// the analysis or a save out of memory or stack. Every check here is a plain loop, or a
// walk whose recursion stops at the depth limit (never more than 10 frames), linear in the text
// or the value, and stops at the first limit passed. The size, and a bound on how many objects
// and lists JSON.parse could build, are checked on the text before JSON.parse; the exact depth
// and element counts on the parsed value (see checkLimits): walked whole (checkValueLimits), or,
// for a file of the current version, record by record as the loader reads it (LimitCount).
//
// The limits (documented in engine/model/FORMAT.md, "Limits"):
// - size: at most 50 MiB of text (52,428,800 characters; a file read from disk is held to the
//   same number of bytes by its reader, app/cli/io.ts and app/main/job-files.ts).
// - elements: at most 200,000 list items, counted over every list in the file at any depth:
//   each node, each link, each point of a device's curve and each number in a point, each item
//   of a list under a key the program does not know. Object members are not counted (the size
//   limit bounds them). A supply, one board and 90,000 circuits on it make 180,003 nodes and
//   links.
// - nesting: at most 8 levels of objects and lists. The file object is level 1; the deepest
//   the format itself goes is 6 (file → links → a link → its device → points → one point), and
//   2 more are left for data kept under unknown keys.
//
// A syntax error found by JSON.parse is located again here (jsonSyntaxError), because Node's
// "Unexpected token" messages give no position.

import type { Problem } from './problems.js';

export const LIMITS = {
  /** Characters of text (bytes, for a file on disk). */
  size: 50 * 1024 * 1024,
  /** List items anywhere in the file. */
  elements: 200_000,
  /** Levels of objects and lists, the file object being level 1. */
  depth: 8,
} as const;

/** The deepest the format itself nests (file → links → link → device → points → point). */
export const FORMAT_DEPTH = 6;

const QUOTE = 34;
const BACKSLASH = 92;
const OPEN_LIST = 91;
const CLOSE_LIST = 93;
const OPEN_OBJECT = 123;
const CLOSE_OBJECT = 125;
const COMMA = 44;

function problem(message: string, field = ''): Problem {
  return { severity: 'error', where: 'file', field, message };
}

/** The index of the quote closing the string that opens at `start`, or -1 when it never closes. */
function stringEnd(text: string, start: number): number {
  let j = text.indexOf('"', start + 1);
  while (j !== -1) {
    let slashes = 0;
    for (let k = j - 1; text.charCodeAt(k) === BACKSLASH; k--) slashes++;
    if (slashes % 2 === 0) return j;
    j = text.indexOf('"', j + 1);
  }
  return -1;
}

function isSpace(c: number): boolean {
  return c === 32 || c === 10 || c === 13 || c === 9;
}

/** "line 3 column 7" for a character offset (columns count characters, from 1). */
export function lineColumn(text: string, offset: number): string {
  let line = 1;
  let lineStart = 0;
  const end = Math.min(offset, text.length);
  for (let i = text.indexOf('\n'); i !== -1 && i < end; i = text.indexOf('\n', i + 1)) {
    line++;
    lineStart = i + 1;
  }
  return `line ${line} column ${end - lineStart + 1}`;
}

function megabytes(chars: number): string {
  return `${(chars / (1024 * 1024)).toFixed(1)} MB`;
}

/**
 * The limits checked on the text before JSON.parse: the size, then a count of the characters
 * `[` and `{` (every object and list JSON.parse could build, and more: those inside texts count
 * too). Up to the element limit, JSON.parse cannot build much, and V8's JSON.parse nests
 * iteratively, so the exact depth and element counts are left to checkValueLimits on the parsed
 * value, which costs a small part of the parse. Past it, the whole text is scanned (scanLimits)
 * before anything is built. Null when the text may be parsed.
 */
export function checkLimits(text: string): Problem | null {
  if (text.length > LIMITS.size) {
    return problem(
      `the file is ${megabytes(text.length)}, over the limit of ${megabytes(LIMITS.size)} for a job file; nothing was read`,
    );
  }
  let opens = 0;
  for (let i = text.indexOf('['); i !== -1 && opens <= LIMITS.elements; i = text.indexOf('[', i + 1)) opens++;
  for (let i = text.indexOf('{'); i !== -1 && opens <= LIMITS.elements; i = text.indexOf('{', i + 1)) opens++;
  return opens > LIMITS.elements ? scanLimits(text) : null;
}

/** What the walk of a parsed value found: within the limits, too deep, or too many elements. */
const WITHIN = 0;
const TOO_DEEP = 1;
const TOO_MANY = 2;

/**
 * The depth and element limits on a parsed value. The walk recurses, but never deeper than the
 * depth limit + 1 levels (it stops at the first container past the limit), so the file cannot
 * make the stack deep: at most 10 frames, whatever it holds. On a value past a limit, the problem
 * comes from scanning `text`, its source, so that it names the path and the line and column.
 */
export function checkValueLimits(value: unknown, text: string): Problem | null {
  if (typeof value !== 'object' || value === null) return null;
  const count = new LimitCount();
  count.found = walkValue(value, 1, count);
  return count.passed ? count.problem(text) : null;
}

/**
 * The depth and element limits counted as the loader reads a current-version file (parseJob):
 * the file object's own keys other than the records are walked first (`file`), then each record
 * as the loader comes to it (`record`, before anything else looks at it). A record its quick
 * check passed and that holds no key the definitions do not know nests no deeper than the format
 * (FORMAT_DEPTH), so only its list items are counted (`shape`, generated/clean.ts); any other
 * record is walked as checkValueLimits walks. The same limits as checkValueLimits, without a
 * second walk over every record.
 */
export class LimitCount {
  items = 0;
  found = WITHIN;

  get passed(): boolean {
    return this.found !== WITHIN;
  }

  /** The file object's keys: `records` lists (nodes, links) counted by length, the rest walked. */
  file(value: Record<string, unknown>, records: readonly string[]): boolean {
    for (const key in value) {
      const x = value[key];
      if (records.includes(key) && Array.isArray(x)) this.add(x.length);
      else if (typeof x === 'object' && x !== null) this.walk(x, 2);
      if (this.found !== WITHIN) return false;
    }
    return true;
  }

  /** One record of a list of the file object (depth 3); `shape` its list items, or −1: walk it. */
  record(value: unknown, shape: number): boolean {
    if (this.found !== WITHIN) return false;
    if (shape >= 0) return this.add(shape);
    if (typeof value === 'object' && value !== null) this.walk(value, 3);
    return this.found === WITHIN;
  }

  private add(items: number): boolean {
    this.items += items;
    if (this.items > LIMITS.elements) this.found = TOO_MANY;
    return this.found === WITHIN;
  }

  private walk(value: object, depth: number): void {
    this.found = walkValue(value, depth, this);
  }

  /** The problem to report once a limit is passed (the place found by scanning `text`). */
  problem(text: string): Problem {
    return (
      scanLimits(text) ??
      (this.found === TOO_DEEP
        ? problem(`the file nests objects and lists more than ${LIMITS.depth} levels deep; nothing was read`)
        : problem(`the file has more than ${LIMITS.elements.toLocaleString('en')} elements; nothing was read`))
    );
  }
}

/** Walk one container at `depth` (the file object is 1) and what it holds; see checkValueLimits. */
function walkValue(v: object, depth: number, counter: { items: number }): number {
  if (depth > LIMITS.depth) return TOO_DEEP;
  if (Array.isArray(v)) {
    const n = v.length;
    counter.items += n;
    if (counter.items > LIMITS.elements) return TOO_MANY;
    for (let i = 0; i < n; i++) {
      const x: unknown = v[i];
      if (typeof x === 'object' && x !== null) {
        const found = walkValue(x, depth + 1, counter);
        if (found !== WITHIN) return found;
      }
    }
    return WITHIN;
  }
  for (const key in v) {
    const x = (v as Record<string, unknown>)[key];
    if (typeof x === 'object' && x !== null) {
      const found = walkValue(x, depth + 1, counter);
      if (found !== WITHIN) return found;
    }
  }
  return WITHIN;
}

/** The first depth or element limit the text passes, by scanning all of it; null when within. */
export function scanLimits(text: string): Problem | null {
  // Which kind each open container is (1 list, 2 object); never deeper than the limit + 1.
  const kinds = new Uint8Array(LIMITS.depth + 2);
  let depth = 0;
  let items = 0;
  let justOpenedList = false;
  const n = text.length;
  for (let i = 0; i < n; i++) {
    const c = text.charCodeAt(i);
    if (isSpace(c)) continue;
    if (justOpenedList) {
      justOpenedList = false;
      if (c !== CLOSE_LIST && ++items > LIMITS.elements) return overElements(text, i);
    }
    if (c === QUOTE) {
      const end = stringEnd(text, i);
      if (end === -1) return null; // not JSON: an unclosed string; JSON.parse says so
      i = end;
    } else if (c === OPEN_LIST || c === OPEN_OBJECT) {
      if (++depth > LIMITS.depth) return tooDeep(text, i);
      kinds[depth] = c === OPEN_LIST ? 1 : 2;
      justOpenedList = c === OPEN_LIST;
    } else if (c === CLOSE_LIST || c === CLOSE_OBJECT) {
      if (depth > 0) depth--;
    } else if (c === COMMA) {
      if (kinds[depth] === 1 && depth > 0 && ++items > LIMITS.elements) return overElements(text, i + 1);
    }
  }
  return null;
}

function tooDeep(text: string, offset: number): Problem {
  const path = pathAt(text, offset);
  return problem(
    `the file nests objects and lists more than ${LIMITS.depth} levels deep at ${path} (${lineColumn(text, offset)}); ` +
      `the format needs at most ${FORMAT_DEPTH} (a device's curve points), so nothing was read`,
    path,
  );
}

function overElements(text: string, offset: number): Problem {
  const path = pathAt(text, offset);
  return problem(
    `the file has more than ${LIMITS.elements.toLocaleString('en')} elements (list items: nodes, links, curve points and ` +
      `any other list entries); the limit is passed at ${path} (${lineColumn(text, offset)}), so nothing was read`,
    path,
  );
}

/** A key as it appears in a path: `.cable` for a plain name, `["odd key"]` otherwise, cut when long. */
function keyPart(key: string): string {
  if (/^[A-Za-z_$][\w$]{0,40}$/.test(key)) return `.${key}`;
  const cut = key.length > 40 ? `${Array.from(key).slice(0, 40).join('')}…` : key;
  return `[${JSON.stringify(cut)}]`;
}

interface Level {
  list: boolean;
  index: number;
  key: string | null;
  /** An object expects a key next (after `{` or `,`). */
  wantKey: boolean;
}

/**
 * The path of the value at `offset` in text already known to nest no deeper than the limit up
 * to that point, such as `links[3].device.points[0]`. Walks the text again, keeping only the
 * open containers (at most the depth limit + 1 of them).
 */
export function pathAt(text: string, offset: number): string {
  const stack: Level[] = [];
  for (let i = 0; i < offset && i < text.length; i++) {
    const c = text.charCodeAt(i);
    if (isSpace(c)) continue;
    const top = stack[stack.length - 1];
    if (c === QUOTE) {
      const end = stringEnd(text, i);
      if (end === -1 || end >= offset) break;
      if (top !== undefined && !top.list && top.wantKey) {
        let key: string;
        try {
          key = JSON.parse(text.slice(i, end + 1)) as string;
        } catch {
          key = text.slice(i + 1, end);
        }
        top.key = key;
        top.wantKey = false;
      }
      i = end;
    } else if (c === OPEN_LIST || c === OPEN_OBJECT) {
      stack.push({ list: c === OPEN_LIST, index: 0, key: null, wantKey: c === OPEN_OBJECT });
    } else if (c === CLOSE_LIST || c === CLOSE_OBJECT) {
      stack.pop();
    } else if (c === COMMA && top !== undefined) {
      if (top.list) top.index++;
      else top.wantKey = true;
    }
  }
  let path = '';
  for (const level of stack) {
    if (level.list) path += `[${level.index}]`;
    else if (level.key !== null) path += keyPart(level.key);
  }
  if (path.startsWith('.')) path = path.slice(1);
  return path === '' ? 'the top of the file' : path;
}

function describeChar(text: string, i: number): string {
  const cp = text.codePointAt(i);
  if (cp === undefined) return 'the end of the file';
  if (cp < 0x20 || (cp >= 0x7f && cp <= 0x9f)) return `a control character (U+${cp.toString(16).toUpperCase().padStart(4, '0')})`;
  return JSON.stringify(String.fromCodePoint(cp));
}

const LITERALS = ['true', 'false', 'null'];
const NUMBER = /-?(?:0|[1-9]\d*)(?:\.\d+)?(?:[eE][+-]?\d+)?/y;

/**
 * Where and why `text` is not JSON, as `unexpected "o" where a value was expected, line 3
 * column 9`; null when no error is found (then JSON.parse's own message stands). Iterative.
 */
export function jsonSyntaxError(text: string): string | null {
  const at = (i: number, what: string): string => `${what}, ${lineColumn(text, i)}`;
  // What comes next: 'value', 'key' (or `}` right after `{`), 'colon', 'after' (`,` or a close).
  const stack: number[] = [];
  let want: 'value' | 'first-value' | 'key' | 'first-key' | 'colon' | 'after' = 'value';
  const n = text.length;
  let i = 0;
  for (;;) {
    while (i < n && isSpace(text.charCodeAt(i))) i++;
    if (i >= n) {
      if (stack.length === 0 && want === 'after') return null;
      return at(i, stack.length > 0 ? 'the file ends before every object and list is closed' : 'the file ends where a value was expected');
    }
    const c = text.charCodeAt(i);
    if (stack.length === 0 && want === 'after') return at(i, `found ${describeChar(text, i)} after the end of the JSON value`);
    if (want === 'colon') {
      if (c !== 58) return at(i, `found ${describeChar(text, i)} where ":" was expected after a property name`);
      want = 'value';
      i++;
      continue;
    }
    if (want === 'after') {
      const top = stack[stack.length - 1];
      if (c === COMMA) {
        want = top === OPEN_OBJECT ? 'key' : 'value';
        i++;
        continue;
      }
      if ((c === CLOSE_LIST && top === OPEN_LIST) || (c === CLOSE_OBJECT && top === OPEN_OBJECT)) {
        stack.pop();
        i++;
        continue;
      }
      const expected = top === OPEN_OBJECT ? '"," or "}"' : '"," or "]"';
      return at(i, `found ${describeChar(text, i)} where ${expected} was expected`);
    }
    if (want === 'key' || want === 'first-key') {
      if (c === CLOSE_OBJECT && want === 'first-key') {
        stack.pop();
        want = 'after';
        i++;
        continue;
      }
      if (c !== QUOTE) return at(i, `found ${describeChar(text, i)} where a property name in double quotes was expected`);
      const bad = badString(text, i);
      if (bad !== null) return at(bad.offset, bad.what);
      i = stringEnd(text, i) + 1;
      want = 'colon';
      continue;
    }
    // A value (or, right after `[`, a `]`).
    if (c === CLOSE_LIST && want === 'first-value') {
      stack.pop();
      want = 'after';
      i++;
      continue;
    }
    if (c === OPEN_LIST || c === OPEN_OBJECT) {
      stack.push(c);
      want = c === OPEN_LIST ? 'first-value' : 'first-key';
      i++;
      continue;
    }
    if (c === QUOTE) {
      const bad = badString(text, i);
      if (bad !== null) return at(bad.offset, bad.what);
      i = stringEnd(text, i) + 1;
      want = 'after';
      continue;
    }
    const literal = LITERALS.find((l) => text.startsWith(l, i));
    if (literal !== undefined) {
      i += literal.length;
      want = 'after';
      continue;
    }
    NUMBER.lastIndex = i;
    const m = NUMBER.exec(text);
    if (m !== null && m[0] !== '-') {
      i += m[0].length;
      want = 'after';
      continue;
    }
    return at(i, `found ${describeChar(text, i)} where a value was expected`);
  }
}

const ESCAPES = new Set(['"', '\\', '/', 'b', 'f', 'n', 'r', 't']);

/** What is wrong inside the string opening at `start`, if anything. */
function badString(text: string, start: number): { offset: number; what: string } | null {
  for (let i = start + 1; i < text.length; i++) {
    const c = text.charCodeAt(i);
    if (c === QUOTE) return null;
    if (c < 0x20) return { offset: i, what: `a text holds ${describeChar(text, i)}, which JSON allows only written as an escape such as \\n` };
    if (c === BACKSLASH) {
      const e = text[i + 1] ?? '';
      if (ESCAPES.has(e)) i++;
      else if (e === 'u' && /^[0-9a-fA-F]{4}$/.test(text.slice(i + 2, i + 6))) i += 5;
      else return { offset: i, what: 'a text holds a backslash that does not start a valid escape' };
    }
  }
  return { offset: text.length, what: 'the file ends inside a text that is never closed' };
}
