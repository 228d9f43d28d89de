import { json, parseBody, route, sessionUser } from "@/lib/server/api";
import { loadEpisode } from "@/lib/server/loaders";
import { shotCreateSchema } from "@/lib/schemas/footage";
import { createShots, linksBelong, listShotsByEpisode, toShotDto } from "@/db/queries/shots";
import { AppError } from "@/lib/server/errors";

type P = { episodeId: string };

export const GET = route<P>(async (req, params) => {
  const user = await sessionUser(req);
  const { episode } = await loadEpisode(user.id, params.episodeId);
  return json({ shots: (await listShotsByEpisode({ episodeId: episode.id })).map(toShotDto) });
});

export const POST = route<P>(async (req, params) => {
  const input = await parseBody(req, shotCreateSchema, "shot");
  const user = await sessionUser(req);
  const { episode } = await loadEpisode(user.id, params.episodeId, "shots.edit");
  const wrong = await linksBelong({ episodeId: episode.id, stepId: input.stepId, segmentId: input.segmentId });
  if (wrong) throw new AppError("unprocessable:shot.link", "That step or segment is not in this episode.", { fields: { [wrong]: ["not in this episode"] } });
  if (input.shootDayId) throw new AppError("unprocessable:shot.day", "Shoot days are not scheduled yet; leave the shoot day empty.", { fields: { shootDayId: ["not available yet"] } });
  const [row] = await createShots({ episodeId: episode.id, rows: [input] });
  return json({ shot: toShotDto(row!) }, 201);
});
