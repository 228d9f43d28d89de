import "server-only";
import { and, asc, eq, lt } from "drizzle-orm";
import { db } from "../client";
import { clips, shots, type Clip } from "../schema";

export function toClipDto(c: Clip) {
  return {
    id: c.id,
    episodeId: c.episodeId,
    shotId: c.shotId,
    state: c.state,
    originalName: c.originalName,
    sizeBytes: c.sizeBytes,
    partSize: c.partSize,
    contentType: c.contentType,
    durationMs: c.durationMs,
    frameRate: c.frameRate,
    width: c.width,
    height: c.height,
    startTimecode: c.startTimecode,
    checksum: c.checksum,
    inFrame: c.inFrame,
    outFrame: c.outFrame,
    createdAt: c.createdAt.toISOString(),
  };
}

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

/** Marks a clip stored with its metadata; linking to a shot marks a planned shot captured. */
export async function finishClip({ id, meta }: { id: string; meta: Partial<Pick<Clip, "durationMs" | "frameRate" | "width" | "height" | "startTimecode" | "checksum">> }) {
  return db().transaction(async (tx) => {
    const [row] = await tx
      .update(clips)
      .set({ ...meta, state: "stored", uploadId: null })
      .where(and(eq(clips.id, id), eq(clips.state, "uploading")))
      .returning();
    if (row?.shotId) await tx.update(shots).set({ status: "captured" }).where(and(eq(shots.id, row.shotId), eq(shots.status, "planned")));
    return row ?? null;
  });
}

export async function updateClip({ id, patch }: { id: string; patch: Partial<Pick<Clip, "shotId" | "inFrame" | "outFrame">> }) {
  return db().transaction(async (tx) => {
    const [row] = await tx.update(clips).set(patch).where(eq(clips.id, id)).returning();
    if (row?.shotId && patch.shotId && row.state === "stored") {
      await tx.update(shots).set({ status: "captured" }).where(and(eq(shots.id, row.shotId), eq(shots.status, "planned")));
    }
    return row ?? null;
  });
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
