import "server-only";
/** Shoot days, schedules and call sheets as the API, the print view, the mail and the calendar show them. */
import { CAUTIONS, DEFER, stepHazards } from "../../safety";
import { formatWhen, zonedParts, type Schedule } from "../../shoot-schedule";
import { minutesToClock, type CallSheetDto, type DaysAwayDto, type ScheduleDto, type ShootDayDto } from "../../schemas/shoot";
import { calendarOf, type CalendarDay } from "../../calendar";
import { appUrl } from "../infra/mail";
import type { ShootDay } from "../../../db/schema";
import { getChannelById } from "../../../db/queries/channels";
import { getEpisodeById, listEpisodesByChannel } from "../../../db/queries/episodes";
import { listShotsByEpisode } from "../../../db/queries/shots";
import { listToolsByChannel } from "../../../db/queries/tools";
import { listStepsByEpisode } from "../../../db/queries/build";
import { listCallSheetSends, listCrewByDays, listDaysAwayByChannel, listHelpersByDays, listScheduledOnDay, listShootDaysByChannel } from "../../../db/queries/shoot-days";
import { db } from "../../../db/client";

const clock = (d: Date, tz: string) => minutesToClock(zonedParts(d.getTime(), tz).minutes);

/** Shoot days with their crew, helpers and who of the crew is away that day. */
export async function shootDayDtos(days: ShootDay[]): Promise<ShootDayDto[]> {
  if (!days.length) return [];
  const ids = days.map((d) => d.id);
  const channelId = days[0]!.channelId;
  const [crew, helpers, away] = await Promise.all([listCrewByDays(db(), ids), listHelpersByDays(db(), ids), listDaysAwayByChannel({ channelId })]);
  const awaySet = new Set(away.map((a) => `${a.userId}|${a.date}`));
  return days.map((d) => ({
    id: d.id,
    channelId: d.channelId,
    episodeId: d.episodeId,
    date: d.day,
    timeZone: d.timeZone,
    callTime: clock(d.callAt, d.timeZone),
    wrapTime: clock(d.wrapAt, d.timeZone),
    callAt: d.callAt.toISOString(),
    wrapAt: d.wrapAt.toISOString(),
    location: d.location,
    equipmentNotes: d.equipmentNotes,
    safetyNotes: d.safetyNotes,
    weatherNote: d.weatherNote,
    contacts: d.contacts,
    notes: d.notes,
    status: d.status,
    crew: crew
      .filter((c) => c.shootDayId === d.id)
      .map((c) => ({ userId: c.userId, name: c.name, duty: c.duty, callTime: c.callAt ? clock(c.callAt, d.timeZone) : null, away: awaySet.has(`${c.userId}|${d.day}`) })),
    helpers: helpers.filter((h) => h.shootDayId === d.id).map((h) => ({ id: h.id, name: h.name, duty: h.duty, email: h.email, callTime: h.callAt ? clock(h.callAt, d.timeZone) : null })),
    callSheetSentAt: d.callSheetSentAt ? d.callSheetSentAt.toISOString() : null,
    updatedAt: d.updatedAt.toISOString(),
  }));
}

export async function daysAwayDtos(channelId: string, from?: string, to?: string): Promise<DaysAwayDto[]> {
  return listDaysAwayByChannel({ channelId, from, to });
}

export function scheduleDto(
  planned: { result: Schedule; moved: ReturnType<typeof import("../../shoot-schedule").changes>; savedAt: Date | null; input: { steps: { id: string; title: string; mustFilm: boolean; pinnedDayId: string | null; waitMinutes: number; waitReason: string }[] }; tz: string },
): ScheduleDto {
  const step = new Map(planned.input.steps.map((s) => [s.id, s]));
  const iso = (t: number) => new Date(t).toISOString();
  const realPin = (p: string | null) => (p && !p.startsWith("gone:") ? p : null);
  return {
    timeZone: planned.tz,
    placements: planned.result.placements.map((p) => {
      const s = step.get(p.stepId)!;
      return { stepId: p.stepId, title: s.title, mustFilm: s.mustFilm, pinnedShootDayId: realPin(s.pinnedDayId), dayId: p.dayId, date: p.date, start: iso(p.start), end: iso(p.end), readyAfter: iso(p.readyAfter), waitMinutes: s.waitMinutes, waitReason: s.waitReason };
    }),
    unscheduled: planned.result.unscheduled.map((u) => ({ stepId: u.stepId, title: step.get(u.stepId)?.title ?? "", reason: u.reason })),
    warnings: planned.result.warnings,
    finish: planned.result.finish ? iso(planned.result.finish) : null,
    shootDaysUsed: planned.result.shootDaysUsed,
    suggestion: planned.result.suggestion ? { date: planned.result.suggestion.date, start: iso(planned.result.suggestion.start), end: iso(planned.result.suggestion.end), text: planned.result.suggestion.text } : null,
    method: planned.result.method,
    moved: planned.moved.map((m) => ({
      stepId: m.stepId,
      title: step.get(m.stepId)?.title ?? "a removed step",
      from: m.from ? { dayId: m.from.dayId, start: iso(m.from.start) } : null,
      to: m.to ? { dayId: m.to.dayId, start: iso(m.to.start) } : null,
    })),
    savedAt: planned.savedAt ? planned.savedAt.toISOString() : null,
  };
}

export const GENERAL_CAUTIONS = [
  "Brief everyone on the day's tools and where the first-aid kit, the extinguisher and the main power switch are.",
  "Filming adds distraction: never talk to camera while a blade is turning; stop the tool, then speak.",
  DEFER,
];

/** The call sheet: the saved running order of the day, with shots, tools and cautions per step. */
export async function callSheetView(day: ShootDay): Promise<CallSheetDto> {
  const [dto] = await shootDayDtos([day]);
  const [channel, scheduled, sends] = await Promise.all([getChannelById({ id: day.channelId }), listScheduledOnDay({ shootDayId: day.id }), listCallSheetSends({ shootDayId: day.id })]);
  const episodeIds = [...new Set([...(day.episodeId ? [day.episodeId] : []), ...scheduled.map((s) => s.step.episodeId)])];
  const [episodes, tools] = await Promise.all([Promise.all(episodeIds.map((id) => getEpisodeById({ id }))), listToolsByChannel({ channelId: day.channelId })]);
  const shots = (await Promise.all(episodeIds.map((id) => listShotsByEpisode({ episodeId: id })))).flat();
  const links = new Map((await Promise.all(episodeIds.map((id) => listStepsByEpisode({ episodeId: id })))).flat().map((s) => [s.id, s.toolIds]));
  const toolById = new Map(tools.map((t) => [t.id, t]));
  const tz = day.timeZone;
  return {
    day: dto!,
    channelName: channel?.name ?? "",
    episodeTitle: episodes.find((e) => e?.id === day.episodeId)?.title ?? episodes[0]?.title ?? null,
    steps: scheduled.map(({ step, startsAt, endsAt }) => {
      const toolIds = links.get(step.id) ?? [];
      const hazards = stepHazards(step.hazards, toolIds.map((t) => toolById.get(t)?.kind ?? ""));
      return {
        stepId: step.id,
        title: step.title,
        start: startsAt.toISOString(),
        end: endsAt.toISOString(),
        startClock: clock(startsAt, tz),
        endClock: clock(endsAt, tz),
        mustFilm: step.mustFilm,
        waitAfter: step.waitMinutes ? `then ${step.waitReason || "wait"} until ${formatWhen(endsAt.getTime() + step.waitMinutes * 60_000, tz)}` : "",
        shots: shots.filter((s) => s.stepId === step.id && s.status !== "rejected").map((s) => ({ id: s.id, kind: s.kind, description: s.description, framing: s.framing, status: s.status })),
        cautions: hazards.map((h) => ({ signalWord: CAUTIONS[h].signal, text: `${CAUTIONS[h].title}: ${CAUTIONS[h].text}` })),
        tools: toolIds.map((t) => toolById.get(t)?.name ?? "").filter(Boolean),
      };
    }),
    sends: sends.map((s) => ({ id: s.id, recipients: s.recipients, status: s.status, queuedAt: s.queuedAt.toISOString(), sentAt: s.sentAt ? s.sentAt.toISOString() : null, error: s.error })),
    generalCautions: GENERAL_CAUTIONS,
  };
}

/** The call sheet as plain text, for the e-mail. */
export function callSheetText(v: CallSheetDto, message = ""): string {
  const d = v.day;
  const lines = [
    `${v.channelName} · call sheet`,
    `${v.episodeTitle ?? "Shoot day"} · ${d.date} · call ${d.callTime}, wrap ${d.wrapTime} (${d.timeZone})`,
    d.location ? `Location: ${d.location}` : "",
    d.weatherNote ? `Weather: ${d.weatherNote}` : "",
    message ? `\n${message}` : "",
    "",
    "Crew",
    ...d.crew.map((c) => `  ${c.name}${c.duty ? ` (${c.duty})` : ""}: call ${c.callTime ?? d.callTime}${c.away ? " · marked away that day" : ""}`),
    ...d.helpers.map((h) => `  ${h.name}${h.duty ? ` (${h.duty})` : ""}: call ${h.callTime ?? d.callTime}`),
    "",
    "Running order",
    ...(v.steps.length ? v.steps : []).flatMap((s) => [
      `  ${s.startClock}–${s.endClock}  ${s.title}${s.mustFilm ? "" : " (off camera)"}`,
      ...s.shots.map((sh) => `      shot: ${sh.description}${sh.framing ? ` · ${sh.framing}` : ""}`),
      ...(s.tools.length ? [`      tools: ${s.tools.join(", ")}`] : []),
      ...s.cautions.map((c) => `      ${c.signalWord}: ${c.text}`),
      ...(s.waitAfter ? [`      ${s.waitAfter}`] : []),
    ]),
    ...(v.steps.length ? [] : ["  (no steps planned on this day yet)"]),
    "",
    d.equipmentNotes ? `Equipment: ${d.equipmentNotes}` : "",
    d.safetyNotes ? `Safety: ${d.safetyNotes}` : "",
    ...v.generalCautions.map((c) => `Safety: ${c}`),
    d.contacts ? `Contacts: ${d.contacts}` : "",
  ];
  return lines.filter((l, i, a) => l !== "" || (a[i - 1] ?? "") !== "").join("\n");
}

export function calendarDayOf(d: ShootDayDto, title: string, description: string): CalendarDay {
  return {
    id: d.id,
    title,
    start: new Date(d.callAt),
    end: new Date(d.wrapAt),
    location: d.location,
    description,
    cancelled: d.status === "cancelled",
    updatedAt: new Date(d.updatedAt),
    url: appUrl(`/c/${d.channelId}/shoot-days/${d.id}/call-sheet`),
  };
}

/** One day as an .ics file (attached to the call sheet mail, or downloaded). */
export async function shootDayIcs(day: ShootDay, sheet?: CallSheetDto): Promise<string> {
  const v = sheet ?? (await callSheetView(day));
  return calendarOf(v.channelName, [calendarDayOf(v.day, `Shoot: ${v.episodeTitle ?? v.channelName}`, callSheetText(v))], { method: "publish" });
}

/** The channel's feed: every shoot day from 60 days ago on, cancelled ones marked so. */
export async function channelFeed(channelId: string): Promise<string> {
  const channel = await getChannelById({ id: channelId });
  const from = new Date(Date.now() - 60 * 86_400_000).toISOString().slice(0, 10);
  const days = await shootDayDtos(await listShootDaysByChannel({ channelId, from }));
  const [active, archived] = await Promise.all([listEpisodesByChannel({ channelId }), listEpisodesByChannel({ channelId, archived: true })]);
  const titles = new Map([...active, ...archived].map((e) => [e.id, e.title]));
  return calendarOf(
    `${channel?.name ?? "Jigboard"} shoot days`,
    days.map((d) => calendarDayOf(d, `Shoot: ${(d.episodeId && titles.get(d.episodeId)) || channel?.name || "shoot day"}`, [d.location && `Location: ${d.location}`, `Crew: ${d.crew.map((c) => c.name).join(", ") || "not set"}`, d.notes].filter(Boolean).join("\n"))),
  );
}
