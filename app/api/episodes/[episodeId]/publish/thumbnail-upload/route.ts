import { channelRoute } from "@/lib/server/http/route-builder";
import { json } from "@/lib/server/http/api";
import { thumbnailUploadSchema } from "@/lib/schemas/publish";
import { issuePhotoUpload } from "@/lib/server/services/uploads";

/** Signs a direct upload of the thumbnail image (JPEG or PNG, at most 2 MB); the server never carries the bytes. */
export const POST = channelRoute({ load: "episode", action: "publish.edit", body: thumbnailUploadSchema, what: "thumbnail" }, async ({ episode, user, body }) =>
  json(await issuePhotoUpload({ channelId: episode.channelId, userId: user.id, purpose: "thumbnail", contentType: body.contentType, size: body.size }), 201),
);
