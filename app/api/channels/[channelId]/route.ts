import { json, parseBody, parseId, route, sessionUser } from "@/lib/server/api";
import { requireChannel } from "@/lib/server/access";
import { channelUpdateSchema } from "@/lib/schemas/account";
import { getChannelById, updateChannel } from "@/db/queries/channels";
import { recordAudit } from "@/db/queries/audit";

type P = { channelId: string };

const dto = (c: NonNullable<Awaited<ReturnType<typeof getChannelById>>>) => ({ id: c.id, name: c.name, units: c.units, currency: c.currency, brollGapMs: c.brollGapMs, toCameraMaxMs: c.toCameraMaxMs });

export const GET = route<P>(async (req, params) => {
  const user = await sessionUser(req);
  const channelId = parseId(params.channelId, "channel");
  await requireChannel(user.id, channelId, "channel.read");
  return json({ channel: dto((await getChannelById({ id: channelId }))!) });
});

/** Owner: the channel's name, units for cut lists, currency, and the B-roll gap thresholds. */
export const PATCH = route<P>(async (req, params) => {
  const patch = await parseBody(req, channelUpdateSchema, "channel settings");
  const user = await sessionUser(req);
  const channelId = parseId(params.channelId, "channel");
  await requireChannel(user.id, channelId, "members.manage");
  const row = await updateChannel({ id: channelId, patch });
  await recordAudit({ channelId, userId: user.id, action: "settings", entity: "channel", entityId: channelId, after: patch });
  return json({ channel: dto(row!) });
});
