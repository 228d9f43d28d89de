import "server-only";
/**
 * The durable job queue: pg-boss, in the same PostgreSQL (schema "pgboss").
 * A job is a row, so a call sheet queued before a restart is still sent
 * after it, and a send that fails (the mail server is down) is tried again
 * with growing delays. The app only enqueues; the worker process
 * (lib/server/jobs/worker.ts, started by `npm start`) does the work, and any
 * number of either may run.
 */
import PgBoss from "pg-boss";
import { env } from "../../env";

export const CALL_SHEET_QUEUE = "call-sheet";
/** Retries for a mail that could not be sent: 10 tries, from 20 s doubling (common practice, no published source; JOB_RETRY_DELAY_SECONDS sets the first delay). */
export const CALL_SHEET_RETRY = { retryLimit: 10, retryDelay: 20, retryBackoff: true } as const;
const retry = () => ({ ...CALL_SHEET_RETRY, retryDelay: env().JOB_RETRY_DELAY_SECONDS });

const g = globalThis as unknown as { __jigboardBoss?: Promise<PgBoss> };

export function queue(opts: { worker?: boolean } = {}): Promise<PgBoss> {
  if (!g.__jigboardBoss) {
    g.__jigboardBoss = (async () => {
      const boss = new PgBoss({ connectionString: env().DATABASE_URL, schema: "pgboss", max: 3, application_name: "jigboard-jobs", supervise: Boolean(opts.worker), schedule: false });
      boss.on("error", (e) => console.error("[jobs]", e.message));
      await boss.start();
      await boss.createQueue(CALL_SHEET_QUEUE, { name: CALL_SHEET_QUEUE, ...retry() });
      return boss;
    })().catch((e) => {
      g.__jigboardBoss = undefined;
      throw e;
    });
  }
  return g.__jigboardBoss;
}

export async function enqueueCallSheet(sendId: string): Promise<string | null> {
  return (await queue()).send(CALL_SHEET_QUEUE, { sendId }, retry());
}

export async function stopQueue(): Promise<void> {
  const b = g.__jigboardBoss;
  g.__jigboardBoss = undefined;
  if (b) await (await b).stop({ graceful: true, wait: true, timeout: 5000 }).catch(() => {});
}
