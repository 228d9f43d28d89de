import { channelRoute } from "@/lib/server/http/route-builder";
import { json } from "@/lib/server/http/api";
import { reviewReplySchema } from "@/lib/schemas/sponsors";
import { recordTeamReply } from "@/lib/server/services/sponsors";
import { dealReviewFor } from "@/lib/server/views/sponsors";

/** The review thread, its state (reopened when the script changed after a decision) and the links sent. */
export const GET = channelRoute({ load: "deal", action: "channel.read" }, async ({ deal }) => json(await dealReviewFor(deal)));

/** The liaison or the presenter answers the sponsor in the thread. */
export const POST = channelRoute({ load: "deal", action: ["sponsors.manage", "script.write"], body: reviewReplySchema, what: "reply" }, async ({ deal, user, body }) => {
  await recordTeamReply({ deal, userId: user.id, body: body.body });
  return json(await dealReviewFor(deal), 201);
});
