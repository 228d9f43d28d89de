import { json, parseBody, parseId, route, sessionUser } from "@/lib/server/api";
import { requireChannel } from "@/lib/server/access";
import { AppError } from "@/lib/server/errors";
import { memberRolesSchema } from "@/lib/schemas/account";
import { updateMemberRoles } from "@/db/queries/channels";
import { recordAudit } from "@/db/queries/audit";

type P = { channelId: string; userId: string };

export const PATCH = route<P>(async (req, params) => {
  const { roles } = await parseBody(req, memberRolesSchema, "member roles");
  const user = await sessionUser(req);
  const channelId = parseId(params.channelId, "channel");
  const memberId = parseId(params.userId, "member");
  await requireChannel(user.id, channelId, "members.manage");
  const result = await updateMemberRoles({ channelId, userId: memberId, roles });
  if (!result.ok && result.reason === "not_found") throw new AppError("not_found:member", "No such member in this channel.");
  if (!result.ok) throw new AppError("conflict:last-owner", "A channel needs at least one owner. Make someone else owner first.");
  await recordAudit({ channelId, userId: user.id, action: "roles", entity: "membership", entityId: memberId, after: { roles } });
  return json({ userId: memberId, roles });
});
