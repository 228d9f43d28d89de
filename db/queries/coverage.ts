import "server-only";
import { and, asc, eq, inArray } from "drizzle-orm";
import { db } from "../client";
import { coverageRanges, episodes, gaps, type Gap } from "../schema";
import type { GapCreate } from "../../lib/schemas/footage";

export async function listRangesByEpisode({ episodeId }: { episodeId: string }) {
  return db().select().from(coverageRanges).where(eq(coverageRanges.episodeId, episodeId)).orderBy(asc(coverageRanges.startFrame));
}

export async function listRangesByEpisodes({ episodeIds }: { episodeIds: string[] }) {
  if (!episodeIds.length) return [];
  return db().select().from(coverageRanges).where(inArray(coverageRanges.episodeId, episodeIds));
}

export async function createRange(v: { episodeId: string; clipId: string | null; clipInFrame: number; startFrame: number; endFrame: number; note: string }) {
  const [row] = await db().insert(coverageRanges).values(v).returning();
  return row!;
}

export async function getRangeById({ id }: { id: string }) {
  const [row] = await db()
    .select({ range: coverageRanges, channelId: episodes.channelId })
    .from(coverageRanges)
    .innerJoin(episodes, eq(episodes.id, coverageRanges.episodeId))
    .where(eq(coverageRanges.id, id))
    .limit(1);
  return row ?? null;
}

export async function deleteRange({ id }: { id: string }) {
  await db().delete(coverageRanges).where(eq(coverageRanges.id, id));
}

export async function listGapsByEpisode({ episodeId }: { episodeId: string }) {
  return db().select().from(gaps).where(eq(gaps.episodeId, episodeId)).orderBy(asc(gaps.startFrame));
}

export async function listGapsByEpisodes({ episodeIds }: { episodeIds: string[] }) {
  if (!episodeIds.length) return [];
  return db().select().from(gaps).where(inArray(gaps.episodeId, episodeIds));
}

export async function createGap({ episodeId, input }: { episodeId: string; input: GapCreate }) {
  const [row] = await db().insert(gaps).values({ ...input, episodeId }).returning();
  return row!;
}

export async function getGapById({ id }: { id: string }) {
  const [row] = await db()
    .select({ gap: gaps, channelId: episodes.channelId })
    .from(gaps)
    .innerJoin(episodes, eq(episodes.id, gaps.episodeId))
    .where(eq(gaps.id, id))
    .limit(1);
  return row ?? null;
}

export async function updateGap({ id, patch }: { id: string; patch: Partial<Pick<Gap, "status" | "note">> }) {
  const [row] = await db().update(gaps).set(patch).where(eq(gaps.id, id)).returning();
  return row ?? null;
}

/** Kept computed gaps that are still open. */
export async function listOpenComputedGaps({ episodeId }: { episodeId: string }) {
  return db().select().from(gaps).where(and(eq(gaps.episodeId, episodeId), eq(gaps.source, "computed"), eq(gaps.status, "open")));
}

export async function resolveGaps({ ids }: { ids: string[] }) {
  if (ids.length) await db().update(gaps).set({ status: "resolved" }).where(inArray(gaps.id, ids));
}
