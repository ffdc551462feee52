// The corner order of the triangulation's top-down sweep: y descending, ties in y broken by x
// ascending (isAbove in predicates.ts), so no two distinct corners are level. O(n log n) worst case:
// - small rooms: a bottom-up merge sort of corner numbers (insertion-sorted runs, then merges);
// - larger rooms: an LSD radix sort (Knuth, TAOCP vol. 3, 5.2.5) on the top 32 bits of y's IEEE 754
//   bit pattern, turned so that unsigned order is y order, in 8- or 11-bit digits (a digit every
//   corner shares is skipped); corners that share those 32 bits (equal y, or y within about 1e-6 of
//   each other) are then put in order by comparing coordinates, a run that is already in order
//   or exactly reversed in linear time (the teeth of a comb come that way), any other by merging.

/** Below this many corners the merge sort is faster than the radix sort's fixed cost. */
const RADIX_FROM = 256;
/** From this many corners on, three 11-bit digits; below, four 8-bit digits (smaller counts to clear). */
const WIDE_DIGITS_FROM = 8192;
const MAX_BUCKETS = 1 << 11;
/** Insertion sort below this run length. */
const SHORT_RUN = 16;

/** Whether typed arrays store a float64's high word second (the radix sort reads it). */
const LITTLE_ENDIAN = new Uint8Array(new Uint16Array([1]).buffer)[0] === 1;

/** Whether corner a comes before corner b in the top-down sweep (isAbove on coordinate arrays). */
export function sweepsBefore(xs: Float64Array, ys: Float64Array, a: number, b: number): boolean {
  return ys[a] > ys[b] || (ys[a] === ys[b] && xs[a] < xs[b]);
}

/** Scratch arrays of the sort, grown on demand and reused by every call. */
export class SweepOrderWork {
  capacity = 0;
  spare = new Int32Array(0);
  keys = new Uint32Array(0);
  spareKeys = new Uint32Array(0);
  /** y values as float64, viewed as 32-bit words to read their bit patterns. */
  wide = new Float64Array(0);
  words = new Uint32Array(0);
  readonly counts = new Int32Array(4 * MAX_BUCKETS);

  ensure(n: number): void {
    if (n <= this.capacity) return;
    // Room to grow up to 65,536 corners; beyond, exactly the size.
    const capacity = Math.max(n, Math.min(2 * this.capacity, 1 << 16), 64);
    this.capacity = capacity;
    this.spare = new Int32Array(capacity);
    this.keys = new Uint32Array(capacity);
    this.spareKeys = new Uint32Array(capacity);
    this.wide = new Float64Array(capacity);
    this.words = new Uint32Array(this.wide.buffer);
  }
}

/**
 * Corners 0 .. n - 1 in top-down sweep order, written to order[0 .. n). xs and ys must hold finite
 * numbers and no two corners may share both coordinates (a valid room's corners are distinct).
 */
export function sortTopDown(xs: Float64Array, ys: Float64Array, n: number, order: Int32Array, work: SweepOrderWork): void {
  work.ensure(n);
  if (n < RADIX_FROM || !LITTLE_ENDIAN) {
    for (let v = 0; v < n; v++) order[v] = v;
    mergeSort(xs, ys, order, 0, n, work.spare);
    return;
  }
  radixSort(xs, ys, n, order, work);
}

/** Convenience for tests and one-off callers: the sweep order of all corners in a fresh array. */
export function sweepOrder(xs: Float64Array, ys: Float64Array): Int32Array {
  const order = new Int32Array(xs.length);
  sortTopDown(xs, ys, xs.length, order, new SweepOrderWork());
  return order;
}

function radixSort(xs: Float64Array, ys: Float64Array, n: number, order: Int32Array, work: SweepOrderWork): void {
  const { wide, words, counts } = work;
  let keys = work.keys;
  let spareKeys = work.spareKeys;
  const wideDigits = n >= WIDE_DIGITS_FROM;
  const digits = wideDigits ? 3 : 4;
  const bits = wideDigits ? 11 : 8;
  const buckets = 1 << bits;
  const mask = buckets - 1;
  counts.fill(0, 0, digits * buckets);
  for (let v = 0; v < n; v++) wide[v] = ys[v] + 0; // + 0 turns -0 into +0: they are the same y
  for (let v = 0; v < n; v++) {
    const high = words[2 * v + 1];
    // Descending y as ascending unsigned: negative numbers keep their bits, others flip all but the sign.
    const key = (high & 0x80000000 ? high : high ^ 0x7fffffff) >>> 0;
    keys[v] = key;
    order[v] = v;
    counts[key & mask]++;
    counts[buckets + ((key >>> bits) & mask)]++;
    counts[2 * buckets + ((key >>> (2 * bits)) & mask)]++;
    if (!wideDigits) counts[3 * buckets + (key >>> 24)]++;
  }
  let from: Int32Array = order;
  let to: Int32Array = work.spare;
  for (let digit = 0; digit < digits; digit++) {
    const base = digit * buckets;
    const shift = digit * bits;
    // Every corner in one bucket: this digit changes nothing.
    if (counts[base + ((keys[0] >>> shift) & mask)] === n) continue;
    let sum = 0;
    for (let b = base; b < base + buckets; b++) {
      const c = counts[b];
      counts[b] = sum;
      sum += c;
    }
    for (let i = 0; i < n; i++) {
      const key = keys[i];
      const k = counts[base + ((key >>> shift) & mask)]++;
      to[k] = from[i];
      spareKeys[k] = key;
    }
    const swap = from;
    from = to;
    to = swap;
    const swapKeys = keys;
    keys = spareKeys;
    spareKeys = swapKeys;
  }
  if (from !== order) order.set(from.subarray(0, n));
  // Corners sharing the 32 bits: order them by comparison (the spare array is free again).
  const spare = work.spare;
  for (let i = 0; i < n; ) {
    const key = keys[i];
    let j = i + 1;
    while (j < n && keys[j] === key) j++;
    if (j - i > 1) sortRun(xs, ys, order, i, j, spare);
    i = j;
  }
}

/** Sort order[lo .. hi) in sweep order: linear when already sorted or exactly reversed. */
function sortRun(xs: Float64Array, ys: Float64Array, order: Int32Array, lo: number, hi: number, spare: Int32Array): void {
  if (hi - lo > SHORT_RUN) {
    let sorted = true;
    let reversed = true;
    for (let i = lo + 1; i < hi && (sorted || reversed); i++) {
      if (sweepsBefore(xs, ys, order[i], order[i - 1])) sorted = false;
      else reversed = false;
    }
    if (sorted) return;
    if (reversed) {
      for (let i = lo, j = hi - 1; i < j; i++, j--) {
        const t = order[i];
        order[i] = order[j];
        order[j] = t;
      }
      return;
    }
  }
  mergeSort(xs, ys, order, lo, hi, spare);
}

/** Bottom-up merge sort of order[lo .. hi) in sweep order, O(m log m), using spare[lo .. hi). */
function mergeSort(xs: Float64Array, ys: Float64Array, order: Int32Array, lo: number, hi: number, spare: Int32Array): void {
  let a: Int32Array = order;
  let b: Int32Array = spare;
  for (let start = lo; start < hi; start += SHORT_RUN) {
    const end = Math.min(start + SHORT_RUN, hi);
    for (let i = start + 1; i < end; i++) {
      const w = a[i];
      const wy = ys[w];
      const wx = xs[w];
      let j = i - 1;
      for (; j >= start; j--) {
        const u = a[j];
        const uy = ys[u];
        if (uy > wy || (uy === wy && xs[u] < wx)) break;
        a[j + 1] = u;
      }
      a[j + 1] = w;
    }
  }
  for (let width = SHORT_RUN; width < hi - lo; width *= 2) {
    for (let start = lo; start < hi; start += 2 * width) {
      const mid = Math.min(start + width, hi);
      const end = Math.min(start + 2 * width, hi);
      let i = start;
      let j = mid;
      let k = start;
      while (i < mid && j < end) b[k++] = sweepsBefore(xs, ys, a[j], a[i]) ? a[j++] : a[i++];
      while (i < mid) b[k++] = a[i++];
      while (j < end) b[k++] = a[j++];
    }
    const swap = a;
    a = b;
    b = swap;
  }
  if (a !== order) order.set(a.subarray(lo, hi), lo);
}
