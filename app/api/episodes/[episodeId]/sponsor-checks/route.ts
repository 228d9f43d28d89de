import { channelRoute } from "@/lib/server/http/route-builder";
import { json } from "@/lib/server/http/api";
import { sponsorChecksFor } from "@/lib/server/views/sponsors";

/** Every deliverable of the episode's deals and every material connection, checked against the script, plan and B-roll, with timecodes. */
export const GET = channelRoute({ load: "episode", action: "channel.read" }, async ({ episode }) => json(await sponsorChecksFor(episode)));
