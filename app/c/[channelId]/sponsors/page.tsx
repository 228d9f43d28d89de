import { pageAccess } from "@/lib/server/access/page-access";
import { getChannelById } from "@/db/queries/channels";
import { listEpisodesByChannel } from "@/db/queries/episodes";
import { listToolsByChannel } from "@/db/queries/tools";
import { can } from "@/lib/permissions";
import { SponsorsView } from "@/components/sponsors/sponsors-view";

export const metadata = { title: "Sponsors" };

export default async function SponsorsPage({ params }: { params: Promise<{ channelId: string }> }) {
  const { channelId } = await params;
  const access = await pageAccess(channelId, "channel.read", `/c/${channelId}/sponsors`);
  const [channel, episodes, tools] = await Promise.all([getChannelById({ id: access.channelId }), listEpisodesByChannel({ channelId: access.channelId }), listToolsByChannel({ channelId: access.channelId })]);
  return (
    <div className="mx-auto max-w-6xl space-y-4">
      <h1 className="text-xl font-bold">Sponsors and deals</h1>
      <SponsorsView channelId={access.channelId} canManage={can(access.roles, "sponsors.manage")} canReply={can(access.roles, "sponsors.manage") || can(access.roles, "script.write")} currency={channel!.currency} episodes={episodes.map((e) => ({ id: e.id, title: e.title }))} tools={tools.map((t) => ({ id: t.id, name: t.name, acquisition: t.acquisition }))} />
    </div>
  );
}
