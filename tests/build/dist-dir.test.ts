// npm test must not build into the `.next` folder an `npm start` of the same checkout serves:
// next.config.mjs takes distDir from SIGHTWARD_DIST_DIR, and scripts/test.sh sets it. Checked with
// Next.js's own configuration loader (next/dist/server/config, the one `next build` and
// `next start` call), in the phases of both commands.
import { execFileSync } from "node:child_process";
import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { PHASE_PRODUCTION_BUILD, PHASE_PRODUCTION_SERVER } from "next/constants";

const ROOT = process.cwd();

// A fresh Node.js process per question: Node caches an imported next.config.mjs for good.
function distDirOf(phase: string, distDirVariable: string | undefined): string {
  const env: NodeJS.ProcessEnv & { SIGHTWARD_DIST_DIR?: string } = { ...process.env, NEXT_TELEMETRY_DISABLED: "1" };
  delete env.SIGHTWARD_DIST_DIR;
  if (distDirVariable !== undefined) env.SIGHTWARD_DIST_DIR = distDirVariable;
  const code = `const configModule = await import("next/dist/server/config.js");
    const loadConfig = configModule.default.default ?? configModule.default;
    const config = await loadConfig(${JSON.stringify(phase)}, process.cwd(), { silent: true });
    process.stdout.write(JSON.stringify(config.distDir));`;
  return JSON.parse(execFileSync(process.execPath, ["--input-type=module", "-e", code], { cwd: ROOT, env, encoding: "utf8" })) as string;
}

/** The value scripts/test.sh exports for SIGHTWARD_DIST_DIR, or null when it exports none. */
function testScriptDistDir(): string | null {
  const match = /^export SIGHTWARD_DIST_DIR=(\S+)$/m.exec(readFileSync(`${ROOT}/scripts/test.sh`, "utf8"));
  return match ? match[1]! : null;
}

describe("the build folder of npm test", () => {
  it("is not the .next folder npm start serves, and git ignores it", () => {
    const dist = testScriptDistDir();
    expect(dist).not.toBeNull();
    expect(dist).not.toBe(".next");
    const ignored = readFileSync(`${ROOT}/.gitignore`, "utf8").split("\n").map((line) => line.trim());
    expect(ignored).toContain(`${dist}/`);
  });

  it("is where next build writes and next start reads when SIGHTWARD_DIST_DIR is set", () => {
    const dist = testScriptDistDir() ?? "unset-in-test-sh";
    expect(distDirOf(PHASE_PRODUCTION_BUILD, dist)).toBe(dist);
    expect(distDirOf(PHASE_PRODUCTION_SERVER, dist)).toBe(dist);
  });

  it("stays .next for npm start, which sets no SIGHTWARD_DIST_DIR", () => {
    expect(distDirOf(PHASE_PRODUCTION_BUILD, undefined)).toBe(".next");
    expect(distDirOf(PHASE_PRODUCTION_SERVER, undefined)).toBe(".next");
  });
});
