import { drizzle, type NodePgDatabase } from "drizzle-orm/node-postgres";
import pg from "pg";
import * as schema from "./schema";
import { env } from "../lib/env";

export type Db = NodePgDatabase<typeof schema>;
export type Tx = Parameters<Parameters<Db["transaction"]>[0]>[0];

// One pool per process, kept on globalThis so dev reloads do not leak pools.
const g = globalThis as unknown as { __jigboardPool?: pg.Pool; __jigboardDb?: Db };

export function pool(): pg.Pool {
  if (!g.__jigboardPool) {
    g.__jigboardPool = new pg.Pool({ connectionString: env().DATABASE_URL, max: env().DATABASE_POOL_MAX });
    g.__jigboardPool.on("error", (err) => console.error("[db] idle client error", err.message));
  }
  return g.__jigboardPool;
}

export function db(): Db {
  if (!g.__jigboardDb) g.__jigboardDb = drizzle(pool(), { schema });
  return g.__jigboardDb;
}

export async function closeDb(): Promise<void> {
  const p = g.__jigboardPool;
  g.__jigboardPool = undefined;
  g.__jigboardDb = undefined;
  await p?.end();
}
