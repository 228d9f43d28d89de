import { channelRoute } from "@/lib/server/http/route-builder";
import { json } from "@/lib/server/http/api";
import { shootDayCreateSchema, shootDayListQuerySchema } from "@/lib/schemas/shoot";
import { listShootDaysByChannel } from "@/db/queries/shoot-days";
import { createShootDay } from "@/lib/server/services/shoot-days";
import { shootDayDtos } from "@/lib/server/views/shoot-days";
import { recordAudit } from "@/db/queries/audit";

/** The channel's shoot days (from/to: dates, inclusive), with crew, helpers and who is away. Every member reads them. */
export const GET = channelRoute({ load: "channel", action: "channel.read", query: shootDayListQuerySchema }, async ({ channelId, query }) => {
  return json({ shootDays: await shootDayDtos(await listShootDaysByChannel({ channelId, from: query.from, to: query.to })) });
});

export const POST = channelRoute({ load: "channel", action: "schedule.edit", body: shootDayCreateSchema, what: "shoot day" }, async ({ channelId, user, body }) => {
  const row = await createShootDay({ channelId, input: body });
  await recordAudit({ channelId, userId: user.id, action: "create", entity: "shoot_day", entityId: row.id, after: body });
  const [dto] = await shootDayDtos([row]);
  return json({ shootDay: dto }, 201);
});
