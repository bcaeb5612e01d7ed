// The rules that span records: ids unique, links join existing nodes, every node fed by at most
// one link, no supply fed, no cycles; and the warning for nodes that no supply reaches.

import type { JobNode, Link } from './types.js';
import type { Problem } from './problems.js';
import { Site } from './fields.js';

interface Indexed<T> {
  item: T;
  index: number;
}

function linkSite(problems: Problem[], l: Indexed<Link>): Site {
  return new Site(problems, `links[${l.index}] (${l.item.id})`, l.item.id);
}

export function checkGraph(nodes: Array<Indexed<JobNode>>, links: Array<Indexed<Link>>, problems: Problem[]): void {
  const seen = new Map<string, string>();
  for (const n of nodes) {
    const here = `nodes[${n.index}] (${n.item.id})`;
    const before = seen.get(n.item.id);
    if (before) new Site(problems, here, n.item.id).report('id', `id ${JSON.stringify(n.item.id)} is already used by ${before}; ids must be unique across nodes and links`);
    else seen.set(n.item.id, here);
  }
  for (const l of links) {
    const here = `links[${l.index}] (${l.item.id})`;
    const before = seen.get(l.item.id);
    if (before) linkSite(problems, l).report('id', `id ${JSON.stringify(l.item.id)} is already used by ${before}; ids must be unique across nodes and links`);
    else seen.set(l.item.id, here);
  }

  const nodeById = new Map(nodes.map((n) => [n.item.id, n.item]));
  const feeder = new Map<string, Indexed<Link>>();
  for (const l of links) {
    const site = linkSite(problems, l);
    const { from, to } = l.item;
    const fromNode = nodeById.get(from);
    const toNode = nodeById.get(to);
    if (!fromNode) site.report('from', `from names ${JSON.stringify(from)}, which is not a node of this job`);
    if (!toNode) site.report('to', `to names ${JSON.stringify(to)}, which is not a node of this job`);
    if (from === to) {
      site.report('to', `a link cannot start and end at the same node ${JSON.stringify(to)}`);
      continue;
    }
    if (toNode?.kind === 'supply') {
      site.report('to', `to names the supply ${JSON.stringify(to)}; a supply is where the network starts and is fed by no link`);
      continue;
    }
    if (!toNode) continue;
    const other = feeder.get(to);
    if (other) {
      site.report('to', `node ${JSON.stringify(to)} is already fed by link ${JSON.stringify(other.item.id)} (links[${other.index}]); every node is fed by exactly one link`);
      continue;
    }
    feeder.set(to, l);
  }

  // With at most one feeder per node, a cycle shows as a walk up the feeders that returns to itself.
  const state = new Map<string, 'walking' | 'done'>();
  for (const n of nodes) {
    const walk: string[] = [];
    let current: string | undefined = n.item.id;
    while (current !== undefined && !state.has(current)) {
      state.set(current, 'walking');
      walk.push(current);
      current = feeder.get(current)?.item.from;
    }
    if (current !== undefined && state.get(current) === 'walking') {
      const loop = walk.slice(walk.indexOf(current));
      const loopLinks = loop.map((id) => feeder.get(id)!).sort((a, b) => a.index - b.index);
      const first = loopLinks[0]!;
      linkSite(problems, first).report(
        'to',
        `to ${JSON.stringify(first.item.to)} closes a cycle: links ${loopLinks.map((l) => l.item.id).join(', ')} loop through nodes ${loop.join(', ')}; the network must be radial (a tree from each supply)`,
      );
    }
    for (const id of walk) state.set(id, 'done');
  }

  // Unreached nodes: a warning, not an error.
  for (const n of nodes) {
    if (n.item.kind === 'supply') continue;
    let current: string | undefined = n.item.id;
    const visited = new Set<string>();
    while (current !== undefined && !visited.has(current)) {
      visited.add(current);
      const node = nodeById.get(current);
      if (node?.kind === 'supply') break;
      current = feeder.get(current)?.item.from;
    }
    const reached = current !== undefined && nodeById.get(current)?.kind === 'supply';
    if (!reached) {
      const name = n.item.name ? ` "${n.item.name}"` : '';
      new Site(problems, `nodes[${n.index}] (${n.item.id})`, n.item.id).report('', `${n.item.kind}${name} is not reached from any supply; its circuits are left unchecked`, 'warning');
    }
  }
}
