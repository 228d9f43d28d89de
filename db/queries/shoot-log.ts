import "server-only";
import { and, desc, eq } from "drizzle-orm";
import { db, type Tx } from "../client";
import { buildSteps, clips, episodes, shootDays, shootLogNotes, users, type ShootLogNote } from "../schema";

export async function listNotesByEpisode({ episodeId }: { episodeId: string }) {
  return db()
    .select({ note: shootLogNotes, authorName: users.name })
    .from(shootLogNotes)
    .leftJoin(users, eq(users.id, shootLogNotes.authorId))
    .where(eq(shootLogNotes.episodeId, episodeId))
    .orderBy(desc(shootLogNotes.notedAt), desc(shootLogNotes.id));
}

/** A note with its episode's channel, for the loader. */
export async function getNoteById({ id }: { id: string }) {
  const [row] = await db().select({ note: shootLogNotes, channelId: episodes.channelId }).from(shootLogNotes).innerJoin(episodes, eq(episodes.id, shootLogNotes.episodeId)).where(eq(shootLogNotes.id, id)).limit(1);
  return row ?? null;
}

/** Stores a note under the id its device made; the same id again stores nothing. Null when the id was already taken. */
export async function insertNoteOnce(tx: Tx, values: typeof shootLogNotes.$inferInsert) {
  const [row] = await tx.insert(shootLogNotes).values(values).onConflictDoNothing({ target: shootLogNotes.id }).returning();
  return row ?? null;
}

export async function lockNote(tx: Tx, id: string) {
  const [row] = await tx.select().from(shootLogNotes).where(eq(shootLogNotes.id, id)).for("update");
  return row ?? null;
}

export async function updateNoteRow(tx: Tx, id: string, set: Partial<Pick<ShootLogNote, "segmentId" | "shotId" | "text" | "stepId" | "clipId">>) {
  const [row] = await tx.update(shootLogNotes).set(set).where(eq(shootLogNotes.id, id)).returning();
  return row ?? null;
}

/** Which of the note's links are not the episode's (or its channel's): the first field that fails, or null. */
export async function noteLinksBelong({ episodeId, channelId, stepId, clipId, shootDayId }: { episodeId: string; channelId: string; stepId?: string | null; clipId?: string | null; shootDayId?: string | null }) {
  if (stepId && !(await db().select({ id: buildSteps.id }).from(buildSteps).where(and(eq(buildSteps.id, stepId), eq(buildSteps.episodeId, episodeId)))).length) return "stepId" as const;
  if (clipId && !(await db().select({ id: clips.id }).from(clips).where(and(eq(clips.id, clipId), eq(clips.episodeId, episodeId)))).length) return "clipId" as const;
  if (shootDayId && !(await db().select({ id: shootDays.id }).from(shootDays).where(and(eq(shootDays.id, shootDayId), eq(shootDays.channelId, channelId)))).length) return "shootDayId" as const;
  return null;
}

export type { ShootLogNote };
