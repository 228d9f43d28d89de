import "server-only";
import { and, asc, eq, gte, inArray, isNotNull, isNull, lt, ne, sql } from "drizzle-orm";
import { db, type Q, type Tx } from "../client";
import { channels, episodes } from "../schema";
import type { Stage } from "../../lib/stages";

export async function listEpisodesByChannel({
  channelId,
  stage,
  month,
  archived = false,
}: {
  channelId: string;
  stage?: Stage;
  month?: string;
  archived?: boolean;
}) {
  const where = [eq(episodes.channelId, channelId), archived ? isNotNull(episodes.archivedAt) : isNull(episodes.archivedAt)];
  if (stage) where.push(eq(episodes.stage, stage));
  if (month) {
    const [y, m] = month.split("-").map(Number) as [number, number];
    const start = `${month}-01`;
    const next = m === 12 ? `${y + 1}-01-01` : `${y}-${String(m + 1).padStart(2, "0")}-01`;
    where.push(gte(episodes.publishDate, start), lt(episodes.publishDate, next));
  }
  return db()
    .select()
    .from(episodes)
    .where(and(...where))
    .orderBy(asc(episodes.stage), asc(episodes.position), asc(episodes.createdAt));
}

/** Loads an episode only together with its channel id; callers then check membership of that channel. */
export async function getEpisodeById({ id }: { id: string }) {
  const [row] = await db().select().from(episodes).where(eq(episodes.id, id)).limit(1);
  return row ?? null;
}

/** Serialises every board write in a channel: positions stay dense and unique per stage. */
export async function listEpisodesByIds({ ids }: { ids: string[] }) {
  if (!ids.length) return [];
  return db().select().from(episodes).where(inArray(episodes.id, ids));
}

export async function lockChannel(tx: Tx, channelId: string) {
  await tx.select({ id: channels.id }).from(channels).where(eq(channels.id, channelId)).for("update");
}

/** The ids of a stage's column in board order (archived episodes are not on the board). */
export async function columnIds(tx: Tx, channelId: string, stage: Stage, excludeId?: string) {
  const rows = await tx
    .select({ id: episodes.id })
    .from(episodes)
    .where(
      and(
        eq(episodes.channelId, channelId),
        eq(episodes.stage, stage),
        isNull(episodes.archivedAt),
        excludeId ? ne(episodes.id, excludeId) : undefined,
      ),
    )
    .orderBy(asc(episodes.position), asc(episodes.createdAt));
  return rows.map((r) => r.id);
}

export async function writeEpisodePositions(tx: Tx, ids: string[]) {
  if (ids.length === 0) return;
  // One statement for the whole column.
  const values = sql.join(
    ids.map((id, i) => sql`(${id}::uuid, ${i}::int)`),
    sql`, `,
  );
  await tx.execute(sql`update episodes set position = v.pos from (values ${values}) as v(id, pos) where episodes.id = v.id`);
}

export async function countActiveInStage(tx: Tx, channelId: string, stage: Stage) {
  const [{ n }] = (await tx.execute(sql`select count(*)::int as n from episodes where channel_id = ${channelId} and stage = ${stage} and archived_at is null`)).rows as [{ n: number }];
  return n;
}

export async function insertEpisode(tx: Tx, values: typeof episodes.$inferInsert) {
  const [row] = await tx.insert(episodes).values(values).returning();
  return row!;
}

export async function getEpisodeInChannel(q: Q, id: string, channelId: string, { archived }: { archived?: boolean } = {}) {
  const [row] = await q
    .select()
    .from(episodes)
    .where(and(eq(episodes.id, id), eq(episodes.channelId, channelId), archived === undefined ? undefined : archived ? isNotNull(episodes.archivedAt) : isNull(episodes.archivedAt)))
    .limit(1);
  return row ?? null;
}

export async function updateEpisodeRow(tx: Tx, id: string, set: Partial<typeof episodes.$inferInsert>) {
  const [row] = await tx
    .update(episodes)
    .set({ ...set, updatedAt: new Date() })
    .where(eq(episodes.id, id))
    .returning();
  return row ?? null;
}

/** Archives an episode that is not archived yet; null otherwise. */
export async function archiveEpisodeRow(tx: Tx, id: string, channelId: string, userId: string) {
  const [row] = await tx
    .update(episodes)
    .set({ archivedAt: new Date(), updatedBy: userId, updatedAt: new Date() })
    .where(and(eq(episodes.id, id), eq(episodes.channelId, channelId), isNull(episodes.archivedAt)))
    .returning();
  return row ?? null;
}

/**
 * Frames stored at one rate, re-expressed at another in one statement per
 * table: the same instants, rounded to the nearest frame (halves up), the
 * arithmetic of convertFrames in lib/timecode.ts. Ranges keep at least one frame.
 */
export async function convertStoredFrames(tx: Tx, episodeId: string, from: { num: number; den: number }, to: { num: number; den: number }) {
  const mul = to.num * from.den;
  const div = to.den * from.num;
  const conv = (col: string) => sql.raw(`((2::bigint * ${col} * ${mul} + ${div}) / (2::bigint * ${div}))::int`);
  await tx.execute(sql`update script_segments set pinned_start_frame = ${conv("pinned_start_frame")}, explicit_duration_frames = ${conv("explicit_duration_frames")} where episode_id = ${episodeId}`);
  await tx.execute(sql`update coverage_ranges set start_frame = ${conv("start_frame")}, end_frame = greatest(${conv("end_frame")}, ${conv("start_frame")} + 1), clip_in_frame = ${conv("clip_in_frame")} where episode_id = ${episodeId}`);
  await tx.execute(sql`update gaps set start_frame = ${conv("start_frame")}, end_frame = greatest(${conv("end_frame")}, ${conv("start_frame")} + 1) where episode_id = ${episodeId}`);
  await tx.execute(sql`update clips set in_frame = ${conv("in_frame")}, out_frame = ${conv("out_frame")} where episode_id = ${episodeId}`);
}
