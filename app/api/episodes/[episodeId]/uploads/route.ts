import { channelRoute } from "@/lib/server/http/route-builder";
import { json } from "@/lib/server/http/api";
import { uploadCreateSchema } from "@/lib/schemas/footage";
import { env } from "@/lib/env";
import { newObjectKey } from "@/storage/keys";
import { createUpload, planParts } from "@/storage/multipart";
import { createClip, shotInEpisode } from "@/db/queries/footage";
import { toClipDto } from "@/lib/server/views/shots";
import { AppError } from "@/lib/server/http/errors";

/**
 * Starts a multipart upload: checks type and size before any byte moves,
 * generates the storage key, and records the clip. The browser then asks for
 * part URLs and PUTs the parts straight to storage.
 */
export const POST = channelRoute({ load: "episode", action: "footage.manage", body: () => uploadCreateSchema(env().UPLOAD_MAX_BYTES), what: "upload" }, async ({ episode, user, body }) => {
  const input = body;
  if (input.shotId && !(await shotInEpisode({ shotId: input.shotId, episodeId: episode.id }))) {
    throw new AppError("unprocessable:upload.shot", "That shot is not on this episode's shot list.", { fields: { shotId: ["not a shot of this episode"] } });
  }
  const key = newObjectKey(episode.channelId, "footage", input.contentType);
  const { partSize, partCount } = planParts(input.size, env().UPLOAD_PART_BYTES);
  const uploadId = await createUpload(key, input.contentType);
  const clip = await createClip({
    channelId: episode.channelId,
    episodeId: episode.id,
    shotId: input.shotId,
    storageKey: key,
    uploadId,
    originalName: input.fileName,
    sizeBytes: input.size,
    partSize,
    contentType: input.contentType,
    createdBy: user.id,
  });
  return json({ clip: toClipDto(clip), partSize, partCount }, 201);
});
