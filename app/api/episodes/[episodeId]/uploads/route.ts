import { json, parseBody, route, sessionUser } from "@/lib/server/api";
import { loadEpisode } from "@/lib/server/loaders";
import { uploadCreateSchema } from "@/lib/schemas/footage";
import { env } from "@/lib/env";
import { newObjectKey } from "@/storage/keys";
import { createUpload, planParts } from "@/storage/multipart";
import { createClip, shotInEpisode, toClipDto } from "@/db/queries/footage";
import { AppError } from "@/lib/server/errors";

type P = { episodeId: string };

/**
 * Starts a multipart upload: checks type and size before any byte moves,
 * generates the storage key, and records the clip. The browser then asks for
 * part URLs and PUTs the parts straight to storage.
 */
export const POST = route<P>(async (req, params) => {
  const input = await parseBody(req, uploadCreateSchema(env().UPLOAD_MAX_BYTES), "upload");
  const user = await sessionUser(req);
  const { episode } = await loadEpisode(user.id, params.episodeId, "footage.manage");
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
