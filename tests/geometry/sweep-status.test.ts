// The sweep status (lib/geometry/sweep-status.ts), both the object tree and the typed-array tree,
// against a plain sorted array (the model), on random operation sequences and on the orders an
// adversary would pick against an unbalanced or randomised structure: sorted, reversed,
// alternating ends, and a comb-like run of searches left to right. After every step the tree's
// height must stay within the AVL bound h < 1.4405 log2(n + 2) - 0.3277 (Adelson-Velsky & Landis
// 1962; Knuth, The Art of Computer Programming vol. 3, 6.2.3, as recalled), so a test fails if the
// balancing breaks even while the order stays right.
import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { IndexSweepStatus, SweepStatus, type StatusNode } from "@/lib/geometry/sweep-status";

/** The AVL height bound for n entries (height of an empty tree: 0, of one entry: 1). */
const avlBound = (n: number) => 1.4405 * Math.log2(n + 2) - 0.3277;

const less = (other: number, probe: number) => other < probe;

/** Orders an adversary would feed a sweep: sorted, reversed, alternating ends, middle out. */
function adversarialOrders(n: number): [string, number[]][] {
  const sorted = Array.from({ length: n }, (_, i) => i);
  const alternating: number[] = [];
  for (let lo = 0, hi = n - 1; lo <= hi; lo++, hi--) {
    alternating.push(lo);
    if (hi !== lo) alternating.push(hi);
  }
  const middleOut = [...sorted].sort((a, b) => Math.abs(a - n / 2) - Math.abs(b - n / 2) || a - b);
  return [
    ["sorted", sorted],
    ["reversed", [...sorted].reverse()],
    ["alternating ends", alternating],
    ["middle out", middleOut],
  ];
}

describe("SweepStatus (AVL tree of objects) against a sorted array", () => {
  it("keeps order, neighbours, searches and the AVL height bound on random operations", () => {
    fc.assert(
      fc.property(fc.array(fc.tuple(fc.boolean(), fc.integer({ min: 0, max: 400 })), { maxLength: 400 }), (operations) => {
        const status = new SweepStatus<number>();
        const nodes = new Map<number, StatusNode<number>>();
        const model: number[] = [];
        for (const [add, value] of operations) {
          if (add && !nodes.has(value)) {
            nodes.set(value, status.insert(value, less, value));
            model.push(value);
            model.sort((a, b) => a - b);
          } else if (!add && nodes.has(value)) {
            const node = nodes.get(value)!;
            const i = model.indexOf(value);
            expect(status.before(node)?.item ?? null).toBe(i > 0 ? model[i - 1] : null);
            expect(status.after(node)?.item ?? null).toBe(i + 1 < model.length ? model[i + 1] : null);
            status.remove(node);
            nodes.delete(value);
            model.splice(i, 1);
          }
          expect(status.items()).toEqual(model);
          expect(status.size).toBe(model.length);
          expect(status.height).toBeLessThan(avlBound(model.length));
          const probe = value + 0.5;
          expect(status.lastWhere(less, probe)?.item ?? null).toBe(model.filter((v) => v < probe).at(-1) ?? null);
        }
        expect(status.items()).toEqual(model);
      }),
      { numRuns: 200, seed: 7 },
    );
  });

  it("stays within the AVL bound on adversarial insertion and removal orders", () => {
    const n = 2000;
    for (const [name, order] of adversarialOrders(n)) {
      const status = new SweepStatus<number>();
      const nodes = new Map<number, StatusNode<number>>();
      for (let k = 0; k < order.length; k++) {
        nodes.set(order[k], status.insert(order[k], less, order[k]));
        if (status.height >= avlBound(k + 1)) throw new Error(`${name}: height ${status.height} after ${k + 1} inserts`);
      }
      expect(status.items()).toEqual(Array.from({ length: n }, (_, i) => i));
      // Remove in the same adversarial order: removals rebalance too.
      for (let k = 0; k < order.length; k++) {
        status.remove(nodes.get(order[k])!);
        if (status.height >= avlBound(n - k - 1)) throw new Error(`${name}: height ${status.height} after ${k + 1} removals`);
      }
      expect(status.size).toBe(0);
      expect(status.items()).toEqual([]);
    }
  });
});

describe("IndexSweepStatus (AVL tree over typed arrays) against a sorted array", () => {
  it("keeps order, searches, replacements and the AVL height bound on random operations", () => {
    const value = fc.integer({ min: 0, max: 300 });
    const operation = fc.oneof(
      { weight: 4, arbitrary: fc.record({ kind: fc.constant("insert" as const), values: fc.array(value, { maxLength: 60 }) }) },
      { weight: 3, arbitrary: fc.record({ kind: fc.constant("remove" as const), values: fc.array(value, { maxLength: 30 }) }) },
      { weight: 2, arbitrary: fc.record({ kind: fc.constant("replace" as const), values: fc.array(value, { maxLength: 20 }) }) },
      // A run of searches with rising probes, as the sweep makes along one row of a comb, then falling.
      { weight: 3, arbitrary: fc.record({ kind: fc.constant("scan" as const), values: fc.tuple(value, fc.integer({ min: 1, max: 40 })) }) },
      { weight: 1, arbitrary: fc.record({ kind: fc.constant("reset" as const), values: fc.tuple(fc.integer({ min: 1, max: 301 })) }) },
    );
    fc.assert(
      fc.property(fc.array(operation, { maxLength: 100 }), (operations) => {
        const status = new IndexSweepStatus(301);
        let capacity = 301;
        let model: number[] = [];
        const below = (probe: number) => model.filter((v) => v < probe).at(-1) ?? -1;
        for (const op of operations) {
          if (op.kind === "reset") {
            capacity = op.values[0];
            status.reset(capacity);
            model = [];
          } else if (op.kind === "insert") {
            for (const v of op.values) {
              const entry = v % capacity;
              if (model.includes(entry)) continue;
              status.insert(entry, less, entry);
              model = [...model, entry].sort((a, b) => a - b);
              expect(status.height).toBeLessThan(avlBound(model.length));
            }
          } else if (op.kind === "remove") {
            for (const v of op.values) {
              const entry = v % capacity;
              if (!model.includes(entry)) continue;
              status.remove(entry);
              model = model.filter((m) => m !== entry);
              expect(status.height).toBeLessThan(avlBound(model.length));
            }
          } else if (op.kind === "replace") {
            // Replace an entry by an absent one that keeps the order (the next wall of a ring).
            for (const v of op.values) {
              const entry = v % capacity;
              const i = model.indexOf(entry);
              const fresh = entry + 1;
              if (i < 0 || fresh >= capacity || model.includes(fresh)) continue;
              status.replace(entry, fresh);
              model = model.map((m) => (m === entry ? fresh : m));
              // The replaced entry's place is searchable: the finger and the root search agree.
              expect(status.lastWhere(less, fresh + 0.5)).toBe(fresh);
            }
          } else {
            const [start, step] = op.values;
            for (let probe = start % capacity; probe < capacity; probe += step) {
              expect(status.lastWhere(less, probe + 0.5)).toBe(below(probe + 0.5));
            }
            for (let probe = capacity - 1 - (start % capacity); probe >= 0; probe -= step) {
              expect(status.lastWhere(less, probe + 0.5)).toBe(below(probe + 0.5));
            }
          }
          expect(status.items()).toEqual(model);
          expect(status.size).toBe(model.length);
        }
      }),
      { numRuns: 150, seed: 11 },
    );
  });

  it("stays within the AVL bound on adversarial orders, with removals from the middle", () => {
    const n = 4000;
    const status = new IndexSweepStatus(n);
    for (const [name, order] of adversarialOrders(n)) {
      status.reset(n);
      for (let k = 0; k < order.length; k++) {
        status.insert(order[k], less, order[k]);
        if (status.height >= avlBound(k + 1)) throw new Error(`${name}: height ${status.height} after ${k + 1} inserts`);
      }
      expect(status.items()).toEqual(Array.from({ length: n }, (_, i) => i));
      // Every search answers right whether or not the finger helps (rising probes hit it).
      for (let probe = 0; probe <= n; probe += 7) expect(status.lastWhere(less, probe + 0.5)).toBe(Math.min(probe, n - 1));
      // Remove every other entry, then the rest in the adversarial order.
      for (let v = 0; v < n; v += 2) status.remove(v);
      expect(status.height).toBeLessThan(avlBound(n / 2));
      for (const v of order) {
        if (v % 2 === 0) continue;
        status.remove(v);
        if (status.height >= avlBound(status.size)) throw new Error(`${name}: height ${status.height} at ${status.size} entries`);
      }
      expect(status.size).toBe(0);
      expect(status.lastWhere(less, 5)).toBe(-1);
    }
  });

  it("keeps order and removals like a sorted array (the model: a plain sorted array)", () => {
    fc.assert(
      fc.property(fc.array(fc.tuple(fc.boolean(), fc.integer({ min: 0, max: 200 })), { maxLength: 300 }), (operations) => {
        const status = new IndexSweepStatus(402);
        const model: number[] = [];
        for (const [add, value] of operations) {
          if (add && !model.includes(value)) {
            status.insert(value, less, value);
            model.push(value);
            model.sort((a, b) => a - b);
          } else if (!add && model.includes(value)) {
            // Half the removals replace the entry in place by a fresh one (value + 201) and remove that.
            if (value % 2 === 0) {
              status.replace(value, value + 201);
              const inPlace = model.map((v) => (v === value ? value + 201 : v));
              expect(status.items()).toEqual(inPlace);
              status.remove(value + 201);
            } else status.remove(value);
            model.splice(model.indexOf(value), 1);
          }
          expect(status.items()).toEqual(model);
          expect(status.size).toBe(model.length);
          const probe = value + 0.5;
          const below = model.filter((v) => v < probe);
          expect(status.lastWhere(less, probe)).toBe(below.length ? below[below.length - 1] : -1);
        }
      }),
      { numRuns: 200, seed: 3 },
    );
  });

  it("refuses entries twice, outside its capacity, and replacements that do not fit", () => {
    const status = new IndexSweepStatus(6);
    status.insert(3, less, 3);
    expect(() => status.insert(3, less, 3)).toThrow(/already in the status/);
    expect(() => status.insert(6, less, 6)).toThrow(/outside 0..5/);
    expect(() => status.remove(2)).toThrow(/not in the status/);
    expect(() => status.replace(2, 4)).toThrow(/not in the status/);
    status.insert(4, less, 4);
    expect(() => status.replace(3, 4)).toThrow(/already in the status/);
    expect(status.items()).toEqual([3, 4]);
    // A reset empties the status and narrows its capacity to the new room's walls.
    status.reset(4);
    expect(status.items()).toEqual([]);
    expect(() => status.insert(4, () => false, 4)).toThrow(RangeError);
    expect(() => status.remove(3)).toThrow(RangeError);
  });
});
