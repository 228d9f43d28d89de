import { json, route, sessionUser } from "@/lib/server/api";
import { listChannelsByUser } from "@/db/queries/channels";

export const GET = route(async (req) => {
  const user = await sessionUser(req);
  const channels = await listChannelsByUser({ userId: user.id });
  return json({ channels });
});
