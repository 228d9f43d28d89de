import { channelRoute } from "@/lib/server/http/route-builder";
import { json } from "@/lib/server/http/api";
import { listClipsByEpisode } from "@/db/queries/footage";
import { toClipDto } from "@/lib/server/views/shots";

export const GET = channelRoute({ load: "episode", action: "channel.read" }, async ({ episode }) => {
  return json({ clips: (await listClipsByEpisode({ episodeId: episode.id })).map(toClipDto) });
});
