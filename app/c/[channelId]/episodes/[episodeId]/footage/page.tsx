import { episodePage } from "@/lib/server/access/episode-page";
import { listShotsByEpisode } from "@/db/queries/shots";
import { can } from "@/lib/permissions";
import { FootagePanel } from "@/components/footage/footage-panel";

export const metadata = { title: "Footage" };

export default async function FootagePage({ params }: { params: Promise<{ channelId: string; episodeId: string }> }) {
  const { channelId, episodeId } = await params;
  const { access, episode } = await episodePage(channelId, episodeId, `/c/${channelId}/episodes/${episodeId}/footage`);
  const shots = await listShotsByEpisode({ episodeId: episode.id });
  return <FootagePanel episodeId={episode.id} channelBase={`/c/${access.channelId}/episodes/${episode.id}`} canManage={can(access.roles, "footage.manage")} shots={shots.map((s) => ({ id: s.id, description: s.description }))} />;
}
