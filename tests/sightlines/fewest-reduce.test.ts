// The set-cover reductions (forced columns, row and column domination: the classic set-covering
// preprocessing, Garfinkel & Nemhauser 1972, set-covering chapter, as recalled; Tozoni, de Rezende
// & de Souza, ACM TOMS 2016) and the exact search that follows them keep the optimum: on random
// covering programs the reduced program's optimum plus its forced columns equals the optimum found
// by exhaustive search over every subset of columns (the outside reference: plain enumeration, no
// solver), and the answer meets every row.
import { describe, expect, it } from "vitest";
import { reduceCover, searchCover, solveCover, type CoverRow } from "@/lib/guarding/fewest-reduce";
import { seededRandom as random } from "../geometry/support/oracle";

function randomProgram(seed: number, doubleRows: boolean) {
  const next = random(seed);
  const columns = 4 + Math.floor(next() * 10);
  const rowCount = 3 + Math.floor(next() * 14);
  const density = 0.15 + next() * 0.5;
  const rows: CoverRow[] = [];
  for (let r = 0; r < rowCount; r++) {
    const items: number[] = [];
    for (let c = 0; c < columns; c++) if (next() < density) items.push(c);
    if (items.length === 0) items.push(Math.floor(next() * columns));
    const need = doubleRows && items.length >= 2 && next() < 0.4 ? 2 : 1;
    rows.push({ items, need });
  }
  const fixed = next() < 0.3 ? [Math.floor(next() * columns)] : [];
  return { columns, rows, fixed };
}

const meets = (rows: CoverRow[], chosen: Set<number>) => rows.every((r) => r.items.filter((c) => chosen.has(c)).length >= r.need);

/** Fewest columns (fixed ones included) meeting every row, by trying every subset. */
function exhaustive(columns: number, rows: CoverRow[], fixed: number[]): number {
  let best = Infinity;
  for (let mask = 0; mask < 1 << columns; mask++) {
    if (fixed.some((c) => !(mask & (1 << c)))) continue;
    const chosen = new Set<number>();
    for (let c = 0; c < columns; c++) if (mask & (1 << c)) chosen.add(c);
    if (chosen.size < best && meets(rows, chosen)) best = chosen.size;
  }
  return best;
}

describe("set-cover reductions keep the optimum (exhaustive search as the reference)", () => {
  for (const doubleRows of [false, true]) {
    it(`300 random programs${doubleRows ? " with rows needing two posts" : ""}: same optimum, every row met`, () => {
      let reducedSomething = 0;
      for (let seed = 1; seed <= 300; seed++) {
        const { columns, rows, fixed } = randomProgram(seed * (doubleRows ? 7919 : 1), doubleRows);
        const truth = exhaustive(columns, rows, fixed);
        const answer = solveCover({ columns, rows, fixed, seconds: 5 });
        if (truth === Infinity) {
          expect(answer.status, `seed ${seed}`).toBe("infeasible");
          continue;
        }
        expect(answer.status, `seed ${seed}`).toBe("optimal");
        expect(answer.chosen.length, `seed ${seed}`).toBe(truth);
        expect(meets(rows, new Set(answer.chosen)), `seed ${seed}`).toBe(true);
        for (const c of fixed) expect(answer.chosen).toContain(c);
        const reduced = reduceCover(columns, rows, fixed);
        if (reduced.rows.length < rows.length || reduced.columns.length < columns) reducedSomething++;
      }
      // The rules must actually fire on these programs, or this test would check nothing.
      expect(reducedSomething).toBeGreaterThan(200);
    });
  }

  it("the exact search alone, on unreduced programs, finds the exhaustive optimum or proves none is small enough", () => {
    for (let seed = 1; seed <= 200; seed++) {
      const { columns, rows } = randomProgram(seed * 31, false);
      const truth = exhaustive(columns, rows, []);
      const found = searchCover(columns, rows.map((r) => r.items), Infinity, 1e6);
      expect(Array.isArray(found), `seed ${seed}`).toBe(true);
      expect((found as number[]).length, `seed ${seed}`).toBe(truth);
      expect(meets(rows, new Set(found as number[])), `seed ${seed}`).toBe(true);
      // Asked for one column fewer than the optimum, there is none.
      expect(searchCover(columns, rows.map((r) => r.items), truth - 1, 1e6), `seed ${seed}`).toBe("infeasible");
    }
    // With no nodes to spend it gives up (and HiGHS takes over in solveCover).
    expect(searchCover(3, [[0, 1], [1, 2], [0, 2]], Infinity, 1)).toBeNull();
  });

  it("asked for plans below the optimum, the reduced program is infeasible; at the optimum it is met", () => {
    for (let seed = 1; seed <= 100; seed++) {
      const { columns, rows, fixed } = randomProgram(seed * 101, seed % 2 === 0);
      const truth = exhaustive(columns, rows, fixed);
      if (truth === Infinity) continue;
      expect(solveCover({ columns, rows, fixed, atMostColumns: truth - 1, seconds: 5 }).status, `seed ${seed}`).toBe("infeasible");
      const answer = solveCover({ columns, rows, fixed, atMostColumns: truth, seconds: 5 });
      expect(answer.chosen.length, `seed ${seed}`).toBe(truth);
    }
  });

  it("a row seen by one column forces it; a column seeing a subset of another's rows goes", () => {
    // Rows: w0 {0}, w1 {1, 2}, w2 {1, 2, 3}. Column 0 is forced; w2 contains w1 and goes; then
    // columns 1 and 2 see the same row w1, so the later (2) goes and w1 forces column 1.
    const reduced = reduceCover(4, [{ items: [0], need: 1 }, { items: [1, 2], need: 1 }, { items: [1, 2, 3], need: 1 }]);
    expect(reduced.infeasible).toBe(false);
    expect(reduced.forced.sort()).toEqual([0, 1]);
    expect(reduced.rows).toEqual([]);
  });

  it("column domination is not used for rows needing two posts (it would lose the optimum)", () => {
    // Both columns are needed by the double row even though column 0's rows are within column 1's.
    const answer = solveCover({ columns: 2, rows: [{ items: [0, 1], need: 2 }, { items: [1], need: 1 }], seconds: 5 });
    expect(answer.chosen).toEqual([0, 1]);
  });

  it("a row needing more posts than it has columns is infeasible", () => {
    expect(reduceCover(3, [{ items: [0], need: 2 }]).infeasible).toBe(true);
  });
});
