// Nodes: supplies (with their source), boards and points (the far ends of final subcircuits).

import type { Problem } from './problems.js';
import type { JobNode, PointUse } from './types.js';
import { isObject, readBoolean, readChoice, readNumber, readObject, readString, Site, type Json } from './fields.js';

export const NODE_KINDS = ['supply', 'board', 'point'] as const;
export const POINT_USES: readonly PointUse[] = ['socket-outlets', 'lighting', 'fixed-equipment', 'motor', 'other'];
export const SOURCE_TYPES = ['unknown', 'impedance', 'fault-current'] as const;

/** Checks one node's own fields; returns it when it has a usable id and kind (for the graph rules). */
export function validateNode(value: unknown, index: number, problems: Problem[]): JobNode | undefined {
  const rawId = isObject(value) && typeof value.id === 'string' && value.id !== '' ? value.id : undefined;
  const site = new Site(problems, () => (rawId ? `nodes[${index}] (${rawId})` : `nodes[${index}]`), rawId);
  if (!isObject(value)) {
    site.report('', `each node must be an object, got ${JSON.stringify(value)}`);
    return undefined;
  }
  const raw: Json = value;
  const id = readString(site, raw, 'id', { required: true, nonEmpty: true });
  const kind = readChoice(site, raw, 'kind', NODE_KINDS, { required: true });
  readString(site, raw, 'name');
  readString(site, raw, 'notes');
  const at = readObject(site, raw, 'at');
  if (at) {
    readNumber(site, at, 'x', {}, { required: true, path: 'at.x' });
    readNumber(site, at, 'y', {}, { required: true, path: 'at.y' });
  }
  if (kind === 'supply') {
    validateSource(site, raw);
    readChoice(site, raw, 'phases', [1, 3] as const);
    const maxFault = readObject(site, raw, 'maxFault');
    if (maxFault) {
      readNumber(site, maxFault, 'current', { above: 0 }, { required: true, path: 'maxFault.current' });
      readNumber(site, maxFault, 'xr', { min: 0 }, { path: 'maxFault.xr' });
    }
    const measured = readObject(site, raw, 'measured');
    if (measured) {
      readNumber(site, measured, 'ze', { above: 0 }, { required: true, path: 'measured.ze' });
      readString(site, measured, 'date', { path: 'measured.date' });
      readString(site, measured, 'instrument', { path: 'measured.instrument' });
    }
  }
  if (kind === 'board') readNumber(site, raw, 'diversity', { above: 0, max: 1 });
  if (kind === 'point') {
    readChoice(site, raw, 'use', POINT_USES, { required: true });
    readBoolean(site, raw, 'handHeld');
    readNumber(site, raw, 'current', { min: 0 });
    readChoice(site, raw, 'phases', [1, 3] as const);
    readNumber(site, raw, 'powerFactor', { above: 0, max: 1 });
  }
  if (id === undefined || kind === undefined) return undefined;
  return raw as unknown as JobNode; // the parsed object itself: loading never changes it
}

function validateSource(site: Site, raw: Json): void {
  const source = readObject(site, raw, 'source', { required: true });
  if (!source) return;
  const type = readChoice(site, source, 'type', SOURCE_TYPES, { required: true, path: 'source.type' });
  if (type === 'impedance') {
    readNumber(site, source, 'r', { min: 0 }, { required: true, path: 'source.r' });
    readNumber(site, source, 'x', { min: 0 }, { required: true, path: 'source.x' });
  } else if (type === 'fault-current') {
    readNumber(site, source, 'current', { above: 0 }, { required: true, path: 'source.current' });
    readNumber(site, source, 'xr', { min: 0 }, { path: 'source.xr' });
  }
}

