import { channelRoute } from "@/lib/server/http/route-builder";
import { json, parseId } from "@/lib/server/http/api";
import { AppError } from "@/lib/server/http/errors";
import { memberRolesSchema } from "@/lib/schemas/account";
import { removeMember, updateMemberRoles } from "@/lib/server/services/accounts";
import { recordAudit } from "@/db/queries/audit";

export const PATCH = channelRoute({ load: "channel", action: "members.manage", body: memberRolesSchema, what: "member roles" }, async ({ channelId, user, params, body }) => {
  const { roles } = body;
  const memberId = parseId(params.userId, "member");
  const result = await updateMemberRoles({ channelId, userId: memberId, roles });
  if (!result.ok && result.reason === "not_found") throw new AppError("not_found:member", "No such member in this channel.");
  if (!result.ok) throw new AppError("conflict:last-owner", "A channel needs at least one owner. Make someone else owner first.");
  await recordAudit({ channelId, userId: user.id, action: "roles", entity: "membership", entityId: memberId, after: { roles } });
  return json({ userId: memberId, roles });
});

/** Removes the member from the channel (owner only; never the last owner). What they made stays. */
export const DELETE = channelRoute({ load: "channel", action: "members.manage" }, async ({ channelId, user, params }) => {
  const memberId = parseId(params.userId, "member");
  const result = await removeMember({ channelId, userId: memberId });
  if (!result.ok && result.reason === "not_found") throw new AppError("not_found:member", "No such member in this channel.");
  if (!result.ok) throw new AppError("conflict:last-owner", "A channel needs at least one owner. Make someone else owner first.");
  await recordAudit({ channelId, userId: user.id, action: "remove", entity: "membership", entityId: memberId });
  return json({ userId: memberId, removed: true });
});
