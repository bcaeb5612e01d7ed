// The rules that span records: ids unique, links join existing nodes, every node fed by at most
// one link, no supply fed, no cycles; and the warning for nodes that no supply reaches.
// Plain loops over arrays (no recursion, no per-node copies), linear in the job.

import type { JobNode, Link } from './types.js';
import type { Problem } from './problems.js';
import { Site } from './fields.js';
import { IdTable } from './id-table.js';

/** Where each id was first used: a position in `nodes` (≥ 0) or in `links` (−1 − position). */
export type IdPlaces = IdTable;

const SUPPLY = 0;
const BOARD = 1;
const POINT = 2;

export interface GraphFacts {
  ids: IdPlaces;
  /** Some link runs from a point to a board (the only way a derived phase count can clash). */
  pointFeedsBoard: boolean;
  /** Each link's origin and far end as positions in `nodes` (−1 when not a node). */
  linkFrom: Int32Array;
  linkTo: Int32Array;
}

/**
 * `nodes` and `links` are the records that passed their own checks; `nodeAt` and `linkAt` give
 * the place of each in the file (null when every record passed, so positions are places).
 * Returns where each id is, for the passes after (phase-rules.ts, the tree order).
 */
export function checkGraph(
  nodes: readonly JobNode[],
  nodeAt: readonly number[] | null,
  links: readonly Link[],
  linkAt: readonly number[] | null,
  problems: Problem[],
): GraphFacts {
  let pointFeedsBoard = false;
  const nodePlace = (i: number): number => (nodeAt === null ? i : nodeAt[i]!);
  const linkPlace = (i: number): number => (linkAt === null ? i : linkAt[i]!);
  const linkSite = (i: number): Site => {
    const id = links[i]!.id;
    return new Site(problems, () => `links[${linkPlace(i)}] (${id})`, id);
  };
  const seen: IdPlaces = new IdTable(nodes.length + links.length);
  const placeOf = (code: number): string =>
    code >= 0 ? `nodes[${nodePlace(code)}] (${nodes[code]!.id})` : `links[${linkPlace(-1 - code)}] (${links[-1 - code]!.id})`;
  const nn = nodes.length;
  const nl = links.length;
  // Each node's kind as a number (read once: node records come in many shapes).
  const kind = new Uint8Array(nn);
  // Ids: one set per record while every id is new (the map's size tells when one was not); at
  // the first repeat the record that had the id first is found by a scan, put back, and the rest
  // is read with a lookup before each set. One scan at most per list, so linear in any file.
  const already = (id: string, before: number) => `id ${JSON.stringify(id)} is already used by ${placeOf(before)}; ids must be unique across nodes and links`;
  /** The code of the first node, or else link before link `uptoLink`, that has the id. */
  const firstHolder = (id: string, uptoNode: number, uptoLink: number): number => {
    for (let n = 0; n < uptoNode; n++) if (nodes[n]!.id === id) return n;
    for (let l = 0; l < uptoLink; l++) if (links[l]!.id === id) return -1 - l;
    return -1; // not reached: the map held the id, so a record before this one has it
  };
  let repeated = false;
  for (let i = 0; i < nn; i++) {
    const node = nodes[i]!;
    const k = node.kind;
    kind[i] = k === 'supply' ? SUPPLY : k === 'board' ? BOARD : POINT;
    const id = node.id;
    if (!repeated) {
      const size = seen.size;
      seen.set(id, i);
      if (seen.size > size) continue;
      repeated = true;
      seen.set(id, firstHolder(id, i, 0));
    } else if (!seen.has(id)) {
      seen.set(id, i);
      continue;
    }
    new Site(problems, `nodes[${nodePlace(i)}] (${id})`, id).report('id', already(id, seen.get(id)!));
  }
  repeated = false;
  for (let i = 0; i < nl; i++) {
    const id = links[i]!.id;
    if (!repeated) {
      const size = seen.size;
      seen.set(id, -1 - i);
      if (seen.size > size) continue;
      repeated = true;
      seen.set(id, firstHolder(id, nn, i));
    } else if (!seen.has(id)) {
      seen.set(id, -1 - i);
      continue;
    }
    linkSite(i).report('id', already(id, seen.get(id)!));
  }

  // Each node's feeding link and the node above it, by position in `nodes`.
  const feederAt = new Int32Array(nn).fill(-1);
  const above = new Int32Array(nn).fill(-1);
  const linkFrom = new Int32Array(nl);
  const linkTo = new Int32Array(nl);
  for (let i = 0; i < nl; i++) {
    const link = links[i]!;
    const from = link.from;
    const to = link.to;
    const fromCode = seen.get(from);
    const toCode = seen.get(to);
    const fromAt = fromCode !== undefined && fromCode >= 0 ? fromCode : -1;
    const toAt = toCode !== undefined && toCode >= 0 ? toCode : -1;
    linkFrom[i] = fromAt;
    linkTo[i] = toAt;
    if (fromAt < 0) linkSite(i).report('from', `from names ${JSON.stringify(from)}, which is not a node of this job`);
    if (toAt < 0) linkSite(i).report('to', `to names ${JSON.stringify(to)}, which is not a node of this job`);
    if (from === to) {
      linkSite(i).report('to', `a link cannot start and end at the same node ${JSON.stringify(to)}`);
      continue;
    }
    if (toAt < 0) continue;
    if (fromAt >= 0 && kind[fromAt] === POINT && kind[toAt] === BOARD) pointFeedsBoard = true;
    if (kind[toAt] === SUPPLY) {
      linkSite(i).report('to', `to names the supply ${JSON.stringify(to)}; a supply is where the network starts and is fed by no link`);
      continue;
    }
    const other = feederAt[toAt]!;
    if (other >= 0) {
      linkSite(i).report('to', `node ${JSON.stringify(to)} is already fed by link ${JSON.stringify(links[other]!.id)} (links[${linkPlace(other)}]); every node is fed by exactly one link`);
      continue;
    }
    feederAt[toAt] = i;
    above[toAt] = fromAt;
  }

  // With at most one feeder per node, a cycle shows as a walk up the feeders that returns to
  // itself. state: 0 new, 1 on the current walk, 2 done; each node is walked once.
  const state = new Uint8Array(nn);
  const walk = new Int32Array(nn); // the nodes of the current walk: walk[0 .. top)
  let top = 0;
  for (let start = 0; start < nn; start++) {
    if (state[start] !== 0) continue;
    top = 0;
    let current = start;
    while (current >= 0 && state[current] === 0) {
      state[current] = 1;
      walk[top++] = current;
      current = above[current]!;
    }
    if (current >= 0 && state[current] === 1) {
      const on = Array.from(walk.subarray(0, top));
      const from = on.indexOf(current);
      const loop = on.slice(from).map((n) => nodes[n]!.id);
      const loopLinks = on.slice(from).map((n) => feederAt[n]!).sort((a, b) => linkPlace(a) - linkPlace(b));
      const first = loopLinks[0]!;
      linkSite(first).report(
        'to',
        `to ${JSON.stringify(links[first]!.to)} closes a cycle: links ${loopLinks.map((l) => links[l]!.id).join(', ')} loop through nodes ${loop.join(', ')}; the network must be radial (a tree from each supply)`,
      );
    }
    for (let k = 0; k < top; k++) state[walk[k]!] = 2;
  }

  // Unreached nodes: a warning, not an error. reached: 0 unknown, 1 yes, 2 no; each walk up the
  // feeders stops at a node already decided, so every node is visited once.
  const reached = new Uint8Array(nn);
  for (let start = 0; start < nn; start++) {
    if (kind[start] === SUPPLY) continue;
    if (reached[start] === 0) {
      top = 0;
      let current = start;
      let answer = 2;
      while (current >= 0) {
        if (reached[current] !== 0) {
          answer = reached[current]!;
          break;
        }
        if (kind[current] === SUPPLY) {
          answer = 1;
          break;
        }
        reached[current] = 2; // provisional: a cycle back to here is unreached
        walk[top++] = current;
        current = above[current]!;
      }
      for (let k = 0; k < top; k++) reached[walk[k]!] = answer;
    }
    if (reached[start] === 2) {
      const node = nodes[start]!;
      const name = node.name ? ` "${node.name}"` : '';
      new Site(problems, `nodes[${nodePlace(start)}] (${node.id})`, node.id).report('', `${node.kind}${name} is not reached from any supply; its circuits are left unchecked`, 'warning');
    }
  }
  return { ids: seen, pointFeedsBoard, linkFrom, linkTo };
}
