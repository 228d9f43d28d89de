import { channelRoute } from "@/lib/server/http/route-builder";
import { json } from "@/lib/server/http/api";
import { shotCreateSchema } from "@/lib/schemas/footage";
import { linksBelong, listShotsByEpisode } from "@/db/queries/shots";
import { createShots } from "@/lib/server/services/shots";
import { toShotDto } from "@/lib/server/views/shots";
import { AppError } from "@/lib/server/http/errors";
import { episodeViewResponse } from "@/lib/server/infra/view-cache";

export const GET = channelRoute({ load: "episode", action: "channel.read" }, async ({ req, episode }) => {
  return episodeViewResponse(req, "shots", episode.id, async () => ({ shots: (await listShotsByEpisode({ episodeId: episode.id })).map(toShotDto) }));
});

export const POST = channelRoute({ load: "episode", action: "shots.edit", body: shotCreateSchema, what: "shot" }, async ({ episode, body }) => {
  const input = body;
  const wrong = await linksBelong({ episodeId: episode.id, stepId: input.stepId, segmentId: input.segmentId });
  if (wrong) throw new AppError("unprocessable:shot.link", "That step or segment is not in this episode.", { fields: { [wrong]: ["not in this episode"] } });
  if (input.shootDayId) throw new AppError("unprocessable:shot.day", "Shoot days are not scheduled yet; leave the shoot day empty.", { fields: { shootDayId: ["not available yet"] } });
  const [row] = await createShots({ episodeId: episode.id, rows: [input] });
  return json({ shot: toShotDto(row!) }, 201);
});
