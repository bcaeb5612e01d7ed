// Job details: the title block of the design (title, site, client, ... revision, date).
// The fields are defined in schema.ts (DETAILS).

import type { JobDetails } from './types.js';
import { isObject, Site, type Json } from './fields.js';
import { reportFields } from './check-spec.js';
import { cleanDetails } from './generated/clean.js';
import * as schema from './schema.js';

export const DETAIL_KEYS = schema.DETAIL_KEYS;

export function emptyDetails(): JobDetails {
  return { title: '', site: '', client: '', designer: '', reference: '', revision: '', date: '', notes: '' };
}

export function validateDetails(value: unknown, site: Site): JobDetails {
  const details = emptyDetails();
  if (value === undefined) return details;
  if (!isObject(value)) {
    site.bad('job', 'an object of job details', value);
    return details;
  }
  const raw: Json = value;
  if (!cleanDetails(raw)) reportFields(site, raw, schema.DETAILS);
  for (const key of DETAIL_KEYS) {
    const text = raw[key];
    if (typeof text === 'string') details[key] = text;
  }
  return { ...raw, ...details } as JobDetails;
}
