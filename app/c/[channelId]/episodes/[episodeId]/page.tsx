import Link from "next/link";
import { notFound } from "next/navigation";
import { z } from "zod";
import { format } from "date-fns";
import { pageAccess } from "@/lib/server/page-access";
import { getEpisodeById, toEpisodeDto } from "@/db/queries/episodes";
import { EpisodeEditor } from "@/components/episode-editor";
import { STAGE_INFO } from "@/lib/stages";
import { can } from "@/lib/permissions";

export const metadata = { title: "Episode" };

export default async function EpisodePage({ params }: { params: Promise<{ channelId: string; episodeId: string }> }) {
  const { channelId, episodeId } = await params;
  const access = await pageAccess(channelId, "channel.read", `/c/${channelId}/episodes/${episodeId}`);
  const id = z.uuid().safeParse(episodeId);
  if (!id.success) notFound();
  const episode = await getEpisodeById({ id: id.data });
  if (!episode || episode.channelId !== access.channelId) notFound();
  const dto = toEpisodeDto(episode);
  return (
    <div className="mx-auto max-w-3xl space-y-4">
      <p className="text-sm">
        <Link href={`/c/${access.channelId}`} className="text-chalk-600 underline">
          ← Episodes
        </Link>
      </p>
      <div>
        <p className="text-sm text-walnut-600">
          Stage {STAGE_INFO[episode.stage].step} · {STAGE_INFO[episode.stage].label}
          {episode.archivedAt ? " · archived" : ""}
        </p>
        <h1 className="text-2xl font-bold">{episode.title}</h1>
        <p className="num text-xs text-walnut-600">
          {episode.frameRate} fps{episode.dropFrame ? " drop-frame" : ""} · updated {format(episode.updatedAt, "d MMM yyyy HH:mm")}
        </p>
      </div>
      <div className="rounded-plank border border-timber-300 bg-white p-4">
        <EpisodeEditor episode={dto} channelId={access.channelId} canEdit={can(access.roles, "episode.edit")} canArchive={can(access.roles, "episode.archive")} />
      </div>
    </div>
  );
}
