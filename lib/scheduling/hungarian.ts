// Minimum-cost assignment (Kuhn 1955, Munkres 1957; shortest augmenting paths with potentials), rows <= columns.

/** Forbidden pairing: costs at or above this are never chosen when avoidable and reported as unassigned. */
export const FORBIDDEN = 1e9;

/**
 * Assigns every row to a distinct column at least total cost. cost[r][c]; rows.length <= columns.
 * Returns for each row its column, or -1 when the only choice was a forbidden pair.
 */
export function assignMinCost(cost: number[][], columns: number): number[] {
  const n = cost.length;
  if (n === 0) return [];
  if (n > columns) throw new Error(`assignMinCost: ${n} rows but only ${columns} columns`);
  const m = columns;
  const u = new Float64Array(n + 1);
  const v = new Float64Array(m + 1);
  const p = new Int32Array(m + 1); // p[col] = row (1-based), 0 = free
  const way = new Int32Array(m + 1);
  const minv = new Float64Array(m + 1);
  const used = new Uint8Array(m + 1);
  for (let i = 1; i <= n; i++) {
    p[0] = i;
    let j0 = 0;
    minv.fill(Infinity);
    used.fill(0);
    do {
      used[j0] = 1;
      const i0 = p[j0];
      const row = cost[i0 - 1];
      let delta = Infinity;
      let j1 = 0;
      for (let j = 1; j <= m; j++) {
        if (used[j]) continue;
        const cur = row[j - 1] - u[i0] - v[j];
        if (cur < minv[j]) {
          minv[j] = cur;
          way[j] = j0;
        }
        if (minv[j] < delta) {
          delta = minv[j];
          j1 = j;
        }
      }
      for (let j = 0; j <= m; j++) {
        if (used[j]) {
          u[p[j]] += delta;
          v[j] -= delta;
        } else minv[j] -= delta;
      }
      j0 = j1;
    } while (p[j0] !== 0);
    do {
      const j1 = way[j0];
      p[j0] = p[j1];
      j0 = j1;
    } while (j0);
  }
  const answer = new Array<number>(n).fill(-1);
  for (let j = 1; j <= m; j++) if (p[j] > 0) answer[p[j] - 1] = cost[p[j] - 1][j - 1] >= FORBIDDEN ? -1 : j - 1;
  return answer;
}
