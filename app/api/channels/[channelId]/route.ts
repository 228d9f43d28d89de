import { channelRoute } from "@/lib/server/http/route-builder";
import { json } from "@/lib/server/http/api";
import { channelUpdateSchema } from "@/lib/schemas/account";
import { getChannelById, updateChannel } from "@/db/queries/channels";
import { recordAudit } from "@/db/queries/audit";

const dto = (c: NonNullable<Awaited<ReturnType<typeof getChannelById>>>) => ({ id: c.id, name: c.name, units: c.units, currency: c.currency, brollGapMs: c.brollGapMs, toCameraMaxMs: c.toCameraMaxMs, timeZone: c.timeZone });

export const GET = channelRoute({ load: "channel", action: "channel.read" }, async ({ channelId }) => {
  return json({ channel: dto((await getChannelById({ id: channelId }))!) });
});

/** Owner: the channel's name, units for cut lists, currency, and the B-roll gap thresholds. */
export const PATCH = channelRoute({ load: "channel", action: "members.manage", body: channelUpdateSchema, what: "channel settings" }, async ({ channelId, user, body }) => {
  const patch = body;
  const row = await updateChannel({ id: channelId, patch });
  await recordAudit({ channelId, userId: user.id, action: "settings", entity: "channel", entityId: channelId, after: patch });
  return json({ channel: dto(row!) });
});
