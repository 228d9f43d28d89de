import { channelRoute } from "@/lib/server/http/route-builder";
import { shootDayIcs } from "@/lib/server/views/shoot-days";

/** One shoot day as an iCalendar file (RFC 5545). */
export const GET = channelRoute({ load: "shootDay", action: "channel.read" }, async ({ shootDay }) => {
  return new Response(await shootDayIcs(shootDay), {
    headers: { "content-type": "text/calendar; charset=utf-8", "content-disposition": `attachment; filename="shoot-day-${shootDay.day}.ics"`, "cache-control": "private, no-store" },
  });
});
