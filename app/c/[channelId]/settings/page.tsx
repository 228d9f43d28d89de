import { pageAccess } from "@/lib/server/access/page-access";
import { getChannelById } from "@/db/queries/channels";
import { can } from "@/lib/permissions";
import { ChannelSettings } from "@/components/channel-settings";
import { ChannelArchive } from "@/components/channel-archive";

export const metadata = { title: "Channel settings" };

export default async function SettingsPage({ params }: { params: Promise<{ channelId: string }> }) {
  const { channelId } = await params;
  const access = await pageAccess(channelId, "channel.read", `/c/${channelId}/settings`);
  const c = (await getChannelById({ id: access.channelId }))!;
  return (
    <div className="mx-auto max-w-3xl space-y-4">
      <h1 className="text-xl font-bold">Channel settings</h1>
      <ChannelSettings channelId={access.channelId} canEdit={can(access.roles, "members.manage")} initial={{ name: c.name, units: c.units, currency: c.currency, brollGapMs: c.brollGapMs, toCameraMaxMs: c.toCameraMaxMs, timeZone: c.timeZone }} />
      {can(access.roles, "channel.export") ? <ChannelArchive channelId={access.channelId} channelName={c.name} /> : null}
    </div>
  );
}
