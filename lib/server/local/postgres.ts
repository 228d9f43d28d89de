/**
 * Starts a private PostgreSQL cluster from Debian's package on 127.0.0.1 only.
 * Works as root (initdb and the server run as the "postgres" user, since
 * PostgreSQL refuses root) and as an ordinary user. TCP only: no socket file,
 * so long project paths do not matter.
 */
import { execFileSync, spawnSync } from "node:child_process";
import fs from "node:fs";
import path from "node:path";
import crypto from "node:crypto";
import pg from "pg";

export interface LocalPostgres {
  url: string;
  port: number;
  dataDir: string;
  startedHere: boolean;
  stop(): Promise<void>;
}

const isRoot = typeof process.getuid === "function" && process.getuid() === 0;

export function findPgBin(): string | null {
  const base = "/usr/lib/postgresql";
  if (!fs.existsSync(base)) return null;
  const versions = fs
    .readdirSync(base)
    .filter((v) => fs.existsSync(path.join(base, v, "bin", "initdb")))
    .sort((a, b) => Number(b) - Number(a));
  return versions[0] ? path.join(base, versions[0], "bin") : null;
}

function ensureInstalled(): string {
  let bin = findPgBin();
  if (bin) return bin;
  if (!isRoot) {
    throw new Error("PostgreSQL server binaries are missing. Install them with:\n  sudo apt-get install -y postgresql");
  }
  console.log("[postgres] installing Debian's postgresql package…");
  execFileSync("apt-get", ["update", "-qq"], { stdio: "inherit" });
  execFileSync("apt-get", ["install", "-y", "-qq", "postgresql"], {
    stdio: "inherit",
    env: { ...process.env, DEBIAN_FRONTEND: "noninteractive" },
  });
  bin = findPgBin();
  if (!bin) throw new Error("postgresql was installed but initdb was not found under /usr/lib/postgresql");
  return bin;
}

/** Runs a PostgreSQL binary as the postgres user when we are root. */
function runPg(bin: string, tool: string, args: string[], opts: { allowFail?: boolean } = {}) {
  const cmd = isRoot ? "runuser" : path.join(bin, tool);
  const full = isRoot ? ["-u", "postgres", "--", path.join(bin, tool), ...args] : args;
  const r = spawnSync(cmd, full, { encoding: "utf8" });
  if (r.status !== 0 && !opts.allowFail) {
    throw new Error(`${tool} failed (${r.status}): ${r.stderr || r.stdout}`);
  }
  return r;
}

/** The postgres user must be able to reach the folder; fall back to /var/tmp when a parent is private. */
function usableDataDir(wanted: string): string {
  if (!isRoot) return wanted;
  const parent = path.dirname(wanted);
  fs.mkdirSync(parent, { recursive: true });
  const probe = spawnSync("runuser", ["-u", "postgres", "--", "test", "-x", parent]);
  if (probe.status === 0) return wanted;
  const hash = crypto.createHash("sha1").update(wanted).digest("hex").slice(0, 10);
  const alt = path.join("/var/tmp", `jigboard-pg-${hash}`);
  console.log(`[postgres] ${parent} is not reachable by the postgres user; using ${alt}`);
  return alt;
}

export async function startLocalPostgres(opts: {
  dataDir: string;
  port: number;
  database: string;
  /** Test clusters trade durability for speed; the app cluster never does. */
  fast?: boolean;
}): Promise<LocalPostgres> {
  const bin = ensureInstalled();
  const dataDir = usableDataDir(path.resolve(opts.dataDir));
  const user = "jigboard";
  const url = `postgres://${user}@127.0.0.1:${opts.port}/${opts.database}`;

  if (!fs.existsSync(path.join(dataDir, "PG_VERSION"))) {
    fs.mkdirSync(dataDir, { recursive: true, mode: 0o700 });
    if (isRoot) execFileSync("chown", ["-R", "postgres:postgres", dataDir]);
    runPg(bin, "initdb", ["-D", dataDir, "-U", user, "--auth=trust", "-E", "UTF8", "--locale=C"]);
  }
  if (isRoot) execFileSync("chown", ["-R", "postgres:postgres", dataDir]);

  let startedHere = false;
  const status = runPg(bin, "pg_ctl", ["-D", dataDir, "status"], { allowFail: true });
  if (status.status !== 0) {
    const settings = [
      `-p ${opts.port}`,
      "-c listen_addresses=127.0.0.1",
      "-c unix_socket_directories=''",
      ...(opts.fast ? ["-c fsync=off", "-c synchronous_commit=off", "-c full_page_writes=off"] : []),
    ].join(" ");
    const logFile = path.join(dataDir, "server.log");
    runPg(bin, "pg_ctl", ["-D", dataDir, "-o", settings, "-l", logFile, "-w", "-t", "60", "start"]);
    startedHere = true;
  }

  // Create the database on first use.
  const admin = new pg.Client({ connectionString: `postgres://${user}@127.0.0.1:${opts.port}/postgres` });
  await admin.connect();
  try {
    const exists = await admin.query("select 1 from pg_database where datname = $1", [opts.database]);
    if (exists.rowCount === 0) await admin.query(`create database "${opts.database.replace(/"/g, "")}"`);
  } finally {
    await admin.end();
  }

  return {
    url,
    port: opts.port,
    dataDir,
    startedHere,
    async stop() {
      if (!startedHere) return;
      runPg(bin, "pg_ctl", ["-D", dataDir, "-m", "fast", "-w", "stop"], { allowFail: true });
    },
  };
}
