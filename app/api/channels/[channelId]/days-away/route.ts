import { channelRoute } from "@/lib/server/http/route-builder";
import { json } from "@/lib/server/http/api";
import { daysAwaySchema, shootDayListQuerySchema } from "@/lib/schemas/shoot";
import { setDaysAway } from "@/lib/server/services/shoot-days";
import { daysAwayDtos } from "@/lib/server/views/shoot-days";

/** Everyone's days away (all members read them, to plan around them). */
export const GET = channelRoute({ load: "channel", action: "channel.read", query: shootDayListQuerySchema }, async ({ channelId, query }) => json({ daysAway: await daysAwayDtos(channelId, query.from, query.to) }));

/** My own days away: dates to add and to take off. Nobody marks anyone else away. */
export const PUT = channelRoute({ load: "channel", action: "availability.own", body: daysAwaySchema, what: "days away" }, async ({ channelId, user, body }) => {
  await setDaysAway({ channelId, userId: user.id, add: body.add, remove: body.remove, note: body.note });
  return json({ daysAway: await daysAwayDtos(channelId) });
});
