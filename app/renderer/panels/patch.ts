// Turning one field edit (a dotted path in the job format and a value) into a store edit.
// The store merges node and link patches shallowly, so a change to `cable.length` replaces
// the whole `cable` object with a copy that has the new length.

type Obj = Record<string, unknown>;

function isObj(v: unknown): v is Obj {
  return typeof v === 'object' && v !== null && !Array.isArray(v);
}

/** Copy `base` with `path` set to `value`; `undefined` removes the key. Arrays are copied too. */
export function setIn(base: unknown, path: readonly string[], value: unknown): unknown {
  const [head, ...rest] = path;
  if (head === undefined) return value;
  if (Array.isArray(base)) {
    const copy = base.slice();
    const index = Number(head);
    copy[index] = setIn(copy[index], rest, value);
    return copy;
  }
  const copy: Obj = isObj(base) ? { ...base } : {};
  const next = rest.length === 0 ? value : setIn(copy[head], rest, value);
  if (next === undefined) delete copy[head];
  else copy[head] = next;
  return copy;
}

export function getIn(base: unknown, path: readonly string[]): unknown {
  let cur: unknown = base;
  for (const key of path) {
    if (Array.isArray(cur)) cur = cur[Number(key)];
    else if (isObj(cur)) cur = cur[key];
    else return undefined;
  }
  return cur;
}

/**
 * The shallow patch for a record (node or link) that sets one dotted field.
 * `patchFor(link, 'cable.length', 40)` → `{ cable: { ...link.cable, length: 40 } }`;
 * `patchFor(link, 'name', undefined)` → `{ name: undefined }` (the store deletes the key).
 */
export function patchFor(record: object, field: string, value: unknown): Obj {
  const [top, ...rest] = field.split('.');
  if (top === undefined || top === '') throw new Error('empty field path');
  if (rest.length === 0) return { [top]: value };
  const current = (record as Obj)[top];
  return { [top]: setIn(current, rest, value) };
}
