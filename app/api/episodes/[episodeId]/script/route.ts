import { channelRoute } from "@/lib/server/http/route-builder";
import { json } from "@/lib/server/http/api";
import { segmentCreateSchema } from "@/lib/schemas/script";
import { createSegment } from "@/lib/server/services/script";
import { toSegmentDto } from "@/lib/server/views/script";
import { listStepTitlesByEpisode } from "@/db/queries/build";
import { scriptViewFor } from "@/lib/server/views/script";
import { AppError } from "@/lib/server/http/errors";
import { episodeViewResponse } from "@/lib/server/infra/view-cache";
import { getEpisodeById } from "@/db/queries/episodes";

/** The script: segments with timing at the episode's rate, totals and chapters. */
export const GET = channelRoute({ load: "episode", action: "channel.read" }, async ({ req, episode }) => {
  // Built from the episode as read after the revision, never the row loaded before it.
  return episodeViewResponse(req, "script", episode.id, async () => scriptViewFor((await getEpisodeById({ id: episode.id })) ?? episode));
});

export const POST = channelRoute({ load: "episode", action: "script.write", body: segmentCreateSchema, what: "segment" }, async ({ episode, user, body }) => {
  const input = body;
  if (input.stepId && !(await listStepTitlesByEpisode({ episodeId: episode.id })).some((s) => s.id === input.stepId)) {
    throw new AppError("unprocessable:segment.step", "That build step is not in this episode.", { fields: { stepId: ["not a step of this episode"] } });
  }
  const r = await createSegment({ episodeId: episode.id, userId: user.id, input });
  if ("error" in r) throw new AppError("unprocessable:segment.after", "The segment to insert after is not in this script.", { fields: { afterId: ["not in this script"] } });
  return json({ segment: toSegmentDto(r.segment) }, 201);
});
