// Fewest plans on all 44 AGPLIB polygons (AGPLIB, Univ. of Campinas), 10 s per room: covered by the
// certificate, no worse than the guaranteed plan (the named peer, computed in the same run),
// orthogonal rooms within floor(n/4) (Kahn, Klawe & Kleitman 1983), the share proven minimal for
// n <= 200 (and proven within 5 s), and the time per room (median over rooms of up to 60 vertices,
// the editor's case, and the slowest room); then double cover on a fixed spread of nine rooms.
import { readFileSync, readdirSync } from "node:fs";
import path from "node:path";
import { fileURLToPath } from "node:url";
import { prepareRoom } from "../../lib/geometry/room";
import { triangulate } from "../../lib/geometry/triangulate";
import { planGuaranteed } from "../../lib/guarding/guaranteed";
import { planFewest } from "../../lib/guarding/fewest";
import type { Point } from "../../lib/geometry/types";

const folder = path.join(path.dirname(fileURLToPath(import.meta.url)), "../fixtures/agplib");
const TIME_LIMIT = Number(process.env.FEWEST_TIME_LIMIT ?? 10);

export default async function (): Promise<string> {
  const files = readdirSync(folder).filter((f) => f.endsWith(".geojson")).sort();
  const rows: string[] = [];
  const small: number[] = [];
  let covered = 0, noWorse = 0, orthogonal = 0, orthogonalWithin = 0, upTo200 = 0, proven = 0, provenIn5 = 0;
  const times: number[] = [];
  for (const file of files) {
    const feature = JSON.parse(readFileSync(path.join(folder, file), "utf8"));
    const rings = feature.geometry.coordinates as Point[][];
    const prepared = prepareRoom({ outline: rings[0], obstacles: rings.slice(1) });
    if (!prepared.ok) {
      rows.push(`| ${file} | invalid: ${prepared.problems[0].message} |`);
      continue;
    }
    const room = prepared.room;
    const n = room.outline.length + room.obstacles.reduce((s, o) => s + o.length, 0);
    const triangulation = triangulate(room);
    const guaranteed = planGuaranteed(room, triangulation).posts;
    const t0 = performance.now();
    const plan = planFewest(room, { triangulation, guaranteedPosts: guaranteed, timeLimit: TIME_LIMIT });
    const ms = performance.now() - t0;
    const isOrthogonal = file.startsWith("random-");
    if (plan.covered === 1) covered++;
    if (plan.posts.length <= guaranteed.length) noWorse++;
    if (isOrthogonal) {
      orthogonal++;
      if (plan.posts.length <= Math.floor(n / 4)) orthogonalWithin++;
    }
    times.push(ms);
    if (n <= 200) {
      upTo200++;
      if (plan.proven) proven++;
      if (plan.proven && ms <= 5000) provenIn5++;
    }
    if (n <= 60) small.push(ms);
    rows.push(
      `| ${file.replace(".geojson", "")} | ${n} | ${room.obstacles.length} | ${guaranteed.length} | ${plan.posts.length} | ${plan.lowerBound} (cells) | ${plan.proven ? "yes" : "no"} | ${plan.covered === 1 ? "1" : plan.covered.toFixed(6)} | ${isOrthogonal ? (plan.posts.length <= Math.floor(n / 4) ? `yes (${Math.floor(n / 4)})` : "NO") : "-"} | ${Math.round(ms)} |`,
    );
  }
  const slowest = rows.length ? Math.max(...times) : NaN;
  small.sort((a, b) => a - b);
  const median = small.length ? small[Math.floor(small.length / 2)] : NaN;
  return [
    `Time limit ${TIME_LIMIT} s per room; lower bound: witness cells (lib/guarding/lower-bound-arrangement.ts). Rooms run in file order in one process, so the first room also pays the JavaScript and WebAssembly warm-up.`,
    "",
    "| summary | value |",
    "| --- | --- |",
    `| covered (certificate) | ${covered} / ${files.length} |`,
    `| fewest <= guaranteed (peer, same run) | ${noWorse} / ${files.length} |`,
    `| orthogonal within floor(n/4) | ${orthogonalWithin} / ${orthogonal} |`,
    `| proven minimal, n <= 200 | ${proven} / ${upTo200} (${((100 * proven) / Math.max(1, upTo200)).toFixed(0)}%) |`,
    `| proven minimal within 5 s, n <= 200 | ${provenIn5} / ${upTo200} |`,
    `| median ms, n <= 60 (${small.length} rooms) | ${Math.round(median)} |`,
    `| slowest room ms | ${Math.round(slowest)} |`,
    "",
    "| room | n | h | guaranteed | fewest | lower bound | proven | covered | orthogonal <= floor(n/4) | ms |",
    "| --- | ---: | ---: | ---: | ---: | ---: | --- | --- | --- | ---: |",
    ...rows,
    "",
    `Double cover (every point seen by two posts; the guaranteed plan is no peer here) on ${DOUBLE_COVER_ROOMS.length} of the rooms, covered twice by the certificate:`,
    "",
    "| room | n | fewest | lower bound | proven | covered twice | ms |",
    "| --- | ---: | ---: | ---: | --- | --- | ---: |",
    ...doubleCoverRows(),
  ].join("\n");
}

/** A spread of sizes and kinds, fixed so runs compare. */
const DOUBLE_COVER_ROOMS = ["random-20-1", "random-40-2", "randsimple-40-1", "randsimple-60-3", "random-100-1", "randsimple-100-2", "gB_simple-simple_25_100v-10h_4", "vonkoch-20-1", "randsimple-200-4"];

function doubleCoverRows(): string[] {
  return DOUBLE_COVER_ROOMS.map((name) => {
    const feature = JSON.parse(readFileSync(path.join(folder, `${name}.geojson`), "utf8"));
    const rings = feature.geometry.coordinates as Point[][];
    const prepared = prepareRoom({ outline: rings[0], obstacles: rings.slice(1) });
    if (!prepared.ok) return `| ${name} | invalid: ${prepared.problems[0].message} |`;
    const room = prepared.room;
    const n = room.outline.length + room.obstacles.reduce((s, o) => s + o.length, 0);
    const t0 = performance.now();
    const plan = planFewest(room, { doubleCover: true, timeLimit: TIME_LIMIT });
    const ms = performance.now() - t0;
    return `| ${name} | ${n} | ${plan.posts.length} | ${plan.lowerBound} | ${plan.proven ? "yes" : "no"} | ${plan.covered === 1 ? "1" : plan.covered.toFixed(6)} | ${Math.round(ms)} |`;
  });
}
