// Protective devices on a link: breaker curves, adjustable breakers, time–current curves,
// devices with a stated trip current; and the RCD.

import { readChoice, readNumber, readObject, readString, Site, type Json } from './fields.js';
import { showValue } from './problems.js';
import { CURVES } from './rules.js';

export const DEVICE_TYPES = ['mcb', 'adjustable', 'curve', 'fixed'] as const;

export function validateDevice(site: Site, link: Json): void {
  const device = readObject(site, link, 'device');
  if (!device) return;
  const type = readChoice(site, device, 'type', DEVICE_TYPES, { required: true, path: 'device.type' });
  readNumber(site, device, 'rating', { above: 0 }, { required: true, path: 'device.rating' });
  readNumber(site, device, 'breaking', { above: 0 }, { path: 'device.breaking' });
  readNumber(site, device, 'letThrough', { above: 0 }, { path: 'device.letThrough' });
  readString(site, device, 'label', { path: 'device.label' });
  switch (type) {
    case 'mcb':
      readChoice(site, device, 'curve', CURVES, { required: true, path: 'device.curve' });
      break;
    case 'adjustable':
      readNumber(site, device, 'instantaneous', { above: 0 }, { required: true, path: 'device.instantaneous' });
      readNumber(site, device, 'tolerance', { min: 0, below: 1 }, { path: 'device.tolerance' });
      break;
    case 'fixed':
      readNumber(site, device, 'tripCurrent', { above: 0 }, { required: true, path: 'device.tripCurrent' });
      break;
    case 'curve':
      validateCurvePoints(site, device.points);
      break;
    default:
      break;
  }
}

function validateCurvePoints(site: Site, points: unknown): void {
  const field = 'device.points';
  if (!Array.isArray(points) || points.length < 2) {
    site.bad(field, 'a list of at least two [current A, time s] points', points);
    return;
  }
  let previous: [number, number] | undefined;
  points.forEach((point: unknown, i) => {
    const f = `${field}[${i}]`;
    const ok =
      Array.isArray(point) &&
      point.length === 2 &&
      point.every((v) => typeof v === 'number' && Number.isFinite(v) && v > 0);
    if (!ok) {
      site.bad(f, 'a pair [current A > 0, time s > 0]', point);
      previous = undefined;
      return;
    }
    const [current, time] = point as [number, number];
    if (previous) {
      if (current <= previous[0]) site.report(f, `${f} current must rise from point to point: ${showValue(current)} A follows ${showValue(previous[0])} A`);
      if (time >= previous[1]) site.report(f, `${f} time must fall from point to point: ${showValue(time)} s follows ${showValue(previous[1])} s`);
    }
    previous = [current, time];
  });
}

export function validateRcd(site: Site, link: Json): void {
  const rcd = readObject(site, link, 'rcd');
  if (!rcd) return;
  readNumber(site, rcd, 'sensitivity', { above: 0, max: 10 }, { required: true, path: 'rcd.sensitivity' });
}
