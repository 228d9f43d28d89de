import { json, parseBody, route, sessionUser } from "@/lib/server/api";
import { loadShot } from "@/lib/server/clip-loader";
import { assertCan } from "@/lib/server/access";
import { shotUpdateSchema } from "@/lib/schemas/footage";
import { deleteShot, linksBelong, toShotDto, updateShot } from "@/db/queries/shots";
import { AppError } from "@/lib/server/errors";

type P = { shotId: string };

export const PATCH = route<P>(async (req, params) => {
  const patch = await parseBody(req, shotUpdateSchema, "shot");
  const user = await sessionUser(req);
  const { shot, access } = await loadShot(user.id, params.shotId);
  assertCan(access, "shots.edit");
  const wrong = await linksBelong({ episodeId: shot.episodeId, stepId: patch.stepId, segmentId: patch.segmentId });
  if (wrong) throw new AppError("unprocessable:shot.link", "That step or segment is not in this episode.", { fields: { [wrong]: ["not in this episode"] } });
  if (patch.shootDayId) throw new AppError("unprocessable:shot.day", "Shoot days are not scheduled yet.", { fields: { shootDayId: ["not available yet"] } });
  const row = await updateShot({ id: shot.id, episodeId: shot.episodeId, patch });
  return json({ shot: toShotDto(row!) });
});

export const DELETE = route<P>(async (req, params) => {
  const user = await sessionUser(req);
  const { shot, access } = await loadShot(user.id, params.shotId);
  assertCan(access, "shots.edit");
  await deleteShot({ id: shot.id, episodeId: shot.episodeId });
  return json({ ok: true });
});
