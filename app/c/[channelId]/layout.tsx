import { pageAccess } from "@/lib/server/access/page-access";
import { listChannelsByUser } from "@/db/queries/channels";
import { AppHeader } from "@/components/app-header";
import { env } from "@/lib/env";
import { LiveProvider } from "@/components/live/live-provider";

export const dynamic = "force-dynamic";

export default async function ChannelLayout({ children, params }: { children: React.ReactNode; params: Promise<{ channelId: string }> }) {
  const { channelId } = await params;
  const access = await pageAccess(channelId, "channel.read", `/c/${channelId}`);
  const channels = await listChannelsByUser({ userId: access.user.id });
  return (
    <LiveProvider channelId={access.channelId} me={access.user.id}>
      <AppHeader channelId={access.channelId} channels={channels} userName={access.user.name} roles={access.roles} mailbox={env().DEV_MAILBOX} />
      <main className="mx-auto max-w-[1600px] px-4 py-4">{children}</main>
    </LiveProvider>
  );
}
