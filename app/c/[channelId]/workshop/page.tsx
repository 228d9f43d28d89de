import Link from "next/link";
import { redirect } from "next/navigation";
import { pageAccess } from "@/lib/server/access/page-access";
import { todayIn } from "@/lib/shoot-schedule";
import { getChannelById } from "@/db/queries/channels";
import { listEpisodesByChannel } from "@/db/queries/episodes";
import { listShootDaysByChannel } from "@/db/queries/shoot-days";

export const metadata = { title: "Workshop" };

/** Today's shoot day opens its episode's workshop view; otherwise the episodes in the shop are listed. */
export default async function WorkshopIndex({ params }: { params: Promise<{ channelId: string }> }) {
  const { channelId } = await params;
  const access = await pageAccess(channelId, "channel.read", `/c/${channelId}/workshop`);
  const channel = (await getChannelById({ id: access.channelId }))!;
  const today = todayIn(channel.timeZone);
  const [days, episodes] = await Promise.all([listShootDaysByChannel({ channelId: access.channelId, from: today, to: today, includeCancelled: false }), listEpisodesByChannel({ channelId: access.channelId })]);
  const todays = days.find((d) => d.episodeId);
  if (todays?.episodeId) redirect(`/c/${access.channelId}/workshop/${todays.episodeId}`);
  const inShop = episodes.filter((e) => e.stage === "shooting" || e.stage === "planning");
  return (
    <div className="mx-auto max-w-md space-y-3">
      <h1 className="text-xl font-bold">Workshop</h1>
      <p className="text-sm text-walnut-700">No shoot day today. Pick the build at the bench:</p>
      <ul className="space-y-2">
        {inShop.map((e) => (
          <li key={e.id}>
            <Link className="jb-tap flex min-h-14 items-center rounded-plank border border-timber-300 bg-white px-4 text-lg font-medium" href={`/c/${access.channelId}/workshop/${e.id}`}>
              {e.title}
            </Link>
          </li>
        ))}
      </ul>
    </div>
  );
}
