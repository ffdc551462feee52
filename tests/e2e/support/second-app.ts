// A second copy of the built app on a free port, with its own environment (the database-down and
// planning-pool tests). The session cookie belongs to the host, so a sign-in on the app under test
// also reaches the second copy.
import { spawn, type ChildProcess } from "node:child_process";
import { createServer } from "node:net";
import path from "node:path";

export interface SecondApp {
  url: string;
  child: ChildProcess;
  output: () => string;
  /** Sends SIGTERM and resolves with the exit once the process has ended. */
  stop: () => Promise<void>;
}

export function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const server = createServer();
    server.once("error", reject);
    server.listen(0, "127.0.0.1", () => {
      const { port } = server.address() as { port: number };
      server.close(() => resolve(port));
    });
  });
}

/** Starts `next start` on a free port with `env` over the test's environment; resolves once it serves. */
export async function startSecondApp(env: Record<string, string>): Promise<SecondApp> {
  const port = await freePort();
  const url = `http://127.0.0.1:${port}`;
  let output = "";
  const child = spawn(process.execPath, [path.resolve("node_modules/next/dist/bin/next"), "start", "-H", "127.0.0.1", "-p", String(port)], {
    env: { ...process.env, NEXTAUTH_URL: url, NEXT_TELEMETRY_DISABLED: "1", ...env },
    stdio: ["ignore", "pipe", "pipe"],
  });
  child.stdout?.on("data", (chunk) => (output += chunk));
  child.stderr?.on("data", (chunk) => (output += chunk));
  const stop = async () => {
    if (child.exitCode !== null || child.signalCode !== null) return;
    const exited = new Promise<void>((resolve) => child.once("exit", () => resolve()));
    child.kill("SIGTERM");
    await exited;
  };
  const deadline = Date.now() + 60_000;
  while (Date.now() < deadline) {
    if (child.exitCode !== null) throw new Error(`the second app exited (${child.exitCode}):\n${output}`);
    try {
      await fetch(url + "/sign-in", { redirect: "manual" });
      return { url, child, output: () => output, stop };
    } catch {
      await new Promise((resolve) => setTimeout(resolve, 250));
    }
  }
  await stop();
  throw new Error(`the second app did not start within 60 s:\n${output}`);
}
