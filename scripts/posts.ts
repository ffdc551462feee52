// `npm run --silent posts -- [--guaranteed-only] [--sight-range M] [--time-limit S] FILE...`
// Plans posts for every room in the GeoJSON files ("-" reads standard input) and prints one JSON
// document {rooms, errors} on stdout; logs go to stderr. Exit 0 when all input was valid, 2 when
// some was not (the valid rooms are still answered), 1 on an internal failure.
// Contract: scripts/README.md.
import { readFileSync } from "node:fs";
import { roomsFromGeoJson } from "../lib/geometry/geojson";
import { planRoomReport, type RoomErrorEntry, type RoomReport, type RoomReportOptions } from "../lib/guarding/room-report";

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

function main(): number {
  const commandLine = readCommandLine(process.argv.slice(2));
  if (typeof commandLine === "string") {
    console.error(commandLine === USAGE ? USAGE : `posts: ${commandLine}\n${USAGE}`);
    process.stdout.write(`${JSON.stringify({ rooms: [], errors: [{ room: null, code: "usage", message: commandLine }] }, null, 2)}\n`);
    return 2;
  }
  const rooms: RoomReport[] = [];
  const errors: (RoomErrorEntry | { room: string; code: string; message: string })[] = [];
  let internalFailure = false;
  for (const file of commandLine.files) {
    const label = file === "-" ? "stdin" : file;
    let value: unknown;
    try {
      value = JSON.parse(readInput(file));
    } catch (error) {
      const unreadable = (error as NodeJS.ErrnoException).code !== undefined;
      errors.push({
        room: label,
        code: unreadable ? "unreadable-file" : "bad-json",
        message: unreadable ? `${label}: cannot read the file (${(error as Error).message})` : `${label}: not valid JSON (${(error as Error).message})`,
      });
      continue;
    }
    const parsed = roomsFromGeoJson(value, label.split("/").pop() ?? label);
    errors.push(...parsed.errors);
    for (const named of parsed.rooms) {
      try {
        const outcome = planRoomReport(named, commandLine.options);
        if (outcome.ok) {
          rooms.push(outcome.report);
          console.error(`posts: ${named.name}: ${outcome.report.guaranteed.posts.length} guaranteed posts (bound ${outcome.report.bound})`);
        } else {
          errors.push(...outcome.errors);
          console.error(`posts: ${named.name}: ${outcome.errors[0].message}`);
        }
      } catch (error) {
        internalFailure = true;
        console.error(`posts: internal failure on ${named.name}:`, error);
        errors.push({ room: named.name, code: "internal", message: `${named.name}: internal failure (${(error as Error).message})` });
      }
    }
  }
  process.stdout.write(`${JSON.stringify({ rooms, errors }, null, 2)}\n`);
  return internalFailure ? 1 : errors.length > 0 ? 2 : 0;
}

try {
  process.exitCode = main();
} catch (error) {
  console.error("posts: internal failure:", error);
  process.exitCode = 1;
}
