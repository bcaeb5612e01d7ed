// The store's id indexes (selectors.ts indexer), brought up to date in place when a list keeps
// its length and ids (a drag frame, a cable edit) and built afresh otherwise: after any run of
// such changes every id reads the record the list holds now, and a gone id reads nothing.
import { describe, expect, it } from 'vitest';
import { selectLink, selectNode, type EditorState } from '../../app/renderer/store/index.js';
import type { JobNode, Link } from '../../engine/index.js';

function state(nodes: JobNode[], links: Link[] = []): EditorState {
  return { job: { nodes, links } } as unknown as EditorState;
}

const node = (id: string, x = 0): JobNode => ({ id, kind: 'board', at: { x, y: 0 } }) as JobNode;

describe('the id indexes behind selectNode and selectLink', () => {
  it('follow moves, renames, additions and removals', () => {
    let nodes = ['A', 'B', 'C', 'D'].map((id) => node(id));
    expect(selectNode('B')(state(nodes))).toBe(nodes[1]);
    // A drag frame: one record replaced in place.
    nodes = nodes.map((n) => (n.id === 'C' ? node('C', 40) : n));
    const s1 = state(nodes);
    expect(selectNode('C')(s1)).toBe(nodes[2]);
    expect(selectNode('A')(s1)).toBe(nodes[0]);
    // A rename at the same place: the old id is gone, the new one found.
    nodes = nodes.map((n) => (n.id === 'B' ? node('B2') : n));
    const s2 = state(nodes);
    expect(selectNode('B')(s2)).toBeUndefined();
    expect(selectNode('B2')(s2)).toBe(nodes[1]);
    // Added and removed.
    nodes = [...nodes.filter((n) => n.id !== 'A'), node('E')];
    const s3 = state(nodes);
    expect(selectNode('A')(s3)).toBeUndefined();
    expect(selectNode('E')(s3)).toBe(nodes[3]);
    expect(selectNode('D')(s3)).toBe(nodes[2]);
    // Back to an older list (a render of an older state): read as that list.
    expect(selectNode('C')(s1)).toBe(s1.job.nodes[2]);
    expect(selectNode('B')(s1)).toBe(s1.job.nodes[1]);
    expect(selectNode('E')(s1)).toBeUndefined();
  });

  it('does the same for links', () => {
    const link = (id: string, length: number): Link => ({ id, from: 'A', to: 'B', cable: { length, material: 'Cu', active: 2.5, earth: 2.5 } }) as Link;
    let links = [link('L1', 10), link('L2', 20)];
    expect(selectLink('L2')(state([], links))?.cable.length).toBe(20);
    links = [links[0]!, link('L2', 99)];
    expect(selectLink('L2')(state([], links))).toBe(links[1]);
    expect(selectLink('L1')(state([], links))).toBe(links[0]);
  });
});
