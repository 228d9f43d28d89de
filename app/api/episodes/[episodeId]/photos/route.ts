import { json, parseBody, route, sessionUser } from "@/lib/server/api";
import { loadEpisode } from "@/lib/server/loaders";
import { photoUploadSchema } from "@/lib/schemas/build";
import { issuePhotoUpload } from "@/lib/server/uploads";

type P = { episodeId: string };

/** Signs a direct upload of one failure photo; the server never carries the bytes. */
export const POST = route<P>(async (req, params) => {
  const input = await parseBody(req, photoUploadSchema, "photo");
  const user = await sessionUser(req);
  const { episode } = await loadEpisode(user.id, params.episodeId, "build.edit");
  return json(await issuePhotoUpload({ channelId: episode.channelId, userId: user.id, purpose: "failure_photo", contentType: input.contentType, size: input.size }), 201);
});
