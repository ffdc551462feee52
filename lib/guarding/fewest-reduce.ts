// Set-cover reductions before every integer program of the fewest plan (the classic preprocessing
// of set covering: Garfinkel & Nemhauser, "Integer Programming", Wiley 1972, set-covering chapter,
// as recalled; used for the art gallery problem by Tozoni, de Rezende & de Souza, ACM TOMS 2016).
// Rows are witnesses (each needs `need` chosen columns among its items), columns are candidate
// posts of unit weight. Repeated to a fixpoint:
// 1. Forced columns: a row with exactly `need` items takes all of them (no other way to meet it).
// 2. Row domination: if row a's items are a subset of row b's and need(a) >= need(b), every
//    choice that meets a meets b, so b is dropped (of two equal rows the later one goes).
// 3. Column domination: if column j's rows are a subset of column k's rows and every row j meets
//    needs only one post, any plan with j stays valid and no larger with k in j's place (or with j
//    simply left out when k is already in), so j is dropped (of two equal columns the later one goes).
// Each rule keeps at least one optimal plan of the original program, so the reduced optimum plus
// the forced columns is the original optimum (tests/sightlines/fewest-reduce.test.ts checks this
// against exhaustive search on random programs).
import { solveBinaryProgram, type BinaryAnswer } from "../solver/highs";

export interface CoverRow {
  items: number[];
  need: number;
}

export interface ReducedCover {
  /** No choice of columns meets every row. */
  infeasible: boolean;
  /** Columns every reduced plan takes (including the fixed ones). */
  forced: number[];
  /** What is left, in reduced column numbers. */
  rows: CoverRow[];
  /** Reduced column number -> original column. */
  columns: number[];
}

class Bits {
  readonly words: Uint32Array;
  constructor(size: number) {
    this.words = new Uint32Array((size + 31) >>> 5);
  }
  set(i: number) {
    this.words[i >>> 5] |= 1 << (i & 31);
  }
  /** Whether every bit of this is also in `other`. */
  within(other: Bits): boolean {
    const a = this.words, b = other.words;
    for (let i = 0; i < a.length; i++) if ((a[i] & ~b[i]) !== 0) return false;
    return true;
  }
}

/** Reduces a unit-weight covering program; `fixed` columns are taken first. */
export function reduceCover(columnCount: number, rows: CoverRow[], fixed: number[] = []): ReducedCover {
  const rowCount = rows.length;
  const need = rows.map((r) => r.need);
  const rowAlive = new Uint8Array(rowCount).fill(1);
  const colAlive = new Uint8Array(columnCount).fill(1);
  const colRows: number[][] = Array.from({ length: columnCount }, () => []);
  const rowItems: number[][] = rows.map((r, i) => {
    const items = [...new Set(r.items)].filter((c) => c >= 0 && c < columnCount).sort((a, b) => a - b);
    for (const c of items) colRows[c].push(i);
    return items;
  });
  const forced: number[] = [];
  const take = (c: number) => {
    if (!colAlive[c]) return;
    colAlive[c] = 0;
    forced.push(c);
    for (const r of colRows[c]) if (rowAlive[r]) need[r]--;
  };
  for (const c of fixed) if (c >= 0 && c < columnCount) take(c);
  let infeasible = false;
  // Rule 3 for identical columns first, by a signature (cheap, and most candidate posts that
  // stand close together see the same witnesses): of equal columns whose rows need one post each
  // the first stays.
  const firstWith = new Map<string, number>();
  for (let c = 0; c < columnCount; c++) {
    if (!colAlive[c]) continue;
    const live = colRows[c].filter((r) => need[r] > 0);
    if (live.length === 0) {
      colAlive[c] = 0;
      continue;
    }
    if (live.some((r) => need[r] !== 1)) continue;
    const signature = live.join(",");
    if (firstWith.has(signature)) colAlive[c] = 0;
    else firstWith.set(signature, c);
  }

  const liveItems = (r: number) => rowItems[r].filter((c) => colAlive[c]);
  const liveRows = (c: number) => colRows[c].filter((r) => rowAlive[r]);
  for (let changed = true; changed && !infeasible; ) {
    changed = false;
    // Rows already met go; rows with no slack force their items.
    for (let r = 0; r < rowCount; r++) {
      if (!rowAlive[r]) continue;
      if (need[r] <= 0) {
        rowAlive[r] = 0;
        changed = true;
        continue;
      }
      const items = liveItems(r);
      if (items.length < need[r]) {
        infeasible = true;
        break;
      }
      if (items.length === need[r]) {
        for (const c of items) take(c);
        rowAlive[r] = 0;
        changed = true;
      }
    }
    if (infeasible) break;
    // Row domination: a row whose items contain another row's (with no larger need) is implied.
    const rowBits = new Map<number, Bits>();
    const itemsOf = new Map<number, number[]>();
    for (let r = 0; r < rowCount; r++) {
      if (!rowAlive[r]) continue;
      if (need[r] <= 0) {
        rowAlive[r] = 0; // met by a column forced later in this pass
        continue;
      }
      const items = liveItems(r);
      if (items.length < need[r]) {
        infeasible = true;
        break;
      }
      const bits = new Bits(columnCount);
      for (const c of items) bits.set(c);
      rowBits.set(r, bits);
      itemsOf.set(r, items);
    }
    if (infeasible) break;
    const rowOrder = [...rowBits.keys()].sort((a, b) => itemsOf.get(a)!.length - itemsOf.get(b)!.length || a - b);
    for (const a of rowOrder) {
      if (!rowAlive[a]) continue;
      const items = itemsOf.get(a)!;
      // Any row containing a's items contains its rarest column.
      let rarest = items[0], fewest = Infinity;
      for (const c of items) {
        const n = colRows[c].length;
        if (n < fewest) {
          fewest = n;
          rarest = c;
        }
      }
      for (const b of colRows[rarest]) {
        if (b === a || !rowAlive[b] || need[b] > need[a]) continue;
        const bItems = itemsOf.get(b)!;
        if (bItems.length < items.length || (bItems.length === items.length && need[b] === need[a] && b < a)) continue;
        if (rowBits.get(a)!.within(rowBits.get(b)!)) {
          rowAlive[b] = 0;
          changed = true;
        }
      }
    }
    // Column domination, for columns whose rows all need one post.
    const colBits = new Map<number, Bits>();
    const rowsOf = new Map<number, number[]>();
    for (let c = 0; c < columnCount; c++) {
      if (!colAlive[c]) continue;
      const live = liveRows(c);
      if (live.length === 0) {
        colAlive[c] = 0; // sees nothing still needed
        changed = true;
        continue;
      }
      const bits = new Bits(rowCount);
      for (const r of live) bits.set(r);
      colBits.set(c, bits);
      rowsOf.set(c, live);
    }
    const colOrder = [...colBits.keys()].sort((a, b) => rowsOf.get(a)!.length - rowsOf.get(b)!.length || b - a);
    for (const j of colOrder) {
      const live = rowsOf.get(j)!;
      if (live.some((r) => need[r] !== 1)) continue;
      let rarest = live[0], fewest = Infinity;
      for (const r of live) {
        const n = rowItems[r].length;
        if (n < fewest) {
          fewest = n;
          rarest = r;
        }
      }
      for (const k of rowItems[rarest]) {
        if (k === j || !colAlive[k]) continue;
        const kRows = rowsOf.get(k)!;
        // Of two equal columns the later one goes.
        if (kRows.length < live.length || (kRows.length === live.length && k > j)) continue;
        if (colBits.get(j)!.within(colBits.get(k)!)) {
          colAlive[j] = 0;
          changed = true;
          break;
        }
      }
    }
  }
  if (infeasible) return { infeasible, forced, rows: [], columns: [] };
  const columns: number[] = [];
  const reducedIndex = new Map<number, number>();
  const reducedRows: CoverRow[] = [];
  for (let r = 0; r < rowCount; r++) {
    if (!rowAlive[r] || need[r] <= 0) continue;
    const items = liveItems(r).map((c) => {
      if (!reducedIndex.has(c)) {
        reducedIndex.set(c, columns.length);
        columns.push(c);
      }
      return reducedIndex.get(c)!;
    });
    reducedRows.push({ items, need: need[r] });
  }
  return { infeasible, forced, rows: reducedRows, columns };
}

/** The fewest columns meeting every row (unit weights), reduced first and the rest solved by HiGHS. */
export function solveCover(problem: {
  columns: number;
  rows: CoverRow[];
  fixed?: number[];
  /**
   * Only plans of at most this many columns are wanted (one fewer than the best plan known): one
   * more row, which lets the search stop as soon as it proves there is none. Infeasible then means
   * no plan this small exists. The reductions keep an optimal plan, so they keep this answer too.
   */
  atMostColumns?: number;
  seconds: number;
  nodes?: number;
}): BinaryAnswer {
  const reduced = reduceCover(problem.columns, problem.rows, problem.fixed);
  if (reduced.infeasible) return { status: "infeasible", chosen: [] };
  const room = problem.atMostColumns === undefined ? Infinity : problem.atMostColumns - reduced.forced.length;
  if (room < 0 || (room === 0 && reduced.rows.length > 0)) return { status: "infeasible", chosen: [] };
  if (reduced.rows.length === 0) return { status: "optimal", chosen: [...reduced.forced].sort((a, b) => a - b) };
  // Small single covers: an exact search in JavaScript first (HiGHS costs more to start than such
  // a search takes); when its node budget runs out, HiGHS decides.
  if (reduced.rows.every((r) => r.need === 1)) {
    const found = searchCover(reduced.columns.length, reduced.rows.map((r) => r.items), room, SEARCH_NODES);
    if (found === "infeasible") return { status: "infeasible", chosen: [] };
    if (found) {
      const chosen = [...reduced.forced, ...found.map((j) => reduced.columns[j])].sort((a, b) => a - b);
      return { status: "optimal", chosen };
    }
  }
  const answer = solveBinaryProgram({
    weights: reduced.columns.map(() => 1),
    atLeast: reduced.rows,
    atMost: room < reduced.columns.length ? [{ items: reduced.columns.map((_, j) => j), most: room }] : [],
    seconds: problem.seconds,
    nodes: problem.nodes,
  });
  if (answer.status === "infeasible") return { ...answer };
  const chosen = [...reduced.forced, ...answer.chosen.map((j) => reduced.columns[j])].sort((a, b) => a - b);
  return { status: answer.status, chosen };
}

/** Nodes the exact search may visit before HiGHS takes over (a count, so the same on any machine). */
export const SEARCH_NODES = 600;

/**
 * The fewest columns (at most `most`) meeting rows that each need one: depth-first search that
 * branches on the open row with the fewest usable columns, each of its columns in turn (a column
 * tried is barred from its later siblings, whose plans without it are all that is left), pruned by
 * a packing bound (open rows with pairwise disjoint usable columns each need a column of their
 * own). An exact search: the classic branching for set covering (Garfinkel & Nemhauser 1972,
 * as recalled). Null when the node budget runs out.
 */
export function searchCover(columnCount: number, rows: number[][], most: number, maxNodes: number): number[] | "infeasible" | null {
  const rowCount = rows.length;
  const colRows: number[][] = Array.from({ length: columnCount }, () => []);
  rows.forEach((items, r) => items.forEach((c) => colRows[c].push(r)));
  const bySize = rows.map((_, r) => r).sort((a, b) => rows[a].length - rows[b].length || a - b);
  const seenBy = new Int32Array(rowCount); // chosen columns meeting each row
  const barred = new Uint8Array(columnCount);
  const stamp = new Int32Array(columnCount);
  let stampId = 0;
  let open = rowCount;
  const chosen: number[] = [];
  let best = Number.isFinite(most) ? most + 1 : Infinity;
  let bestSet: number[] | null = null;
  let nodes = 0;
  let aborted = false;

  const packing = (): number => {
    stampId++;
    let count = 0;
    for (const r of bySize) {
      if (seenBy[r] > 0) continue;
      let free = true, usable = 0;
      for (const c of rows[r]) {
        if (barred[c]) continue;
        usable++;
        if (stamp[c] === stampId) free = false;
      }
      if (usable === 0) return Infinity;
      if (!free) continue;
      count++;
      for (const c of rows[r]) if (!barred[c]) stamp[c] = stampId;
    }
    return count;
  };
  const take = (c: number, sign: 1 | -1) => {
    for (const r of colRows[c]) {
      if (sign === 1 && seenBy[r]++ === 0) open--;
      if (sign === -1 && --seenBy[r] === 0) open++;
    }
  };
  const search = () => {
    if (aborted) return;
    if (++nodes > maxNodes) {
      aborted = true;
      return;
    }
    if (open === 0) {
      if (chosen.length < best) {
        best = chosen.length;
        bestSet = [...chosen];
      }
      return;
    }
    if (chosen.length + packing() >= best) return;
    let row = -1, fewest = Infinity;
    for (let r = 0; r < rowCount; r++) {
      if (seenBy[r] > 0) continue;
      let usable = 0;
      for (const c of rows[r]) if (!barred[c]) usable++;
      if (usable < fewest) {
        fewest = usable;
        row = r;
      }
    }
    const gain = (c: number) => colRows[c].reduce((n, r) => n + (seenBy[r] === 0 ? 1 : 0), 0);
    const order = rows[row].filter((c) => !barred[c]).sort((a, b) => gain(b) - gain(a) || a - b);
    const tried: number[] = [];
    for (const c of order) {
      chosen.push(c);
      take(c, 1);
      search();
      take(c, -1);
      chosen.pop();
      if (aborted) break;
      barred[c] = 1;
      tried.push(c);
    }
    for (const c of tried) barred[c] = 0;
  };
  search();
  if (aborted) return null;
  return bestSet ?? "infeasible";
}
