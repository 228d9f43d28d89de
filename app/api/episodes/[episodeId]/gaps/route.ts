import { channelRoute } from "@/lib/server/http/route-builder";
import { json } from "@/lib/server/http/api";
import { gapCreateSchema } from "@/lib/schemas/footage";
import { createGap } from "@/db/queries/coverage";
import { linksBelong } from "@/db/queries/shots";
import { AppError } from "@/lib/server/http/errors";

/** Marks a gap by hand, or keeps a computed one so it can be dismissed or resolved. */
export const POST = channelRoute({ load: "episode", action: "coverage.manage", body: gapCreateSchema, what: "gap" }, async ({ episode, body }) => {
  const input = body;
  if (await linksBelong({ episodeId: episode.id, segmentId: input.segmentId })) {
    throw new AppError("unprocessable:gap.segment", "That segment is not in this episode.", { fields: { segmentId: ["not in this episode"] } });
  }
  const row = await createGap({ episodeId: episode.id, input });
  return json({ gap: { id: row.id, status: row.status, source: row.source, startFrame: row.startFrame, endFrame: row.endFrame } }, 201);
});
