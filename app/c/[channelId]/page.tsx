import { pageAccess } from "@/lib/server/access/page-access";
import type { ComponentProps } from "react";
import { Board } from "@/components/board/board";
import { isStage } from "@/lib/stages";
import { boardJson } from "@/lib/server/views/board";

export const metadata = { title: "Episodes" };

export default async function BoardPage({ params, searchParams }: { params: Promise<{ channelId: string }>; searchParams: Promise<{ stage?: string }> }) {
  const { channelId } = await params;
  const { stage } = await searchParams;
  const access = await pageAccess(channelId, "channel.read", `/c/${channelId}`);
  // The same cached cards as GET /api/channels/{id}/episodes.
  const { episodes } = JSON.parse(await boardJson(access.channelId, {})) as { episodes: ComponentProps<typeof Board>["initial"] };
  return <Board channelId={access.channelId} roles={access.roles} initialStage={isStage(stage) ? stage : "all"} initial={episodes} />;
}
