import { channelRoute } from "@/lib/server/http/route-builder";
import { json } from "@/lib/server/http/api";
import { planSchedule } from "@/lib/server/services/shoot-days";
import { scheduleDto } from "@/lib/server/views/shoot-days";
import { recordAudit } from "@/db/queries/audit";

/** The schedule the current plan, shoot days and days away give, and what would move against the saved one. */
export const GET = channelRoute({ load: "episode", action: "channel.read" }, async ({ episode }) => json(scheduleDto(await planSchedule({ episode, save: false }))));

/** Plans again and saves it: call sheets read the saved schedule. Answers what moved. */
export const POST = channelRoute({ load: "episode", action: "schedule.edit" }, async ({ episode, user }) => {
  const planned = await planSchedule({ episode, save: true });
  await recordAudit({ channelId: episode.channelId, userId: user.id, action: "schedule", entity: "episode", entityId: episode.id, after: { placed: planned.result.placements.length, unscheduled: planned.result.unscheduled.length, moved: planned.moved.length } });
  return json(scheduleDto(planned));
});
