import { channelRoute } from "@/lib/server/http/route-builder";
import { json } from "@/lib/server/http/api";
import { AppError } from "@/lib/server/http/errors";
import { removeDeliverable } from "@/lib/server/services/sponsors";

export const DELETE = channelRoute({ load: "deliverable", action: "sponsors.manage" }, async ({ deliverable }) => {
  if (!(await removeDeliverable({ id: deliverable.id }))) throw new AppError("not_found:deliverable", "No such deliverable.");
  return json({ ok: true });
});
