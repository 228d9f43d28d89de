import { channelRoute } from "@/lib/server/http/route-builder";
import { json } from "@/lib/server/http/api";
import { photoUploadSchema } from "@/lib/schemas/build";
import { issuePhotoUpload } from "@/lib/server/services/uploads";

/** Signs a direct upload of one failure photo; the server never carries the bytes. */
export const POST = channelRoute({ load: "episode", action: "build.edit", body: photoUploadSchema, what: "photo" }, async ({ episode, user, body }) => {
  const input = body;
  return json(await issuePhotoUpload({ channelId: episode.channelId, userId: user.id, purpose: "failure_photo", contentType: input.contentType, size: input.size }), 201);
});
