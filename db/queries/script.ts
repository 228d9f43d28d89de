import "server-only";
import { and, asc, desc, eq, inArray, sql } from "drizzle-orm";
import { db, type Q, type Tx } from "../client";
import { episodes, scriptRevisions, scriptSegments, users, type ScriptSegment } from "../schema";

export type Segment = ScriptSegment;

/** What a revision keeps of a segment (everything but its timestamps and episode). */
export function segmentSnapshot(s: Segment) {
  return {
    id: s.id,
    position: s.position,
    kind: s.kind,
    text: s.text,
    stepId: s.stepId,
    pinnedStartFrame: s.pinnedStartFrame,
    explicitDurationFrames: s.explicitDurationFrames,
    editorNotes: s.editorNotes,
    chapterStart: s.chapterStart,
    chapterTitle: s.chapterTitle,
    version: s.version,
    updatedBy: s.updatedBy,
  };
}
export type SegmentSnapshot = ReturnType<typeof segmentSnapshot>;

export async function listSegmentsByEpisode({ episodeId }: { episodeId: string }) {
  return db().select().from(scriptSegments).where(eq(scriptSegments.episodeId, episodeId)).orderBy(asc(scriptSegments.position), asc(scriptSegments.updatedAt));
}

export async function getSegmentById({ id }: { id: string }) {
  const [row] = await db()
    .select({ segment: scriptSegments, channelId: episodes.channelId })
    .from(scriptSegments)
    .innerJoin(episodes, eq(episodes.id, scriptSegments.episodeId))
    .where(eq(scriptSegments.id, id))
    .limit(1);
  return row ?? null;
}

/** The episode a segment belongs to (it never changes), read before any lock so the episode is locked first. */
export async function episodeOfSegment(tx: Tx, id: string) {
  const [row] = await tx.select({ episodeId: scriptSegments.episodeId }).from(scriptSegments).where(eq(scriptSegments.id, id));
  return row?.episodeId ?? null;
}

export async function orderedSegmentIds(tx: Q, episodeId: string) {
  const rows = await tx.select({ id: scriptSegments.id }).from(scriptSegments).where(eq(scriptSegments.episodeId, episodeId)).orderBy(asc(scriptSegments.position));
  return rows.map((r) => r.id);
}

/** Writes positions 0..n-1 in the given order, in one statement. */
export async function writeSegmentPositions(tx: Tx, ids: string[]) {
  if (!ids.length) return;
  const values = sql.join(
    ids.map((id, i) => sql`(${id}::uuid, ${i}::int)`),
    sql`, `,
  );
  await tx.execute(sql`update script_segments set position = v.pos from (values ${values}) as v(id, pos) where script_segments.id = v.id`);
}

export async function writeRevision(tx: Tx, episodeId: string, segmentId: string, userId: string, before: Segment | null, after: Segment | null) {
  await tx.insert(scriptRevisions).values({ episodeId, segmentId, userId, before: before ? segmentSnapshot(before) : null, after: after ? segmentSnapshot(after) : null });
}

/** The segment row, locked for this transaction. */
export async function lockSegment(tx: Tx, id: string) {
  const [row] = await tx.select().from(scriptSegments).where(eq(scriptSegments.id, id)).for("update");
  return row ?? null;
}

export async function insertSegment(tx: Tx, values: typeof scriptSegments.$inferInsert) {
  const [row] = await tx.insert(scriptSegments).values(values).returning();
  return row!;
}

/** Writes fields and the next version; with `expectVersion`, only if the row still has it. */
export async function updateSegmentRow(tx: Tx, id: string, set: Partial<typeof scriptSegments.$inferInsert>, expectVersion?: number) {
  const [row] = await tx
    .update(scriptSegments)
    .set({ ...set, updatedAt: new Date() })
    .where(and(eq(scriptSegments.id, id), expectVersion === undefined ? undefined : eq(scriptSegments.version, expectVersion)))
    .returning();
  return row ?? null;
}

export async function deleteSegmentRow(tx: Tx, id: string) {
  await tx.delete(scriptSegments).where(eq(scriptSegments.id, id));
}

export async function getRevision(tx: Tx, id: string) {
  const [row] = await tx.select().from(scriptRevisions).where(eq(scriptRevisions.id, id));
  return row ?? null;
}

export async function listRevisionsByEpisode({ episodeId, limit = 100 }: { episodeId: string; limit?: number }) {
  return db()
    .select({ id: scriptRevisions.id, segmentId: scriptRevisions.segmentId, before: scriptRevisions.before, after: scriptRevisions.after, createdAt: scriptRevisions.createdAt, userName: users.name })
    .from(scriptRevisions)
    .leftJoin(users, eq(users.id, scriptRevisions.userId))
    .where(eq(scriptRevisions.episodeId, episodeId))
    .orderBy(desc(scriptRevisions.createdAt), desc(scriptRevisions.id))
    .limit(limit);
}

export async function getRevisionById({ id }: { id: string }) {
  const [row] = await db()
    .select({ revision: scriptRevisions, channelId: episodes.channelId })
    .from(scriptRevisions)
    .innerJoin(episodes, eq(episodes.id, scriptRevisions.episodeId))
    .where(eq(scriptRevisions.id, id))
    .limit(1);
  return row ?? null;
}

export async function listSegmentsByEpisodes({ episodeIds }: { episodeIds: string[] }) {
  if (episodeIds.length === 0) return [];
  return db().select().from(scriptSegments).where(inArray(scriptSegments.episodeId, episodeIds)).orderBy(asc(scriptSegments.episodeId), asc(scriptSegments.position));
}
