import { channelRoute } from "@/lib/server/http/route-builder";
import { json } from "@/lib/server/http/api";
import { assertCan } from "@/lib/server/access/access";
import { pickupCreateSchema as schema } from "@/lib/schemas/footage";
import { linksBelong } from "@/db/queries/shots";
import { createPickup } from "@/lib/server/services/shots";
import { toShotDto } from "@/lib/server/views/shots";
import { getGapById } from "@/db/queries/coverage";
import { formatTimecode, rateOf } from "@/lib/timecode";
import { AppError } from "@/lib/server/http/errors";

/** Turns a gap into a pickup shot on the shot list, linked back to the gap and its segment. */
export const POST = channelRoute({ load: "episode", action: "coverage.manage", body: schema, what: "pickup" }, async ({ episode, access, body }) => {
  const input = body;
  assertCan(access, "shots.edit");
  let gap: { id?: string; startFrame: number; endFrame: number; segmentId: string | null; reason: "voice_over" | "to_camera" | null };
  if (input.gapId) {
    const row = await getGapById({ id: input.gapId });
    if (!row || row.gap.episodeId !== episode.id) throw new AppError("not_found:gap", "No such gap in this episode.");
    gap = { id: row.gap.id, startFrame: row.gap.startFrame, endFrame: row.gap.endFrame, segmentId: row.gap.segmentId, reason: row.gap.reason };
  } else {
    if (await linksBelong({ episodeId: episode.id, segmentId: input.segmentId })) throw new AppError("unprocessable:gap.segment", "That segment is not in this episode.", { fields: { segmentId: ["not in this episode"] } });
    gap = { startFrame: input.startFrame!, endFrame: input.endFrame!, segmentId: input.segmentId, reason: input.reason };
  }
  const rate = rateOf(episode.frameRate, episode.dropFrame);
  const description = input.description || `Pickup: B-roll to cover ${formatTimecode(gap.startFrame, rate)}–${formatTimecode(gap.endFrame, rate)}`;
  const made = await createPickup({ episodeId: episode.id, gap, description, kind: input.kind });
  if (made.duplicate) throw new AppError("conflict:gap.pickup", `This gap already has a pickup shot on the shot list: “${made.duplicate.description}”. Capture it, or place B-roll over the gap.`);
  return json({ shot: toShotDto(made.shot!), gapId: made.gapId }, 201);
});
