// Runs every benchmark in tests/bench (files named *.bench.ts) and prints their tables.
// Each benchmark module exports `default async function (): Promise<string>` returning Markdown.
// Usage: npm run bench [-- NAME...]   (NAME filters by file name, e.g. `npm run bench -- roster`)
import { readdirSync } from "node:fs";
import { fileURLToPath, pathToFileURL } from "node:url";
import path from "node:path";

const folder = path.dirname(fileURLToPath(import.meta.url));
const wanted = process.argv.slice(2);
const files = readdirSync(folder)
  .filter((name) => name.endsWith(".bench.ts"))
  .filter((name) => wanted.length === 0 || wanted.some((w) => name.includes(w)))
  .sort();

if (files.length === 0) {
  console.error(`no benchmark matches ${wanted.join(", ") || "(all)"} in ${folder}`);
  process.exit(1);
}
for (const name of files) {
  const bench = (await import(pathToFileURL(path.join(folder, name)).href)) as {
    default: () => Promise<string>;
  };
  console.log(`\n## ${name.replace(/\.bench\.ts$/, "")}\n`);
  console.log(await bench.default());
}
