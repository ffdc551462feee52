// `npm run --silent roster -- SCENARIO.json` (or `-` for stdin): one JSON document on stdout (scripts/README.md), logs on stderr.
// Exit 0 = valid input answered, 2 = invalid input (errors name the field), 1 = internal failure.
import { readFileSync } from "node:fs";
import { buildRoster } from "@/lib/scheduling/engine";
import { resultToJson } from "@/lib/scheduling/output";
import { parseScenario } from "@/lib/scheduling/scenario";

async function main(): Promise<number> {
  const file = process.argv.slice(2).find((a) => !a.startsWith("--"));
  if (!file) {
    process.stdout.write(JSON.stringify({ errors: [{ field: "(arguments)", message: "usage: npm run --silent roster -- SCENARIO.json (or - for standard input)" }] }) + "\n");
    return 2;
  }
  let text: string;
  try {
    text = readFileSync(file === "-" ? 0 : file, "utf8");
  } catch (error) {
    process.stdout.write(JSON.stringify({ errors: [{ field: "(file)", message: `cannot read ${file}: ${(error as Error).message}` }] }) + "\n");
    return 2;
  }
  let json: unknown;
  try {
    json = JSON.parse(text);
  } catch (error) {
    process.stdout.write(JSON.stringify({ errors: [{ field: "(json)", message: `${file} is not valid JSON: ${(error as Error).message}` }] }) + "\n");
    return 2;
  }
  const parsed = parseScenario(json);
  if (!parsed.ok) {
    process.stdout.write(JSON.stringify({ errors: parsed.errors }, null, 2) + "\n");
    return 2;
  }
  const result = await buildRoster(parsed.scenario);
  console.error(`roster: ${result.roster.shifts.length} shifts, ${result.roster.unfilled.length} unfilled slots, ${result.violations.length} violations, ${Math.round(result.stats.ms.total)} ms (${result.stats.coverStatus})`);
  process.stdout.write(JSON.stringify(resultToJson(parsed.scenario, result), null, 2) + "\n");
  return 0;
}

main().then(
  (code) => process.exit(code),
  (error) => {
    console.error(error);
    process.stdout.write(JSON.stringify({ errors: [{ field: "(internal)", message: String((error as Error)?.message ?? error) }] }) + "\n");
    process.exit(1);
  },
);
