// The tables of an analysis (typed arrays by link and by node), shared by the analysis and every
// analysis derived from it by a length change (reanalyse), so that a re-analysis writes only the
// entries it redoes instead of copying every table.
//
// Exactly one version of a family is "current": the tables hold its values. Every other version
// holds the entries where it differs from a newer or older version (`to`), with its own values
// for them. Making a version current again (reroot) walks the chain of differences to the
// current one and swaps the values back in, turning each difference around as it goes, so the
// version it left is kept exactly too. This is the classic "persistent array by rerooting".
// The walk is a loop (no recursion), and each step costs the entries of one re-analysis.
//
// Only the engine reads the tables (analyse.ts): every read of an older version starts with
// reroot(). Results objects are plain values and never read the tables.

export type Column = Float64Array | Int32Array | Uint8Array;

/** The shared tables: those indexed by link and those indexed by node. */
export interface Columns {
  readonly link: readonly Column[];
  readonly node: readonly Column[];
}

export class Version {
  /** The version whose values are one step nearer to the tables' (null: this one is current). */
  private to: Version | null = null;
  /** Where this version differs from `to`: link and node indices, and its values there. */
  private links: Int32Array | null = null;
  private nodes: Int32Array | null = null;
  private saved: Float64Array | null = null;

  constructor(readonly columns: Columns) {}

  get current(): boolean {
    return this.to === null;
  }

  /** Make the tables hold this version's values (the version that held them keeps its own). */
  reroot(): void {
    if (this.to === null) return;
    const chain: Version[] = [];
    for (let v: Version = this; v.to !== null; v = v.to) chain.push(v);
    // From the step next to the current version back to this one.
    for (let i = chain.length - 1; i >= 0; i--) {
      const v = chain[i]!;
      const next = v.to!;
      swap(this.columns, v.links!, v.nodes!, v.saved!); // the tables now hold v's values, saved holds next's
      next.to = v;
      next.links = v.links;
      next.nodes = v.nodes;
      next.saved = v.saved;
      v.to = null;
      v.links = null;
      v.nodes = null;
      v.saved = null;
    }
  }

  /**
   * A new version, current from now on, that will differ from this one at most at `links` and
   * `nodes` (the caller then writes the new values there, and nowhere else). This version keeps
   * its values for those entries. This version must be current.
   */
  derive(links: Int32Array, nodes: Int32Array): Version {
    if (this.to !== null) throw new Error('internal error: a version derived from one that is not current');
    const { link, node } = this.columns;
    const saved = new Float64Array(links.length * link.length + nodes.length * node.length);
    let k = 0;
    for (const column of link) for (let i = 0; i < links.length; i++) saved[k++] = column[links[i]!]!;
    for (const column of node) for (let i = 0; i < nodes.length; i++) saved[k++] = column[nodes[i]!]!;
    const next = new Version(this.columns);
    this.to = next;
    this.links = links;
    this.nodes = nodes;
    this.saved = saved;
    return next;
  }
}

/** Swap the tables' values at the given entries with `saved` (the same order as derive's). */
function swap(columns: Columns, links: Int32Array, nodes: Int32Array, saved: Float64Array): void {
  swapAt(columns.node, nodes, saved, swapAt(columns.link, links, saved, 0));
}

/** Swap each column's values at `at` with saved[k ...]; returns the next k. */
function swapAt(columns: readonly Column[], at: Int32Array, saved: Float64Array, k: number): number {
  for (const column of columns) {
    for (let i = 0; i < at.length; i++) {
      const v = column[at[i]!]!;
      column[at[i]!] = saved[k]!;
      saved[k++] = v;
    }
  }
  return k;
}
