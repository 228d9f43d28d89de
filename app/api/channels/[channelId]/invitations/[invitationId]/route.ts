import { json, parseId, route, sessionUser } from "@/lib/server/api";
import { requireChannel } from "@/lib/server/access";
import { AppError } from "@/lib/server/errors";
import { revokeInvitation } from "@/db/queries/auth";

type P = { channelId: string; invitationId: string };

export const DELETE = route<P>(async (req, params) => {
  const user = await sessionUser(req);
  const channelId = parseId(params.channelId, "channel");
  const id = parseId(params.invitationId, "invitation");
  await requireChannel(user.id, channelId, "members.manage");
  const row = await revokeInvitation({ id, channelId });
  if (!row) throw new AppError("not_found:invitation", "No open invitation with that id.");
  return json({ ok: true });
});
