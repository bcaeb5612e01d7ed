// Job details: the title block of the design (title, site, client, ... revision, date).

import type { JobDetails } from './types.js';
import { isObject, readString, Site, type Json } from './fields.js';

export const DETAIL_KEYS = ['title', 'site', 'client', 'designer', 'reference', 'revision', 'date', 'notes'] as const;

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
  for (const key of DETAIL_KEYS) {
    const text = readString(site, raw, key, { path: key });
    if (text !== undefined) details[key] = text;
  }
  return { ...raw, ...details } as JobDetails;
}
