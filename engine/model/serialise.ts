// Writing a job back to its file form: known keys in a fixed order, unknown top-level keys kept.

import type { Job } from './types.js';

export function toFileObject(job: Job): Record<string, unknown> {
  return {
    format: job.format,
    version: job.version,
    job: job.job,
    rules: job.rules,
    nodes: job.nodes,
    links: job.links,
    ...(job.extra ?? {}),
  };
}

export function serialiseJob(job: Job): string {
  return `${JSON.stringify(toFileObject(job), null, 2)}\n`;
}
