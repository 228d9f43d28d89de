import { pageAccess } from "@/lib/server/access/page-access";
import { listToolsByChannel } from "@/db/queries/tools";
import { listSponsorsByChannel } from "@/db/queries/sponsors";
import { toolDto } from "@/lib/server/views/plan";
import { can } from "@/lib/permissions";
import { ToolShelf } from "@/components/tools/tool-shelf";
import { presignGet } from "@/storage/presign";

export const metadata = { title: "Tool shelf" };

export default async function ToolsPage({ params }: { params: Promise<{ channelId: string }> }) {
  const { channelId } = await params;
  const access = await pageAccess(channelId, "channel.read", `/c/${channelId}/tools`);
  const [tools, sponsors] = await Promise.all([listToolsByChannel({ channelId: access.channelId }), listSponsorsByChannel({ channelId: access.channelId })]);
  const photoUrls = Object.fromEntries(await Promise.all(tools.filter((t) => t.photoKey).map(async (t) => [t.id, await presignGet(t.photoKey!)] as const)));
  return (
    <div className="mx-auto max-w-5xl space-y-4">
      <h1 className="text-xl font-bold">Tool shelf</h1>
      <ToolShelf channelId={access.channelId} tools={tools.map(toolDto)} sponsors={sponsors.map((s) => ({ id: s.id, name: s.name }))} canEdit={can(access.roles, "tools.edit")} photoUrls={photoUrls} />
    </div>
  );
}
