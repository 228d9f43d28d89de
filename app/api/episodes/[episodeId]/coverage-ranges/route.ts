import { channelRoute } from "@/lib/server/http/route-builder";
import { json } from "@/lib/server/http/api";
import { coverageRangeSchema } from "@/lib/schemas/footage";
import { createRange } from "@/db/queries/coverage";
import { getClipById } from "@/db/queries/footage";
import { msToFrames, rateOf } from "@/lib/timecode";
import { settleGaps } from "@/lib/server/services/coverage";
import { AppError } from "@/lib/server/http/errors";

/**
 * Lays B-roll on the script timeline: a clip placed at a frame (its in/out
 * decide the length, unless an end is given), or a marked range.
 */
export const POST = channelRoute({ load: "episode", action: "coverage.manage", body: coverageRangeSchema, what: "coverage range" }, async ({ episode, body }) => {
  const input = body;
  let endFrame = input.endFrame;
  let clipInFrame = 0;
  if (input.clipId) {
    const clip = await getClipById({ id: input.clipId });
    if (!clip || clip.episodeId !== episode.id) throw new AppError("unprocessable:range.clip", "That clip is not part of this episode's footage.", { fields: { clipId: ["not a clip of this episode"] } });
    if (clip.state !== "stored") throw new AppError("unprocessable:range.clip", "That clip has not finished uploading.", { fields: { clipId: ["still uploading"] } });
    clipInFrame = clip.inFrame ?? 0;
    if (endFrame == null) {
      const rate = rateOf(episode.frameRate, episode.dropFrame);
      const length = clip.outFrame != null ? clip.outFrame - clipInFrame : clip.durationMs != null ? msToFrames(clip.durationMs, rate) - clipInFrame : null;
      if (!length || length <= 0) throw new AppError("unprocessable:range.length", "The clip's length is unknown; give an end timecode.", { fields: { endFrame: ["give an end"] } });
      endFrame = input.startFrame + length;
    }
  }
  const row = await createRange({ episodeId: episode.id, clipId: input.clipId, clipInFrame, startFrame: input.startFrame, endFrame: endFrame!, note: input.note });
  await settleGaps(episode);
  return json({ range: { id: row.id, clipId: row.clipId, startFrame: row.startFrame, endFrame: row.endFrame } }, 201);
});
