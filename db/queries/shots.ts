import "server-only";
import { and, asc, eq, inArray, sql } from "drizzle-orm";
import { db, type Tx } from "../client";
import { buildSteps, episodes, gaps, scriptSegments, shots } from "../schema";
import type { ShotStatus } from "../../lib/schemas/footage";

export async function listShotsByEpisode({ episodeId }: { episodeId: string }) {
  return db().select().from(shots).where(eq(shots.episodeId, episodeId)).orderBy(asc(shots.position), asc(shots.createdAt));
}

export async function getShotById({ id }: { id: string }) {
  const [row] = await db()
    .select({ shot: shots, channelId: episodes.channelId })
    .from(shots)
    .innerJoin(episodes, eq(episodes.id, shots.episodeId))
    .where(eq(shots.id, id))
    .limit(1);
  return row ?? null;
}

/** True when every given step/segment belongs to the episode. */
export async function linksBelong({ episodeId, stepId, segmentId }: { episodeId: string; stepId?: string | null; segmentId?: string | null }) {
  if (stepId) {
    const [s] = await db().select({ id: buildSteps.id }).from(buildSteps).where(and(eq(buildSteps.id, stepId), eq(buildSteps.episodeId, episodeId)));
    if (!s) return "stepId" as const;
  }
  if (segmentId) {
    const [s] = await db().select({ id: scriptSegments.id }).from(scriptSegments).where(and(eq(scriptSegments.id, segmentId), eq(scriptSegments.episodeId, episodeId)));
    if (!s) return "segmentId" as const;
  }
  return null;
}

export async function countShots(tx: Tx, episodeId: string) {
  const rows = await tx.select({ id: shots.id }).from(shots).where(eq(shots.episodeId, episodeId));
  return rows.length;
}

export async function insertShots(tx: Tx, rows: (typeof shots.$inferInsert)[]) {
  if (!rows.length) return [];
  return tx.insert(shots).values(rows).returning();
}

export async function updateShotRow(tx: Tx, id: string, episodeId: string, patch: Partial<typeof shots.$inferInsert>) {
  const [row] = await tx.update(shots).set(patch).where(and(eq(shots.id, id), eq(shots.episodeId, episodeId))).returning();
  return row ?? null;
}

export async function deleteShotRow(tx: Tx, id: string, episodeId: string) {
  const [row] = await tx.delete(shots).where(and(eq(shots.id, id), eq(shots.episodeId, episodeId))).returning();
  return row ?? null;
}

/** Which of the ids are shots of the episode. */
export async function findShotIds(tx: Tx, episodeId: string, ids: string[]) {
  const rows = await tx.select({ id: shots.id }).from(shots).where(and(eq(shots.episodeId, episodeId), inArray(shots.id, ids)));
  return rows.map((r) => r.id);
}

export async function setStatusOfShots(tx: Tx, episodeId: string, ids: string[], status: ShotStatus) {
  await tx.update(shots).set({ status }).where(and(eq(shots.episodeId, episodeId), inArray(shots.id, ids)));
}

/** A planned shot becomes captured (a clip was linked to it); other statuses stay. */
export async function markShotCaptured(tx: Tx, shotId: string) {
  await tx.update(shots).set({ status: "captured" }).where(and(eq(shots.id, shotId), eq(shots.status, "planned")));
}

/** The kept row of a computed gap, matched by its frames. */
export async function findComputedGap(tx: Tx, episodeId: string, startFrame: number, endFrame: number) {
  const [row] = await tx
    .select({ id: gaps.id })
    .from(gaps)
    .where(and(eq(gaps.episodeId, episodeId), eq(gaps.source, "computed"), eq(gaps.startFrame, startFrame), eq(gaps.endFrame, endFrame)))
    .limit(1);
  return row?.id ?? null;
}

export async function findPickupOfGap(tx: Tx, episodeId: string, gapId: string) {
  const [row] = await tx.select().from(shots).where(and(eq(shots.episodeId, episodeId), eq(shots.gapId, gapId))).limit(1);
  return row ?? null;
}

export async function insertGapRow(tx: Tx, values: typeof gaps.$inferInsert) {
  const [row] = await tx.insert(gaps).values(values).returning();
  return row!;
}

/** Shots captured or better, and all shots not rejected, per episode of a channel. */
export async function countShotsByChannel({ channelId }: { channelId: string }) {
  const out = new Map<string, { done: number; total: number }>();
  const r = await db().execute(sql`
    select s.episode_id, count(*) filter (where s.status in ('captured', 'selected'))::int as done, count(*)::int as total
    from shots s join episodes e on e.id = s.episode_id
    where e.channel_id = ${channelId} and s.status <> 'rejected'
    group by s.episode_id`);
  for (const row of r.rows as { episode_id: string; done: number; total: number }[]) out.set(row.episode_id, { done: row.done, total: row.total });
  return out;
}
