import { addDays } from "date-fns";
import { json, parseBody, parseId, route, sessionUser } from "@/lib/server/api";
import { requireChannel } from "@/lib/server/access";
import { invitationCreateSchema } from "@/lib/schemas/account";
import { createInvitation, listInvitationsByChannel } from "@/db/queries/auth";
import { getChannelById } from "@/db/queries/channels";
import { recordAudit } from "@/db/queries/audit";
import { newToken } from "@/lib/server/tokens";
import { appUrl, sendMail } from "@/lib/server/mail";
import { ROLE_LABELS } from "@/lib/roles";

type P = { channelId: string };

export const GET = route<P>(async (req, params) => {
  const user = await sessionUser(req);
  const channelId = parseId(params.channelId, "channel");
  await requireChannel(user.id, channelId, "members.manage");
  const rows = await listInvitationsByChannel({ channelId });
  return json({ invitations: rows.map((r) => ({ ...r, expiresAt: r.expiresAt.toISOString(), createdAt: r.createdAt.toISOString() })) });
});

export const POST = route<P>(async (req, params) => {
  const input = await parseBody(req, invitationCreateSchema, "invitation");
  const user = await sessionUser(req);
  const channelId = parseId(params.channelId, "channel");
  await requireChannel(user.id, channelId, "members.manage");
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
