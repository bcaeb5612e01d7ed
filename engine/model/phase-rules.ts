// The phase rules that span records (method-depth.md §1), refused as errors with their place:
// a link with 3 phases fed (directly or higher up) by a 1-phase link or under a supply with 1
// phase, and a point with `phases: 3` whose feeding link has 1 phase. Run on a job whose graph
// rules already hold.

import { phaseTable } from '../analysis/phases.js';
import { TreeOrder } from '../analysis/order.js';
import type { Job, JobNode, Link } from './types.js';
import type { Problem } from './problems.js';
import { Site } from './fields.js';

interface Indexed<T> {
  item: T;
  index: number;
}

export function checkPhases(nodes: Array<Indexed<JobNode>>, links: Array<Indexed<Link>>, problems: Problem[]): void {
  const job = { nodes: nodes.map((n) => n.item), links: links.map((l) => l.item) } as unknown as Job;
  const order = new TreeOrder(job);
  const phases = phaseTable(order);
  const linkAt = (l: number) => `links[${links[l]!.index}] (${links[l]!.item.id})`;
  const single = (l: number) => `the single-phase link ${links[l]!.item.id} (${linkAt(l).split(' ')[0]})`;
  for (const n of order.pre) {
    const f = order.feederOf[n]!;
    if (f < 0) continue;
    const from = order.linkFrom[f]!;
    const node = nodes[n]!;
    if (phases.link[f] === 3) {
      const supply = order.supplyOf[n]!;
      const site = new Site(problems, linkAt(f), links[f]!.item.id);
      const how = links[f]!.item.phases === 3 ? 'phases 3' : 'three phases (derived)';
      if (supply >= 0 && phases.supply[supply] === 1) {
        site.report('phases', `${how} is not possible under the single-phase supply ${nodes[supply]!.item.id}; state phases 1, or give the supply phases 3`);
      } else if (phases.singleAbove[from]) {
        let up = order.feederOf[from]!;
        while (up >= 0 && phases.link[up] !== 1) up = order.feederOf[order.linkFrom[up]!]!;
        site.report('phases', `${how} is not possible: it is fed through ${up >= 0 ? single(up) : 'a single-phase link'}`);
      }
    }
    if (node.item.kind === 'point' && node.item.phases === 3 && phases.link[f] === 1) {
      new Site(problems, `nodes[${node.index}] (${node.item.id})`, node.item.id).report(
        'phases',
        `phases 3 needs a three-phase feed, but its link ${links[f]!.item.id} (${linkAt(f).split(' ')[0]}) has 1 phase`,
      );
    }
  }
}
