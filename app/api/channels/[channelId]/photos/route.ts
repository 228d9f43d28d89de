import { json, parseBody, parseId, route, sessionUser } from "@/lib/server/api";
import { requireChannel } from "@/lib/server/access";
import { photoUploadSchema } from "@/lib/schemas/build";
import { issuePhotoUpload } from "@/lib/server/uploads";

type P = { channelId: string };

/** Signs a direct upload of a tool photo for the channel's shelf. */
export const POST = route<P>(async (req, params) => {
  const input = await parseBody(req, photoUploadSchema, "photo");
  const user = await sessionUser(req);
  const channelId = parseId(params.channelId, "channel");
  await requireChannel(user.id, channelId, "tools.edit");
  return json(await issuePhotoUpload({ channelId, userId: user.id, purpose: "tool_photo", contentType: input.contentType, size: input.size }), 201);
});
