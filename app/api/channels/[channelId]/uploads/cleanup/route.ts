import { channelRoute } from "@/lib/server/http/route-builder";
import { json } from "@/lib/server/http/api";
import { cleanupAbandonedUploads } from "@/lib/server/services/upload-cleanup";

/** Owner: abort this channel's uploads that were abandoned more than a day ago. */
export const POST = channelRoute({ load: "channel", action: "members.manage" }, async ({ channelId }) => {
  return json(await cleanupAbandonedUploads(channelId));
});
