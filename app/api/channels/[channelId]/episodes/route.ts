import { json, parseBody, parseId, parseQuery, route, sessionUser } from "@/lib/server/api";
import { requireChannel } from "@/lib/server/access";
import { episodeCreateSchema, episodeListQuerySchema } from "@/lib/schemas/episode";
import { createEpisode, listEpisodesByChannel, toEpisodeDto } from "@/db/queries/episodes";
import { recordAudit } from "@/db/queries/audit";
import { boardFigures } from "@/lib/server/board-figures";

type P = { channelId: string };

export const GET = route<P>(async (req, params) => {
  const query = parseQuery(req, episodeListQuerySchema);
  const user = await sessionUser(req);
  const channelId = parseId(params.channelId, "channel");
  await requireChannel(user.id, channelId, "channel.read");
  const rows = await listEpisodesByChannel({ channelId, stage: query.stage, month: query.month, archived: query.archived === "true" });
  const figures = await boardFigures(rows);
  return json({ episodes: rows.map((e) => ({ ...toEpisodeDto(e), ...figures.get(e.id) })) });
});

export const POST = route<P>(async (req, params) => {
  const input = await parseBody(req, episodeCreateSchema, "episode");
  const user = await sessionUser(req);
  const channelId = parseId(params.channelId, "channel");
  await requireChannel(user.id, channelId, "episode.create");
  const row = await createEpisode({ channelId, userId: user.id, input });
  await recordAudit({ channelId, userId: user.id, action: "create", entity: "episode", entityId: row.id, after: toEpisodeDto(row) });
  return json({ episode: toEpisodeDto(row) }, 201);
});
