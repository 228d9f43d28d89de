/**
 * Shoot days through the API on real PostgreSQL, the job worker and the SMTP
 * fake: roles, field errors, time zones, days away, the schedule around a
 * glue-up, call sheets by e-mail with the .ics attached, and the calendar
 * feed. Calendar text is parsed with ical.js (a general-purpose iCalendar
 * parser) and checked for what RFC 5545 requires.
 */
import { beforeAll, describe, expect, it } from "vitest";
import crypto from "node:crypto";
import { eq, sql } from "drizzle-orm";
import ICAL from "ical.js";
import * as daysRoute from "@/app/api/channels/[channelId]/shoot-days/route";
import * as dayRoute from "@/app/api/shoot-days/[shootDayId]/route";
import * as sheetRoute from "@/app/api/shoot-days/[shootDayId]/call-sheet/route";
import * as icsRoute from "@/app/api/shoot-days/[shootDayId]/ics/route";
import * as awayRoute from "@/app/api/channels/[channelId]/days-away/route";
import * as scheduleRoute from "@/app/api/episodes/[episodeId]/schedule/route";
import * as feedRoute from "@/app/api/channels/[channelId]/calendar-feed/route";
import * as publicFeed from "@/app/api/calendar/[token]/route";
import * as stepsRoute from "@/app/api/episodes/[episodeId]/steps/route";
import * as stepRoute from "@/app/api/steps/[stepId]/route";
import { db } from "@/db/client";
import { callSheetSends, channels } from "@/db/schema";
import { call, makeEpisode, makeWorld } from "../support/fixtures";

type World = Awaited<ReturnType<typeof makeWorld>>;
let w: World;

beforeAll(async () => {
  w = await makeWorld();
  await db().update(channels).set({ timeZone: "Europe/Dublin" }).where(eq(channels.id, w.channel.id));
});

const newDay = (body: Record<string, unknown>, user = w.members.producer) => call(daysRoute.POST as never, { method: "POST", params: { channelId: w.channel.id }, user, body });

describe("shoot days", () => {
  it("producer and owner add days; other roles may not; another channel sees nothing", async () => {
    expect((await newDay({ date: "2027-01-09" })).status).toBe(201);
    expect((await newDay({ date: "2027-01-10" }, w.members.owner)).status).toBe(201);
    expect((await newDay({ date: "2027-01-11" }, w.members.editor)).status).toBe(403);
    expect((await newDay({ date: "2027-01-11" }, w.members.presenter)).status).toBe(403);
    const list = await call(daysRoute.GET as never, { params: { channelId: w.channel.id }, user: w.members.sponsor_liaison, path: "/x?from=2027-01-01&to=2027-01-31" });
    expect(list.status).toBe(200);
    expect(list.json.shootDays.map((d: { date: string }) => d.date)).toEqual(["2027-01-09", "2027-01-10"]);
    const outside = await call(daysRoute.GET as never, { params: { channelId: w.channel.id }, user: w.outsider });
    expect(outside.status).toBe(404);
  });

  it("names the bad field: wrap before call, a date that is not one, crew from outside the channel", async () => {
    const r1 = await newDay({ date: "2027-01-12", callTime: "15:00", wrapTime: "09:00" });
    expect(r1.status).toBe(400);
    expect(r1.json.error.fields.wrapTime[0]).toMatch(/wrap must be after call/);
    const r2 = await newDay({ date: "2027-02-30" });
    expect(r2.status).toBe(400);
    expect(Object.keys(r2.json.error.fields)).toEqual(["date"]);
    const r3 = await newDay({ date: "2027-01-12", crew: [{ userId: w.outsider.id }] });
    expect(r3.status).toBe(422);
    expect(r3.json.error.fields.crew[0]).toMatch(/not members of this channel/);
  });

  it("reads hours in the channel's time zone, daylight saving included (IANA tz: Dublin is UTC+1 from 29 Mar 2026)", async () => {
    const r = await newDay({ date: "2026-03-29", callTime: "09:00", wrapTime: "17:00" });
    expect(r.json.shootDay.callAt).toBe("2026-03-29T08:00:00.000Z");
    const before = await newDay({ date: "2026-03-28", callTime: "09:00", wrapTime: "17:00" });
    expect(before.json.shootDay.callAt).toBe("2026-03-28T09:00:00.000Z");
    // Moving the day keeps its wall-clock hours on the new date.
    const moved = await call(dayRoute.PATCH as never, { method: "PATCH", params: { shootDayId: before.json.shootDay.id }, user: w.members.producer, body: { date: "2026-03-30" } });
    expect(moved.json.shootDay.callTime).toBe("09:00");
    expect(moved.json.shootDay.callAt).toBe("2026-03-30T08:00:00.000Z");
  });

  it("each member marks their own days away; everyone reads them", async () => {
    const put = await call(awayRoute.PUT as never, { method: "PUT", params: { channelId: w.channel.id }, user: w.members.editor, body: { add: ["2027-01-09", "2027-01-16"], note: "at a craft fair" } });
    expect(put.status).toBe(200);
    const off = await call(awayRoute.PUT as never, { method: "PUT", params: { channelId: w.channel.id }, user: w.members.editor, body: { remove: ["2027-01-16"] } });
    expect(off.json.daysAway.filter((d: { userId: string }) => d.userId === w.members.editor.id).map((d: { date: string }) => d.date)).toEqual(["2027-01-09"]);
    const bad = await call(awayRoute.PUT as never, { method: "PUT", params: { channelId: w.channel.id }, user: w.members.editor, body: { add: ["2027-01-20"], remove: ["2027-01-20"] } });
    expect(bad.status).toBe(400);
  });
});

describe("schedule around a glue-up", () => {
  it("lands the next step after the cure on the second day, saves, and re-plans when a day is cancelled", async () => {
    const episode = await makeEpisode(w.channel.id, "planning", 0, "Hall bench");
    const crew = [{ userId: w.members.producer.id }, { userId: w.members.presenter.id }];
    const sat = (await newDay({ date: "2027-02-06", callTime: "09:00", wrapTime: "17:00", episodeId: episode.id, crew })).json.shootDay;
    const sun = (await newDay({ date: "2027-02-07", callTime: "09:00", wrapTime: "17:00", episodeId: episode.id, crew })).json.shootDay;
    const add = async (body: Record<string, unknown>) => (await call(stepsRoute.POST as never, { method: "POST", params: { episodeId: episode.id }, user: w.members.presenter, body })).json.step.id as string;
    const mill = await add({ title: "Mill the seat", activeMinutes: 180 });
    const glue = await add({ title: "Glue up the seat", activeMinutes: 120, waitMinutes: 24 * 60, waitReason: "glue cures", dependsOn: [mill] });
    const flatten = await add({ title: "Flatten the seat", activeMinutes: 120, dependsOn: [glue] });

    const preview = await call(scheduleRoute.GET as never, { params: { episodeId: episode.id }, user: w.members.editor });
    expect(preview.status).toBe(200);
    const at = (id: string) => preview.json.placements.find((p: { stepId: string }) => p.stepId === id);
    expect(at(glue).dayId).toBe(sat.id);
    expect(at(flatten).dayId).toBe(sun.id);
    // Glue out of the clamps at 14:00 on Saturday, cured 24 h later: 14:00 GMT on Sunday.
    expect(at(flatten).start).toBe("2027-02-07T14:00:00.000Z");

    expect((await call(scheduleRoute.POST as never, { method: "POST", params: { episodeId: episode.id }, user: w.members.editor })).status).toBe(403);
    const saved = await call(scheduleRoute.POST as never, { method: "POST", params: { episodeId: episode.id }, user: w.members.producer });
    expect(saved.json.savedAt).not.toBeNull();
    expect(saved.json.moved).toHaveLength(3);

    // A producer pins; a day of another channel cannot be pinned.
    const foreign = await db().execute(sql`insert into shoot_days (channel_id, day, call_at, wrap_at) values (${w.other.id}, '2027-02-08', now(), now() + interval '1 hour') returning id`);
    const pinBad = await call(stepRoute.PATCH as never, { method: "PATCH", params: { stepId: flatten }, user: w.members.producer, body: { pinnedShootDayId: (foreign.rows[0] as { id: string }).id } });
    expect(pinBad.status).toBe(422);
    expect(pinBad.json.error.fields.pinnedShootDayId).toBeDefined();

    // Sunday is cancelled: the flattening no longer fits, the answer says why and suggests a day.
    await call(dayRoute.PATCH as never, { method: "PATCH", params: { shootDayId: sun.id }, user: w.members.producer, body: { status: "cancelled" } });
    const after = await call(scheduleRoute.GET as never, { params: { episodeId: episode.id }, user: w.members.producer });
    expect(after.json.unscheduled.map((u: { stepId: string }) => u.stepId)).toEqual([flatten]);
    expect(after.json.unscheduled[0].reason).toMatch(/“Flatten the seat” can start at Sun 7 Feb 14:00 at the earliest \(after “Glue up the seat” and its wait, glue cures, 24 h\)/);
    expect(after.json.suggestion.date).toBe("2027-02-07");
    expect(after.json.moved.map((m: { stepId: string; to: unknown }) => [m.stepId, m.to])).toEqual([[flatten, null]]);
  });
});

describe("call sheets", () => {
  it("mails the crew through the job queue, with the day attached as an .ics that matches the download", async () => {
    const episode = await makeEpisode(w.channel.id, "shooting", 0, "Step stool");
    const day = (await newDay({ date: "2027-03-06", location: "Back shop", crew: [{ userId: w.members.presenter.id, duty: "on camera" }], helpers: [{ name: "Rowan Vale", duty: "camera two", email: "rowan@helpers.example" }], episodeId: episode.id })).json.shootDay;
    const r = await call(sheetRoute.POST as never, { method: "POST", params: { shootDayId: day.id }, user: w.members.producer, body: {} });
    expect(r.status).toBe(202);
    expect(r.json.send.recipients.sort()).toEqual([w.members.presenter.email, "rowan@helpers.example"].sort());
    expect((await call(sheetRoute.POST as never, { method: "POST", params: { shootDayId: day.id }, user: w.members.editor, body: {} })).status).toBe(403);

    // The worker (started by the test harness) sends it.
    let status = "queued";
    for (let i = 0; i < 100 && status !== "sent"; i++) {
      await new Promise((res) => setTimeout(res, 200));
      status = (await db().select().from(callSheetSends).where(eq(callSheetSends.id, r.json.send.id)))[0]!.status;
    }
    expect(status).toBe("sent");
    const mail = (await db().execute(sql`select subject, text_body, attachments from mail_messages where kind = 'call_sheet' and ref_id = ${r.json.send.id}`)).rows[0] as { subject: string; text_body: string; attachments: { filename: string; contentType: string; sha256: string; base64: string }[] };
    expect(mail.subject).toMatch(/Call sheet: Step stool, 2027-03-06, call 09:00/);
    expect(mail.text_body).toContain("Rowan Vale (camera two): call 09:00");
    expect(mail.text_body).toContain("Follow the manufacturer's instructions, local codes and licensed practice");
    const [att] = mail.attachments;
    expect(att!.filename).toBe("shoot-day-2027-03-06.ics");
    expect(att!.contentType).toMatch(/^text\/calendar/);
    const ics = Buffer.from(att!.base64, "base64").toString("utf8");
    const download = await call(icsRoute.GET as never, { params: { shootDayId: day.id }, user: w.members.editor });
    // Intact: byte for byte what the download gives (DTSTAMP is the day's last edit, not the clock).
    expect(crypto.createHash("sha256").update(download.json as string).digest("hex")).toBe(att!.sha256);

    const cal = new ICAL.Component(ICAL.parse(ics));
    // RFC 5545 §3.6: a VCALENDAR needs PRODID (§3.7.3) and VERSION 2.0 (§3.7.4); a VEVENT needs UID (§3.8.4.7) and DTSTAMP (§3.8.7.2), and DTSTART when there is no METHOD... given here anyway.
    expect(cal.getFirstPropertyValue("version")).toBe("2.0");
    expect(cal.getFirstPropertyValue("prodid")).toBe("-//Jigboard//Shoot days//EN");
    const ev = cal.getFirstSubcomponent("vevent")!;
    expect(ev.getFirstPropertyValue("uid")).toBe(`shoot-day-${day.id}@jigboard`);
    expect(ev.getFirstPropertyValue("dtstamp")).toBeTruthy();
    expect((ev.getFirstPropertyValue("dtstart") as ICAL.Time).toJSDate().toISOString()).toBe("2027-03-06T09:00:00.000Z");
    expect(ev.getFirstPropertyValue("location")).toBe("Back shop");

    const sheet = await call(sheetRoute.GET as never, { params: { shootDayId: day.id }, user: w.members.sponsor_liaison });
    expect(sheet.json.sends[0].status).toBe("sent");
  }, 30_000);

  it("refuses a send with nobody to send to, naming why", async () => {
    const day = (await newDay({ date: "2027-03-13" })).json.shootDay;
    const r = await call(sheetRoute.POST as never, { method: "POST", params: { shootDayId: day.id }, user: w.members.producer, body: {} });
    expect(r.status).toBe(422);
    expect(r.json.error.message).toMatch(/Nobody on this day has an e-mail address/);
  });
});

describe("calendar feed", () => {
  it("the owner makes a secret URL; it serves the channel's days with stable UIDs; a new one retires the old", async () => {
    expect((await call(feedRoute.POST as never, { method: "POST", params: { channelId: w.channel.id }, user: w.members.producer })).status).toBe(403);
    const first = await call(feedRoute.POST as never, { method: "POST", params: { channelId: w.channel.id }, user: w.members.owner });
    expect(first.status).toBe(201);
    const token = (first.json.url as string).split("/api/calendar/")[1]!;
    const get = (t: string) => call(publicFeed.GET as never, { params: { token: t }, user: null });
    const a = await get(token);
    expect(a.status).toBe(200);
    expect(a.headers.get("content-type")).toMatch(/^text\/calendar/);
    const cal = new ICAL.Component(ICAL.parse(a.json as string));
    const uids = cal.getAllSubcomponents("vevent").map((e) => e.getFirstPropertyValue("uid"));
    expect(uids.length).toBeGreaterThan(3);
    expect(new Set(uids).size).toBe(uids.length);
    // Fetched again, the same UIDs: a calendar app updates rather than duplicates (RFC 5545 §3.8.4.7).
    const again = new ICAL.Component(ICAL.parse((await get(token)).json as string)).getAllSubcomponents("vevent").map((e) => e.getFirstPropertyValue("uid"));
    expect(again).toEqual(uids);
    // A cancelled day stays in the feed, marked CANCELLED (§3.8.1.11), so subscribers drop it.
    expect(cal.getAllSubcomponents("vevent").some((e) => e.getFirstPropertyValue("status") === "CANCELLED")).toBe(true);

    const second = await call(feedRoute.POST as never, { method: "POST", params: { channelId: w.channel.id }, user: w.members.owner });
    expect((await get(token)).status).toBe(404);
    expect((await get((second.json.url as string).split("/api/calendar/")[1]!)).status).toBe(200);
    expect((await get("not-a-real-token-at-all-xx")).status).toBe(404);
  });
});

describe("the mail queue when the mail server is down", () => {
  it("keeps the send queued with the reason, leaves the job to be retried, and delivers once mail works again", async () => {
    const { deliverCallSheet } = await import("@/lib/server/jobs/call-sheets");
    const { CALL_SHEET_RETRY } = await import("@/lib/server/jobs/queue");
    const nodemailer = (await import("nodemailer")).default;
    const day = (await newDay({ date: "2027-03-20", crew: [{ userId: w.members.presenter.id }] })).json.shootDay;
    const [send] = await db().insert(callSheetSends).values({ shootDayId: day.id, sentBy: w.members.producer.id, recipients: [w.members.presenter.email] }).returning();
    const g = globalThis as unknown as { __jigboardMail?: unknown };
    const working = g.__jigboardMail;
    // A mail server that is not there (nothing listens on port 9 here).
    g.__jigboardMail = nodemailer.createTransport({ host: "127.0.0.1", port: 9, connectionTimeout: 500 });
    await expect(deliverCallSheet(send!.id)).rejects.toThrow();
    const queued = (await db().select().from(callSheetSends).where(eq(callSheetSends.id, send!.id)))[0]!;
    expect(queued.status).toBe("queued");
    expect(queued.error).toMatch(/not sent yet, will retry/);
    // pg-boss retries a thrown job: ten tries with growing delays (the queue's policy).
    expect(CALL_SHEET_RETRY).toEqual({ retryLimit: 10, retryDelay: 20, retryBackoff: true });
    g.__jigboardMail = working;
    expect(await deliverCallSheet(send!.id)).toBe("sent");
    expect((await db().select().from(callSheetSends).where(eq(callSheetSends.id, send!.id)))[0]!.status).toBe("sent");
    // Delivered once: a second run changes nothing.
    expect(await deliverCallSheet(send!.id)).toBe("gone");
  }, 20_000);
});
