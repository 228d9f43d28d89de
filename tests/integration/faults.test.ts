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
import { startLocalSmtp } from "@/lib/server/local/smtp";
import { runMigrations } from "@/db/migrate";
import { cookieFor } from "../support/fixtures";

const PORT = 3109;
const PG_PORT = 54369;
const SMTP_PORT = 54367;
const base = `http://127.0.0.1:${PORT}`;
const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), "jigboard-fault-pg-"));
let pgc: Awaited<ReturnType<typeof startLocalPostgres>>;
let app: ChildProcess;
let worker: ChildProcess | undefined;
let smtp: Awaited<ReturnType<typeof startLocalSmtp>> | undefined;
let cookie = "";
let channelId = "";
let userId = "";

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
  userId = user;
  await c.end();
  cookie = await cookieFor(user);
  await startApp();
}, 120_000);

/** The app server as a process of its own, on this test's database, the shared storage and this test's mail port. */
async function startApp() {
  app = spawn(process.execPath, [path.join(process.cwd(), "lib", "server", "http", "serve.mjs"), "127.0.0.1", String(PORT)], {
    env: { ...process.env, DATABASE_URL: pgc.url, NODE_ENV: "production", NEXTAUTH_URL: base, SMTP_URL: `smtp://127.0.0.1:${SMTP_PORT}`, UPLOAD_PART_BYTES: String(5 * 1024 * 1024) },
    stdio: "ignore",
  });
  expect(await until(async () => (await fetch(`${base}/api/health`, { signal: AbortSignal.timeout(2000) })).status !== 0, 60_000)).toBe(true);
}

afterAll(async () => {
  app?.kill("SIGTERM");
  worker?.kill("SIGTERM");
  await smtp?.stop();
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

async function query<T = Record<string, unknown>>(sql: string, params: unknown[] = []): Promise<T[]> {
  const c = new pg.Client({ connectionString: pgc.url });
  await c.connect();
  try {
    return (await c.query(sql, params)).rows as T[];
  } finally {
    await c.end();
  }
}

describe("mail server down", () => {
  it("a call sheet stays queued while the mail server is down and is delivered exactly once when it returns", async () => {
    const [day] = await query<{ id: string }>("insert into shoot_days (channel_id, day, call_at, wrap_at) values ($1, '2027-01-09', '2027-01-09T09:00:00Z', '2027-01-09T17:00:00Z') returning id", [channelId]);
    await query("insert into shoot_day_crew (shoot_day_id, user_id, duty) values ($1, $2, 'camera')", [day!.id, userId]);
    // The worker, with the mail server not there yet; a failed send is tried again after 1 s, then 2, 4…
    worker = spawn(process.execPath, [path.join(process.cwd(), "node_modules", "tsx", "dist", "cli.mjs"), "--conditions=react-server", path.join(process.cwd(), "lib", "server", "jobs", "worker.ts")], {
      env: { ...process.env, DATABASE_URL: pgc.url, SMTP_URL: `smtp://127.0.0.1:${SMTP_PORT}`, JOB_POLL_SECONDS: "0.5", JOB_RETRY_DELAY_SECONDS: "1" },
      stdio: "ignore",
    });
    const sent = await fetch(`${base}/api/shoot-days/${day!.id}/call-sheet`, { method: "POST", headers: { cookie, origin: base, "content-type": "application/json" }, body: JSON.stringify({ message: "Bring ear defenders." }) });
    expect(sent.status).toBe(202);
    const sendId = ((await sent.json()) as { send: { id: string } }).send.id;
    // Tried and refused: still queued, with the reason, and nothing delivered.
    expect(await until(async () => ((await query<{ error: string | null }>("select error from call_sheet_sends where id = $1", [sendId]))[0]?.error ?? "").startsWith("not sent yet"), 30_000)).toBe(true);
    expect((await query<{ status: string }>("select status from call_sheet_sends where id = $1", [sendId]))[0]!.status).toBe("queued");
    expect(await query("select 1 from mail_messages")).toHaveLength(0);

    smtp = await startLocalSmtp({ port: SMTP_PORT, databaseUrl: pgc.url });
    expect(await until(async () => (await query<{ status: string }>("select status from call_sheet_sends where id = $1", [sendId]))[0]!.status === "sent", 60_000)).toBe(true);
    expect(await until(async () => (await query("select 1 from mail_messages where kind = 'call_sheet'")).length === 1, 10_000)).toBe(true);
    // Never twice: later retries do not send it again.
    await new Promise((r) => setTimeout(r, 3000));
    expect(await query("select 1 from mail_messages where kind = 'call_sheet'")).toHaveLength(1);
  }, 120_000);
});

describe("app server killed during an upload", () => {
  it("a new server process lists the parts already stored, and the upload finishes from there", async () => {
    const api = async (url: string, method = "GET", body?: unknown) => {
      const r = await fetch(`${base}${url}`, { method, headers: { cookie, origin: base, "content-type": "application/json" }, body: body === undefined ? undefined : JSON.stringify(body) });
      return { status: r.status, json: (await r.json()) as any };
    };
    const [ep] = await query<{ id: string }>("insert into episodes (channel_id, title, stage, position) values ($1, 'Upload under fire', 'editing', 0) returning id", [channelId]);
    const size = 12 * 1024 * 1024;
    const started = await api(`/api/episodes/${ep!.id}/uploads`, "POST", { fileName: "A003_C002.mp4", size, contentType: "video/mp4" });
    expect(started.status).toBe(201);
    const clipId = started.json.clip.id as string;
    const partSize = started.json.partSize as number;
    const count = started.json.partCount as number;
    expect(count).toBe(3);
    const bytes = Buffer.alloc(size, 7);
    const put = async (n: number) => {
      const { json } = await api(`/api/clips/${clipId}/parts`, "POST", { partNumbers: [n] });
      const body = bytes.subarray((n - 1) * partSize, Math.min(size, n * partSize));
      const r = await fetch(json.urls[0].url, { method: "PUT", body: new Blob([body as Uint8Array<ArrayBuffer>]) });
      expect(r.ok).toBe(true);
    };
    await put(1);
    await put(2);
    // The server dies mid-upload; the parts are in storage, not in the server.
    app.kill("SIGKILL");
    await new Promise((r) => app.once("exit", r));
    expect(await fetch(`${base}/api/health`).then(() => "up", () => "down")).toBe("down");
    await startApp();
    const stored = await api(`/api/clips/${clipId}/parts`);
    expect(stored.status).toBe(200);
    expect(stored.json.parts.map((p: { partNumber: number }) => p.partNumber)).toEqual([1, 2]);
    await put(3);
    const done = await api(`/api/clips/${clipId}/complete`, "POST");
    expect(done.status).toBe(200);
    expect(done.json.clip.sizeBytes).toBe(size);
  }, 120_000);
});
