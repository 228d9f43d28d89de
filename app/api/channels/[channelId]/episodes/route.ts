import { channelRoute } from "@/lib/server/http/route-builder";
import { json } from "@/lib/server/http/api";
import { episodeCreateSchema, episodeListQuerySchema } from "@/lib/schemas/episode";
import { listEpisodesByChannel } from "@/db/queries/episodes";
import { createEpisode } from "@/lib/server/services/episodes";
import { toEpisodeDto } from "@/lib/server/views/episode";
import { recordAudit } from "@/db/queries/audit";
import { boardFigures } from "@/lib/server/views/board-figures";

export const GET = channelRoute({ load: "channel", action: "channel.read", query: episodeListQuerySchema }, async ({ channelId, query }) => {
  const rows = await listEpisodesByChannel({ channelId, stage: query.stage, month: query.month, archived: query.archived === "true" });
  const figures = await boardFigures(rows);
  return json({ episodes: rows.map((e) => ({ ...toEpisodeDto(e), ...figures.get(e.id) })) });
});

export const POST = channelRoute({ load: "channel", action: "episode.create", body: episodeCreateSchema, what: "episode" }, async ({ channelId, user, body }) => {
  const input = body;
  const row = await createEpisode({ channelId, userId: user.id, input });
  await recordAudit({ channelId, userId: user.id, action: "create", entity: "episode", entityId: row.id, after: toEpisodeDto(row) });
  return json({ episode: toEpisodeDto(row) }, 201);
});
