import { channelRoute } from "@/lib/server/http/route-builder";
import { json } from "@/lib/server/http/api";
import { restoreEpisode } from "@/lib/server/services/episodes";
import { toEpisodeDto } from "@/lib/server/views/episode";
import { recordAudit } from "@/db/queries/audit";
import { AppError } from "@/lib/server/http/errors";

/** Puts an archived episode back on the board, at the end of its stage. */
export const POST = channelRoute({ load: "episode", action: "episode.archive" }, async ({ episode, user }) => {
  const row = await restoreEpisode({ id: episode.id, channelId: episode.channelId, userId: user.id });
  if (!row) throw new AppError("conflict:episode.active", "This episode is not archived.");
  await recordAudit({ channelId: episode.channelId, userId: user.id, action: "restore", entity: "episode", entityId: episode.id });
  return json({ episode: toEpisodeDto(row) });
});
