/**
 * `npm start`: local services → migrations → demo seed (once) → build if
 * needed → the app (lib/server/http/serve.mjs) on 127.0.0.1. Ctrl-C or SIGTERM stops everything
 * this process started; a second start reuses the data in .data/.
 */
import { spawn, spawnSync } from "node:child_process";
import path from "node:path";
import { drizzle } from "drizzle-orm/node-postgres";
import pg from "pg";
import { authSecret, demoPutObject, startLocalServices } from "./services";
import { buildIsStale } from "./build-check";
import { LOCAL_PORTS } from "../../env";
import { seedDemo } from "../../../db/seed";
import * as schema from "../../../db/schema";

const root = process.cwd();
const dataRoot = path.join(root, ".data");
const port = Number(process.env.PORT ?? 3000);
const dev = process.argv.includes("--dev");

async function main() {
  const services = await startLocalServices({ dataRoot, ports: LOCAL_PORTS, database: "jigboard", appUrl: process.env.NEXTAUTH_URL ?? `http://127.0.0.1:${port}` });
  const running: { child?: ReturnType<typeof spawn>; worker?: ReturnType<typeof spawn> } = {};
  let stopping = false;
  const shutdown = async (code = 0) => {
    if (stopping) return;
    stopping = true;
    console.log("\n[jigboard] stopping…");
    for (const c of [running.child, running.worker]) {
      if (!c?.pid) continue;
      try {
        process.kill(-c.pid, "SIGTERM");
      } catch {
        /* already gone */
      }
    }
    await services.stop();
    process.exit(code);
  };
  process.on("SIGINT", () => void shutdown(0));
  process.on("SIGTERM", () => void shutdown(0));

  const seedWanted = process.env.SEED_DEMO ? /^(1|true|yes)$/i.test(process.env.SEED_DEMO) : services.localDatabase;
  if (seedWanted) {
    const pool = new pg.Pool({ connectionString: services.env.DATABASE_URL });
    const seeded = await seedDemo(drizzle(pool, { schema }), { putObject: await demoPutObject(services.env) });
    await pool.end();
    console.log(seeded ? "[seed] demo scenario created" : "[seed] data present, demo not re-seeded");
  }

  // Abandoned footage uploads (started more than a day ago) are aborted at every start.
  Object.assign(process.env, services.env, { NEXTAUTH_SECRET: authSecret(dataRoot) });
  try {
    // The same service as the owner's cleanup route.
    const { cleanupAbandonedUploads } = await import("../services/upload-cleanup");
    const { closeDb } = await import("../../../db/client");
    const { abortedUploads, removedClips } = await cleanupAbandonedUploads();
    await closeDb();
    if (abortedUploads || removedClips) console.log(`[cleanup] aborted ${abortedUploads} abandoned uploads, removed ${removedClips} unfinished clips`);
  } catch (e) {
    console.error("[cleanup] skipped:", (e as Error).message);
  }

  const childEnv = {
    ...process.env,
    ...services.env,
    NEXTAUTH_SECRET: authSecret(dataRoot),
    NEXTAUTH_URL: process.env.NEXTAUTH_URL ?? `http://127.0.0.1:${port}`,
    NEXT_TELEMETRY_DISABLED: "1",
  };
  const nextBin = path.join(root, "node_modules", "next", "dist", "bin", "next");

  if (!dev && buildIsStale(root)) {
    console.log("[jigboard] building (about half a minute)…");
    const b = spawnSync(process.execPath, [nextBin, "build"], { stdio: "inherit", env: { ...childEnv, NODE_ENV: "production" } });
    if (b.status !== 0) return shutdown(b.status ?? 1);
  }

  const child = spawn(process.execPath, [path.join(root, "lib", "server", "http", "serve.mjs"), "127.0.0.1", String(port), ...(dev ? ["--dev"] : [])], {
    stdio: "inherit",
    env: childEnv,
    detached: true,
  });
  running.child = child;
  child.on("exit", (code) => void shutdown(code ?? 0));
  // The job worker (call-sheet mail) as its own process, as it would run in production.
  running.worker = spawn(process.execPath, [path.join(root, "node_modules", "tsx", "dist", "cli.mjs"), "--conditions=react-server", path.join(root, "lib", "server", "jobs", "worker.ts")], { stdio: "inherit", env: childEnv, detached: true });
  console.log(`[jigboard] serving http://127.0.0.1:${port}`);
}

main().catch((e) => {
  console.error(e);
  process.exit(1);
});
