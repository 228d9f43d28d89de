import "server-only";
import { and, eq, gt, asc, lt, sql } from "drizzle-orm";
import { db } from "../client";
import { liveEvents } from "../schema";

/** Events of a channel after `afterId` (a reconnect's Last-Event-ID), oldest first. */
export async function listLiveEventsAfter({ channelId, afterId, limit = 500 }: { channelId: string; afterId: number; limit?: number }) {
  return db().select().from(liveEvents).where(and(eq(liveEvents.channelId, channelId), gt(liveEvents.id, afterId))).orderBy(asc(liveEvents.id)).limit(limit);
}

/** Presence is announced, never stored. */
export async function announcePresence(payload: object) {
  await db().execute(sql`select pg_notify('jigboard_live', ${JSON.stringify(payload)})`);
}

/** Events older than a day are no longer needed for reconnects. */
export async function pruneLiveEvents() {
  await db().delete(liveEvents).where(lt(liveEvents.at, sql`now() - interval '1 day'`));
}
