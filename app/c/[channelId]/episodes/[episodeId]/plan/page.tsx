import { episodePage } from "@/lib/server/access/episode-page";
import { listToolsByChannel } from "@/db/queries/tools";
import { toolDto } from "@/lib/server/views/plan";
import { can } from "@/lib/permissions";
import { BuildPlan } from "@/components/plan/build-plan";

export const metadata = { title: "Build plan" };

export default async function PlanPage({ params }: { params: Promise<{ channelId: string; episodeId: string }> }) {
  const { channelId, episodeId } = await params;
  const { access, episode } = await episodePage(channelId, episodeId, `/c/${channelId}/episodes/${episodeId}/plan`);
  const shelf = (await listToolsByChannel({ channelId: access.channelId })).map(toolDto);
  return <BuildPlan episodeId={episode.id} tools={shelf} canEdit={can(access.roles, "build.edit")} canTime={can(access.roles, "build.timing")} />;
}
