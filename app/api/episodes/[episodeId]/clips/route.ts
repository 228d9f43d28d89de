import { json, route, sessionUser } from "@/lib/server/api";
import { loadEpisode } from "@/lib/server/loaders";
import { listClipsByEpisode, toClipDto } from "@/db/queries/footage";

type P = { episodeId: string };

export const GET = route<P>(async (req, params) => {
  const user = await sessionUser(req);
  const { episode } = await loadEpisode(user.id, params.episodeId);
  return json({ clips: (await listClipsByEpisode({ episodeId: episode.id })).map(toClipDto) });
});
