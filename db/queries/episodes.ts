import "server-only";
import { and, asc, eq, gte, isNotNull, isNull, lt, ne, sql } from "drizzle-orm";
import { db, type Tx } from "../client";
import { lockEpisode } from "./episode-lock";
import { channels, episodes, type Episode } from "../schema";
import type { Stage } from "../../lib/stages";
import type { EpisodeCreate, EpisodeDto, EpisodeUpdate } from "../../lib/schemas/episode";

export function toEpisodeDto(e: Episode): EpisodeDto {
  return {
    id: e.id,
    channelId: e.channelId,
    title: e.title,
    summary: e.summary,
    stage: e.stage,
    position: e.position,
    targetRuntimeSeconds: e.targetRuntimeSeconds,
    publishDate: e.publishDate,
    frameRate: e.frameRate,
    dropFrame: e.dropFrame,
    presenterId: e.presenterId,
    createdBy: e.createdBy,
    updatedBy: e.updatedBy,
    createdAt: e.createdAt.toISOString(),
    updatedAt: e.updatedAt.toISOString(),
    archivedAt: e.archivedAt ? e.archivedAt.toISOString() : null,
  };
}

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
async function lockChannel(tx: Tx, channelId: string) {
  await tx.select({ id: channels.id }).from(channels).where(eq(channels.id, channelId)).for("update");
}

async function columnIds(tx: Tx, channelId: string, stage: Stage, excludeId?: string) {
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

async function writePositions(tx: Tx, ids: string[]) {
  if (ids.length === 0) return;
  // One statement for the whole column.
  const values = sql.join(
    ids.map((id, i) => sql`(${id}::uuid, ${i}::int)`),
    sql`, `,
  );
  await tx.execute(sql`update episodes set position = v.pos from (values ${values}) as v(id, pos) where episodes.id = v.id`);
}

export async function createEpisode({ channelId, userId, input }: { channelId: string; userId: string; input: EpisodeCreate }) {
  return db().transaction(async (tx) => {
    await lockChannel(tx, channelId);
    const [{ n }] = (await tx.execute(
      sql`select count(*)::int as n from episodes where channel_id = ${channelId} and stage = ${input.stage} and archived_at is null`,
    )).rows as [{ n: number }];
    const [row] = await tx
      .insert(episodes)
      .values({ ...input, channelId, position: n, createdBy: userId, updatedBy: userId })
      .returning();
    return row!;
  });
}

/**
 * Applies field edits and/or a move in one transaction. A move puts the
 * episode at `position` in the target stage (clamped) and renumbers both
 * columns densely.
 */
/**
 * Frames stored at one rate, re-expressed at another in one statement per
 * table: the same instants, rounded to the nearest frame (halves up), the
 * arithmetic of convertFrames in lib/timecode.ts. Ranges keep at least one frame.
 */
async function convertStoredFrames(tx: Tx, episodeId: string, from: { num: number; den: number }, to: { num: number; den: number }) {
  const mul = to.num * from.den;
  const div = to.den * from.num;
  const conv = (col: string) => sql.raw(`((2::bigint * ${col} * ${mul} + ${div}) / (2::bigint * ${div}))::int`);
  await tx.execute(sql`update script_segments set pinned_start_frame = ${conv("pinned_start_frame")}, explicit_duration_frames = ${conv("explicit_duration_frames")} where episode_id = ${episodeId}`);
  await tx.execute(sql`update coverage_ranges set start_frame = ${conv("start_frame")}, end_frame = greatest(${conv("end_frame")}, ${conv("start_frame")} + 1), clip_in_frame = ${conv("clip_in_frame")} where episode_id = ${episodeId}`);
  await tx.execute(sql`update gaps set start_frame = ${conv("start_frame")}, end_frame = greatest(${conv("end_frame")}, ${conv("start_frame")} + 1) where episode_id = ${episodeId}`);
  await tx.execute(sql`update clips set in_frame = ${conv("in_frame")}, out_frame = ${conv("out_frame")} where episode_id = ${episodeId}`);
}

export async function updateEpisode({
  id,
  channelId,
  userId,
  patch,
  check,
  rates,
}: {
  id: string;
  channelId: string;
  userId: string;
  patch: EpisodeUpdate;
  /** Called with the locked row before writing; throws to refuse. */
  check?: (current: Episode) => void;
  /** When the frame rate changes: the old and new rates, so stored frame counts keep their time. */
  rates?: (current: Episode) => { from: { num: number; den: number }; to: { num: number; den: number } } | null;
}) {
  return db().transaction(async (tx) => {
    await lockChannel(tx, channelId);
    const [current] = await tx.select().from(episodes).where(and(eq(episodes.id, id), eq(episodes.channelId, channelId))).limit(1);
    if (!current) return null;
    check?.(current);
    const change = rates?.(current);
    if (change) {
      // The episode row before its rows, as every content write does.
      await lockEpisode(tx, id);
      await convertStoredFrames(tx, id, change.from, change.to);
    }
    const { stage, position, ...fields } = patch;
    const moving = stage !== undefined || position !== undefined;
    const toStage = stage ?? current.stage;

    if (Object.keys(fields).length > 0 || moving) {
      await tx
        .update(episodes)
        .set({ ...fields, stage: toStage, updatedBy: userId, updatedAt: new Date() })
        .where(eq(episodes.id, id));
    }
    if (moving && !current.archivedAt) {
      const target = await columnIds(tx, channelId, toStage, id);
      const at = Math.max(0, Math.min(position ?? (toStage === current.stage ? current.position : target.length), target.length));
      target.splice(at, 0, id);
      await writePositions(tx, target);
      if (toStage !== current.stage) await writePositions(tx, await columnIds(tx, channelId, current.stage));
    }
    const [after] = await tx.select().from(episodes).where(eq(episodes.id, id)).limit(1);
    return { before: current, after: after! };
  });
}

export async function archiveEpisode({ id, channelId, userId }: { id: string; channelId: string; userId: string }) {
  return db().transaction(async (tx) => {
    await lockChannel(tx, channelId);
    const [row] = await tx
      .update(episodes)
      .set({ archivedAt: new Date(), updatedBy: userId, updatedAt: new Date() })
      .where(and(eq(episodes.id, id), eq(episodes.channelId, channelId), isNull(episodes.archivedAt)))
      .returning();
    if (row) await writePositions(tx, await columnIds(tx, channelId, row.stage));
    return row ?? null;
  });
}

/** Brings an archived episode back to the end of its stage's column. */
export async function restoreEpisode({ id, channelId, userId }: { id: string; channelId: string; userId: string }) {
  return db().transaction(async (tx) => {
    await lockChannel(tx, channelId);
    const [current] = await tx.select().from(episodes).where(and(eq(episodes.id, id), eq(episodes.channelId, channelId), isNotNull(episodes.archivedAt)));
    if (!current) return null;
    const column = await columnIds(tx, channelId, current.stage);
    const [row] = await tx
      .update(episodes)
      .set({ archivedAt: null, position: column.length, updatedBy: userId, updatedAt: new Date() })
      .where(eq(episodes.id, id))
      .returning();
    return row ?? null;
  });
}
