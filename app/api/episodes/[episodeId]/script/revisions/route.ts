import { channelRoute } from "@/lib/server/http/route-builder";
import { json } from "@/lib/server/http/api";
import { listRevisionsByEpisode } from "@/db/queries/script";

export const GET = channelRoute({ load: "episode", action: "channel.read" }, async ({ episode }) => {
  const rows = await listRevisionsByEpisode({ episodeId: episode.id });
  return json({ revisions: rows.map((r) => ({ ...r, createdAt: r.createdAt.toISOString() })) });
});
