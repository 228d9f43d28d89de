import Link from "next/link";
import { format } from "date-fns";
import { episodePage } from "@/lib/server/access/episode-page";
import { STAGE_INFO } from "@/lib/stages";
import { EpisodeNav } from "@/components/episode-nav";

export default async function EpisodeLayout({ children, params }: { children: React.ReactNode; params: Promise<{ channelId: string; episodeId: string }> }) {
  const { channelId, episodeId } = await params;
  const { access, episode } = await episodePage(channelId, episodeId, `/c/${channelId}/episodes/${episodeId}`);
  return (
    <div className="mx-auto max-w-5xl space-y-4">
      <p className="text-sm print:hidden">
        <Link href={`/c/${access.channelId}`} className="text-chalk-600 underline">
          ← Episodes
        </Link>
      </p>
      <div className="print:hidden">
        <p className="text-sm text-walnut-600">
          Stage {STAGE_INFO[episode.stage].step} · {STAGE_INFO[episode.stage].label}
          {episode.archivedAt ? " · archived" : ""}
        </p>
        <h1 className="text-2xl font-bold">{episode.title}</h1>
        <p className="num text-xs text-walnut-600">
          {episode.frameRate} fps{episode.dropFrame ? " drop-frame" : ""} · updated {format(episode.updatedAt, "d MMM yyyy HH:mm")}
        </p>
      </div>
      <div className="print:hidden">
        <EpisodeNav base={`/c/${access.channelId}/episodes/${episode.id}`} />
      </div>
      {children}
    </div>
  );
}
