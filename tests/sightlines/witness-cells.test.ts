// The witness-cell bound is a proof only if every point of the room lies in a cell whose label
// holds every witness that point sees (then any post stands in a cell that sees at least what the
// post sees; Tozoni, de Rezende & de Souza, ACM TOMS 2016). The overlay decides most cells without
// a boolean operation (a window clip of the region), so this checks that property directly: for
// sampled points, every witness the independent sampler says the point sees (segment against
// every wall, tests/sightlines/sampler.ts, never the planner's own visibility code) must be in the
// label of the point's cell. Rooms: AGPLIB, Univ. of Campinas.
import { describe, expect, it } from "vitest";
import { triangulate } from "@/lib/geometry/triangulate";
import { createSightlines } from "@/lib/geometry/visibility";
import { createWitnessCells } from "@/lib/guarding/lower-bound-arrangement";
import type { Point } from "@/lib/geometry/types";
import { agplibRoom } from "./rooms";
import { samplePoints, seesPoint, walls } from "./sampler";

describe("witness cells hold every witness their points see (AGPLIB, Univ. of Campinas)", () => {
  for (const [name, count] of [["gB_simple-simple_25_100v-10h_2", 40], ["vonkoch-20-1", 30], ["randsimple-40-1", 40]] as const) {
    it(`${name}: ${count} witnesses, 1500 sampled points`, () => {
      const room = agplibRoom(name);
      const sightlines = createSightlines(room, triangulate(room));
      const wallList = walls(room);
      // Witnesses at wall corners and wall middles: small and large regions, many crossings.
      // (A wall middle rounded into an obstacle has no region and is left out.)
      const witnesses: Point[] = wallList
        .flatMap(([a, b]) => [a, [(a[0] + b[0]) / 2, (a[1] + b[1]) / 2] as Point])
        .filter((w, i) => (i % 2 === 0 || i % 5 === 1) && sightlines.regionOf(w).ok)
        .slice(0, count);
      const overlay = createWitnessCells(room);
      const regions = witnesses.map((w) => {
        const answer = sightlines.regionOf(w);
        return answer.ok ? [[answer.region]] : [];
      });
      expect(overlay.add(regions, {})).toBe(witnesses.length);
      let checked = 0;
      for (const p of samplePoints(room, 1500, 1e-3, 7)) {
        const label = overlay.labelAt(p);
        expect(label, `(${p[0]}, ${p[1]}) lies in no cell`).not.toBeNull();
        witnesses.forEach((w, k) => {
          if (seesPoint(w, p, room, wallList)) {
            checked++;
            expect(label, `(${p[0]}, ${p[1]}) sees witness ${k} at (${w[0]}, ${w[1]})`).toContain(k);
          }
        });
      }
      // The check must have had something to check.
      expect(checked).toBeGreaterThan(1500);
    });
  }
});
