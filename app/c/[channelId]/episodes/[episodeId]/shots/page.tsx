import { episodePage } from "@/lib/server/access/episode-page";
import { listStepsByEpisode } from "@/db/queries/build";
import { can } from "@/lib/permissions";
import { ShotList } from "@/components/shots/shot-list";

export const metadata = { title: "Shot list" };

export default async function ShotsPage({ params }: { params: Promise<{ channelId: string; episodeId: string }> }) {
  const { channelId, episodeId } = await params;
  const { access, episode } = await episodePage(channelId, episodeId, `/c/${channelId}/episodes/${episodeId}/shots`);
  const steps = await listStepsByEpisode({ episodeId: episode.id });
  return <ShotList episodeId={episode.id} base={`/c/${access.channelId}/episodes/${episode.id}`} canEdit={can(access.roles, "shots.edit")} steps={steps.map((s) => ({ id: s.id, title: s.title, coverageKinds: s.coverageKinds }))} />;
}
