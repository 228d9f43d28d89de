import { json, route, sessionUser } from "@/lib/server/api";
import { loadEpisode } from "@/lib/server/loaders";
import { listRevisionsByEpisode } from "@/db/queries/script";

type P = { episodeId: string };

export const GET = route<P>(async (req, params) => {
  const user = await sessionUser(req);
  const { episode } = await loadEpisode(user.id, params.episodeId);
  const rows = await listRevisionsByEpisode({ episodeId: episode.id });
  return json({ revisions: rows.map((r) => ({ ...r, createdAt: r.createdAt.toISOString() })) });
});
