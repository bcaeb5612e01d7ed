// Links: the cables between nodes, each with an optional protective device and RCD at its origin.

import type { Link } from './types.js';
import type { Problem } from './problems.js';
import { isObject, readBoolean, readChoice, readNumber, readObject, readString, Site, type Json } from './fields.js';
import { validateDevice, validateRcd } from './devices.js';
import { MATERIALS } from './rules.js';

export const INSULATIONS = ['pvc', 'xlpe'] as const;

/** Checks one link's own fields; returns it when it has usable id, from and to (for the graph rules). */
export function validateLink(value: unknown, index: number, problems: Problem[]): Link | undefined {
  const rawId = isObject(value) && typeof value.id === 'string' && value.id !== '' ? value.id : undefined;
  const site = new Site(problems, () => (rawId ? `links[${index}] (${rawId})` : `links[${index}]`), rawId);
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
  readChoice(site, raw, 'phases', [1, 3] as const);
  readNumber(site, raw, 'designCurrent', { above: 0 });
  readNumber(site, raw, 'powerFactor', { above: 0, max: 1 });
  readNumber(site, raw, 'voltageDropLimit', { above: 0, max: 100 });
  const measured = readObject(site, raw, 'measured');
  if (measured) {
    readNumber(site, measured, 'zs', { above: 0 }, { required: true, path: 'measured.zs' });
    readNumber(site, measured, 'temperature', { min: -30, max: 60 }, { path: 'measured.temperature' });
    readString(site, measured, 'date', { path: 'measured.date' });
    readString(site, measured, 'instrument', { path: 'measured.instrument' });
  }
  validateCable(site, raw);
  validateDevice(site, raw);
  validateRcd(site, raw);
  if (id === undefined || from === undefined || to === undefined) return undefined;
  return raw as unknown as Link; // the parsed object itself: loading never changes it
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
  readChoice(site, cable, 'insulation', INSULATIONS, { path: 'cable.insulation' });
  readBoolean(site, cable, 'earthInCable', { path: 'cable.earthInCable' });
  readNumber(site, cable, 'capacity', { above: 0 }, { path: 'cable.capacity' });
  readNumber(site, cable, 'derating', { above: 0, max: 1 }, { path: 'cable.derating' });
}
