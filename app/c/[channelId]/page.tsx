import { pageAccess } from "@/lib/server/page-access";
import { listEpisodesByChannel, toEpisodeDto } from "@/db/queries/episodes";
import { Board } from "@/components/board/board";
import { scriptRuntimes } from "@/lib/server/script-view";

export const metadata = { title: "Episodes" };

export default async function BoardPage({ params }: { params: Promise<{ channelId: string }> }) {
  const { channelId } = await params;
  const access = await pageAccess(channelId, "channel.read", `/c/${channelId}`);
  const rows = await listEpisodesByChannel({ channelId: access.channelId });
  const runtimes = await scriptRuntimes(rows);
  return <Board channelId={access.channelId} roles={access.roles} initial={rows.map((e) => ({ ...toEpisodeDto(e), scriptSeconds: runtimes.get(e.id) ?? null }))} />;
}
