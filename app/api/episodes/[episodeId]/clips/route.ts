import { channelRoute } from "@/lib/server/route-builder";
import { json } from "@/lib/server/api";
import { listClipsByEpisode, toClipDto } from "@/db/queries/footage";

export const GET = channelRoute({ load: "episode", action: "channel.read" }, async ({ episode }) => {
  return json({ clips: (await listClipsByEpisode({ episodeId: episode.id })).map(toClipDto) });
});
