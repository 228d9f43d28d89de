import { channelRoute } from "@/lib/server/http/route-builder";
import { json } from "@/lib/server/http/api";
import { AppError } from "@/lib/server/http/errors";
import { revokeReviewLink } from "@/lib/server/services/sponsors";
import { recordAudit } from "@/db/queries/audit";

/** Withdraws a review link at once. */
export const DELETE = channelRoute({ load: "reviewLink", action: "sponsors.manage" }, async ({ link, channelId, user }) => {
  if (!(await revokeReviewLink({ id: link.id }))) throw new AppError("conflict:review-link.revoked", "This link was already withdrawn.");
  await recordAudit({ channelId, userId: user.id, action: "revoke", entity: "review_link", entityId: link.id });
  return json({ ok: true });
});
