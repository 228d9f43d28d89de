import { episodePage } from "@/lib/server/access/episode-page";
import { can, canMoveEpisode } from "@/lib/permissions";
import { PublishView } from "@/components/publish/publish-view";

export const metadata = { title: "Publish" };

export default async function PublishPage({ params }: { params: Promise<{ channelId: string; episodeId: string }> }) {
  const { channelId, episodeId } = await params;
  const { access, episode } = await episodePage(channelId, episodeId, `/c/${channelId}/episodes/${episodeId}/publish`);
  return (
    <PublishView
      episodeId={episode.id}
      base={`/c/${access.channelId}/episodes/${episode.id}`}
      canEdit={can(access.roles, "publish.edit")}
      canMarkFinal={can(access.roles, "script.write")}
      canPublish={can(access.roles, "episode.move") && canMoveEpisode(access.roles, episode.stage, "published")}
      isOwner={access.roles.includes("owner")}
    />
  );
}
