// The live re-plan off the main thread: the one planning pipeline (lib/guarding/plan-room.ts) with
// the guaranteed plan, or the shown posts, certified and their sight drawn. Newest job wins.
import { guaranteedPosts, planRoom } from "@/lib/guarding/plan-room";
import { SIGHT_DRAWING_LIMIT, type PlanAnswer, type PlanJob, type PlanTriangle } from "./plan-messages";

let latest = 0;

function plan(job: PlanJob): PlanAnswer {
  const started = performance.now();
  const outcome = planRoom(job.room, {
    method: job.shownPosts ? "shown" : "guaranteed",
    shownPosts: job.shownPosts ?? undefined,
    sightRange: job.sightRange && job.sightRange > 0 ? job.sightRange : undefined,
    doubleCover: job.doubleCover,
    withRegions: true,
    regionLimit: SIGHT_DRAWING_LIMIT,
  });
  if (!outcome.ok) return { id: job.id, ok: false, problems: outcome.problems };
  const { guaranteed, plan: shown, regions } = outcome.planned;
  const triangles: PlanTriangle[] = guaranteed.triangles.map((t, i) => ({
    corners: [guaranteed.points[t[0]], guaranteed.points[t[1]], guaranteed.points[t[2]]],
    colours: guaranteed.cornerColours[i],
  }));
  return {
    id: job.id,
    ok: true,
    vertices: outcome.planned.vertices,
    obstacles: outcome.planned.obstacles,
    area: outcome.planned.area,
    bound: guaranteed.bound,
    triangles,
    // Double cover: the guaranteed plan is the two smallest colour classes (each sees the floor once).
    guaranteed: { posts: guaranteedPosts(guaranteed, { doubleCover: job.doubleCover }), colour: guaranteed.postColour, doubleCover: job.doubleCover },
    sight: { posts: shown.posts, regions: regions ?? [], covered: shown.covered ?? 0, uncovered: shown.uncovered, regionsOmitted: outcome.planned.regionsOmitted },
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
