import { channelRoute } from "@/lib/server/http/route-builder";
import { json } from "@/lib/server/http/api";
import { clipUpdateSchema } from "@/lib/schemas/footage";
import { deleteClipRow, shotInEpisode } from "@/db/queries/footage";
import { toClipDto } from "@/lib/server/views/shots";
import { updateClip } from "@/lib/server/services/footage";
import { abortUpload, deleteObject } from "@/storage/multipart";
import { presignGet } from "@/storage/presign";
import { AppError } from "@/lib/server/http/errors";
import { settleGaps } from "@/lib/server/services/coverage";

/** The clip with a short-lived playback URL (5 minutes), issued after the permission check. */
export const GET = channelRoute({ load: "clip", action: "channel.read" }, async ({ clip }) => {
  const playbackUrl = clip.state === "stored" ? await presignGet(clip.storageKey, 5 * 60) : null;
  return json({ clip: toClipDto(clip), playbackUrl });
});

export const PATCH = channelRoute({ load: "clip", action: "footage.manage", body: clipUpdateSchema, what: "clip" }, async ({ clip, body }) => {
  const patch = body;
  if (patch.shotId && !(await shotInEpisode({ shotId: patch.shotId, episodeId: clip.episodeId }))) {
    throw new AppError("unprocessable:clip.shot", "That shot is not on this episode's shot list.", { fields: { shotId: ["not a shot of this episode"] } });
  }
  const inF = patch.inFrame !== undefined ? patch.inFrame : clip.inFrame;
  const outF = patch.outFrame !== undefined ? patch.outFrame : clip.outFrame;
  if (inF != null && outF != null && outF <= inF) throw new AppError("unprocessable:clip.range", "The out point must come after the in point.", { fields: { outFrame: ["must be after the in point"] } });
  const row = await updateClip({ clip, patch });
  return json({ clip: toClipDto(row!) });
});

/** Deleting a clip removes its stored object (or aborts its unfinished upload) and its timeline ranges. */
export const DELETE = channelRoute({ load: "clip", action: "footage.manage" }, async ({ clip, episode }) => {
  if (clip.state === "uploading" && clip.uploadId) await abortUpload(clip.storageKey, clip.uploadId);
  else await deleteObject(clip.storageKey);
  await deleteClipRow({ id: clip.id });
  await settleGaps(episode);
  return json({ ok: true });
});
