import { pageAccess } from "@/lib/server/access/page-access";
import { OverviewView } from "@/components/overview/overview-view";

export const metadata = { title: "Channel overview" };

export default async function OverviewPage({ params }: { params: Promise<{ channelId: string }> }) {
  const { channelId } = await params;
  const access = await pageAccess(channelId, "channel.read", `/c/${channelId}/overview`);
  return (
    <div className="mx-auto max-w-6xl space-y-4">
      <h1 className="text-xl font-bold">Channel at a glance</h1>
      <OverviewView channelId={access.channelId} />
    </div>
  );
}
