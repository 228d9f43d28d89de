import { channelRoute } from "@/lib/server/http/route-builder";
import { json, jsonText } from "@/lib/server/http/api";
import { episodeCreateSchema, episodeListQuerySchema } from "@/lib/schemas/episode";
import { createEpisode } from "@/lib/server/services/episodes";
import { toEpisodeDto } from "@/lib/server/views/episode";
import { recordAudit } from "@/db/queries/audit";
import { boardJson } from "@/lib/server/views/board";

export const GET = channelRoute({ load: "channel", action: "channel.read", query: episodeListQuerySchema }, async ({ channelId, query }) => {
  return jsonText(await boardJson(channelId, query));
});

export const POST = channelRoute({ load: "channel", action: "episode.create", body: episodeCreateSchema, what: "episode" }, async ({ channelId, user, body }) => {
  const input = body;
  const row = await createEpisode({ channelId, userId: user.id, input });
  await recordAudit({ channelId, userId: user.id, action: "create", entity: "episode", entityId: row.id, after: toEpisodeDto(row) });
  return json({ episode: toEpisodeDto(row) }, 201);
});
