import "server-only";
import { and, eq, isNull, lt } from "drizzle-orm";
import { db } from "../client";
import { pendingUploads, type PendingUpload } from "../schema";

export async function createPendingUpload(v: { key: string; channelId: string; purpose: PendingUpload["purpose"]; contentType: string; sizeBytes: number; createdBy: string }) {
  await db().insert(pendingUploads).values(v);
}

/** The issued upload with exactly this key, for this channel and purpose; nothing else matches. */
export async function getPendingUploadByKey({ key, channelId, purpose }: { key: string; channelId: string; purpose: PendingUpload["purpose"] }) {
  const [row] = await db()
    .select()
    .from(pendingUploads)
    .where(and(eq(pendingUploads.key, key), eq(pendingUploads.channelId, channelId), eq(pendingUploads.purpose, purpose)))
    .limit(1);
  return row ?? null;
}

export async function markPendingUploadUsed({ key }: { key: string }) {
  await db().update(pendingUploads).set({ usedAt: new Date() }).where(and(eq(pendingUploads.key, key), isNull(pendingUploads.usedAt)));
}

/** Issued keys never used within a day are forgotten (their objects, if any, are orphans for the store's lifecycle rules). */
export async function deleteStalePendingUploads({ before }: { before: Date }) {
  return db()
    .delete(pendingUploads)
    .where(and(isNull(pendingUploads.usedAt), lt(pendingUploads.createdAt, before)))
    .returning({ key: pendingUploads.key });
}
