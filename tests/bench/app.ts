/**
 * Local services and one app server for a benchmark, on ports of their own,
 * with a signed-in user; everything is removed by stop().
 */
import { spawn, spawnSync, type ChildProcess } from "node:child_process";
import fs from "node:fs";
import path from "node:path";
import crypto from "node:crypto";
import { drizzle } from "drizzle-orm/node-postgres";
import pg from "pg";
import { encode } from "next-auth/jwt";
import { startLocalServices } from "../../lib/server/local/services";
import { buildIsStale } from "../../lib/server/local/build-check";
import * as schema from "../../db/schema";

export function rssKiB(pid: number): number {
  try {
    const m = /VmRSS:\s+(\d+)/.exec(fs.readFileSync(`/proc/${pid}/status`, "utf8"));
    return m ? Number(m[1]) : 0;
  } catch {
    return 0;
  }
}

export async function startBenchApp(opts: { name: string; port: number; basePort: number; env?: Record<string, string> }) {
  const root = process.cwd();
  for (const k of ["DATABASE_URL", "S3_ENDPOINT", "SMTP_URL"]) delete process.env[k];
  const dataRoot = path.join(root, ".test-data", opts.name);
  fs.rmSync(dataRoot, { recursive: true, force: true });
  const b = opts.basePort;
  const services = await startLocalServices({ dataRoot, ports: { postgres: b, s3: b + 1, smtp: b + 2, payments: b + 3 }, database: `jigboard_${opts.name}`, fast: true, log: () => {} });
  const pool = new pg.Pool({ connectionString: services.env.DATABASE_URL });
  const db = drizzle(pool, { schema });
  const [user] = await db.insert(schema.users).values({ email: `bench-${Date.now()}@bench.example`, name: "Bench", passwordHash: "x" }).returning();
  const secret = crypto.randomBytes(32).toString("base64url");
  const env = { ...process.env, ...services.env, NEXTAUTH_SECRET: secret, NEXTAUTH_URL: `http://127.0.0.1:${opts.port}`, NODE_ENV: "production" as const, NEXT_TELEMETRY_DISABLED: "1", ...opts.env };
  const nextBin = path.join(root, "node_modules", "next", "dist", "bin", "next");
  if (buildIsStale(root)) spawnSync(process.execPath, [nextBin, "build"], { stdio: "inherit", env });
  const app: ChildProcess = spawn(process.execPath, [...(process.env.BENCH_APP_PROFILE ? ["--cpu-prof", `--cpu-prof-dir=${process.env.BENCH_APP_PROFILE}`] : []), path.join(root, "lib", "server", "http", "serve.mjs"), "127.0.0.1", String(opts.port)], { env, stdio: "ignore" });
  for (let i = 0; i < 200; i++) {
    if (await fetch(`http://127.0.0.1:${opts.port}/api/health`).then((r) => r.ok).catch(() => false)) break;
    await new Promise((r) => setTimeout(r, 250));
  }
  const cookie = `next-auth.session-token=${await encode({ token: { sub: user!.id }, secret })}`;
  return {
    services,
    db,
    pool,
    user: user!,
    app,
    cookie,
    base: `http://127.0.0.1:${opts.port}`,
    async stop() {
      app.kill("SIGTERM");
      await pool.end();
      await services.stop();
      fs.rmSync(dataRoot, { recursive: true, force: true });
    },
  };
}
