import { json, parseBody, route, sessionUser } from "@/lib/server/api";
import { loadEpisode } from "@/lib/server/loaders";
import { photoUploadSchema } from "@/lib/schemas/build";
import { newObjectKey } from "@/storage/keys";
import { presignPut } from "@/storage/presign";

type P = { episodeId: string };

/** Signs a direct upload of one photo (failure evidence, tool photos); the server never carries the bytes. */
export const POST = route<P>(async (req, params) => {
  const input = await parseBody(req, photoUploadSchema, "photo");
  const user = await sessionUser(req);
  const { episode } = await loadEpisode(user.id, params.episodeId, "build.edit");
  const ext = input.contentType.split("/")[1]!.replace("jpeg", "jpg");
  const key = newObjectKey(episode.channelId, "photo", ext);
  const uploadUrl = await presignPut(key, input.contentType, input.size);
  return json({ key, uploadUrl, headers: { "content-type": input.contentType } }, 201);
});
