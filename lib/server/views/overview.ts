import "server-only";
/** The channel at a glance: pipeline, shoot days, publishing, gaps, sponsor dates and runtime against target. */
import { STAGES, STAGE_INFO } from "../../stages";
import { todayIn } from "../../shoot-schedule";
import type { OverviewDto } from "../../schemas/publish";
import type { Channel } from "../../../db/schema";
import { listEpisodesByChannel } from "../../../db/queries/episodes";
import { listShootDaysByChannel } from "../../../db/queries/shoot-days";
import { dealLinks, listDealsByChannel, listSponsorsByChannel } from "../../../db/queries/sponsors";
import { db } from "../../../db/client";
import { boardFigures } from "./board-figures";

/** How far ahead the overview looks for shoot days and sponsor dates (common practice for a weekly channel, no published source). */
export const OVERVIEW_DAYS_AHEAD = 60;

function plusDays(date: string, days: number): string {
  const d = new Date(`${date}T00:00:00Z`);
  d.setUTCDate(d.getUTCDate() + days);
  return d.toISOString().slice(0, 10);
}

export async function overviewFor(channel: Channel, now = Date.now()): Promise<OverviewDto> {
  const today = todayIn(channel.timeZone, now);
  const until = plusDays(today, OVERVIEW_DAYS_AHEAD);
  const [episodes, days, deals, sponsors] = await Promise.all([
    listEpisodesByChannel({ channelId: channel.id }),
    listShootDaysByChannel({ channelId: channel.id, from: today, to: until, includeCancelled: false }),
    listDealsByChannel({ channelId: channel.id }),
    listSponsorsByChannel({ channelId: channel.id, archived: true }),
  ]);
  const figures = await boardFigures(episodes);
  const title = new Map(episodes.map((e) => [e.id, e.title]));
  const live = deals.filter((d) => !d.archivedAt && d.status !== "cancelled" && d.status !== "paid");
  const links = await dealLinks(db(), live.map((d) => d.id));
  const sponsorName = new Map(sponsors.map((s) => [s.id, s.name]));
  const deliverables: OverviewDto["deliverables"] = [];
  for (const d of live) {
    const eps = links.episodes.filter((x) => x.dealId === d.id).map((x) => ({ id: x.episodeId, title: title.get(x.episodeId) ?? "(archived episode)", state: figures.get(x.episodeId)?.sponsorState ?? null }));
    const dates: [OverviewDto["deliverables"][number]["what"], string | null][] = [
      ["script", d.scriptDue],
      ["review", d.reviewDue],
      ["publish_window", d.publishTo],
      ["return", d.returnBy],
    ];
    for (const [what, due] of dates) if (due && due >= today && due <= until) deliverables.push({ dealId: d.id, dealTitle: d.title, sponsorName: sponsorName.get(d.sponsorId) ?? "", what, due, episodes: eps });
  }
  deliverables.sort((a, b) => a.due.localeCompare(b.due));
  return {
    today,
    pipeline: STAGES.map((s) => ({ stage: s, label: STAGE_INFO[s].label, count: episodes.filter((e) => e.stage === s).length })),
    shootDays: days.map((d) => ({ id: d.id, date: d.day, status: d.status, episodeId: d.episodeId, episodeTitle: d.episodeId ? (title.get(d.episodeId) ?? null) : null })),
    publishing: episodes
      .filter((e) => e.publishDate)
      .sort((a, b) => a.publishDate!.localeCompare(b.publishDate!))
      .map((e) => ({ episodeId: e.id, title: e.title, publishDate: e.publishDate!, stage: e.stage })),
    openGaps: episodes.flatMap((e) => {
      const n = figures.get(e.id)?.openGaps ?? 0;
      return n > 0 ? [{ episodeId: e.id, title: e.title, openGaps: n }] : [];
    }),
    deliverables,
    runtime: episodes
      .filter((e) => e.stage !== "idea")
      .map((e) => ({ episodeId: e.id, title: e.title, stage: e.stage, scriptSeconds: figures.get(e.id)?.scriptSeconds ?? null, targetSeconds: e.targetRuntimeSeconds })),
  };
}
