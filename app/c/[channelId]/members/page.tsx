import { pageAccess } from "@/lib/server/access/page-access";
import { listMembersByChannel } from "@/db/queries/channels";
import { listInvitationsByChannel } from "@/db/queries/auth";
import { can } from "@/lib/permissions";
import { MembersPanel } from "@/components/members-panel";

export const metadata = { title: "People" };

export default async function MembersPage({ params }: { params: Promise<{ channelId: string }> }) {
  const { channelId } = await params;
  const access = await pageAccess(channelId, "channel.read", `/c/${channelId}/members`);
  const manage = can(access.roles, "members.manage");
  const members = await listMembersByChannel({ channelId: access.channelId });
  const invites = manage ? await listInvitationsByChannel({ channelId: access.channelId }) : [];
  return (
    <div className="mx-auto max-w-4xl space-y-4">
      <h1 className="text-xl font-bold">People</h1>
      {!manage ? <p className="text-sm text-walnut-700">Only the owner invites people and changes roles.</p> : null}
      <MembersPanel
        channelId={access.channelId}
        selfId={access.user.id}
        manage={manage}
        members={members.map((m) => ({ userId: m.userId, name: m.name, email: m.email, roles: m.roles }))}
        invites={invites.map((i) => ({ id: i.id, email: i.email, roles: i.roles, expiresAt: i.expiresAt.toISOString() }))}
      />
    </div>
  );
}
