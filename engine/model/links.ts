// Links: the cables between nodes, each with an optional protective device and RCD at its origin.
// The fields are defined in schema.ts (LINK); a link the quick check passes is taken as it is.

import type { Link } from './types.js';
import { showValue, type Problem } from './problems.js';
import { isObject, Site, type Json } from './fields.js';
import { reportFields } from './check-spec.js';
import { cleanLink, shapeLink } from './generated/clean.js';
import type { LimitCount } from './limits.js';
import * as schema from './schema.js';

export const INSULATIONS = schema.INSULATIONS;

const usable = (v: unknown): boolean => typeof v === 'string' && v.trim() !== '';

/** Checks one link's own fields; returns it when it has usable id, from and to (for the graph rules). */
export function validateLink(value: unknown, index: number, problems: Problem[], limits?: LimitCount): Link | undefined {
  if (cleanLink(value)) {
    limits?.record(value, shapeLink(value));
    return value as Link; // the parsed object itself: loading never changes it
  }
  // The limits first (parseJob): nothing below walks a value nested past them.
  if (limits !== undefined && !limits.record(value, -1)) return undefined;
  const rawId = isObject(value) && typeof value.id === 'string' && value.id !== '' ? value.id : undefined;
  const site = new Site(problems, () => (rawId ? `links[${index}] (${rawId})` : `links[${index}]`), rawId);
  if (!isObject(value)) {
    site.report('', `each link must be an object, got ${showValue(value)}`);
    return undefined;
  }
  const raw: Json = value;
  reportFields(site, raw, schema.LINK);
  return usable(raw.id) && usable(raw.from) && usable(raw.to) ? (raw as unknown as Link) : undefined;
}
