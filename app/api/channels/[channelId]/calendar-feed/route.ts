import { channelRoute } from "@/lib/server/http/route-builder";
import { json } from "@/lib/server/http/api";
import { appUrl } from "@/lib/server/infra/mail";
import { rotateCalendarToken } from "@/lib/server/services/shoot-days";
import { recordAudit } from "@/db/queries/audit";

/** Makes a new secret feed URL for the channel's shoot days (owner); the old URL stops working. The URL is shown once. */
export const POST = channelRoute({ load: "channel", action: "calendar.rotate" }, async ({ channelId, user }) => {
  const token = await rotateCalendarToken({ channelId });
  await recordAudit({ channelId, userId: user.id, action: "rotate", entity: "calendar_feed" });
  return json({ url: appUrl(`/api/calendar/${token}`) }, 201);
});
