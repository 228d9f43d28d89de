import { episodePage } from "@/lib/server/access/episode-page";
import { toEpisodeDto } from "@/lib/server/views/episode";
import { EpisodeEditor } from "@/components/episode-editor";
import { can } from "@/lib/permissions";

export const metadata = { title: "Episode" };

export default async function EpisodePage({ params }: { params: Promise<{ channelId: string; episodeId: string }> }) {
  const { channelId, episodeId } = await params;
  const { access, episode } = await episodePage(channelId, episodeId, `/c/${channelId}/episodes/${episodeId}`);
  return (
    <div className="rounded-plank border border-timber-300 bg-white p-4">
      <EpisodeEditor episode={toEpisodeDto(episode)} channelId={access.channelId} canEdit={can(access.roles, "episode.edit")} canArchive={can(access.roles, "episode.archive")} />
    </div>
  );
}
