import { channelRoute } from "@/lib/server/route-builder";
import { json } from "@/lib/server/api";
import { cleanupAbandonedUploads } from "@/lib/server/cleanup";

/** Owner: abort this channel's uploads that were abandoned more than a day ago. */
export const POST = channelRoute({ load: "channel", action: "members.manage" }, async ({ channelId }) => {
  return json(await cleanupAbandonedUploads(channelId));
});
