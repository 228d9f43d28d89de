import { json, parseBody, route, sessionUser } from "@/lib/server/api";
import { loadEpisode } from "@/lib/server/loaders";
import { gapCreateSchema } from "@/lib/schemas/footage";
import { createGap } from "@/db/queries/coverage";
import { linksBelong } from "@/db/queries/shots";
import { AppError } from "@/lib/server/errors";

type P = { episodeId: string };

/** Marks a gap by hand, or keeps a computed one so it can be dismissed or resolved. */
export const POST = route<P>(async (req, params) => {
  const input = await parseBody(req, gapCreateSchema, "gap");
  const user = await sessionUser(req);
  const { episode } = await loadEpisode(user.id, params.episodeId, "coverage.manage");
  if (await linksBelong({ episodeId: episode.id, segmentId: input.segmentId })) {
    throw new AppError("unprocessable:gap.segment", "That segment is not in this episode.", { fields: { segmentId: ["not in this episode"] } });
  }
  const row = await createGap({ episodeId: episode.id, input });
  return json({ gap: { id: row.id, status: row.status, source: row.source, startFrame: row.startFrame, endFrame: row.endFrame } }, 201);
});
