// The `posts` command (scripts/posts.ts) against its contract in scripts/README.md:
// one JSON document on stdout, exit 0 when all input is valid, 2 when some is not, rooms and
// errors fields as specified. Inputs: AGPLIB benchmark polygons (AGPLIB, Univ. of Campinas) and
// the hard-case fixtures.
import { describe, expect, it } from "vitest";
import { spawnSync } from "node:child_process";
import path from "node:path";
import { fileURLToPath } from "node:url";
import { AGPLIB_FOLDER } from "../geometry/support/agplib";
import { FIXTURE_FOLDER } from "../geometry/support/fixtures";

const repo = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "../..");

function posts(args: string[], input?: string) {
  const run = spawnSync("npm", ["run", "--silent", "posts", "--", ...args], { cwd: repo, input, encoding: "utf8", timeout: 60_000 });
  return { status: run.status, stdout: run.stdout, stderr: run.stderr, json: JSON.parse(run.stdout) };
}

describe("npm run posts", () => {
  it("answers benchmark polygons with the contract's fields, exit 0", () => {
    const files = ["gB_simple-simple_25_100v-10h_1.geojson", "random-40-1.geojson", "vonkoch-20-1.geojson"].map((f) => path.join(AGPLIB_FOLDER, f));
    const run = posts(["--guaranteed-only", ...files]);
    expect(run.status).toBe(0);
    expect(run.json.errors).toEqual([]);
    expect(run.json.rooms).toHaveLength(3);
    for (const room of run.json.rooms) {
      const n = room.vertices;
      const h = room.obstacles;
      expect(room.triangles).toBe(n + 2 * h - 2);
      expect(room.bound).toBe(Math.floor((n + 2 * h) / 3));
      expect(room.guaranteed.posts.length).toBeLessThanOrEqual(room.bound);
      expect(room.area).toBeGreaterThan(0);
      expect(typeof room.ms.triangulate).toBe("number");
      expect(typeof room.ms.guaranteed).toBe("number");
      expect(room.fewest).toBeUndefined();
    }
    expect(run.json.rooms[0]).toMatchObject({ name: "gB_simple-simple_25_100v-10h_1", vertices: 100, obstacles: 10, triangles: 118, bound: 40 });
  });

  it("answers the valid rooms and lists the invalid ones under errors, exit 2", () => {
    const run = posts(["--guaranteed-only", path.join(FIXTURE_FOLDER, "comb-5.json"), path.join(FIXTURE_FOLDER, "bow-tie.json")]);
    expect(run.status).toBe(2);
    expect(run.json.rooms.map((r: { name: string }) => r.name)).toEqual(["comb-5"]);
    expect(run.json.rooms[0].guaranteed.posts).toHaveLength(5);
    expect(run.json.errors).toEqual([
      { room: "bow-tie", code: "self-intersection", message: "walls 1-2 and 3-4 of the outline cross at (1.0, 1.0)", at: [1, 1] },
    ]);
  });

  it("reads standard input for '-' and accepts either ring orientation and a missing closing point", () => {
    const feature = { type: "Feature", properties: { name: "west-annex" }, geometry: { type: "Polygon", coordinates: [[[0, 0], [0, 5], [5, 5], [5, 0]]] } };
    const run = posts(["--guaranteed-only", "-"], JSON.stringify(feature));
    expect(run.status).toBe(0);
    expect(run.json.rooms[0]).toMatchObject({ name: "west-annex", vertices: 4, obstacles: 0, area: 25, triangles: 2, bound: 1 });
    expect(run.json.rooms[0].guaranteed.posts).toHaveLength(1);
  });

  it("says what is wrong with unreadable input and bad options", () => {
    const missing = posts(["--guaranteed-only", "/nonexistent/room.geojson"]);
    expect(missing.status).toBe(2);
    expect(missing.json.errors[0].code).toBe("unreadable-file");
    const bad = posts(["--sight-range", "far", path.join(FIXTURE_FOLDER, "comb-5.json")]);
    expect(bad.status).toBe(2);
    expect(bad.json.errors[0].message).toContain("--sight-range needs a positive number");
  });
});
