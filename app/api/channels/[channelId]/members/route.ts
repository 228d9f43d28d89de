import { json, parseId, route, sessionUser } from "@/lib/server/api";
import { requireChannel } from "@/lib/server/access";
import { listMembersByChannel } from "@/db/queries/channels";

type P = { channelId: string };

export const GET = route<P>(async (req, params) => {
  const user = await sessionUser(req);
  const channelId = parseId(params.channelId, "channel");
  await requireChannel(user.id, channelId, "channel.read");
  const members = await listMembersByChannel({ channelId });
  return json({ members: members.map((m) => ({ ...m, joinedAt: m.joinedAt.toISOString() })) });
});
