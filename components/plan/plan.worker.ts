// The live re-plan off the main thread: validation, triangulation, the guaranteed plan and the
// posts' visibility and coverage, with the same lib/ code the server runs. Newest job wins.
import { prepareRoom, roomArea, roomCounts } from "@/lib/geometry/room";
import { triangulate } from "@/lib/geometry/triangulate";
import { createSightlines } from "@/lib/geometry/visibility";
import { clipToSightRange } from "@/lib/geometry/visibility-range";
import { certifyCoverage, type Region } from "@/lib/geometry/coverage";
import { planGuaranteed } from "@/lib/guarding/guaranteed";
import type { Point } from "@/lib/geometry/types";
import type { PlanAnswer, PlanJob, PlanTriangle } from "./plan-messages";

let latest = 0;

function plan(job: PlanJob): PlanAnswer {
  const started = performance.now();
  const prepared = prepareRoom(job.room);
  if (!prepared.ok) return { id: job.id, ok: false, problems: prepared.problems };
  const room = prepared.room;
  const triangulation = triangulate(room);
  const guaranteed = planGuaranteed(room, triangulation);
  const triangles: PlanTriangle[] = guaranteed.triangles.map((t, i) => ({
    corners: [guaranteed.points[t[0]], guaranteed.points[t[1]], guaranteed.points[t[2]]],
    colours: guaranteed.cornerColours[i],
  }));
  const sightlines = createSightlines(room, triangulation);
  const posts: Point[] = job.shownPosts ?? guaranteed.posts;
  const range = job.sightRange && job.sightRange > 0 ? job.sightRange : null;
  const regions: Region[] = posts.map((post) => {
    const answer = sightlines.regionOf(post);
    if (!answer.ok || answer.region.length < 3) return [];
    return range ? clipToSightRange(answer.region, post, range) : [[answer.region]];
  }, 0);
  const certificate = certifyCoverage(room, regions, job.doubleCover ? 2 : 1);
  const { vertices, obstacles } = roomCounts(room);
  return {
    id: job.id,
    ok: true,
    vertices,
    obstacles,
    area: roomArea(room),
    bound: guaranteed.bound,
    triangles,
    guaranteed: { posts: guaranteed.posts, colour: guaranteed.postColour },
    sight: { posts, regions, covered: certificate.covered, uncovered: certificate.uncovered },
    ms: Math.round(performance.now() - started),
  };
}

self.onmessage = (event: MessageEvent<PlanJob>) => {
  const job = event.data;
  latest = job.id;
  // A newer job arrived while this one waited in the queue: skip the stale one.
  setTimeout(() => {
    if (job.id !== latest) return;
    let answer: PlanAnswer;
    try {
      answer = plan(job);
    } catch (error) {
      answer = { id: job.id, ok: false, problems: [], failure: error instanceof Error ? error.message : String(error) };
    }
    (self as unknown as Worker).postMessage(answer);
  }, 0);
};
