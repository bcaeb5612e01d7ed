// A table from ids (strings) to whole numbers, for the loader's and the tree order's index of
// ids. An open-addressing hash table over typed arrays: on a job of 10,000 circuits it sets and
// finds its 40,000 ids several times faster than a Map (whose growing and entry objects the
// collector pays for).
//
// A file cannot make it slow: the hash is seeded at random per process, so ids cannot be chosen
// in advance to collide, and should any id still need more than MAX_PROBES slots to be placed or
// found, the table moves its entries into a Map and answers from that from then on. Every
// operation is then bounded, and the whole index linear in the ids' total length.

export interface IdLookup {
  get(id: string): number | undefined;
  has(id: string): boolean;
  readonly size: number;
}

const MAX_PROBES = 64;
const SEED = (Math.random() * 0x1_0000_0000) | 0;

/** The seeded hash of an id (FNV-1a steps from a random start, then a final mix). */
function hashOf(id: string): number {
  let h = SEED ^ id.length;
  for (let i = 0; i < id.length; i++) h = Math.imul(h ^ id.charCodeAt(i), 0x01000193);
  h ^= h >>> 16;
  h = Math.imul(h, 0x85ebca6b);
  h ^= h >>> 13;
  h = Math.imul(h, 0xc2b2ae35);
  return h ^ (h >>> 16);
}

export class IdTable implements IdLookup {
  /** The ids and their numbers, in the order first set. */
  private keys: string[] = [];
  private values: Int32Array;
  /** Each slot: 1 + an entry's position in `keys`, or 0 when empty. */
  private slots: Int32Array;
  private mask: number;
  /** Set once some id needed too many probes: the entries live here from then on. */
  private map: Map<string, number> | null = null;

  /**
   * `expected`: about how many ids will be set (the table grows past it as needed). `hash` is
   * for the tests, to make ids collide.
   */
  constructor(
    expected = 8,
    private readonly hash: (id: string) => number = hashOf,
  ) {
    let capacity = 16;
    while (capacity < expected * 2) capacity *= 2;
    this.slots = new Int32Array(capacity);
    this.mask = capacity - 1;
    this.values = new Int32Array(Math.max(8, expected));
  }

  get size(): number {
    return this.map !== null ? this.map.size : this.keys.length;
  }

  /** The slot holding `id`, or −1 − the empty slot where it would go (−1 − capacity: too many probes). */
  private find(id: string): number {
    const { slots, keys, mask } = this;
    let at = this.hash(id) & mask;
    for (let probe = 0; probe < MAX_PROBES; probe++) {
      const entry = slots[at]!;
      if (entry === 0) return -1 - at;
      if (keys[entry - 1] === id) return at;
      at = (at + 1) & mask;
    }
    return -1 - slots.length;
  }

  get(id: string): number | undefined {
    if (this.map !== null) return this.map.get(id);
    const at = this.find(id);
    if (at >= 0) return this.values[this.slots[at]! - 1];
    if (at === -1 - this.slots.length) this.toMap();
    return undefined;
  }

  has(id: string): boolean {
    return this.get(id) !== undefined;
  }

  /** Set id's number (a new entry, or a new number for an id already set). */
  set(id: string, value: number): this {
    if (this.map !== null) {
      this.map.set(id, value);
      return this;
    }
    const at = this.find(id);
    if (at >= 0) {
      this.values[this.slots[at]! - 1] = value;
      return this;
    }
    if (at === -1 - this.slots.length) {
      this.toMap();
      this.map!.set(id, value);
      return this;
    }
    const n = this.keys.length;
    if (n === this.values.length) {
      const grown = new Int32Array(n * 2);
      grown.set(this.values);
      this.values = grown;
    }
    this.keys.push(id);
    this.values[n] = value;
    this.slots[-1 - at] = n + 1;
    if ((n + 1) * 2 > this.slots.length) this.grow();
    return this;
  }

  /** Twice the slots, every entry placed again. */
  private grow(): void {
    const capacity = this.slots.length * 2;
    const slots = new Int32Array(capacity);
    const mask = capacity - 1;
    const keys = this.keys;
    for (let e = 0; e < keys.length; e++) {
      let at = this.hash(keys[e]!) & mask;
      let probes = 0;
      while (slots[at] !== 0) {
        at = (at + 1) & mask;
        if (++probes >= MAX_PROBES) {
          this.toMap();
          return;
        }
      }
      slots[at] = e + 1;
    }
    this.slots = slots;
    this.mask = mask;
  }

  /** Every entry into a Map, which answers from now on. */
  private toMap(): void {
    const map = new Map<string, number>();
    for (let e = 0; e < this.keys.length; e++) map.set(this.keys[e]!, this.values[e]!);
    this.map = map;
    this.keys = [];
    this.values = new Int32Array(0);
    this.slots = new Int32Array(0);
    this.mask = 0;
  }

  /** Whether the entries have moved into a Map (for the tests). */
  get degraded(): boolean {
    return this.map !== null;
  }
}
