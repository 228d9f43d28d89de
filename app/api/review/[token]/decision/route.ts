import { guestRoute } from "@/lib/server/http/route-builder";
import { json } from "@/lib/server/http/api";
import { reviewDecisionSchema } from "@/lib/schemas/sponsors";
import { recordGuestDecision } from "@/lib/server/services/sponsors";
import { guestReviewFor } from "@/lib/server/views/sponsors";

/** The sponsor approves, or asks for changes with a comment. */
export const POST = guestRoute({ body: reviewDecisionSchema, what: "review" }, async ({ deal, link, body }) => {
  await recordGuestDecision({ deal, link, decision: body.decision, comment: body.comment });
  return json(await guestReviewFor(deal, link), 201);
});
