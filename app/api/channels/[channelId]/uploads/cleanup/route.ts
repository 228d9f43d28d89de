import { json, parseId, route, sessionUser } from "@/lib/server/api";
import { requireChannel } from "@/lib/server/access";
import { cleanupAbandonedUploads } from "@/lib/server/cleanup";

type P = { channelId: string };

/** Owner: abort this channel's uploads that were abandoned more than a day ago. */
export const POST = route<P>(async (req, params) => {
  const user = await sessionUser(req);
  const channelId = parseId(params.channelId, "channel");
  await requireChannel(user.id, channelId, "members.manage");
  return json(await cleanupAbandonedUploads(channelId));
});
