import { Readable } from "node:stream";
import { channelRoute } from "@/lib/server/http/route-builder";
import { exportChannel } from "@/lib/server/services/channel-archive";

/** Every record of the channel and the manifest of its stored objects, streamed as a signed zip (owner only). */
export const GET = channelRoute({ load: "channel", action: "channel.export" }, async ({ channelId }) => {
  const zip = await exportChannel(channelId);
  const day = new Date().toISOString().slice(0, 10);
  return new Response(Readable.toWeb(zip) as ReadableStream, {
    headers: { "content-type": "application/zip", "content-disposition": `attachment; filename="jigboard-channel-${day}.zip"`, "cache-control": "no-store" },
  });
});
