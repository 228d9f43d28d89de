import { channelRoute } from "@/lib/server/http/route-builder";
import { json, parseId } from "@/lib/server/http/api";
import { AppError } from "@/lib/server/http/errors";
import { revokeInvitation } from "@/db/queries/auth";

export const DELETE = channelRoute({ load: "channel", action: "members.manage" }, async ({ channelId, params }) => {
  const id = parseId(params.invitationId, "invitation");
  const row = await revokeInvitation({ id, channelId });
  if (!row) throw new AppError("not_found:invitation", "No open invitation with that id.");
  return json({ ok: true });
});
