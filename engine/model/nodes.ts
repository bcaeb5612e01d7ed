// Nodes: supplies (with their source), boards and points (the far ends of final subcircuits).
// The fields are defined in schema.ts (NODE); a node the quick check passes is taken as it is.

import { showValue, type Problem } from './problems.js';
import type { JobNode, PointUse } from './types.js';
import { isObject, Site, type Json } from './fields.js';
import { reportFields } from './check-spec.js';
import { cleanNode, shapeNode } from './generated/clean.js';
import type { LimitCount } from './limits.js';
import * as schema from './schema.js';

export const NODE_KINDS = schema.NODE_KINDS;
export const POINT_USES: readonly PointUse[] = schema.POINT_USES;
export const SOURCE_TYPES = schema.SOURCE_TYPES;

/** Checks one node's own fields; returns it when it has a usable id and kind (for the graph rules). */
export function validateNode(value: unknown, index: number, problems: Problem[], limits?: LimitCount): JobNode | undefined {
  if (cleanNode(value)) {
    limits?.record(value, shapeNode(value));
    return value as JobNode; // the parsed object itself: loading never changes it
  }
  // The limits first (parseJob): nothing below walks a value nested past them.
  if (limits !== undefined && !limits.record(value, -1)) return undefined;
  const rawId = isObject(value) && typeof value.id === 'string' && value.id !== '' ? value.id : undefined;
  const site = new Site(problems, () => (rawId ? `nodes[${index}] (${rawId})` : `nodes[${index}]`), rawId);
  if (!isObject(value)) {
    site.report('', `each node must be an object, got ${showValue(value)}`);
    return undefined;
  }
  const raw: Json = value;
  reportFields(site, raw, schema.NODE);
  const idOk = typeof raw.id === 'string' && raw.id.trim() !== '';
  const kindOk = (NODE_KINDS as readonly unknown[]).includes(raw.kind);
  return idOk && kindOk ? (raw as unknown as JobNode) : undefined;
}
