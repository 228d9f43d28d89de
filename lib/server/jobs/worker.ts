/**
 * The job worker: takes queued jobs (call-sheet mail) from pg-boss and runs
 * them. `npm start` starts one next to the app; in production run
 * `npm run worker` as its own process (as many as you like).
 */
import { CALL_SHEET_QUEUE, queue, stopQueue } from "./queue";
import { deliverCallSheet } from "./call-sheets";
import { pruneLiveEvents } from "../../../db/queries/live";

/** Live events are kept a day for reconnects; the worker clears older ones every hour. */
const PRUNE_EVERY_MS = 3600_000;

export async function startWorkers(opts: { pollingIntervalSeconds?: number } = {}) {
  const boss = await queue({ worker: true });
  await boss.work<{ sendId: string }>(CALL_SHEET_QUEUE, { pollingIntervalSeconds: opts.pollingIntervalSeconds ?? 2, batchSize: 1 }, async (jobs) => {
    for (const job of jobs) await deliverCallSheet(job.data.sendId);
  });
  const prune = () => void pruneLiveEvents().catch((e) => console.error("[worker] pruning live events:", (e as Error).message));
  prune();
  setInterval(prune, PRUNE_EVERY_MS).unref();
  return boss;
}

export { stopQueue as stopWorkers };

const isMain = typeof process !== "undefined" && process.argv[1] && /jobs[\\/]worker\.ts$/.test(process.argv[1]);
if (isMain) {
  startWorkers({ pollingIntervalSeconds: Number(process.env.JOB_POLL_SECONDS) || 2 })
    .then(() => console.log("[worker] taking jobs"))
    .catch((e) => {
      console.error("[worker] could not start:", (e as Error).message);
      process.exit(1);
    });
  for (const sig of ["SIGTERM", "SIGINT"] as const) process.on(sig, () => void stopQueue().then(() => process.exit(0)));
}
