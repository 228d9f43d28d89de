import { pageAccess } from "@/lib/server/access/page-access";
import { currentUser } from "@/lib/server/access/session";
import { getChannelById, listMembersByChannel } from "@/db/queries/channels";
import { listEpisodesByChannel } from "@/db/queries/episodes";
import { can } from "@/lib/permissions";
import { todayIn } from "@/lib/shoot-schedule";
import { ShootDaysView } from "@/components/shoot-days/shoot-days-view";

export const metadata = { title: "Shoot days" };

export default async function ShootDaysPage({ params }: { params: Promise<{ channelId: string }> }) {
  const { channelId } = await params;
  const access = await pageAccess(channelId, "channel.read", `/c/${channelId}/shoot-days`);
  const [channel, members, episodes, me] = await Promise.all([getChannelById({ id: access.channelId }), listMembersByChannel({ channelId: access.channelId }), listEpisodesByChannel({ channelId: access.channelId }), currentUser()]);
  const today = todayIn(channel!.timeZone);
  return (
    <div className="mx-auto max-w-6xl space-y-4">
      <h1 className="text-xl font-bold">Shoot days</h1>
      <ShootDaysView
        channelId={access.channelId}
        timeZone={channel!.timeZone}
        canPlan={can(access.roles, "schedule.edit")}
        isOwner={can(access.roles, "calendar.rotate")}
        me={me!.id}
        members={members.map((m) => ({ userId: m.userId, name: m.name }))}
        episodes={episodes.map((e) => ({ id: e.id, title: e.title }))}
        today={today}
      />
    </div>
  );
}
