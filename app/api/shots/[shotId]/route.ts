import { channelRoute } from "@/lib/server/http/route-builder";
import { json } from "@/lib/server/http/api";
import { shotUpdateSchema } from "@/lib/schemas/footage";
import { linksBelong } from "@/db/queries/shots";
import { deleteShot, updateShot } from "@/lib/server/services/shots";
import { toShotDto } from "@/lib/server/views/shots";
import { AppError } from "@/lib/server/http/errors";

export const PATCH = channelRoute({ load: "shot", action: "shots.edit", body: shotUpdateSchema, what: "shot" }, async ({ shot, body }) => {
  const patch = body;
  const wrong = await linksBelong({ episodeId: shot.episodeId, stepId: patch.stepId, segmentId: patch.segmentId });
  if (wrong) throw new AppError("unprocessable:shot.link", "That step or segment is not in this episode.", { fields: { [wrong]: ["not in this episode"] } });
  if (patch.shootDayId) throw new AppError("unprocessable:shot.day", "Shoot days are not scheduled yet.", { fields: { shootDayId: ["not available yet"] } });
  const row = await updateShot({ id: shot.id, episodeId: shot.episodeId, patch });
  return json({ shot: toShotDto(row!) });
});

export const DELETE = channelRoute({ load: "shot", action: "shots.edit" }, async ({ shot }) => {
  await deleteShot({ id: shot.id, episodeId: shot.episodeId });
  return json({ ok: true });
});
