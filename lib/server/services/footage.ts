import "server-only";
/** Clip writes that touch shots: linking a stored clip to a planned shot marks the shot captured. */
import { db } from "../../../db/client";
import { lockEpisode } from "../../../db/queries/episode-lock";
import { markClipStored, updateClipRow } from "../../../db/queries/footage";
import { markShotCaptured } from "../../../db/queries/shots";
import type { Clip } from "../../../db/schema";

/** Marks a clip stored with its metadata; null when it was not uploading. */
export async function finishClip({ clip, meta }: { clip: Pick<Clip, "id" | "episodeId">; meta: Parameters<typeof markClipStored>[2] }) {
  return db().transaction(async (tx) => {
    await lockEpisode(tx, clip.episodeId);
    const row = await markClipStored(tx, clip.id, meta);
    if (row?.shotId) await markShotCaptured(tx, row.shotId);
    return row;
  });
}

export async function updateClip({ clip, patch }: { clip: Pick<Clip, "id" | "episodeId">; patch: Parameters<typeof updateClipRow>[2] }) {
  return db().transaction(async (tx) => {
    await lockEpisode(tx, clip.episodeId);
    const row = await updateClipRow(tx, clip.id, patch);
    if (row?.shotId && patch.shotId && row.state === "stored") await markShotCaptured(tx, row.shotId);
    return row;
  });
}
