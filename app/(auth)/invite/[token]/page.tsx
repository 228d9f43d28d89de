import { InviteForm } from "@/components/auth/invite-form";
import { getOpenInvitationByTokenHash } from "@/db/queries/auth";
import { hashToken } from "@/lib/server/infra/tokens";
import { ROLE_LABELS } from "@/lib/roles";

export const metadata = { title: "Invitation" };
export const dynamic = "force-dynamic";

export default async function InvitePage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const inv = token.length >= 20 && token.length <= 200 ? await getOpenInvitationByTokenHash({ tokenHash: hashToken(token) }) : null;
  if (!inv) {
    return (
      <div className="space-y-2">
        <h1 className="text-xl font-bold">This invitation does not work</h1>
        <p className="text-sm text-walnut-700">It was already used, revoked or has expired. Ask the channel owner to send a new one.</p>
      </div>
    );
  }
  return <InviteForm token={token} email={inv.email} channelName={inv.channelName} roles={inv.roles.map((r) => ROLE_LABELS[r]).join(", ")} />;
}
