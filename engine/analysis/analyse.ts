// analyse(job): every link checked, in file order, with the worst fault path and a summary.
// The sheet, the command line, the printout and the tests all call this one function.

import type { Job } from '../model/types.js';
import { resolveRules } from './basis.js';
import { checkLink } from './check.js';
import { LoopSums } from './loop.js';
import { Network } from './network.js';
import type { Results, Summary } from './results.js';
import { worstPath } from './worst-path.js';

export function analyse(job: Job): Results {
  const rules = resolveRules(job.rules);
  const net = new Network(job);
  const sums = new LoopSums(net, rules);
  const circuits = job.links.map((link) => checkLink(sums, link));
  const counts = () => ({ pass: 0, fail: 0, rcd: 0, unchecked: 0 });
  const checkCounts = () => ({ pass: 0, fail: 0, unchecked: 0 });
  const summary: Summary = {
    ...counts(),
    verdict: counts(),
    checks: { voltage: checkCounts(), capacity: checkCounts(), breaking: checkCounts(), withstand: checkCounts(), measured: counts() },
  };
  for (const c of circuits) {
    summary[c.status] += 1;
    summary.verdict[c.verdict] += 1;
    summary.checks.voltage[c.voltageStatus] += 1;
    summary.checks.capacity[c.capacityStatus] += 1;
    summary.checks.breaking[c.breakingStatus] += 1;
    summary.checks.withstand[c.withstandStatus] += 1;
    if (c.measured) summary.checks.measured[c.measured.status] += 1;
  }
  return {
    format: 'loopwright.results',
    version: 2,
    basis: rules.basis,
    circuits,
    worst: worstPath(net, job.links, circuits),
    supplies: [],
    summary,
  };
}
