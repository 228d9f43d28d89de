import { channelRoute } from "@/lib/server/http/route-builder";
import { json } from "@/lib/server/http/api";
import { listMembersByChannel } from "@/db/queries/channels";

export const GET = channelRoute({ load: "channel", action: "channel.read" }, async ({ channelId }) => {
  const members = await listMembersByChannel({ channelId });
  return json({ members: members.map((m) => ({ ...m, joinedAt: m.joinedAt.toISOString() })) });
});
