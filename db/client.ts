import { drizzle, type NodePgDatabase } from "drizzle-orm/node-postgres";
import pg from "pg";
import * as schema from "./schema";
import { databaseConfig } from "./config";

export type Db = NodePgDatabase<typeof schema>;
export type Tx = Parameters<Parameters<Db["transaction"]>[0]>[0];
/** Either the pool or an open transaction: what a query runs on. */
export type Q = Db | Tx;

// One pool per process, kept on globalThis so dev reloads do not leak pools.
const g = globalThis as unknown as { __jigboardPool?: pg.Pool; __jigboardDb?: Db };

export function pool(): pg.Pool {
  if (!g.__jigboardPool) {
    g.__jigboardPool = new pg.Pool({ connectionString: databaseConfig().url, max: databaseConfig().poolMax });
    g.__jigboardPool.on("error", (err) => console.error("[db] idle client error", err.message));
  }
  return g.__jigboardPool;
}

const RETRYABLE = new Set(["40001", "40P01"]); // serialization failure, deadlock detected

function pgCode(e: unknown): unknown {
  return (e as { code?: unknown } | null)?.code ?? (e as { cause?: { code?: unknown } } | null)?.cause?.code;
}

/**
 * Transactions that PostgreSQL aborted as a deadlock or a serialization
 * failure are run again, a few times with jittered backoff. Callbacks only
 * touch the database, so running one again is safe.
 */
function withRetries(base: Db): Db {
  const original = base.transaction.bind(base);
  base.transaction = (async (fn: Parameters<Db["transaction"]>[0], config?: Parameters<Db["transaction"]>[1]) => {
    for (let attempt = 1; ; attempt++) {
      try {
        return await original(fn, config);
      } catch (e) {
        if (!RETRYABLE.has(pgCode(e) as string) || attempt >= 4) throw e;
        await new Promise((r) => setTimeout(r, Math.random() * 20 * 2 ** attempt));
      }
    }
  }) as Db["transaction"];
  return base;
}

export function db(): Db {
  if (!g.__jigboardDb) g.__jigboardDb = withRetries(drizzle(pool(), { schema }));
  return g.__jigboardDb;
}

export async function closeDb(): Promise<void> {
  const p = g.__jigboardPool;
  g.__jigboardPool = undefined;
  g.__jigboardDb = undefined;
  await p?.end();
}
