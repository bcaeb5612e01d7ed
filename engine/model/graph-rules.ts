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
  return new Site(problems, () => `links[${l.index}] (${l.item.id})`, l.item.id);
}

export function checkGraph(nodes: Array<Indexed<JobNode>>, links: Array<Indexed<Link>>, problems: Problem[]): void {
  // Where each id was first used: a position in `nodes` (≥ 0) or in `links` (−1 − position).
  const seen = new Map<string, number>();
  const placeOf = (code: number): string => {
    const at = code >= 0 ? nodes[code]! : links[-1 - code]!;
    return `${code >= 0 ? 'nodes' : 'links'}[${at.index}] (${at.item.id})`;
  };
  nodes.forEach((n, i) => {
    const before = seen.get(n.item.id);
    if (before !== undefined) new Site(problems, `nodes[${n.index}] (${n.item.id})`, n.item.id).report('id', `id ${JSON.stringify(n.item.id)} is already used by ${placeOf(before)}; ids must be unique across nodes and links`);
    else seen.set(n.item.id, i);
  });
  links.forEach((l, i) => {
    const before = seen.get(l.item.id);
    if (before !== undefined) linkSite(problems, l).report('id', `id ${JSON.stringify(l.item.id)} is already used by ${placeOf(before)}; ids must be unique across nodes and links`);
    else seen.set(l.item.id, -1 - i);
  });
  /** The position in `nodes` of the node with this id, or −1. */
  const nodeAt = (id: string): number => {
    const code = seen.get(id);
    return code !== undefined && code >= 0 ? code : -1;
  };

  // Each node's feeding link and the node above it, by position in `nodes`.
  const feederAt: Array<Indexed<Link> | undefined> = new Array(nodes.length);
  const above = new Int32Array(nodes.length).fill(-1);
  for (const l of links) {
    const { from, to } = l.item;
    const fromAt = nodeAt(from);
    const toAt = nodeAt(to);
    if (fromAt < 0) linkSite(problems, l).report('from', `from names ${JSON.stringify(from)}, which is not a node of this job`);
    if (toAt < 0) linkSite(problems, l).report('to', `to names ${JSON.stringify(to)}, which is not a node of this job`);
    if (from === to) {
      linkSite(problems, l).report('to', `a link cannot start and end at the same node ${JSON.stringify(to)}`);
      continue;
    }
    if (toAt < 0) continue;
    if (nodes[toAt]!.item.kind === 'supply') {
      linkSite(problems, l).report('to', `to names the supply ${JSON.stringify(to)}; a supply is where the network starts and is fed by no link`);
      continue;
    }
    const other = feederAt[toAt];
    if (other) {
      linkSite(problems, l).report('to', `node ${JSON.stringify(to)} is already fed by link ${JSON.stringify(other.item.id)} (links[${other.index}]); every node is fed by exactly one link`);
      continue;
    }
    feederAt[toAt] = l;
    above[toAt] = fromAt;
  }

  // With at most one feeder per node, a cycle shows as a walk up the feeders that returns to
  // itself. state: 0 new, 1 on the current walk, 2 done; each node is walked once.
  const state = new Uint8Array(nodes.length);
  const walk: number[] = [];
  for (let start = 0; start < nodes.length; start++) {
    walk.length = 0;
    let current = start;
    while (current >= 0 && state[current] === 0) {
      state[current] = 1;
      walk.push(current);
      current = above[current]!;
    }
    if (current >= 0 && state[current] === 1) {
      const loop = walk.slice(walk.indexOf(current)).map((i) => nodes[i]!.item.id);
      const loopLinks = walk.slice(walk.indexOf(current)).map((i) => feederAt[i]!).sort((a, b) => a.index - b.index);
      const first = loopLinks[0]!;
      linkSite(problems, first).report(
        'to',
        `to ${JSON.stringify(first.item.to)} closes a cycle: links ${loopLinks.map((l) => l.item.id).join(', ')} loop through nodes ${loop.join(', ')}; the network must be radial (a tree from each supply)`,
      );
    }
    for (const i of walk) state[i] = 2;
  }

  // Unreached nodes: a warning, not an error. reached: 0 unknown, 1 yes, 2 no; each walk up the
  // feeders stops at a node already decided, so every node is visited once.
  const reached = new Uint8Array(nodes.length);
  const isReached = (start: number): boolean => {
    walk.length = 0;
    let current = start;
    let answer = 2;
    while (current >= 0) {
      if (reached[current] !== 0) {
        answer = reached[current]!;
        break;
      }
      if (nodes[current]!.item.kind === 'supply') {
        answer = 1;
        break;
      }
      reached[current] = 2; // provisional: a cycle back to here is unreached
      walk.push(current);
      current = above[current]!;
    }
    for (const i of walk) reached[i] = answer;
    return answer === 1;
  };
  nodes.forEach((n, i) => {
    if (n.item.kind === 'supply') return;
    if (!isReached(i)) {
      const name = n.item.name ? ` "${n.item.name}"` : '';
      new Site(problems, `nodes[${n.index}] (${n.item.id})`, n.item.id).report('', `${n.item.kind}${name} is not reached from any supply; its circuits are left unchecked`, 'warning');
    }
  });
}
