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
