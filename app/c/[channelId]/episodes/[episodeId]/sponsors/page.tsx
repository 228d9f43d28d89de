import { episodePage } from "@/lib/server/access/episode-page";
import { SponsorChecksView } from "@/components/sponsors/sponsor-checks-view";

export const metadata = { title: "Sponsor checks" };

export default async function SponsorChecksPage({ params }: { params: Promise<{ channelId: string; episodeId: string }> }) {
  const { channelId, episodeId } = await params;
  const { episode } = await episodePage(channelId, episodeId, `/c/${channelId}/episodes/${episodeId}/sponsors`);
  return <SponsorChecksView episodeId={episode.id} />;
}
