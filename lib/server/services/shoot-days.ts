import "server-only";
/**
 * Shoot days, days away, the saved schedule, call sheets and the calendar
 * feed token. Every shoot-day write locks the channel row first; a schedule
 * save locks the episode. Crew must be members of the channel and a linked
 * episode must be the channel's; anything else is refused with the field named.
 */
import crypto from "node:crypto";
import { changes, schedule, zonedInstant, zonedParts, type ScheduleInput } from "../../shoot-schedule";
import { clockToMinutes, minutesToClock, type ShootDayCreate, type ShootDayUpdate } from "../../schemas/shoot";
import { AppError } from "../http/errors";
import { db } from "../../../db/client";
import { lockEpisode } from "../../../db/queries/episode-lock";
import { getEpisodeById } from "../../../db/queries/episodes";
import { getChannelById } from "../../../db/queries/channels";
import { listStepsByEpisode } from "../../../db/queries/build";
import type { Episode, ShootDay } from "../../../db/schema";
import {
  addDaysAway,
  deleteShootDayRow,
  insertCallSheetSend,
  insertShootDay,
  listCrewByDays,
  listDaysAwayByChannel,
  listHelpersByDays,
  listMemberIds,
  listScheduledSteps,
  listShootDaysByChannel,
  listTakenOnDays,
  lockChannelForDays,
  memberIdsOf,
  removeDaysAway,
  replaceCrew,
  replaceHelpers,
  replaceScheduledSteps,
  setCalendarTokenHash,
  updateShootDayRow,
} from "../../../db/queries/shoot-days";
import { enqueueCallSheet } from "../jobs/queue";

type DayFields = Omit<ShootDayCreate, "crew" | "helpers" | "date" | "callTime" | "wrapTime">;

async function checkLinks(channelId: string, input: { crew?: { userId: string }[]; episodeId?: string | null }) {
  if (input.crew?.length) {
    const members = await memberIdsOf(db(), channelId, input.crew.map((c) => c.userId));
    const strangers = input.crew.filter((c) => !members.has(c.userId));
    if (strangers.length) throw new AppError("unprocessable:shoot-day.crew", "Crew must be members of this channel; add outside help as helpers.", { fields: { crew: [`${strangers.length} of these people are not members of this channel`] } });
  }
  if (input.episodeId) {
    const e = await getEpisodeById({ id: input.episodeId });
    if (!e || e.channelId !== channelId) throw new AppError("unprocessable:shoot-day.episode", "That episode is not on this channel.", { fields: { episodeId: ["not an episode of this channel"] } });
  }
}

const at = (date: string, clock: string | null, tz: string) => (clock ? new Date(zonedInstant(date, clockToMinutes(clock), tz)) : null);

export async function createShootDay({ channelId, input }: { channelId: string; input: ShootDayCreate }) {
  await checkLinks(channelId, input);
  return db().transaction(async (tx) => {
    const channel = (await lockChannelForDays(tx, channelId))!;
    const tz = channel.timeZone;
    const { crew, helpers, date, callTime, wrapTime, ...fields } = input;
    const row = await insertShootDay(tx, { ...(fields as DayFields), channelId, day: date, timeZone: tz, callAt: at(date, callTime, tz)!, wrapAt: at(date, wrapTime, tz)! });
    await replaceCrew(tx, row.id, crew.map((c) => ({ userId: c.userId, duty: c.duty, callAt: at(date, c.callTime, tz) })));
    await replaceHelpers(tx, row.id, helpers.map((h) => ({ name: h.name, duty: h.duty, email: h.email, callAt: at(date, h.callTime, tz) })));
    return row;
  });
}

/** Edits a day; moving it to another date keeps its hours (and each person's call time) on the new date. */
export async function updateShootDay({ day, patch }: { day: ShootDay; patch: ShootDayUpdate }) {
  await checkLinks(day.channelId, patch);
  return db().transaction(async (tx) => {
    await lockChannelForDays(tx, day.channelId);
    const tz = day.timeZone;
    const minutesOf = (d: Date) => minutesToClock(zonedParts(d.getTime(), tz).minutes);
    const { crew, helpers, date, callTime, wrapTime, ...fields } = patch;
    const newDate = date ?? day.day;
    const call = callTime ?? minutesOf(day.callAt);
    const wrap = wrapTime ?? minutesOf(day.wrapAt);
    if (clockToMinutes(wrap) <= clockToMinutes(call)) throw new AppError("validation:shoot-day.hours", "Wrap must be after call.", { fields: { wrapTime: ["wrap must be after call (a day ends by midnight)"] } });
    const row = (await updateShootDayRow(tx, day.id, { ...fields, day: newDate, callAt: at(newDate, call, tz)!, wrapAt: at(newDate, wrap, tz)! }))!;
    if (crew) await replaceCrew(tx, day.id, crew.map((c) => ({ userId: c.userId, duty: c.duty, callAt: at(newDate, c.callTime, tz) })));
    else if (date && date !== day.day) {
      // Keep each person's own call time on the new date.
      const old = await listCrewByDays(tx, [day.id]);
      await replaceCrew(tx, day.id, old.map((c) => ({ userId: c.userId, duty: c.duty, callAt: c.callAt ? at(newDate, minutesOf(c.callAt), tz) : null })));
    }
    if (helpers) await replaceHelpers(tx, day.id, helpers.map((h) => ({ name: h.name, duty: h.duty, email: h.email, callAt: at(newDate, h.callTime, tz) })));
    return row;
  });
}

export async function deleteShootDay({ day }: { day: ShootDay }) {
  return db().transaction(async (tx) => {
    await lockChannelForDays(tx, day.channelId);
    return deleteShootDayRow(tx, day.id);
  });
}

/** A member marks their own dates away (or takes them back); nobody else's. */
export async function setDaysAway({ channelId, userId, add, remove, note }: { channelId: string; userId: string; add: string[]; remove: string[]; note: string }) {
  const both = add.filter((d) => remove.includes(d));
  if (both.length) throw new AppError("validation:days-away", "A date cannot be added and removed at once.", { fields: { remove: [`${both[0]} is also in add`] } });
  await db().transaction(async (tx) => {
    await addDaysAway(tx, channelId, userId, add, note);
    await removeDaysAway(tx, channelId, userId, remove);
  });
}

/** What the scheduler needs for one episode, read fresh. */
export async function scheduleInput(episode: Episode): Promise<{ input: ScheduleInput; saved: Awaited<ReturnType<typeof listScheduledSteps>>; days: ShootDay[]; titles: Map<string, string>; tz: string }> {
  const [steps, allDays, members, away, saved, channel] = await Promise.all([
    listStepsByEpisode({ episodeId: episode.id }),
    listShootDaysByChannel({ channelId: episode.channelId }),
    listMemberIds(db(), episode.channelId),
    listDaysAwayByChannel({ channelId: episode.channelId }),
    listScheduledSteps(db(), episode.id),
    getChannelById({ id: episode.channelId }).then((c) => c!),
  ]);
  // This episode's days and days not tied to any episode; time other episodes already saved there is taken.
  const days = allDays.filter((d) => (d.status === "planned" || d.status === "confirmed") && (d.episodeId === episode.id || d.episodeId === null));
  const dayIds = days.map((d) => d.id);
  const [crew, helpers, taken] = await Promise.all([listCrewByDays(db(), dayIds), listHelpersByDays(db(), dayIds), listTakenOnDays(db(), dayIds, episode.id)]);
  const tz = channel.timeZone;
  const input: ScheduleInput = {
    steps: steps.map((s) => ({
      id: s.id,
      title: s.title,
      position: s.position,
      activeMinutes: s.activeMinutes,
      waitMinutes: s.waitMinutes,
      waitReason: s.waitReason,
      dependsOn: s.dependsOn,
      crewNeeded: s.crewNeeded,
      mustFilm: s.mustFilm,
      pinnedDayId: s.pinnedShootDayId && days.some((d) => d.id === s.pinnedShootDayId) ? s.pinnedShootDayId : s.pinnedShootDayId ? `gone:${s.pinnedShootDayId}` : null,
      settled: s.status === "done" || s.status === "skipped" || s.status === "failed",
    })),
    days: days.map((d) => ({
      id: d.id,
      date: d.day,
      start: d.callAt.getTime(),
      end: d.wrapAt.getTime(),
      crew: crew.filter((c) => c.shootDayId === d.id).map((c) => c.userId),
      helpers: helpers.filter((h) => h.shootDayId === d.id).length,
      taken: taken.filter((t) => t.shootDayId === d.id).map((t) => [t.startsAt.getTime(), t.endsAt.getTime()] as [number, number]),
    })),
    members,
    away: away.map((a) => ({ userId: a.userId, date: a.date })),
    timeZone: tz,
    previous: Object.fromEntries(saved.map((s) => [s.stepId, s.shootDayId])),
  };
  return { input, saved, days, titles: new Map(steps.map((s) => [s.id, s.title])), tz };
}

/** Computes the episode's schedule; with `save`, stores it (under the episode lock) and reports what moved. */
export async function planSchedule({ episode, save }: { episode: Episode; save: boolean }) {
  const { input, saved, days, titles, tz } = await scheduleInput(episode);
  const result = schedule(input);
  const moved = changes(
    saved.map((s) => ({ stepId: s.stepId, dayId: s.shootDayId, start: s.startsAt.getTime() })),
    result,
  );
  let savedAt: Date | null = saved.length ? saved.reduce((a, s) => (s.plannedAt > a ? s.plannedAt : a), saved[0]!.plannedAt) : null;
  if (save) {
    await db().transaction(async (tx) => {
      await lockEpisode(tx, episode.id);
      await replaceScheduledSteps(
        tx,
        episode.id,
        result.placements.map((p) => ({ stepId: p.stepId, shootDayId: p.dayId, startsAt: new Date(p.start), endsAt: new Date(p.end) })),
      );
    });
    savedAt = new Date();
  }
  return { result, moved, savedAt, input, days, titles, tz };
}

/** Queues the call sheet to everyone on the day with an address; the mail goes out from the job queue. */
export async function sendCallSheet({ day, userId }: { day: ShootDay; userId: string }) {
  const [crew, helpers] = await Promise.all([listCrewByDays(db(), [day.id]), listHelpersByDays(db(), [day.id])]);
  const recipients = [...new Set([...crew.map((c) => c.email), ...helpers.flatMap((h) => (h.email ? [h.email] : []))])];
  if (!recipients.length) throw new AppError("unprocessable:call-sheet.recipients", "Nobody on this day has an e-mail address yet. Add crew or helpers with addresses first.", { fields: { crew: ["add someone to send the call sheet to"] } });
  if (day.status === "cancelled") throw new AppError("conflict:call-sheet.cancelled", "This shoot day is cancelled; there is no call sheet to send.");
  const send = await db().transaction((tx) => insertCallSheetSend(tx, { shootDayId: day.id, sentBy: userId, recipients }));
  await enqueueCallSheet(send.id);
  return send;
}

export function hashCalendarToken(token: string): string {
  return crypto.createHash("sha256").update(token).digest("hex");
}

/** A new secret for the channel's calendar feed; the old URL stops working at once. Shown once. */
export async function rotateCalendarToken({ channelId }: { channelId: string }): Promise<string> {
  const token = crypto.randomBytes(24).toString("base64url");
  await setCalendarTokenHash(db(), channelId, hashCalendarToken(token));
  return token;
}
