// Visibility region speed: lib/geometry/visibility.ts (triangular expansion, exact predicates)
// against the visibility-polygon npm package (named peer, a rotational sweep over segments),
// measured in the same run on the same 1,000-vertex rooms and the same posts. The room's
// preparation (our triangulation and neighbour table; the peer's segment splitting) is timed
// apart from the per-post query.
import { breakIntersections, compute, convertToSegments } from "visibility-polygon";
import { prepareRoom } from "../../lib/geometry/room";
import { triangulate } from "../../lib/geometry/triangulate";
import { createSightlines } from "../../lib/geometry/visibility";
import { comb } from "../../lib/guarding/comb";
import type { Point, Room } from "../../lib/geometry/types";
import { seededRandom } from "../geometry/support/oracle";
import { spiralRoom, starRoom } from "../geometry/support/shapes";
import { samplePoints } from "../sightlines/sampler";

function cpuNow(): number {
  const u = process.cpuUsage();
  return (u.user + u.system) / 1000;
}

/** CPU milliseconds per call, median of 5 rounds of at least 30 ms each. */
function timePerCall(work: () => void): number {
  const rounds: number[] = [];
  for (let r = 0; r < 5; r++) {
    const t0 = cpuNow();
    let calls = 0;
    do {
      work();
      calls++;
    } while (cpuNow() - t0 < 30);
    rounds.push((cpuNow() - t0) / calls);
  }
  return rounds.sort((a, b) => a - b)[2];
}

function prepared(plain: { outline: Point[]; obstacles: Point[][] }): Room {
  const answer = prepareRoom(plain);
  if (!answer.ok) throw new Error(answer.problems[0].message);
  return answer.room;
}

export default async function (): Promise<string> {
  const random = seededRandom(4);
  const rooms: [string, Room][] = [
    ["random star-shaped", prepared(starRoom(random, 1000) as { outline: Point[]; obstacles: Point[][] })],
    ["comb, 333 prongs", prepared(comb(333))],
    ["spiral", prepared(spiralRoom(1000) as { outline: Point[]; obstacles: Point[][] })],
  ];
  const lines = [
    "| room (no obstacles) | n | posts | ours: prepare ms | peer: prepare ms | ours: ms per post | visibility-polygon: ms per post | peer / ours | same area |",
    "| --- | ---: | ---: | ---: | ---: | ---: | ---: | ---: | --- |",
  ];
  for (const [name, room] of rooms) {
    const posts = samplePoints(room, 40, 1e-3, 9).slice(0, 25);
    const oursPrepare = timePerCall(() => createSightlines(room, triangulate(room)));
    const theirsPrepare = timePerCall(() => breakIntersections(convertToSegments([room.outline])));
    const sightlines = createSightlines(room, triangulate(room));
    const segments = breakIntersections(convertToSegments([room.outline]));
    let i = 0;
    const ours = timePerCall(() => sightlines.regionOf(posts[i++ % posts.length]));
    let j = 0;
    const theirs = timePerCall(() => compute(posts[j++ % posts.length], segments));
    // Both must describe the same region: areas agree to 1e-7 relative on every post.
    const area = (ring: Point[]) => Math.abs(ring.reduce((s, p, k) => s + p[0] * ring[(k + 1) % ring.length][1] - ring[(k + 1) % ring.length][0] * p[1], 0) / 2);
    const agree = posts.every((p) => {
      const a = sightlines.regionOf(p);
      const b = area(compute(p, segments) as Point[]);
      return a.ok && Math.abs(area(a.region) - b) <= 1e-7 * Math.max(1, b);
    });
    lines.push(
      `| ${name} | ${room.outline.length} | ${posts.length} | ${oursPrepare.toFixed(2)} | ${theirsPrepare.toFixed(2)} | ${ours.toFixed(3)} | ${theirs.toFixed(3)} | ${(theirs / ours).toFixed(1)}x | ${agree ? "yes" : "NO"} |`,
    );
  }
  return lines.join("\n");
}
