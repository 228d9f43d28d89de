import "server-only";
import { and, asc, desc, eq, inArray, sql } from "drizzle-orm";
import { db, type Tx } from "../client";
import { lockEpisode } from "./episode-lock";
import { episodes, scriptRevisions, scriptSegments, users, type ScriptSegment } from "../schema";
import type { SegmentCreate, SegmentSave } from "../../lib/schemas/script";

export type Segment = ScriptSegment;

export function toSegmentDto(s: Segment) {
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
    updatedAt: s.updatedAt.toISOString(),
  };
}
export type SegmentDto = ReturnType<typeof toSegmentDto>;

const snapshot = (s: Segment) => {
  const { updatedAt: _u, ...rest } = toSegmentDto(s);
  return rest;
};

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
async function episodeOfSegment(tx: Tx, id: string) {
  const [row] = await tx.select({ episodeId: scriptSegments.episodeId }).from(scriptSegments).where(eq(scriptSegments.id, id));
  return row?.episodeId ?? null;
}

async function orderedIds(tx: Tx, episodeId: string) {
  const rows = await tx.select({ id: scriptSegments.id }).from(scriptSegments).where(eq(scriptSegments.episodeId, episodeId)).orderBy(asc(scriptSegments.position));
  return rows.map((r) => r.id);
}

async function renumber(tx: Tx, ids: string[]) {
  if (!ids.length) return;
  const values = sql.join(
    ids.map((id, i) => sql`(${id}::uuid, ${i}::int)`),
    sql`, `,
  );
  await tx.execute(sql`update script_segments set position = v.pos from (values ${values}) as v(id, pos) where script_segments.id = v.id`);
}

async function revision(tx: Tx, episodeId: string, segmentId: string, userId: string, before: Segment | null, after: Segment | null) {
  await tx.insert(scriptRevisions).values({ episodeId, segmentId, userId, before: before ? snapshot(before) : null, after: after ? snapshot(after) : null });
}

export async function createSegment({ episodeId, userId, input }: { episodeId: string; userId: string; input: SegmentCreate }) {
  return db().transaction(async (tx) => {
    await lockEpisode(tx, episodeId);
    const ids = await orderedIds(tx, episodeId);
    const { afterId, ...fields } = input;
    if (afterId && !ids.includes(afterId)) return { error: "after_not_found" as const };
    const [row] = await tx
      .insert(scriptSegments)
      .values({ ...fields, episodeId, position: ids.length, updatedBy: userId })
      .returning();
    const at = afterId ? ids.indexOf(afterId) + 1 : ids.length;
    ids.splice(at, 0, row!.id);
    await renumber(tx, ids);
    await revision(tx, episodeId, row!.id, userId, null, row!);
    return { segment: { ...row!, position: at } };
  });
}

/**
 * Saves fields only if the stored version is the one the edit was based on;
 * otherwise nothing is written and the stored segment comes back.
 */
export async function saveSegment({ id, userId, save }: { id: string; userId: string; save: SegmentSave }) {
  return db().transaction(async (tx) => {
    const episodeId = await episodeOfSegment(tx, id);
    if (!episodeId) return { missing: true as const };
    await lockEpisode(tx, episodeId);
    const [current] = await tx.select().from(scriptSegments).where(eq(scriptSegments.id, id)).for("update");
    if (!current) return { missing: true as const };
    if (current.version !== save.version) return { conflict: current };
    const { version, ...fields } = save;
    const [after] = await tx
      .update(scriptSegments)
      .set({ ...fields, version: version + 1, updatedBy: userId, updatedAt: new Date() })
      .where(and(eq(scriptSegments.id, id), eq(scriptSegments.version, version)))
      .returning();
    await revision(tx, current.episodeId, id, userId, current, after!);
    return { segment: after! };
  });
}

export async function splitSegment({ id, userId, version, before, after }: { id: string; userId: string; version: number; before: string; after: string }) {
  return db().transaction(async (tx) => {
    const episodeId = await episodeOfSegment(tx, id);
    if (!episodeId) return { missing: true as const };
    await lockEpisode(tx, episodeId);
    const [current] = await tx.select().from(scriptSegments).where(eq(scriptSegments.id, id)).for("update");
    if (!current) return { missing: true as const };
    if (current.version !== version) return { conflict: current };
    const [first] = await tx
      .update(scriptSegments)
      .set({ text: before, version: version + 1, updatedBy: userId, updatedAt: new Date() })
      .where(eq(scriptSegments.id, id))
      .returning();
    const [second] = await tx
      .insert(scriptSegments)
      .values({ episodeId: current.episodeId, position: current.position + 1, kind: current.kind, text: after, stepId: current.stepId, updatedBy: userId })
      .returning();
    const ids = (await orderedIds(tx, current.episodeId)).filter((x) => x !== second!.id);
    ids.splice(ids.indexOf(id) + 1, 0, second!.id);
    await renumber(tx, ids);
    await revision(tx, current.episodeId, id, userId, current, first!);
    await revision(tx, current.episodeId, second!.id, userId, null, second!);
    return { first: first!, second: second! };
  });
}

/** Appends the next segment's text to this one and removes the next; both versions must be current. */
export async function joinWithNext({ id, userId, version, nextVersion }: { id: string; userId: string; version: number; nextVersion: number }) {
  return db().transaction(async (tx) => {
    const episodeId = await episodeOfSegment(tx, id);
    if (!episodeId) return { missing: true as const };
    await lockEpisode(tx, episodeId);
    const [current] = await tx.select().from(scriptSegments).where(eq(scriptSegments.id, id)).for("update");
    if (!current) return { missing: true as const };
    const ids = await orderedIds(tx, current.episodeId);
    const nextId = ids[ids.indexOf(id) + 1];
    if (!nextId) return { noNext: true as const };
    const [next] = await tx.select().from(scriptSegments).where(eq(scriptSegments.id, nextId)).for("update");
    if (current.version !== version) return { conflict: current };
    if (next!.version !== nextVersion) return { conflict: next! };
    const text = [current.text.trimEnd(), next!.text.trimStart()].filter(Boolean).join(" ");
    const [joined] = await tx
      .update(scriptSegments)
      .set({ text, version: version + 1, updatedBy: userId, updatedAt: new Date() })
      .where(eq(scriptSegments.id, id))
      .returning();
    await tx.delete(scriptSegments).where(eq(scriptSegments.id, nextId));
    await renumber(tx, ids.filter((x) => x !== nextId));
    await revision(tx, current.episodeId, id, userId, current, joined!);
    await revision(tx, current.episodeId, nextId, userId, next!, null);
    return { segment: joined! };
  });
}

export async function deleteSegment({ id, userId }: { id: string; userId: string }) {
  return db().transaction(async (tx) => {
    const episodeId = await episodeOfSegment(tx, id);
    if (!episodeId) return null;
    await lockEpisode(tx, episodeId);
    const [current] = await tx.select().from(scriptSegments).where(eq(scriptSegments.id, id)).for("update");
    if (!current) return null;
    await tx.delete(scriptSegments).where(eq(scriptSegments.id, id));
    await renumber(tx, await orderedIds(tx, current.episodeId));
    await revision(tx, current.episodeId, id, userId, current, null);
    return current;
  });
}

export async function reorderSegments({ episodeId, ids, check }: { episodeId: string; ids: string[]; check: (current: string[]) => void }) {
  return db().transaction(async (tx) => {
    await lockEpisode(tx, episodeId);
    check(await orderedIds(tx, episodeId));
    await renumber(tx, ids);
  });
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

type Snapshot = ReturnType<typeof snapshot>;

/**
 * Puts a segment back as it was after (or, for a deletion, before) a
 * revision. A segment that no longer exists is recreated at the end.
 */
export async function restoreRevision({ revisionId, userId }: { revisionId: string; userId: string }) {
  return db().transaction(async (tx) => {
    const [rev] = await tx.select().from(scriptRevisions).where(eq(scriptRevisions.id, revisionId));
    if (!rev || !rev.segmentId) return null;
    const state = (rev.after ?? rev.before) as Snapshot | null;
    if (!state) return null;
    await lockEpisode(tx, rev.episodeId);
    const fields = {
      kind: state.kind,
      text: state.text,
      stepId: state.stepId,
      pinnedStartFrame: state.pinnedStartFrame,
      explicitDurationFrames: state.explicitDurationFrames,
      editorNotes: state.editorNotes,
      chapterStart: state.chapterStart,
      chapterTitle: state.chapterTitle,
    };
    const [current] = await tx.select().from(scriptSegments).where(eq(scriptSegments.id, rev.segmentId)).for("update");
    let after: Segment;
    if (current) {
      [after] = (await tx
        .update(scriptSegments)
        .set({ ...fields, version: current.version + 1, updatedBy: userId, updatedAt: new Date() })
        .where(eq(scriptSegments.id, current.id))
        .returning()) as [Segment];
    } else {
      const ids = await orderedIds(tx, rev.episodeId);
      // The step may have been deleted meanwhile; keep the text, drop the link.
      [after] = (await tx
        .insert(scriptSegments)
        .values({ ...fields, stepId: null, id: rev.segmentId, episodeId: rev.episodeId, position: ids.length, updatedBy: userId })
        .returning()) as [Segment];
    }
    await revision(tx, rev.episodeId, rev.segmentId, userId, current ?? null, after);
    return after;
  });
}

export async function listSegmentsByEpisodes({ episodeIds }: { episodeIds: string[] }) {
  if (episodeIds.length === 0) return [];
  return db().select().from(scriptSegments).where(inArray(scriptSegments.episodeId, episodeIds)).orderBy(asc(scriptSegments.episodeId), asc(scriptSegments.position));
}
