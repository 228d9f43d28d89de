import { json, route, sessionUser } from "@/lib/server/api";
import { loadEpisode } from "@/lib/server/loaders";
import { restoreEpisode, toEpisodeDto } from "@/db/queries/episodes";
import { recordAudit } from "@/db/queries/audit";
import { AppError } from "@/lib/server/errors";

type P = { episodeId: string };

/** Puts an archived episode back on the board, at the end of its stage. */
export const POST = route<P>(async (req, params) => {
  const user = await sessionUser(req);
  const { episode } = await loadEpisode(user.id, params.episodeId, "episode.archive");
  const row = await restoreEpisode({ id: episode.id, channelId: episode.channelId, userId: user.id });
  if (!row) throw new AppError("conflict:episode.active", "This episode is not archived.");
  await recordAudit({ channelId: episode.channelId, userId: user.id, action: "restore", entity: "episode", entityId: episode.id });
  return json({ episode: toEpisodeDto(row) });
});
