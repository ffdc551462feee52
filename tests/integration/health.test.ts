// GET /api/health: 200 ok with the real database up; 503 degraded when PostgreSQL cannot be
// reached (a closed port) or does not answer (a port that accepts but never speaks).
import { afterAll, describe, expect, it } from "vitest";
import net from "node:net";
import { createDb } from "@/db";
import { checkHealth } from "@/lib/health";
import { requireDatabaseUrl } from "./support/database";

/** A port on 127.0.0.1 that nothing listens on (bound, then released). */
async function closedPort(): Promise<number> {
  const server = net.createServer();
  await new Promise<void>((resolve) => server.listen(0, "127.0.0.1", resolve));
  const { port } = server.address() as net.AddressInfo;
  await new Promise<void>((resolve) => server.close(() => resolve()));
  return port;
}

describe("health", () => {
  const handles: { destroy(): Promise<void> }[] = [];
  afterAll(async () => {
    for (const handle of handles) await handle.destroy();
  });

  it("is ok when PostgreSQL answers", async () => {
    const db = createDb(requireDatabaseUrl());
    handles.push(db);
    expect(await checkHealth(db)).toEqual({ httpStatus: 200, body: { status: "ok", database: "up" } });
  });

  it("is degraded when the database port is closed", async () => {
    const db = createDb(`postgres://sightward@127.0.0.1:${await closedPort()}/sightward`, { connectionTimeoutMillis: 2000 });
    handles.push(db);
    expect(await checkHealth(db)).toEqual({ httpStatus: 503, body: { status: "degraded", database: "down" } });
  });

  it("is degraded when the database accepts a connection but never answers", async () => {
    const sockets: net.Socket[] = [];
    const silent = net.createServer((socket) => sockets.push(socket));
    await new Promise<void>((resolve) => silent.listen(0, "127.0.0.1", resolve));
    const { port } = silent.address() as net.AddressInfo;
    const db = createDb(`postgres://sightward@127.0.0.1:${port}/sightward`, { connectionTimeoutMillis: 10_000 });
    try {
      expect(await checkHealth(db, 500)).toEqual({ httpStatus: 503, body: { status: "degraded", database: "down" } });
    } finally {
      for (const socket of sockets) socket.destroy();
      await new Promise<void>((resolve) => silent.close(() => resolve()));
      await db.destroy().catch(() => undefined);
    }
  });

  it("the route handler answers 200 with the JSON body from DATABASE_URL", async () => {
    requireDatabaseUrl();
    const { GET, dynamic } = await import("@/app/api/health/route");
    expect(dynamic).toBe("force-dynamic");
    const response = await GET();
    expect(response.status).toBe(200);
    expect(response.headers.get("content-type")).toMatch(/application\/json/);
    expect(await response.json()).toEqual({ status: "ok", database: "up" });
    const { db } = await import("@/db");
    handles.push(db);
  });
});
