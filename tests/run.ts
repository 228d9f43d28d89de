/**
 * `npm test`: starts a throw-away PostgreSQL cluster, the S3 and SMTP fakes on
 * test ports, migrates and seeds, builds the app if stale, serves it on
 * 127.0.0.1:3100, then runs vitest (unit + integration) and Playwright (e2e)
 * and prints one line "N passed, N failed" for all suites.
 */
import { spawn, spawnSync } from "node:child_process";
import fs from "node:fs";
import path from "node:path";
import crypto from "node:crypto";
import { drizzle } from "drizzle-orm/node-postgres";
import pg from "pg";
import { demoPutObject, startLocalServices } from "../lib/server/local/services";
import { seedDemo } from "../db/seed";
import * as schema from "../db/schema";
import { buildIsStale } from "../lib/server/local/build-check";

const root = process.cwd();
const dataRoot = path.join(root, ".test-data");
const artifacts = path.join(root, "tests", ".artifacts");
const appPort = Number(process.env.TEST_APP_PORT ?? 3100);
const SUITES = ["static", "unit", "integration", "e2e"];
const only = process.argv.slice(2).filter((a) => SUITES.includes(a));
// Anything else (a spec file, --grep) goes to Playwright, for running one e2e test while working on it.
const playwrightArgs = process.argv.slice(2).filter((a) => !SUITES.includes(a));
const want = (suite: string) => only.length === 0 || only.includes(suite);

// Tests always use their own local services, never a configured real one.
for (const k of ["DATABASE_URL", "S3_ENDPOINT", "SMTP_URL", "NEXTAUTH_SECRET", "NEXTAUTH_URL", "STRIPE_SECRET_KEY", "STRIPE_WEBHOOK_SECRET"]) delete process.env[k];

function run(cmd: string, args: string[], env: NodeJS.ProcessEnv): Promise<number> {
  return new Promise((resolve) => {
    const p = spawn(cmd, args, { stdio: "inherit", env });
    p.on("exit", (code) => resolve(code ?? 1));
  });
}

async function waitFor(url: string, ms: number) {
  const end = Date.now() + ms;
  while (Date.now() < end) {
    try {
      const r = await fetch(url);
      if (r.ok) return;
    } catch {
      /* not up yet */
    }
    await new Promise((r) => setTimeout(r, 300));
  }
  throw new Error(`${url} did not answer within ${ms} ms`);
}

function countVitest(file: string) {
  if (!fs.existsSync(file)) return { passed: 0, failed: 1 };
  const r = JSON.parse(fs.readFileSync(file, "utf8")) as { numPassedTests: number; numFailedTests: number; numTotalTestSuites: number; testResults: { status: string; assertionResults: unknown[] }[] };
  // A test file that failed to load has no assertions; count it as a failure.
  const brokenFiles = r.testResults.filter((t) => t.status === "failed" && t.assertionResults.length === 0).length;
  return { passed: r.numPassedTests, failed: r.numFailedTests + brokenFiles };
}

function countPlaywright(file: string) {
  if (!fs.existsSync(file)) return { passed: 0, failed: 1 };
  const r = JSON.parse(fs.readFileSync(file, "utf8")) as { stats: { expected: number; unexpected: number; flaky: number }; errors?: unknown[] };
  return { passed: r.stats.expected + r.stats.flaky, failed: r.stats.unexpected + (r.errors?.length ?? 0) };
}

async function main() {
  fs.rmSync(dataRoot, { recursive: true, force: true });
  fs.mkdirSync(artifacts, { recursive: true });
  const services = await startLocalServices({
    dataRoot,
    ports: { postgres: 54339, s3: 54340, smtp: 54335, payments: 54336 },
    appUrl: `http://127.0.0.1:${appPort}`,
    database: "jigboard_test",
    fast: true,
    log: (m) => console.log(`[test] ${m}`),
  });
  let app: ReturnType<typeof spawn> | undefined;
  let appB: ReturnType<typeof spawn> | undefined;
  let worker: ReturnType<typeof spawn> | undefined;
  const totals = { passed: 0, failed: 0 };
  const stop = async () => {
    for (const c of [app, appB, worker]) {
      if (!c?.pid) continue;
      try {
        process.kill(-c.pid, "SIGTERM");
      } catch {
        /* gone */
      }
    }
    await services.stop();
  };
  process.on("SIGINT", () => void stop().then(() => process.exit(130)));

  try {
    const pool = new pg.Pool({ connectionString: services.env.DATABASE_URL });
    await seedDemo(drizzle(pool, { schema }), { putObject: await demoPutObject(services.env) });
    await pool.end();

    const env: NodeJS.ProcessEnv = {
      ...process.env,
      ...services.env,
      NEXTAUTH_SECRET: crypto.randomBytes(32).toString("base64url"),
      NEXTAUTH_URL: `http://127.0.0.1:${appPort}`,
      JIGBOARD_TEST_URL: `http://127.0.0.1:${appPort}`,
      JIGBOARD_TEST_URL_B: `http://127.0.0.1:${appPort + 1}`,
      NEXT_TELEMETRY_DISABLED: "1",
      SIGN_IN_MAX_FAILURES: "5",
      // The tests act as the proxy in front of the app: X-Forwarded-For names the client.
      TRUST_PROXY: "true",
      // Small parts so the browser tests see several parts on a small file.
      UPLOAD_PART_BYTES: String(5 * 1024 * 1024),
    };
    const nextBin = path.join(root, "node_modules", "next", "dist", "bin", "next");

    if (want("integration") || want("e2e")) {
      if (buildIsStale(root)) {
        console.log("[test] building the app…");
        const b = spawnSync(process.execPath, [nextBin, "build"], { stdio: "inherit", env: { ...env, NODE_ENV: "production" } });
        if (b.status !== 0) throw new Error("next build failed");
      }
      app = spawn(process.execPath, [path.join(root, "lib", "server", "http", "serve.mjs"), "127.0.0.1", String(appPort)], {
        env: { ...env, NODE_ENV: "production" },
        stdio: ["ignore", fs.openSync(path.join(artifacts, "app.log"), "w"), fs.openSync(path.join(artifacts, "app.err.log"), "w")],
        detached: true,
      });
      // A second instance on the same database and storage, as behind a load balancer: live updates must cross between them.
      appB = spawn(process.execPath, [path.join(root, "lib", "server", "http", "serve.mjs"), "127.0.0.1", String(appPort + 1)], {
        env: { ...env, NODE_ENV: "production", NEXTAUTH_URL: `http://127.0.0.1:${appPort + 1}` },
        stdio: ["ignore", fs.openSync(path.join(artifacts, "app-b.log"), "w"), fs.openSync(path.join(artifacts, "app-b.err.log"), "w")],
        detached: true,
      });
      await waitFor(`http://127.0.0.1:${appPort}/api/health`, 60_000);
      await waitFor(`http://127.0.0.1:${appPort + 1}/api/health`, 60_000);
      console.log(`[test] app on http://127.0.0.1:${appPort} and a second instance on http://127.0.0.1:${appPort + 1}`);
      // The job worker, as npm start runs it: queued call sheets are mailed by it.
      worker = spawn(process.execPath, [path.join(root, "node_modules", "tsx", "dist", "cli.mjs"), "--conditions=react-server", path.join(root, "lib", "server", "jobs", "worker.ts")], {
        env: { ...env, JOB_POLL_SECONDS: "0.5" },
        stdio: ["ignore", fs.openSync(path.join(artifacts, "worker.log"), "w"), fs.openSync(path.join(artifacts, "worker.err.log"), "w")],
        detached: true,
      });
    }

    if (want("static")) {
      // Type check and lint count as one check each.
      for (const [name, args] of [
        ["typecheck", [path.join(root, "node_modules", "typescript", "bin", "tsc"), "--noEmit", "-p", "."]],
        ["lint", [path.join(root, "node_modules", "eslint", "bin", "eslint.js"), "."]],
      ] as const) {
        const code = await run(process.execPath, [...args], env);
        console.log(`[test] ${name}: ${code === 0 ? "passed" : "failed"}`);
        if (code === 0) totals.passed += 1;
        else totals.failed += 1;
      }
    }

    const vitestSuites = ["unit", "integration"].filter(want);
    if (vitestSuites.length) {
      const out = path.join(artifacts, "vitest.json");
      fs.rmSync(out, { force: true });
      // Extra arguments name test files when only vitest suites run (e.g. `integration response-shapes`).
      const dirs = playwrightArgs.length && !want("e2e") ? playwrightArgs : vitestSuites.map((s) => `tests/${s}`);
      await run(process.execPath, [path.join(root, "node_modules", "vitest", "vitest.mjs"), "run", ...dirs, "--reporter=default", "--reporter=json", `--outputFile.json=${out}`], env);
      const c = countVitest(out);
      console.log(`[test] vitest: ${c.passed} passed, ${c.failed} failed`);
      totals.passed += c.passed;
      totals.failed += c.failed;
    }

    if (want("e2e")) {
      const out = path.join(artifacts, "playwright.json");
      fs.rmSync(out, { force: true });
      await run(process.execPath, [path.join(root, "node_modules", "@playwright", "test", "cli.js"), "test", "--config", "tests/e2e/playwright.config.ts", ...playwrightArgs], {
        ...env,
        PLAYWRIGHT_JSON_OUTPUT_NAME: out,
      });
      const c = countPlaywright(out);
      console.log(`[test] playwright: ${c.passed} passed, ${c.failed} failed`);
      totals.passed += c.passed;
      totals.failed += c.failed;
    }
  } catch (e) {
    console.error("[test] harness error:", e);
    totals.failed += 1;
  } finally {
    await stop();
  }
  console.log(`${totals.passed} passed, ${totals.failed} failed`);
  process.exit(totals.failed > 0 ? 1 : 0);
}

void main();
