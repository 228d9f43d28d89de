import { z } from "zod";
import { publicRoute } from "@/lib/server/http/route-builder";
import { AppError } from "@/lib/server/http/errors";
import { getChannelByCalendarTokenHash } from "@/db/queries/shoot-days";
import { hashCalendarToken } from "@/lib/server/services/shoot-days";
import { channelFeed } from "@/lib/server/views/shoot-days";

const token = z.string().regex(/^[A-Za-z0-9_-]{20,64}$/);

/**
 * Public by design: calendar apps subscribe without a session. The secret
 * token in the path is the key (only its hash is stored); it reads this one
 * feed and nothing else, and the owner can replace it at any time.
 */
export const GET = publicRoute({}, async ({ params }) => {
  const t = token.safeParse(params.token);
  const channel = t.success ? await getChannelByCalendarTokenHash({ hash: hashCalendarToken(t.data) }) : null;
  if (!channel || channel.archivedAt) throw new AppError("not_found:calendar", "No such calendar.");
  return new Response(await channelFeed(channel.id), { headers: { "content-type": "text/calendar; charset=utf-8", "cache-control": "private, max-age=300" } });
});
