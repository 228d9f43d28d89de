import { json } from "@/lib/server/http/api";
import { userRoute } from "@/lib/server/http/route-builder";
import { listChannelsByUser } from "@/db/queries/channels";

/** The channels the signed-in person is a member of. */
export const GET = userRoute({}, async ({ user }) => json({ channels: await listChannelsByUser({ userId: user.id }) }));
