import { channelRoute } from "@/lib/server/route-builder";
import { json } from "@/lib/server/api";
import { listRevisionsByEpisode } from "@/db/queries/script";

export const GET = channelRoute({ load: "episode", action: "channel.read" }, async ({ episode }) => {
  const rows = await listRevisionsByEpisode({ episodeId: episode.id });
  return json({ revisions: rows.map((r) => ({ ...r, createdAt: r.createdAt.toISOString() })) });
});
