// Backups of the museum's database with PostgreSQL's own tools (pg_dump / pg_restore from Debian's
// postgresql packages), against DATABASE_URL (default: the cluster `npm start` runs).
//   npm run backup [-- FILE]    writes a custom-format dump (default backups/sightward-<time>.dump)
//   npm run restore -- FILE     replaces the database's contents with the dump, in one transaction
// A restore that fails part-way changes nothing (--single-transaction).
import { spawnSync } from "node:child_process";
import { existsSync, mkdirSync, openSync, readSync, closeSync, statSync } from "node:fs";
import { dirname, resolve } from "node:path";
import { databaseUrl } from "../db/index";

const redact = (url: string) => url.replace(/\/\/([^:@/]+):[^@/]*@/, "//$1:***@");

function run(tool: string, args: string[]): { ok: boolean; message: string } {
  const result = spawnSync(tool, args, { encoding: "utf8" });
  if (result.error) {
    const missing = (result.error as NodeJS.ErrnoException).code === "ENOENT";
    return { ok: false, message: missing ? `${tool} is not installed: apt-get install -y postgresql-client` : result.error.message };
  }
  return { ok: result.status === 0, message: (result.stderr || "").trim() };
}

/** A custom-format dump starts with the bytes "PGDMP" (PostgreSQL documentation, pg_dump -Fc). */
function looksLikeDump(file: string): boolean {
  const fd = openSync(file, "r");
  try {
    const head = Buffer.alloc(5);
    readSync(fd, head, 0, 5, 0);
    return head.toString("latin1") === "PGDMP";
  } finally {
    closeSync(fd);
  }
}

function stamp(date = new Date()): string {
  return date.toISOString().replace(/[-:]/g, "").replace("T", "-").slice(0, 15);
}

function backup(url: string, file: string): number {
  mkdirSync(dirname(file), { recursive: true });
  const done = run("pg_dump", ["--format=custom", "--no-owner", "--no-privileges", `--file=${file}`, `--dbname=${url}`]);
  if (!done.ok) {
    console.error(`backup: could not dump ${redact(url)}: ${done.message || "pg_dump failed"} (is the database running? npm start starts it)`);
    return 1;
  }
  console.error(`backup: wrote ${file} (${statSync(file).size} bytes) from ${redact(url)}`);
  return 0;
}

function restore(url: string, file: string | undefined): number {
  if (!file) {
    console.error("restore: say which dump to restore: npm run restore -- backups/sightward-<time>.dump");
    return 2;
  }
  if (!existsSync(file)) {
    console.error(`restore: ${file} does not exist`);
    return 2;
  }
  if (!looksLikeDump(file)) {
    console.error(`restore: ${file} is not a dump written by npm run backup (pg_dump custom format); nothing was changed`);
    return 2;
  }
  const done = run("pg_restore", ["--clean", "--if-exists", "--no-owner", "--no-privileges", "--single-transaction", "--exit-on-error", `--dbname=${url}`, file]);
  if (!done.ok) {
    console.error(`restore: ${file} could not be restored into ${redact(url)}; nothing was changed: ${done.message || "pg_restore failed"}`);
    return 1;
  }
  console.error(`restore: ${redact(url)} now holds the contents of ${file}`);
  return 0;
}

function main(argv: string[]): number {
  const [command, file] = argv;
  const url = databaseUrl();
  if (command === "backup") return backup(url, resolve(file ?? `backups/sightward-${stamp()}.dump`));
  if (command === "restore") return restore(url, file ? resolve(file) : undefined);
  console.error("usage: npm run backup [-- FILE] | npm run restore -- FILE");
  return 2;
}

process.exitCode = main(process.argv.slice(2));
