import { episodePage } from "@/lib/server/access/episode-page";
import { listClipsByEpisode } from "@/db/queries/footage";
import { can } from "@/lib/permissions";
import { CoverageView } from "@/components/coverage/coverage-view";

export const metadata = { title: "B-roll coverage" };

export default async function CoveragePage({ params }: { params: Promise<{ channelId: string; episodeId: string }> }) {
  const { channelId, episodeId } = await params;
  const { access, episode } = await episodePage(channelId, episodeId, `/c/${channelId}/episodes/${episodeId}/coverage`);
  const clips = (await listClipsByEpisode({ episodeId: episode.id })).filter((c) => c.state === "stored");
  return <CoverageView episodeId={episode.id} base={`/c/${access.channelId}/episodes/${episode.id}`} canManage={can(access.roles, "coverage.manage")} canShots={can(access.roles, "shots.edit")} clips={clips.map((c) => ({ id: c.id, name: c.originalName, durationMs: c.durationMs }))} />;
}
