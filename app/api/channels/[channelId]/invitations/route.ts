import { channelRoute } from "@/lib/server/http/route-builder";
import { addDays } from "date-fns";
import { json } from "@/lib/server/http/api";
import { invitationCreateSchema } from "@/lib/schemas/account";
import { createInvitation, listInvitationsByChannel } from "@/db/queries/auth";
import { getChannelById } from "@/db/queries/channels";
import { recordAudit } from "@/db/queries/audit";
import { newToken } from "@/lib/server/infra/tokens";
import { appUrl, sendMail } from "@/lib/server/infra/mail";
import { ROLE_LABELS } from "@/lib/roles";

export const GET = channelRoute({ load: "channel", action: "members.manage" }, async ({ channelId }) => {
  const rows = await listInvitationsByChannel({ channelId });
  return json({ invitations: rows.map((r) => ({ ...r, expiresAt: r.expiresAt.toISOString(), createdAt: r.createdAt.toISOString() })) });
});

export const POST = channelRoute({ load: "channel", action: "members.manage", body: invitationCreateSchema, what: "invitation" }, async ({ channelId, user, body }) => {
  const input = body;
  const channel = await getChannelById({ id: channelId });
  const { token, hash } = newToken();
  const inv = await createInvitation({ channelId, email: input.email, roles: input.roles, tokenHash: hash, invitedBy: user.id, expiresAt: addDays(new Date(), 7) });
  const link = appUrl(`/invite/${token}`);
  await sendMail({
    to: input.email,
    subject: `${user.name} invited you to ${channel?.name ?? "a channel"} on Jigboard`,
    text: [
      `${user.name} invited you to join ${channel?.name ?? "their channel"} on Jigboard as ${input.roles.map((r) => ROLE_LABELS[r]).join(", ")}.`,
      "",
      `Accept the invitation: ${link}`,
      "",
      "The link works once and expires in 7 days.",
    ].join("\n"),
    tag: { kind: "invitation", channelId, refId: inv.id },
  });
  await recordAudit({ channelId, userId: user.id, action: "invite", entity: "invitation", entityId: inv.id, after: { email: input.email, roles: input.roles } });
  return json({ invitation: { id: inv.id, email: inv.email, roles: inv.roles, expiresAt: inv.expiresAt.toISOString() } }, 201);
});
