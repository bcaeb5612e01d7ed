// The phase rules that span records (method-depth.md §1), refused as errors with their place:
// a link with 3 phases fed (directly or higher up) by a 1-phase link or under a supply with 1
// phase, and a point with `phases: 3` whose feeding link has 1 phase. Run on a job whose graph
// rules already hold.

import { phaseTable } from '../analysis/phases.js';
import { TreeOrder } from '../analysis/order.js';
import type { Job, JobNode, Link } from './types.js';
import type { Problem } from './problems.js';
import { Site } from './fields.js';
import type { GraphFacts } from './graph-rules.js';

/**
 * `nodes` and `links` as checkGraph took them (every record valid, so positions are places in
 * the file), `graph` what it returned. Phases can only be refused where a link states its phases,
 * a point asks for 3, or a link runs from a point to a board (a derived three-phase submain below
 * a derived single-phase final subcircuit): a job with none of these is passed without ordering it.
 */
export function checkPhases(nodes: readonly JobNode[], links: readonly Link[], graph: GraphFacts, problems: Problem[]): void {
  let stated = graph.pointFeedsBoard;
  for (let i = 0; i < links.length && !stated; i++) if (links[i]!.phases !== undefined) stated = true;
  for (let i = 0; i < nodes.length && !stated; i++) {
    const n = nodes[i]!;
    if (n.kind === 'point' && n.phases === 3) stated = true;
  }
  if (!stated) return;
  const job = { nodes, links } as unknown as Job;
  const order = new TreeOrder(job, graph.ids);
  const phases = phaseTable(order);
  const linkAt = (l: number) => `links[${l}] (${links[l]!.id})`;
  const single = (l: number) => `the single-phase link ${links[l]!.id} (links[${l}])`;
  for (const n of order.pre) {
    const f = order.feederOf[n]!;
    if (f < 0) continue;
    const from = order.linkFrom[f]!;
    const node = nodes[n]!;
    if (phases.link[f] === 3) {
      const supply = order.supplyOf[n]!;
      const site = new Site(problems, linkAt(f), links[f]!.id);
      const how = links[f]!.phases === 3 ? 'phases 3' : 'three phases (derived)';
      if (supply >= 0 && phases.supply[supply] === 1) {
        site.report('phases', `${how} is not possible under the single-phase supply ${nodes[supply]!.id}; state phases 1, or give the supply phases 3`);
      } else if (phases.singleAbove[from]) {
        let up = order.feederOf[from]!;
        while (up >= 0 && phases.link[up] !== 1) up = order.feederOf[order.linkFrom[up]!]!;
        site.report('phases', `${how} is not possible: it is fed through ${up >= 0 ? single(up) : 'a single-phase link'}`);
      }
    }
    if (node.kind === 'point' && node.phases === 3 && phases.link[f] === 1) {
      new Site(problems, `nodes[${n}] (${node.id})`, node.id).report(
        'phases',
        `phases 3 needs a three-phase feed, but its link ${links[f]!.id} (links[${f}]) has 1 phase`,
      );
    }
  }
}
