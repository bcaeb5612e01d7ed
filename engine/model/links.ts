// Links: the cables between nodes, each with an optional protective device and RCD at its origin.

import type { Link } from './types.js';
import type { Problem } from './problems.js';
import { isObject, readChoice, readNumber, readObject, readString, Site, type Json } from './fields.js';
import { validateDevice, validateRcd } from './devices.js';
import { MATERIALS } from './rules.js';

/** Checks one link's own fields; returns it when it has usable id, from and to (for the graph rules). */
export function validateLink(value: unknown, index: number, problems: Problem[]): Link | undefined {
  const rawId = isObject(value) && typeof value.id === 'string' && value.id !== '' ? value.id : undefined;
  const site = new Site(problems, rawId ? `links[${index}] (${rawId})` : `links[${index}]`, rawId);
  if (!isObject(value)) {
    site.report('', `each link must be an object, got ${JSON.stringify(value)}`);
    return undefined;
  }
  const raw: Json = value;
  const id = readString(site, raw, 'id', { required: true, nonEmpty: true });
  const from = readString(site, raw, 'from', { required: true, nonEmpty: true });
  const to = readString(site, raw, 'to', { required: true, nonEmpty: true });
  readString(site, raw, 'name');
  readString(site, raw, 'notes');
  readNumber(site, raw, 'requiredTime', { above: 0, max: 3600 });
  validateCable(site, raw);
  validateDevice(site, raw);
  validateRcd(site, raw);
  if (id === undefined || from === undefined || to === undefined) return undefined;
  return { ...raw } as unknown as Link;
}

function validateCable(site: Site, link: Json): void {
  const cable = readObject(site, link, 'cable', { required: true });
  if (!cable) return;
  readNumber(site, cable, 'length', { min: 0 }, { required: true, path: 'cable.length' });
  readChoice(site, cable, 'material', MATERIALS, { required: true, path: 'cable.material' });
  readNumber(site, cable, 'active', { above: 0 }, { required: true, path: 'cable.active' });
  readNumber(site, cable, 'earth', { above: 0 }, { required: true, path: 'cable.earth' });
  readChoice(site, cable, 'earthMaterial', MATERIALS, { path: 'cable.earthMaterial' });
  readNumber(site, cable, 'parallel', { min: 1, integer: true }, { path: 'cable.parallel' });
  readNumber(site, cable, 'reactance', { min: 0, max: 0.01 }, { path: 'cable.reactance' });
}
