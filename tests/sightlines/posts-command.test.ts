// The `posts` command's fewest fields, --sight-range and --time-limit, against the contract in
// scripts/README.md, on a comb (Chvátal 1975: k prongs need k posts) and an AGPLIB
// polygon (AGPLIB, Univ. of Campinas).
import { describe, expect, it } from "vitest";
import { spawnSync } from "node:child_process";
import path from "node:path";
import { fileURLToPath } from "node:url";

const repo = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "../..");

function posts(args: string[], input?: string) {
  const run = spawnSync("npm", ["run", "--silent", "posts", "--", ...args], { cwd: repo, input, encoding: "utf8", timeout: 90_000 });
  return { status: run.status, json: JSON.parse(run.stdout) };
}

const comb3 = {
  type: "Feature",
  properties: { name: "comb-3" },
  geometry: { type: "Polygon", coordinates: [[[0, 0], [8, 0], [7, 10], [6, 1], [5, 1], [4, 10], [3, 1], [2, 1], [1, 10], [0, 0]]] },
};

describe("npm run posts: the fewest plan", () => {
  it("gives a proven fewest plan with every contract field for a comb with 3 prongs (Chvátal 1975)", () => {
    const run = posts(["--time-limit", "3", "-"], JSON.stringify(comb3));
    expect(run.status).toBe(0);
    const room = run.json.rooms[0];
    expect(room.fewest.posts).toHaveLength(3);
    expect(room.fewest.lowerBound).toBe(3);
    expect(room.fewest.proven).toBe(true);
    expect(room.fewest.covered).toBe(1);
    expect(room.fewest.uncovered).toEqual([]);
    expect(room.fewest.posts.length).toBeLessThanOrEqual(room.guaranteed.posts.length);
    expect(typeof room.ms.fewest).toBe("number");
  });
  it("applies --sight-range to the plan and reports it, and --guaranteed-only leaves fewest out", () => {
    const agplib = path.resolve(repo, "tests/fixtures/agplib/randsimple-20-2.geojson");
    const limited = posts(["--time-limit", "2", "--sight-range", "3", agplib]);
    expect(limited.status).toBe(0);
    expect(limited.json.rooms[0].sightRange).toBe(3);
    expect(limited.json.rooms[0].fewest.covered).toBe(1);
    const unlimited = posts(["--time-limit", "2", agplib]);
    // Any plan under a sight range also sees the room without one, so it needs at least the proven minimum.
    expect(unlimited.json.rooms[0].fewest.proven).toBe(true);
    expect(limited.json.rooms[0].fewest.posts.length).toBeGreaterThanOrEqual(unlimited.json.rooms[0].fewest.posts.length);
    expect(posts(["--guaranteed-only", agplib]).json.rooms[0].fewest).toBeUndefined();
  });
});
