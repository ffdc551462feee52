// Planning large rooms and the server's responsiveness meanwhile.
// 1. Easy large rooms: a 5,000-corner near-circle (convex) and a 5,000-corner star-shaped room
//    through the whole pipeline (planRoom, fewest), against the guaranteed plan alone as the peer.
// 2. A hall of about 1,000 corners and 100 vitrines at a 1 s fewest limit: time over the limit.
// 3. Four previews of 5,000-corner rooms at once in the planning pool (threads: cores less one, as
//    in the server), while an HTTP health route on the main thread is asked every 50 ms: its p95
//    latency against the same probe with nothing planning (the peer, in the same run), and the
//    process's peak resident memory (threads included).
import { createServer } from "node:http";
import type { AddressInfo } from "node:net";
import type { Point, Room } from "../../lib/geometry/types";
import { planRoom } from "../../lib/guarding/plan-room";
import { PlanPool } from "../../lib/guarding/plan-pool";
import { sawHall } from "../support/halls";

function nearCircle(n: number): Room {
  const outline: Point[] = [];
  for (let i = 0; i < n; i++) outline.push([50 * Math.cos((2 * Math.PI * i) / n), 50 * Math.sin((2 * Math.PI * i) / n)]);
  return { outline, obstacles: [] };
}

/** Star-shaped about the centre: corners at increasing angles, radii alternating 40 m and 25-35 m. */
function star(n: number): Room {
  let state = 7;
  const random = () => ((state = (state * 1103515245 + 12345) % 2147483648) / 2147483648);
  const outline: Point[] = [];
  for (let i = 0; i < n; i++) {
    const r = i % 2 === 0 ? 40 : 25 + 10 * random();
    outline.push([r * Math.cos((2 * Math.PI * i) / n), r * Math.sin((2 * Math.PI * i) / n)]);
  }
  return { outline, obstacles: [] };
}

const percentile = (values: number[], p: number) => {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.min(sorted.length - 1, Math.floor(p * sorted.length))] ?? NaN;
};
const median = (values: number[]) => percentile(values, 0.5);

function easyRows(): string[] {
  const rows = ["| room | corners | fewest ms (median of 3) | posts | proven | guaranteed-only ms (peer) | guaranteed posts |", "| --- | ---: | ---: | ---: | --- | ---: | ---: |"];
  for (const [name, room] of [["near-circle", nearCircle(5000)], ["star-shaped", star(5000)]] as const) {
    const fewest: number[] = [];
    const peer: number[] = [];
    let posts = 0, proven = false, guaranteed = 0;
    for (let run = 0; run < 3; run++) {
      let t = performance.now();
      const outcome = planRoom(room, { method: "fewest", timeLimit: 10 });
      fewest.push(performance.now() - t);
      t = performance.now();
      const alone = planRoom(room, { method: "guaranteed", certify: false });
      peer.push(performance.now() - t);
      if (outcome.ok && alone.ok) {
        posts = outcome.planned.plan.posts.length;
        proven = outcome.planned.plan.proven;
        guaranteed = alone.planned.plan.posts.length;
      }
    }
    rows.push(`| ${name} | 5000 | ${median(fewest).toFixed(0)} | ${posts} | ${proven ? "yes" : "no"} | ${median(peer).toFixed(0)} | ${guaranteed} |`);
  }
  return rows;
}

function hallRows(): string[] {
  const room = sawHall(300, 5, 20);
  const t = performance.now();
  const outcome = planRoom(room, { method: "fewest", timeLimit: 1 });
  const ms = performance.now() - t;
  if (!outcome.ok) return [`hall: invalid (${outcome.problems[0].message})`];
  const p = outcome.planned;
  return [
    "| room | corners | obstacles | limit s | ms | fewest posts | lower bound | guaranteed posts |",
    "| --- | ---: | ---: | ---: | ---: | ---: | ---: | ---: |",
    `| saw hall with vitrines | ${p.vertices} | ${p.obstacles} | 1 | ${ms.toFixed(0)} | ${p.plan.posts.length} | ${p.plan.lowerBound ?? "-"} | ${p.guaranteed.posts.length} |`,
  ];
}

async function probe(url: string, untilDone: Promise<unknown> | null, count: number): Promise<number[]> {
  const latencies: number[] = [];
  let done = false;
  void untilDone?.then(() => (done = true));
  while (untilDone ? !done : latencies.length < count) {
    const t = performance.now();
    const response = await fetch(url);
    await response.text();
    if (response.status !== 200) throw new Error(`health answered ${response.status}`);
    latencies.push(performance.now() - t);
    await new Promise((resolve) => setTimeout(resolve, 50));
  }
  return latencies;
}

async function responsivenessRows(): Promise<string[]> {
  const server = createServer((_, response) => {
    response.writeHead(200, { "content-type": "application/json" });
    response.end(JSON.stringify({ status: "ok" }));
  });
  await new Promise<void>((resolve) => server.listen(0, "127.0.0.1", resolve));
  const url = `http://127.0.0.1:${(server.address() as AddressInfo).port}/health`;
  const baseline = await probe(url, null, 60);
  const pool = new PlanPool({ queue: 8 });
  let peak = process.memoryUsage().rss;
  const sampler = setInterval(() => (peak = Math.max(peak, process.memoryUsage().rss)), 100);
  const rooms = [nearCircle(5000), star(5000), sawHall(2498, 0, 0), sawHall(2400, 4, 6)];
  const began = performance.now();
  const jobs = Promise.all(
    rooms.map((room, i) =>
      pool.run({ kind: "report", named: { name: `room ${i + 1}`, room }, options: { timeLimitSeconds: 2 } }, { seconds: 7 }),
    ),
  );
  const busy = await probe(url, jobs, 0);
  const answers = await jobs;
  const wall = performance.now() - began;
  clearInterval(sampler);
  await pool.close();
  server.close();
  const stopped = answers.filter((a) => a.status === "stopped").length;
  const failed = answers.filter((a) => a.status === "failed").length;
  return [
    `Pool of ${pool.size} planning thread(s); four previews (2 s fewest limit, 7 s deadline) took ${(wall / 1000).toFixed(1)} s; ${stopped} ended at the deadline with the guaranteed plan, ${failed} failed.`,
    "",
    "| health probe | requests | p50 ms | p95 ms | max ms |",
    "| --- | ---: | ---: | ---: | ---: |",
    `| nothing planning (peer) | ${baseline.length} | ${median(baseline).toFixed(1)} | ${percentile(baseline, 0.95).toFixed(1)} | ${Math.max(...baseline).toFixed(1)} |`,
    `| four 5,000-corner previews | ${busy.length} | ${median(busy).toFixed(1)} | ${percentile(busy, 0.95).toFixed(1)} | ${Math.max(...busy).toFixed(1)} |`,
    "",
    `Peak resident memory of the process (threads included): ${(peak / 2 ** 20).toFixed(0)} MB (target under 1,536 MB).`,
  ];
}

export default async function (): Promise<string> {
  const rows = [
    "Easy large rooms (kernel fast path):",
    "",
    ...easyRows(),
    "",
    "A large hall at a short limit:",
    "",
    ...hallRows(),
    "",
    ...(await responsivenessRows()),
  ];
  return rows.join("\n");
}
