/**
 * The two database settings, read here so that db/ depends on nothing above
 * it. The defaults match the local cluster `npm start` runs; lib/env.ts
 * validates the same variables (with every other one) when the app starts.
 */
export const LOCAL_DATABASE_URL = "postgres://jigboard@127.0.0.1:54329/jigboard";

export function databaseConfig(): { url: string; poolMax: number } {
  const poolMax = Number(process.env.DATABASE_POOL_MAX ?? 10);
  return { url: process.env.DATABASE_URL || LOCAL_DATABASE_URL, poolMax: Number.isInteger(poolMax) && poolMax > 0 ? poolMax : 10 };
}
