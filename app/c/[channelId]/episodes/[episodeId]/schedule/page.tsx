import { episodePage } from "@/lib/server/access/episode-page";
import { can } from "@/lib/permissions";
import { ScheduleView } from "@/components/schedule/schedule-view";

export const metadata = { title: "Schedule" };

export default async function SchedulePage({ params }: { params: Promise<{ channelId: string; episodeId: string }> }) {
  const { channelId, episodeId } = await params;
  const { access, episode } = await episodePage(channelId, episodeId, `/c/${channelId}/episodes/${episodeId}/schedule`);
  return <ScheduleView episodeId={episode.id} channelId={access.channelId} canPlan={can(access.roles, "schedule.edit")} />;
}
