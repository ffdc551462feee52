// `npm run --silent posts -- [--guaranteed-only] [--sight-range M] [--time-limit S] FILE...`
// Plans posts for every room in the GeoJSON files ("-" reads standard input) and prints one JSON
// document {rooms, errors} on stdout; logs go to stderr. Exit 0 when all input was valid, 2 when
// some was not (the valid rooms are still answered), 1 on an internal failure.
// Contract: scripts/README.md. The rooms are planned in parallel in the planning pool (worker
// threads, cores less one; SIGHTWARD_PLAN_WORKERS), answered in input order; each room has a hard
// deadline of its time limit plus SIGHTWARD_PLAN_OVERHEAD_SECONDS (default here 120), after which
// it answers the best plan then known with stoppedBecause "deadline".
import { readFileSync } from "node:fs";
import { roomsFromGeoJson, type NamedRoom } from "../lib/geometry/geojson";
import { PlanPool } from "../lib/guarding/plan-pool";
import { planOverheadSeconds } from "../lib/guarding/fewest-preview";
import { stoppedRoomReport, type RoomErrorEntry, type RoomOutcome, type RoomReport, type RoomReportOptions } from "../lib/guarding/room-report";

interface CommandLine {
  options: RoomReportOptions;
  files: string[];
}

const USAGE = "usage: npm run --silent posts -- [--guaranteed-only] [--sight-range M] [--time-limit S] FILE...  ('-' reads stdin)";

function readCommandLine(args: string[]): CommandLine | string {
  const options: RoomReportOptions = {};
  const files: string[] = [];
  const positiveNumber = (flag: string, value: string | undefined): number | string => {
    const n = Number(value);
    return value !== undefined && value.trim() !== "" && Number.isFinite(n) && n > 0 ? n : `${flag} needs a positive number, got ${value ?? "nothing"}`;
  };
  for (let i = 0; i < args.length; i++) {
    const arg = args[i];
    const [flag, inline] = arg.startsWith("--") && arg.includes("=") ? [arg.slice(0, arg.indexOf("=")), arg.slice(arg.indexOf("=") + 1)] : [arg, undefined];
    if (flag === "--guaranteed-only") options.guaranteedOnly = true;
    else if (flag === "--sight-range" || flag === "--time-limit") {
      const value = positiveNumber(flag, inline ?? args[++i]);
      if (typeof value === "string") return value;
      if (flag === "--sight-range") options.sightRange = value;
      else options.timeLimitSeconds = value;
    } else if (flag === "--help" || flag === "-h") return USAGE;
    else if (flag.startsWith("--")) return `unknown option ${flag}`;
    else files.push(arg);
  }
  if (files.length === 0) return "no input files";
  return { options, files };
}

function readInput(file: string): string {
  return file === "-" ? readFileSync(0, "utf8") : readFileSync(file, "utf8");
}

type ErrorEntry = RoomErrorEntry | { room: string; code: string; message: string };


async function planInPool(pool: PlanPool, named: NamedRoom, options: RoomReportOptions): Promise<RoomOutcome | { internal: string }> {
  const seconds = (options.guaranteedOnly ? 0 : (options.timeLimitSeconds ?? 10)) + planOverheadSeconds(120);
  const answer = await pool.run(
    { kind: "report", named, options },
    {
      seconds,
      onProgress: (progress) => {
        const best = progress.best;
        const plan = best ? `, best ${best.posts.length} posts (${best.method})` : "";
        console.error(`posts: ${named.name}: ${progress.stage} done at ${Math.round(progress.ms)} ms${plan}`);
      },
    },
  );
  if (answer.status === "done") return answer.result.kind === "report" ? answer.result.outcome : { internal: "the planner answered another kind of job" };
  if (answer.status === "failed") return { internal: answer.message };
  const report = answer.reason === "cancelled" || answer.reason === "shutdown" ? null : stoppedRoomReport(named, options, answer.progress, answer.reason);
  if (report) return { ok: true, report };
  return {
    ok: false,
    errors: [{ room: named.name, code: "planning-deadline", message: `${named.name}: planning stopped (${answer.reason}) after ${Math.round(seconds)} s before the guaranteed plan was ready` }],
  };
}

async function main(): Promise<number> {
  const commandLine = readCommandLine(process.argv.slice(2));
  if (typeof commandLine === "string") {
    console.error(commandLine === USAGE ? USAGE : `posts: ${commandLine}\n${USAGE}`);
    process.stdout.write(`${JSON.stringify({ rooms: [], errors: [{ room: null, code: "usage", message: commandLine }] }, null, 2)}\n`);
    return 2;
  }
  const pool = new PlanPool({ queue: Number.MAX_SAFE_INTEGER });
  // Every room is queued at once; the answers are gathered in input order.
  const work: ({ named: NamedRoom; answer: Promise<RoomOutcome | { internal: string }> } | { errors: ErrorEntry[] })[] = [];
  for (const file of commandLine.files) {
    const label = file === "-" ? "stdin" : file;
    let value: unknown;
    try {
      value = JSON.parse(readInput(file));
    } catch (error) {
      const unreadable = (error as NodeJS.ErrnoException).code !== undefined;
      work.push({
        errors: [
          {
            room: label,
            code: unreadable ? "unreadable-file" : "bad-json",
            message: unreadable ? `${label}: cannot read the file (${(error as Error).message})` : `${label}: not valid JSON (${(error as Error).message})`,
          },
        ],
      });
      continue;
    }
    const parsed = roomsFromGeoJson(value, label.split("/").pop() ?? label);
    work.push({ errors: parsed.errors });
    for (const named of parsed.rooms) work.push({ named, answer: planInPool(pool, named, commandLine.options) });
  }
  const rooms: RoomReport[] = [];
  const errors: ErrorEntry[] = [];
  let internalFailure = false;
  try {
    for (const item of work) {
      if ("errors" in item) {
        errors.push(...item.errors);
        continue;
      }
      const { named } = item;
      const outcome = await item.answer;
      if ("internal" in outcome) {
        internalFailure = true;
        console.error(`posts: internal failure on ${named.name}: ${outcome.internal}`);
        errors.push({ room: named.name, code: "internal", message: `${named.name}: internal failure (${outcome.internal})` });
      } else if (outcome.ok) {
        rooms.push(outcome.report);
        const stopped = outcome.report.stoppedBecause === "deadline" || outcome.report.stoppedBecause === "memory-limit" ? `, stopped: ${outcome.report.stoppedBecause}` : "";
        console.error(`posts: ${named.name}: ${outcome.report.guaranteed.posts.length} guaranteed posts (bound ${outcome.report.bound})${stopped}`);
      } else {
        errors.push(...outcome.errors);
        console.error(`posts: ${named.name}: ${outcome.errors[0].message}`);
      }
    }
  } finally {
    await pool.close();
  }
  process.stdout.write(`${JSON.stringify({ rooms, errors }, null, 2)}\n`);
  return internalFailure ? 1 : errors.length > 0 ? 2 : 0;
}

main().then(
  (code) => {
    process.exitCode = code;
  },
  (error) => {
    console.error("posts: internal failure:", error);
    process.exitCode = 1;
  },
);
