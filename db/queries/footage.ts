import "server-only";
import { and, asc, eq, lt } from "drizzle-orm";
import { db, type Tx } from "../client";
import { clips, shots, type Clip } from "../schema";

export async function createClip(v: { channelId: string; episodeId: string; shotId: string | null; storageKey: string; uploadId: string; originalName: string; sizeBytes: number; partSize: number; contentType: string; createdBy: string }) {
  const [row] = await db().insert(clips).values({ ...v, state: "uploading" }).returning();
  return row!;
}

export async function getClipById({ id }: { id: string }) {
  const [row] = await db().select().from(clips).where(eq(clips.id, id)).limit(1);
  return row ?? null;
}

export async function listClipsByEpisode({ episodeId }: { episodeId: string }) {
  return db().select().from(clips).where(eq(clips.episodeId, episodeId)).orderBy(asc(clips.createdAt));
}

/** Marks an uploading clip stored with its metadata; null when it is not uploading. */
export async function markClipStored(tx: Tx, id: string, meta: Partial<Pick<Clip, "durationMs" | "frameRate" | "width" | "height" | "startTimecode" | "checksum">>) {
  const [row] = await tx
    .update(clips)
    .set({ ...meta, state: "stored", uploadId: null })
    .where(and(eq(clips.id, id), eq(clips.state, "uploading")))
    .returning();
  return row ?? null;
}

export async function updateClipRow(tx: Tx, id: string, patch: Partial<Pick<Clip, "shotId" | "inFrame" | "outFrame">>) {
  const [row] = await tx.update(clips).set(patch).where(eq(clips.id, id)).returning();
  return row ?? null;
}

export async function deleteClipRow({ id }: { id: string }) {
  const [row] = await db().delete(clips).where(eq(clips.id, id)).returning();
  return row ?? null;
}

export async function shotInEpisode({ shotId, episodeId }: { shotId: string; episodeId: string }) {
  const [row] = await db().select({ id: shots.id }).from(shots).where(and(eq(shots.id, shotId), eq(shots.episodeId, episodeId)));
  return Boolean(row);
}

/** Clip rows still uploading that were started before a date (their multipart uploads get aborted). */
export async function listStaleUploadingClips({ channelId, before }: { channelId?: string; before: Date }) {
  const where = [eq(clips.state, "uploading"), lt(clips.createdAt, before)];
  if (channelId) where.push(eq(clips.channelId, channelId));
  return db().select().from(clips).where(and(...where));
}
