// The ordered "status" of a plane sweep (the walls crossing the sweep line, left to right): an AVL
// tree (Adelson-Velsky & Landis 1962), a binary search tree whose two subtrees under any entry
// differ in height by at most one, so its height stays below 1.4405 log2(n + 2) - 0.3277 (the
// AVL bound, Knuth, The Art of Computer Programming vol. 3, 6.2.3, as recalled) whatever the order
// of the walls: every insert, removal and search costs O(log n) in the worst case, and a whole
// sweep O(n log n) worst case, with no random choice an adversary could play against. Each entry
// also links to its neighbours left and right, so before/after/replace cost O(1).

/** One entry of the status; keep it to remove the entry or find its neighbours later. */
export interface StatusNode<T> {
  readonly item: T;
}

/** A tree node: its place in the tree and, for O(1) neighbours, in the left-to-right order. */
class TreeNode<T> implements StatusNode<T> {
  left: TreeNode<T> | null = null;
  right: TreeNode<T> | null = null;
  parent: TreeNode<T> | null = null;
  /** Entries on the longest path down from here, this one included (a leaf: 1). */
  height = 1;
  before: TreeNode<T> | null = null;
  after: TreeNode<T> | null = null;
  constructor(readonly item: T) {}
}

const heightOf = <T>(node: TreeNode<T> | null): number => (node === null ? 0 : node.height);

export class SweepStatus<T> {
  private root: TreeNode<T> | null = null;
  private first: TreeNode<T> | null = null;
  private last: TreeNode<T> | null = null;
  private count = 0;

  get size(): number {
    return this.count;
  }

  /** Height of the tree (0 when empty): for tests of the AVL bound. */
  get height(): number {
    return heightOf(this.root);
  }

  /**
   * The last entry for which `isBefore` holds, or null when there is none. `isBefore` must be
   * monotone along the status: true for a prefix of the entries, false for the rest.
   */
  lastWhere<Q>(isBefore: (item: T, probe: Q) => boolean, probe?: Q): StatusNode<T> | null {
    let found: TreeNode<T> | null = null;
    for (let x = this.root; x !== null; ) {
      if (isBefore(x.item, probe as Q)) {
        found = x;
        x = x.right;
      } else x = x.left;
    }
    return found;
  }

  /**
   * Insert `item` right after the entries for which `isBefore` holds (monotone, as in lastWhere).
   * `probe` is passed to isBefore, so hot loops need not build a closure per call. When isBefore
   * throws, the status is left as it was.
   */
  insert<Q>(item: T, isBefore: (other: T, probe: Q) => boolean, probe?: Q): StatusNode<T> {
    let parent: TreeNode<T> | null = null;
    let toRight = false;
    let before: TreeNode<T> | null = null;
    let after: TreeNode<T> | null = null;
    for (let x = this.root; x !== null; ) {
      parent = x;
      toRight = isBefore(x.item, probe as Q);
      if (toRight) {
        before = x;
        x = x.right;
      } else {
        after = x;
        x = x.left;
      }
    }
    const node = new TreeNode(item);
    node.parent = parent;
    if (parent === null) this.root = node;
    else if (toRight) parent.right = node;
    else parent.left = node;
    node.before = before;
    node.after = after;
    if (before === null) this.first = node;
    else before.after = node;
    if (after === null) this.last = node;
    else after.before = node;
    this.count++;
    this.rebalance(parent);
    return node;
  }

  /** Remove an entry returned by insert. */
  remove(entry: StatusNode<T>): void {
    const node = entry as TreeNode<T>;
    let from: TreeNode<T> | null;
    if (node.left === null || node.right === null) {
      const child = node.left ?? node.right;
      from = node.parent;
      this.replaceChild(node, child);
      if (child !== null) child.parent = from;
    } else {
      // Two children: the next entry (leftmost of the right subtree, no left child) takes its place.
      const next = node.after!;
      if (next === node.right) from = next;
      else {
        from = next.parent!;
        from.left = next.right;
        if (next.right !== null) next.right.parent = from;
        next.right = node.right;
        node.right.parent = next;
      }
      next.left = node.left;
      node.left.parent = next;
      next.height = node.height;
      next.parent = node.parent;
      this.replaceChild(node, next);
    }
    if (node.before === null) this.first = node.after;
    else node.before.after = node.after;
    if (node.after === null) this.last = node.before;
    else node.after.before = node.before;
    node.left = node.right = node.parent = node.before = node.after = null;
    this.count--;
    this.rebalance(from);
  }

  /** The entry just before `node` (to its left), or null. */
  before(node: StatusNode<T>): StatusNode<T> | null {
    return (node as TreeNode<T>).before;
  }

  /** The entry just after `node` (to its right), or null. */
  after(node: StatusNode<T>): StatusNode<T> | null {
    return (node as TreeNode<T>).after;
  }

  /** All entries left to right (for tests and debugging). */
  items(): T[] {
    const out: T[] = [];
    for (let n = this.first; n !== null; n = n.after) out.push(n.item);
    return out;
  }

  /** Put `child` where `node` hangs from its parent (or at the root). */
  private replaceChild(node: TreeNode<T>, child: TreeNode<T> | null): void {
    const parent = node.parent;
    if (parent === null) this.root = child;
    else if (parent.left === node) parent.left = child;
    else parent.right = child;
  }

  /** Rotate `x`'s left child up into its place; returns that child. */
  private rotateRight(x: TreeNode<T>): TreeNode<T> {
    const y = x.left!;
    x.left = y.right;
    if (y.right !== null) y.right.parent = x;
    y.parent = x.parent;
    this.replaceChild(x, y);
    y.right = x;
    x.parent = y;
    x.height = Math.max(heightOf(x.left), heightOf(x.right)) + 1;
    y.height = Math.max(heightOf(y.left), x.height) + 1;
    return y;
  }

  /** Rotate `x`'s right child up into its place; returns that child. */
  private rotateLeft(x: TreeNode<T>): TreeNode<T> {
    const y = x.right!;
    x.right = y.left;
    if (y.left !== null) y.left.parent = x;
    y.parent = x.parent;
    this.replaceChild(x, y);
    y.left = x;
    x.parent = y;
    x.height = Math.max(heightOf(x.left), heightOf(x.right)) + 1;
    y.height = Math.max(x.height, heightOf(y.right)) + 1;
    return y;
  }

  /**
   * Restore the AVL balance from `x` up after an insert or removal below it: single or double
   * rotations (Adelson-Velsky & Landis 1962), stopping where a subtree's height did not change.
   */
  private rebalance(x: TreeNode<T> | null): void {
    while (x !== null) {
      const old = x.height;
      const hl = heightOf(x.left);
      const hr = heightOf(x.right);
      if (hl > hr + 1) {
        const l = x.left!;
        if (heightOf(l.left) < heightOf(l.right)) this.rotateLeft(l);
        x = this.rotateRight(x);
      } else if (hr > hl + 1) {
        const r = x.right!;
        if (heightOf(r.right) < heightOf(r.left)) this.rotateRight(r);
        x = this.rotateLeft(x);
      } else x.height = (hl > hr ? hl : hr) + 1;
      if (x.height === old) return;
      x = x.parent;
    }
  }
}

/**
 * The same AVL tree for entries that are small integers (0 .. capacity - 1, each present at most
 * once), with its links in typed arrays: no object per entry, so a sweep over many corners makes
 * no garbage, and reset() empties it for the next sweep without allocating unless it must grow.
 * A search first tries a finger, the entry the previous search or insertion ended at: when the
 * wanted entry is the finger or the one right after it (consecutive corners meeting neighbouring
 * walls left to right, as along a comb's valleys), it answers in O(1); otherwise it searches down
 * from the root in O(log n) worst case. An entry that goes after every other (sweeps often add
 * walls left to right) is placed with no search at all.
 */
export class IndexSweepStatus {
  // Node id = entry + 1; id 0 means "none" in the tree links, and heads the circular list of
  // neighbours: after[0] is the leftmost entry, before[0] the rightmost.
  private left = new Int32Array(0);
  private right = new Int32Array(0);
  private parent = new Int32Array(0);
  private before = new Int32Array(0);
  private after = new Int32Array(0);
  /** Height of each node's subtree (1 for a leaf); 0: not in the status (and for id 0). */
  private heights = new Uint8Array(0);
  private capacity = 0;
  private root = 0;
  private count = 0;
  /** The node the last search or insertion ended at (0: none): tried first by the next search. */
  private finger = 0;

  constructor(capacity: number) {
    this.reset(capacity);
  }

  /** Empty the status for entries 0 .. capacity - 1, keeping its arrays when they are big enough. */
  reset(capacity: number): void {
    if (capacity + 1 > this.heights.length) {
      const size = capacity + 1;
      this.left = new Int32Array(size);
      this.right = new Int32Array(size);
      this.parent = new Int32Array(size);
      this.before = new Int32Array(size);
      this.after = new Int32Array(size);
      this.heights = new Uint8Array(size);
    } else {
      // Entries a sweep that stopped early (an error) left behind.
      this.heights.fill(0, 0, this.capacity + 1);
    }
    this.before[0] = 0;
    this.after[0] = 0;
    this.capacity = capacity;
    this.root = 0;
    this.count = 0;
    this.finger = 0;
  }

  get size(): number {
    return this.count;
  }

  /** Height of the tree (0 when empty): for tests of the AVL bound. */
  get height(): number {
    return this.heights[this.root];
  }

  /**
   * The last node for which `isBefore` holds (0: none holds). O(1) when the finger or the node
   * after it is the answer, else a search down from the root: O(log n) worst case either way.
   */
  private lastNode<Q>(isBefore: (entry: number, probe: Q) => boolean, probe: Q): number {
    const after = this.after;
    let x = this.finger;
    if (x !== 0 && isBefore(x - 1, probe)) {
      let n = after[x];
      if (n === 0 || !isBefore(n - 1, probe)) return x;
      x = n;
      n = after[x];
      if (n === 0 || !isBefore(n - 1, probe)) return x;
    }
    const left = this.left;
    const right = this.right;
    let found = 0;
    for (x = this.root; x !== 0; ) {
      if (isBefore(x - 1, probe)) {
        found = x;
        x = right[x];
      } else x = left[x];
    }
    return found;
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
    const heights = this.heights;
    if (heights[id] !== 0) throw new RangeError(`sweep status: entry ${entry} is already in the status`);
    const before = this.before;
    const after = this.after;
    const last = before[0];
    // The node it goes after (0: first of all): with no search when it goes after every entry.
    const previous = last !== 0 && isBefore(last - 1, probe) ? last : this.count === 0 ? 0 : this.lastNode(isBefore, probe);
    const following = after[previous];
    this.left[id] = 0;
    this.right[id] = 0;
    heights[id] = 1;
    // In-order between previous and following: under previous's right when it is free, else
    // under following's left (following is then the leftmost of previous's right subtree).
    let parent: number;
    if (previous !== 0 && this.right[previous] === 0) {
      parent = previous;
      this.right[parent] = id;
    } else if (following !== 0) {
      parent = following;
      this.left[parent] = id;
    } else {
      parent = 0;
      this.root = id;
    }
    this.parent[id] = parent;
    before[id] = previous;
    after[id] = following;
    after[previous] = id;
    before[following] = id;
    this.finger = id;
    this.count++;
    this.rebalance(parent);
  }

  /** Remove an entry that is in the status. */
  remove(entry: number): void {
    const id = entry + 1;
    if (!(entry >= 0 && entry < this.capacity) || this.heights[id] === 0) {
      throw new RangeError(`sweep status: entry ${entry} is not in the status`);
    }
    const left = this.left;
    const right = this.right;
    const parent = this.parent;
    const before = this.before;
    const after = this.after;
    let from: number;
    const l = left[id];
    const r = right[id];
    if (l === 0 || r === 0) {
      const child = l !== 0 ? l : r;
      from = parent[id];
      this.replaceChild(id, child);
      if (child !== 0) parent[child] = from;
    } else {
      // Two children: the next entry (leftmost of the right subtree, no left child) takes its place.
      const next = after[id];
      if (next === r) from = next;
      else {
        from = parent[next];
        const nr = right[next];
        left[from] = nr;
        if (nr !== 0) parent[nr] = from;
        right[next] = r;
        parent[r] = next;
      }
      left[next] = l;
      parent[l] = next;
      this.heights[next] = this.heights[id];
      parent[next] = parent[id];
      this.replaceChild(id, next);
    }
    const b = before[id];
    const a = after[id];
    after[b] = a;
    before[a] = b;
    if (this.finger === id) this.finger = b;
    this.heights[id] = 0;
    this.count--;
    this.rebalance(from);
  }

  /**
   * Put `entry` in the place of `old`, which leaves the status, in O(1) with no search: for a wall
   * that ends where the next wall of its ring begins, so nothing lies between the two.
   */
  replace(old: number, entry: number): void {
    const from = old + 1;
    const id = entry + 1;
    const heights = this.heights;
    if (!(old >= 0 && old < this.capacity) || heights[from] === 0) throw new RangeError(`sweep status: entry ${old} is not in the status`);
    if (!(entry >= 0 && entry < this.capacity)) throw new RangeError(`sweep status: entry ${entry} outside 0..${this.capacity - 1}`);
    if (heights[id] !== 0) throw new RangeError(`sweep status: entry ${entry} is already in the status`);
    const left = this.left;
    const right = this.right;
    const parent = this.parent;
    const l = left[from];
    const r = right[from];
    left[id] = l;
    right[id] = r;
    parent[l] = id;
    parent[r] = id;
    parent[id] = parent[from];
    this.replaceChild(from, id);
    const b = this.before[from];
    const a = this.after[from];
    this.before[id] = b;
    this.after[id] = a;
    this.after[b] = id;
    this.before[a] = id;
    heights[id] = heights[from];
    heights[from] = 0;
    if (this.finger === from) this.finger = id;
  }

  /** All entries left to right (for tests and debugging). */
  items(): number[] {
    const out: number[] = [];
    for (let n = this.after[0]; n !== 0; n = this.after[n]) out.push(n - 1);
    return out;
  }

  /** Put `child` where node `x` hangs from its parent (or at the root). */
  private replaceChild(x: number, child: number): void {
    const p = this.parent[x];
    if (p === 0) this.root = child;
    else if (this.left[p] === x) this.left[p] = child;
    else this.right[p] = child;
  }

  /** Rotate node x's left child (right child when `toLeft`) up into its place; returns that child. */
  private rotate(x: number, toLeft: boolean): number {
    const left = this.left;
    const right = this.right;
    const parent = this.parent;
    const heights = this.heights;
    let y: number;
    if (toLeft) {
      y = right[x];
      const inner = left[y];
      right[x] = inner;
      parent[inner] = x;
      left[y] = x;
    } else {
      y = left[x];
      const inner = right[y];
      left[x] = inner;
      parent[inner] = x;
      right[y] = x;
    }
    parent[y] = parent[x];
    this.replaceChild(x, y);
    parent[x] = y;
    const hl = heights[left[x]];
    const hr = heights[right[x]];
    const hx = (hl > hr ? hl : hr) + 1;
    heights[x] = hx;
    const other = heights[toLeft ? right[y] : left[y]];
    heights[y] = (hx > other ? hx : other) + 1;
    return y;
  }

  /**
   * Restore the AVL balance from node x up after an insert or removal below it: single or double
   * rotations (Adelson-Velsky & Landis 1962), stopping where a subtree's height did not change.
   */
  private rebalance(x: number): void {
    const left = this.left;
    const right = this.right;
    const heights = this.heights;
    while (x !== 0) {
      const old = heights[x];
      const hl = heights[left[x]];
      const hr = heights[right[x]];
      if (hl > hr + 1) {
        const l = left[x];
        if (heights[left[l]] < heights[right[l]]) this.rotate(l, true);
        x = this.rotate(x, false);
      } else if (hr > hl + 1) {
        const r = right[x];
        if (heights[right[r]] < heights[left[r]]) this.rotate(r, false);
        x = this.rotate(x, true);
      } else heights[x] = (hl > hr ? hl : hr) + 1;
      if (heights[x] === old) return;
      x = this.parent[x];
    }
  }
}
