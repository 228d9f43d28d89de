import { json, parseBody, parseId, route, sessionUser } from "@/lib/server/api";
import { requireChannel } from "@/lib/server/access";
import { photoUploadSchema } from "@/lib/schemas/build";
import { newObjectKey } from "@/storage/keys";
import { presignPut } from "@/storage/presign";

type P = { channelId: string };

/** Signs a direct upload of a tool photo for the channel's shelf. */
export const POST = route<P>(async (req, params) => {
  const input = await parseBody(req, photoUploadSchema, "photo");
  const user = await sessionUser(req);
  const channelId = parseId(params.channelId, "channel");
  await requireChannel(user.id, channelId, "tools.edit");
  const key = newObjectKey(channelId, "photo", input.contentType.split("/")[1]!.replace("jpeg", "jpg"));
  return json({ key, uploadUrl: await presignPut(key, input.contentType, input.size), headers: { "content-type": input.contentType } }, 201);
});
