import { channelRoute } from "@/lib/server/http/route-builder";
import { json } from "@/lib/server/http/api";
import { AppError } from "@/lib/server/http/errors";
import { shootDayUpdateSchema } from "@/lib/schemas/shoot";
import { deleteShootDay, updateShootDay } from "@/lib/server/services/shoot-days";
import { shootDayDtos } from "@/lib/server/views/shoot-days";
import { recordAudit } from "@/db/queries/audit";

export const GET = channelRoute({ load: "shootDay", action: "channel.read" }, async ({ shootDay }) => {
  const [dto] = await shootDayDtos([shootDay]);
  return json({ shootDay: dto });
});

/** Edit a day, move it to another date (its hours go with it), change its crew or cancel it (status). */
export const PATCH = channelRoute({ load: "shootDay", action: "schedule.edit", body: shootDayUpdateSchema, what: "shoot day" }, async ({ shootDay, channelId, user, body }) => {
  const row = await updateShootDay({ day: shootDay, patch: body });
  await recordAudit({ channelId, userId: user.id, action: "update", entity: "shoot_day", entityId: shootDay.id, before: shootDay, after: body });
  const [dto] = await shootDayDtos([row]);
  return json({ shootDay: dto });
});

export const DELETE = channelRoute({ load: "shootDay", action: "schedule.edit" }, async ({ shootDay, channelId, user }) => {
  const row = await deleteShootDay({ day: shootDay });
  if (!row) throw new AppError("not_found:shoot-day", "No such shoot day.");
  await recordAudit({ channelId, userId: user.id, action: "delete", entity: "shoot_day", entityId: shootDay.id, before: shootDay });
  return json({ ok: true });
});
