import { channelRoute } from "@/lib/server/http/route-builder";
import { json } from "@/lib/server/http/api";
import { photoUploadSchema } from "@/lib/schemas/build";
import { issuePhotoUpload } from "@/lib/server/services/uploads";

/** Signs a direct upload of a tool photo for the channel's shelf. */
export const POST = channelRoute({ load: "channel", action: "tools.edit", body: photoUploadSchema, what: "photo" }, async ({ channelId, user, body }) => {
  const input = body;
  return json(await issuePhotoUpload({ channelId, userId: user.id, purpose: "tool_photo", contentType: input.contentType, size: input.size }), 201);
});
