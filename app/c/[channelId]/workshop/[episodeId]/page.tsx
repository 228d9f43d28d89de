import { notFound } from "next/navigation";
import { z } from "zod";
import { pageAccess } from "@/lib/server/access/page-access";
import { can } from "@/lib/permissions";
import { CAUTIONS, DEFER, stepHazards } from "@/lib/safety";
import { todayIn, zonedParts } from "@/lib/shoot-schedule";
import { getEpisodeInChannel } from "@/db/queries/episodes";
import { getChannelById } from "@/db/queries/channels";
import { listStepsByEpisode } from "@/db/queries/build";
import { listToolsByChannel } from "@/db/queries/tools";
import { listShotsByEpisode } from "@/db/queries/shots";
import { listScheduledSteps, listShootDaysByChannel } from "@/db/queries/shoot-days";
import { listNotesByEpisode } from "@/db/queries/shoot-log";
import { db } from "@/db/client";
import { toNoteDto } from "@/lib/server/views/shoot-log";
import { WorkshopView, type WorkshopStep } from "@/components/workshop/workshop-view";
import { ServiceWorker } from "@/components/workshop/register-sw";

export const metadata = { title: "Workshop" };

/** The phone view at the bench: today's shoot day, the step in hand with its cautions and shots, and the shoot log. */
export default async function WorkshopPage({ params }: { params: Promise<{ channelId: string; episodeId: string }> }) {
  const { channelId, episodeId } = await params;
  const access = await pageAccess(channelId, "channel.read", `/c/${channelId}/workshop/${episodeId}`);
  const id = z.uuid().safeParse(episodeId);
  if (!id.success) notFound();
  const episode = await getEpisodeInChannel(db(), id.data, access.channelId);
  if (!episode) notFound();
  const channel = (await getChannelById({ id: access.channelId }))!;
  const today = todayIn(channel.timeZone);
  const [steps, tools, shots, days, scheduled, notes] = await Promise.all([
    listStepsByEpisode({ episodeId: episode.id }),
    listToolsByChannel({ channelId: access.channelId }),
    listShotsByEpisode({ episodeId: episode.id }),
    listShootDaysByChannel({ channelId: access.channelId, from: today, to: today, includeCancelled: false }),
    listScheduledSteps(db(), episode.id),
    listNotesByEpisode({ episodeId: episode.id }),
  ]);
  const day = days.find((d) => d.episodeId === episode.id) ?? days.find((d) => !d.episodeId) ?? null;
  const tool = new Map(tools.map((t) => [t.id, t]));
  const view: WorkshopStep[] = steps.map((s) => ({
    id: s.id,
    title: s.title,
    notes: s.notes,
    activeMinutes: s.activeMinutes,
    waitMinutes: s.waitMinutes,
    waitReason: s.waitReason,
    status: s.status,
    tools: s.toolIds.map((t) => tool.get(t)?.name ?? "").filter(Boolean),
    cautions: stepHazards(s.hazards, s.toolIds.map((t) => tool.get(t)?.kind ?? "other")).map((h) => CAUTIONS[h]),
    shots: shots.filter((x) => x.stepId === s.id).map((x) => ({ id: x.id, description: x.description, status: x.status })),
  }));
  // Start at the first step booked on today's shoot day that is not done, else the first step not done.
  const todays = day ? new Set(scheduled.filter((x) => x.shootDayId === day.id).map((x) => x.stepId)) : new Set<string>();
  const open = (s: WorkshopStep) => s.status !== "done";
  let start = view.findIndex((s) => todays.has(s.id) && open(s));
  if (start < 0) start = view.findIndex(open);
  const hm = (d: Date) => {
    const { minutes } = zonedParts(d.getTime(), channel.timeZone);
    return `${String(Math.floor(minutes / 60)).padStart(2, "0")}:${String(minutes % 60).padStart(2, "0")}`;
  };
  return (
    <ServiceWorker>
    <WorkshopView
      episodeId={episode.id}
      title={episode.title}
      today={day ? { label: `Shoot day ${day.day}`, hours: `call ${hm(day.callAt)}, wrap ${hm(day.wrapAt)}`, status: day.status } : null}
      steps={view}
      startIndex={Math.max(0, start)}
      defer={DEFER}
      notes={notes.map((n) => toNoteDto(n.note, n.authorName))}
      canNote={can(access.roles, "shootlog.write")}
      canShots={can(access.roles, "shots.edit")}
      canScript={can(access.roles, "script.write")}
    />
    </ServiceWorker>
  );
}
