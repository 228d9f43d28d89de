import { channelRoute } from "@/lib/server/http/route-builder";
import { json } from "@/lib/server/http/api";
import { thumbnailSetSchema } from "@/lib/schemas/publish";
import { setThumbnail } from "@/lib/server/services/publish";
import { publishViewFor } from "@/lib/server/views/publish";

/** Sets the thumbnail to an upload issued to this channel for a thumbnail (422 for any other key). */
export const PUT = channelRoute({ load: "episode", action: "publish.edit", body: thumbnailSetSchema, what: "thumbnail" }, async ({ episode, user, body }) => {
  await setThumbnail({ episode, userId: user.id, key: body.key });
  return json(await publishViewFor(episode));
});

export const DELETE = channelRoute({ load: "episode", action: "publish.edit" }, async ({ episode, user }) => {
  await setThumbnail({ episode, userId: user.id, key: null });
  return json(await publishViewFor(episode));
});
