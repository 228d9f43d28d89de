import { json } from "@/lib/server/http/api";
import { channelRoute } from "@/lib/server/http/route-builder";
import { AppError } from "@/lib/server/http/errors";
import { episodeUpdateSchema } from "@/lib/schemas/episode";
import { archiveEpisode, updateEpisode } from "@/lib/server/services/episodes";
import { toEpisodeDto } from "@/lib/server/views/episode";
import { recordAudit } from "@/db/queries/audit";

export const GET = channelRoute({ load: "episode", action: "channel.read" }, async ({ episode }) => json({ episode: toEpisodeDto(episode) }));

/** Edits need episode.edit; a move is checked against the stages (editors move only within editing). */
export const PATCH = channelRoute({ load: "episode", action: ["episode.edit", "episode.move"], body: episodeUpdateSchema, what: "episode" }, async ({ episode, access, user, body: patch }) => {
  const result = await updateEpisode({ id: episode.id, channelId: episode.channelId, userId: user.id, access, patch });
  if (!result) throw new AppError("not_found:episode", "No such episode.");
  await recordAudit({
    channelId: episode.channelId,
    userId: user.id,
    action: patch.stage !== undefined || patch.position !== undefined ? "move" : "update",
    entity: "episode",
    entityId: episode.id,
    before: toEpisodeDto(result.before),
    after: toEpisodeDto(result.after),
  });
  return json({ episode: toEpisodeDto(result.after) });
});

/** Deleting an episode archives it; nothing is destroyed. */
export const DELETE = channelRoute({ load: "episode", action: "episode.archive" }, async ({ episode, user }) => {
  const row = await archiveEpisode({ id: episode.id, channelId: episode.channelId, userId: user.id });
  if (!row) throw new AppError("conflict:episode.archived", "This episode is already archived.");
  await recordAudit({ channelId: episode.channelId, userId: user.id, action: "archive", entity: "episode", entityId: episode.id });
  return json({ episode: toEpisodeDto(row) });
});
