import { channelRoute } from "@/lib/server/http/route-builder";
import { json } from "@/lib/server/http/api";
import { reviewLinkCreateSchema } from "@/lib/schemas/sponsors";
import { sendReviewLink } from "@/lib/server/services/sponsors";
import { recordAudit } from "@/db/queries/audit";

/** Mails a sponsor's contact a signed, expiring link that shows only this deal. */
export const POST = channelRoute({ load: "deal", action: "sponsors.manage", body: reviewLinkCreateSchema, what: "review link" }, async ({ deal, channelId, user, body }) => {
  const { link } = await sendReviewLink({ deal, userId: user.id, contactEmail: body.contactEmail, days: body.days });
  await recordAudit({ channelId, userId: user.id, action: "send", entity: "review_link", entityId: link.id, after: { dealId: deal.id, contactEmail: body.contactEmail, expiresAt: link.expiresAt } });
  return json({ link: { id: link.id, contactEmail: link.contactEmail, expiresAt: link.expiresAt.toISOString() } }, 201);
});
