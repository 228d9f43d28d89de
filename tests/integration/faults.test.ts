/**
 * The database goes away under a running app server and comes back: while it
 * is down every request answers 503 with a clear message (never a 500, never
 * a hang), nothing half-written is left, and once it is back the same server
 * process serves again without a restart. The server here has a PostgreSQL
 * cluster of its own, so the shared test database is never touched.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { spawn, type ChildProcess } from "node:child_process";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import pg from "pg";
import { startLocalPostgres } from "@/lib/server/local/postgres";
import { runMigrations } from "@/db/migrate";
import { cookieFor } from "../support/fixtures";

const PORT = 3109;
const PG_PORT = 54369;
const base = `http://127.0.0.1:${PORT}`;
const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), "jigboard-fault-pg-"));
let pgc: Awaited<ReturnType<typeof startLocalPostgres>>;
let app: ChildProcess;
let cookie = "";
let channelId = "";

async function until(fn: () => Promise<boolean>, ms: number) {
  const end = Date.now() + ms;
  while (Date.now() < end) {
    if (await fn().catch(() => false)) return true;
    await new Promise((r) => setTimeout(r, 200));
  }
  return false;
}

async function count(): Promise<number> {
  const c = new pg.Client({ connectionString: pgc.url });
  await c.connect();
  try {
    return Number((await c.query("select count(*)::int as n from episodes where channel_id = $1", [channelId])).rows[0].n);
  } finally {
    await c.end();
  }
}

const createEpisode = (title: string) =>
  fetch(`${base}/api/channels/${channelId}/episodes`, { method: "POST", headers: { cookie, origin: base, "content-type": "application/json" }, body: JSON.stringify({ title }), signal: AbortSignal.timeout(15_000) });

beforeAll(async () => {
  pgc = await startLocalPostgres({ dataDir, port: PG_PORT, database: "jigboard_fault", fast: true });
  await runMigrations(pgc.url);
  const c = new pg.Client({ connectionString: pgc.url });
  await c.connect();
  const user = (await c.query("insert into users (email, name, password_hash) values ('fault@test.example', 'Fault', 'x') returning id")).rows[0].id as string;
  channelId = (await c.query("insert into channels (name) values ('Fault channel') returning id")).rows[0].id as string;
  await c.query("insert into memberships (channel_id, user_id, roles) values ($1, $2, '{owner}')", [channelId, user]);
  await c.end();
  cookie = await cookieFor(user);
  app = spawn(process.execPath, [path.join(process.cwd(), "lib", "server", "http", "serve.mjs"), "127.0.0.1", String(PORT)], {
    env: { ...process.env, DATABASE_URL: pgc.url, NODE_ENV: "production", NEXTAUTH_URL: base },
    stdio: "ignore",
  });
  expect(await until(async () => (await fetch(`${base}/api/health`)).ok, 60_000)).toBe(true);
}, 120_000);

afterAll(async () => {
  app?.kill("SIGTERM");
  await pgc?.stop();
  fs.rmSync(dataDir, { recursive: true, force: true });
});

describe("database restarted during a run", () => {
  it("503 with a clear message while it is down, served again after, nothing half-written", async () => {
    expect((await createEpisode("Before the restart")).status).toBe(201);
    await pgc.stop();
    const down = await createEpisode("While it is down");
    expect(down.status).toBe(503);
    expect(down.headers.get("retry-after")).toBe("5");
    expect((await down.json()).error).toEqual({ code: "unavailable:database", message: "The database is not answering just now, so nothing was saved. Try again in a moment." });
    const read = await fetch(`${base}/api/channels/${channelId}/episodes`, { headers: { cookie }, signal: AbortSignal.timeout(15_000) });
    expect(read.status).toBe(503);
    const health = await fetch(`${base}/api/health`, { signal: AbortSignal.timeout(15_000) });
    expect(health.status).toBe(503);

    pgc = await startLocalPostgres({ dataDir, port: PG_PORT, database: "jigboard_fault", fast: true });
    // The same server process, not restarted, serves again once its pool reconnects.
    expect(await until(async () => (await createEpisode("After the restart")).status === 201, 30_000)).toBe(true);
    const titles = await count();
    expect(titles).toBe(2);
  }, 120_000);
});
