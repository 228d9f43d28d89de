import { pageAccess } from "@/lib/server/access/page-access";
import { listEpisodesByChannel } from "@/db/queries/episodes";
import { toEpisodeDto } from "@/lib/server/views/episode";
import { Board } from "@/components/board/board";
import { isStage } from "@/lib/stages";
import { boardFigures } from "@/lib/server/views/board-figures";

export const metadata = { title: "Episodes" };

export default async function BoardPage({ params, searchParams }: { params: Promise<{ channelId: string }>; searchParams: Promise<{ stage?: string }> }) {
  const { channelId } = await params;
  const { stage } = await searchParams;
  const access = await pageAccess(channelId, "channel.read", `/c/${channelId}`);
  const rows = await listEpisodesByChannel({ channelId: access.channelId });
  const figures = await boardFigures(rows);
  return <Board channelId={access.channelId} roles={access.roles} initialStage={isStage(stage) ? stage : "all"} initial={rows.map((e) => ({ ...toEpisodeDto(e), ...figures.get(e.id) }))} />;
}
