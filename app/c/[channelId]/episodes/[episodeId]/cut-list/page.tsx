import { episodePage } from "@/lib/server/access/episode-page";
import { getChannelById } from "@/db/queries/channels";
import { listStepTitlesByEpisode } from "@/db/queries/build";
import { can } from "@/lib/permissions";
import { CutList } from "@/components/cut-list/cut-list";
import { Caution } from "@/components/caution";

export const metadata = { title: "Cut list" };

export default async function CutListPage({ params }: { params: Promise<{ channelId: string; episodeId: string }> }) {
  const { channelId, episodeId } = await params;
  const { access, episode } = await episodePage(channelId, episodeId, `/c/${channelId}/episodes/${episodeId}/cut-list`);
  const channel = await getChannelById({ id: access.channelId });
  const steps = await listStepTitlesByEpisode({ episodeId: episode.id });
  return (
    <div className="space-y-3">
      <CutList episodeId={episode.id} canEdit={can(access.roles, "build.edit")} defaultUnit={channel?.units === "metric" ? "mm" : "in"} currency={channel?.currency ?? "USD"} steps={steps} />
      <Caution hazard="power_tool" extra="Breaking down sheet goods and ripping long boards needs outfeed support and a helper." />
    </div>
  );
}
