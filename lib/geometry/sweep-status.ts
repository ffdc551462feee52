// The ordered "status" of a plane sweep (the walls crossing the sweep line, left to right): a skip
// list (Pugh 1990), so every insert, removal and search costs O(log n) expected and a whole sweep
// stays O(n log n) instead of the O(n^2) of a linear scan.

const MAX_LEVEL = 32;

/** One entry of the status; keep it to remove the entry or find its neighbours later. */
export interface StatusNode<T> {
  readonly item: T;
  next: (StatusNode<T> | null)[];
  prev: (StatusNode<T> | null)[];
}

export class SweepStatus<T> {
  private readonly head: StatusNode<T>;
  private level = 1;
  private seed: number;
  private count = 0;
  /** Scratch array for insert: the last entry before the new one on each level. */
  private readonly update: StatusNode<T>[] = new Array(MAX_LEVEL);

  constructor(seed = 0x9e3779b9) {
    this.head = { item: undefined as unknown as T, next: new Array(MAX_LEVEL).fill(null), prev: [] };
    // A fixed seed keeps runs reproducible; the skip list's balance does not depend on input order.
    this.seed = seed >>> 0 || 1;
  }

  get size(): number {
    return this.count;
  }

  /** Random level with probability 1/2 per extra level (xorshift32: fast, deterministic). */
  private randomLevel(): number {
    let level = 1;
    while (level < MAX_LEVEL) {
      let x = this.seed;
      x ^= x << 13;
      x ^= x >>> 17;
      x ^= x << 5;
      this.seed = x >>> 0;
      if ((this.seed & 1) === 0) break;
      level++;
    }
    return level;
  }

  /**
   * The last entry for which `isBefore` holds, or null when there is none. `isBefore` must be
   * monotone along the status: true for a prefix of the entries, false for the rest.
   */
  lastWhere<Q>(isBefore: (item: T, probe: Q) => boolean, probe?: Q): StatusNode<T> | null {
    let x = this.head;
    for (let l = this.level - 1; l >= 0; l--) {
      for (let n = x.next[l]; n !== null && isBefore(n.item, probe as Q); n = x.next[l]) x = n;
    }
    return x === this.head ? null : x;
  }

  /**
   * Insert `item` right after the entries for which `isBefore` holds (monotone, as in lastWhere).
   * `probe` is passed to isBefore, so hot loops need not build a closure per call.
   */
  insert<Q>(item: T, isBefore: (other: T, probe: Q) => boolean, probe?: Q): StatusNode<T> {
    const update = this.update;
    let x = this.head;
    for (let l = this.level - 1; l >= 0; l--) {
      for (let n = x.next[l]; n !== null && isBefore(n.item, probe as Q); n = x.next[l]) x = n;
      update[l] = x;
    }
    const level = this.randomLevel();
    if (level > this.level) {
      for (let l = this.level; l < level; l++) update[l] = this.head;
      this.level = level;
    }
    const node: StatusNode<T> = { item, next: new Array(level), prev: new Array(level) };
    for (let l = 0; l < level; l++) {
      const after = update[l];
      const following = after.next[l];
      node.next[l] = following;
      node.prev[l] = after;
      after.next[l] = node;
      if (following !== null) following.prev[l] = node;
    }
    this.count++;
    return node;
  }

  /** Remove an entry returned by insert. */
  remove(node: StatusNode<T>): void {
    for (let l = 0; l < node.next.length; l++) {
      const before = node.prev[l]!;
      const after = node.next[l];
      before.next[l] = after;
      if (after !== null) after.prev[l] = before;
    }
    this.count--;
  }

  /** The entry just before `node` (to its left), or null. */
  before(node: StatusNode<T>): StatusNode<T> | null {
    const p = node.prev[0];
    return p === this.head ? null : p;
  }

  /** The entry just after `node` (to its right), or null. */
  after(node: StatusNode<T>): StatusNode<T> | null {
    return node.next[0];
  }

  /** All entries left to right (for tests and debugging). */
  items(): T[] {
    const out: T[] = [];
    for (let n = this.head.next[0]; n !== null; n = n.next[0]) out.push(n.item);
    return out;
  }
}

/**
 * The same skip list for entries that are small integers (0 .. capacity - 1, each present at most
 * once), with its links in typed arrays: no object per entry, so a sweep over many corners makes
 * no garbage, and reset() empties it for the next sweep without allocating unless it must grow.
 * Levels are promoted with probability 1/4 (Pugh 1990), which halves the link arrays. A search
 * starts from a finger, the entry the previous search or insertion ended at, when the wanted entry
 * lies at or right of it, and climbs only as high as the distance needs (Pugh 1990, "A skip list
 * cookbook": search with fingers): a sweep whose consecutive corners meet neighbouring walls left
 * to right (a comb's valleys, at one height) pays O(1) expected per search, and any search stays
 * O(log n) expected.
 */
export class IndexSweepStatus {
  // Node id = entry + 1; id 0 is the head, and a link 0 means "none" (the head is never a successor).
  // Links of level l live at [l * stride, (l + 1) * stride) of one array each way.
  private next = new Int32Array(0);
  private prev = new Int32Array(0);
  private heights = new Uint8Array(0);
  private stride = 0;
  /** Levels the link arrays have room for. */
  private levels = 0;
  /** log4(capacity) + 2 levels: enough for O(log n) searches at promotion 1/4 (Pugh 1990). */
  private maxHeight = 0;
  private capacity = 0;
  private readonly update = new Int32Array(MAX_LEVEL);
  /** The last node on each level (0: none): entries that go to the right end need no search. */
  private readonly tails = new Int32Array(MAX_LEVEL);
  private level = 0;
  private seed = 1;
  private count = 0;
  /** The node the last search or insertion ended at (0: the head): where the next search starts. */
  private finger = 0;

  constructor(
    capacity: number,
    private readonly firstSeed = 0x9e3779b9,
  ) {
    this.reset(capacity);
  }

  /** Empty the status for entries 0 .. capacity - 1, keeping its arrays when they are big enough. */
  reset(capacity: number): void {
    const maxHeight = Math.min(16, Math.ceil(Math.log2(capacity + 1) / 2) + 2);
    if (capacity + 1 > this.stride || maxHeight > this.levels) {
      this.stride = Math.max(capacity + 1, this.stride);
      this.levels = Math.max(maxHeight, this.levels);
      this.next = new Int32Array(this.stride * this.levels);
      this.prev = new Int32Array(this.stride * this.levels);
      this.heights = new Uint8Array(this.stride);
    } else {
      // Entries a sweep that stopped early (an error) left behind, and the head's links.
      this.heights.fill(0, 0, this.capacity + 1);
      for (let l = 0; l < this.levels; l++) this.next[l * this.stride] = 0;
    }
    this.capacity = capacity;
    this.maxHeight = maxHeight;
    this.tails.fill(0);
    this.level = 0;
    this.count = 0;
    this.finger = 0;
    this.seed = this.firstSeed >>> 0 || 1;
  }

  get size(): number {
    return this.count;
  }

  /** Random height: 1, plus one more level with probability 1/4 each (xorshift32). */
  private randomHeight(): number {
    let x = this.seed;
    x ^= x << 13;
    x ^= x >>> 17;
    x ^= x << 5;
    this.seed = x >>> 0;
    let height = 1;
    for (let bits = this.seed; (bits & 3) === 0 && height < this.maxHeight; bits >>>= 2) height++;
    return height;
  }

  /**
   * The last node for which `isBefore` holds (0: the head, none holds). When the finger still
   * holds, the search climbs from it while the next node on its top level holds too, then goes
   * down the levels as in Pugh's search; otherwise it searches from the head. (Searching backward
   * from the finger as well made random rooms, whose consecutive corners are far apart, slower.)
   */
  private lastNode<Q>(isBefore: (entry: number, probe: Q) => boolean, probe: Q): number {
    const next = this.next;
    const heights = this.heights;
    const stride = this.stride;
    let x = this.finger;
    let l: number;
    if (x !== 0 && isBefore(x - 1, probe)) {
      l = heights[x] - 1;
      for (let n = next[l * stride + x]; n !== 0 && isBefore(n - 1, probe); n = next[l * stride + x]) {
        x = n;
        l = heights[x] - 1;
      }
      l--; // the next node on level l does not hold: the answer is below
    } else {
      x = 0;
      l = this.level - 1;
    }
    for (; l >= 0; l--) {
      const base = l * stride;
      for (let n = next[base + x]; n !== 0 && isBefore(n - 1, probe); n = next[base + x]) x = n;
    }
    return x;
  }

  /** The last entry for which `isBefore` holds (monotone along the status), or -1 when none. */
  lastWhere<Q>(isBefore: (entry: number, probe: Q) => boolean, probe: Q): number {
    if (this.count === 0) return -1;
    const x = this.lastNode(isBefore, probe);
    this.finger = x;
    return x - 1;
  }

  /** Insert `entry` right after the entries for which `isBefore` holds (monotone, as in lastWhere). */
  insert<Q>(entry: number, isBefore: (other: number, probe: Q) => boolean, probe: Q): void {
    if (!(entry >= 0 && entry < this.capacity)) throw new RangeError(`sweep status: entry ${entry} outside 0..${this.capacity - 1}`);
    const id = entry + 1;
    if (this.heights[id] !== 0) throw new RangeError(`sweep status: entry ${entry} is already in the status`);
    const update = this.update;
    const next = this.next;
    const prev = this.prev;
    const heights = this.heights;
    const stride = this.stride;
    const height = this.randomHeight();
    const known = Math.min(height, this.level);
    const last = this.tails[0];
    if (last !== 0 && isBefore(last - 1, probe)) {
      // After every entry (sweeps often add walls left to right): the tails are the predecessors.
      for (let l = 0; l < known; l++) update[l] = this.tails[l];
    } else {
      // The predecessor on level 0, then on each higher level the nearest node back that reaches it.
      let x = this.count === 0 ? 0 : this.lastNode(isBefore, probe);
      for (let l = 0; l < known; l++) {
        while (x !== 0 && heights[x] <= l) x = prev[(l - 1) * stride + x];
        update[l] = x;
      }
    }
    while (this.level < height) update[this.level++] = 0;
    heights[id] = height;
    for (let l = 0; l < height; l++) {
      const base = l * stride;
      const after = update[l];
      const following = next[base + after];
      next[base + id] = following;
      prev[base + id] = after;
      next[base + after] = id;
      if (following !== 0) prev[base + following] = id;
      else this.tails[l] = id;
    }
    this.finger = id;
    this.count++;
  }

  /** Remove an entry that is in the status. */
  remove(entry: number): void {
    const id = entry + 1;
    const height = entry >= 0 && entry < this.capacity ? this.heights[id] : 0;
    if (height === 0) throw new RangeError(`sweep status: entry ${entry} is not in the status`);
    const next = this.next;
    const prev = this.prev;
    if (this.finger === id) this.finger = prev[id];
    for (let l = 0, base = 0; l < height; l++, base += this.stride) {
      const before = prev[base + id];
      const after = next[base + id];
      next[base + before] = after;
      if (after !== 0) prev[base + after] = before;
      else this.tails[l] = before;
    }
    this.heights[id] = 0;
    this.count--;
  }

  /**
   * Put `entry` in the place of `old`, which leaves the status, in O(height) with no search: for a
   * wall that ends where the next wall of its ring begins, so nothing lies between the two.
   */
  replace(old: number, entry: number): void {
    const from = old + 1;
    const id = entry + 1;
    const height = old >= 0 && old < this.capacity ? this.heights[from] : 0;
    if (height === 0) throw new RangeError(`sweep status: entry ${old} is not in the status`);
    if (!(entry >= 0 && entry < this.capacity)) throw new RangeError(`sweep status: entry ${entry} outside 0..${this.capacity - 1}`);
    if (this.heights[id] !== 0) throw new RangeError(`sweep status: entry ${entry} is already in the status`);
    const next = this.next;
    const prev = this.prev;
    for (let l = 0, base = 0; l < height; l++, base += this.stride) {
      const before = prev[base + from];
      const after = next[base + from];
      next[base + id] = after;
      prev[base + id] = before;
      next[base + before] = id;
      if (after !== 0) prev[base + after] = id;
      else this.tails[l] = id;
    }
    this.heights[id] = height;
    this.heights[from] = 0;
    if (this.finger === from) this.finger = id;
  }

  /** All entries left to right (for tests and debugging). */
  items(): number[] {
    const out: number[] = [];
    if (this.level === 0) return out;
    for (let n = this.next[0]; n !== 0; n = this.next[n]) out.push(n - 1);
    return out;
  }
}
