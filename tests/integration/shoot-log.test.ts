/**
 * The shoot log through the API: a note is stored once per device id (an
 * offline queue may send it again), its links must be the episode's, and a
 * note becomes a voice-over segment or a pickup shot, keeping the link.
 */
import { beforeAll, describe, expect, it } from "vitest";
import crypto from "node:crypto";
import { eq } from "drizzle-orm";
import * as logRoute from "@/app/api/episodes/[episodeId]/shoot-log/route";
import * as toScript from "@/app/api/shoot-log-notes/[noteId]/to-script/route";
import * as toPickup from "@/app/api/shoot-log-notes/[noteId]/to-pickup/route";
import { db } from "@/db/client";
import { buildSteps, scriptSegments, shootLogNotes, shots } from "@/db/schema";
import { call, makeEpisode, makeWorld } from "../support/fixtures";

type World = Awaited<ReturnType<typeof makeWorld>>;
let w: World;
beforeAll(async () => {
  w = await makeWorld();
});

describe("shoot log", () => {
  it("stores a note once however often its device sends it", async () => {
    const ep = await makeEpisode(w.channel.id, "shooting", 0, "Shaker box");
    const [step] = await db().insert(buildSteps).values({ episodeId: ep.id, position: 0, title: "Steam the bands" }).returning();
    const id = crypto.randomUUID();
    const body = { id, text: "In hindsight, the string stretched; use a batten.", stepId: step!.id, notedAt: "2026-12-12T10:15:00+00:00" };
    const first = await call(logRoute.POST as never, { method: "POST", params: { episodeId: ep.id }, user: w.members.presenter, body });
    expect(first.status).toBe(201);
    expect(first.json.created).toBe(true);
    const again = await call(logRoute.POST as never, { method: "POST", params: { episodeId: ep.id }, user: w.members.presenter, body });
    expect(again.status).toBe(200);
    expect(again.json.created).toBe(false);
    expect(await db().select().from(shootLogNotes).where(eq(shootLogNotes.id, id))).toHaveLength(1);
    const list = await call(logRoute.GET as never, { params: { episodeId: ep.id }, user: w.members.sponsor_liaison });
    expect(list.json.notes).toHaveLength(1);
    expect(list.json.notes[0]).toMatchObject({ text: body.text, stepId: step!.id, notedAt: "2026-12-12T10:15:00.000Z", authorName: "presenter" });
    // The same id sent to another episode is not a retry.
    const other = await makeEpisode(w.channel.id, "shooting", 1, "Other");
    expect((await call(logRoute.POST as never, { method: "POST", params: { episodeId: other.id }, user: w.members.presenter, body: { id, text: "x" } })).status).toBe(409);
  });

  it("names the bad field, refuses another episode's step, and lets the liaison only read", async () => {
    const ep = await makeEpisode(w.channel.id, "shooting", 2, "Links");
    const foreignEp = await makeEpisode(w.other.id, "shooting", 0, "Not ours");
    const [foreignStep] = await db().insert(buildSteps).values({ episodeId: foreignEp.id, position: 0, title: "Theirs" }).returning();
    const bad = await call(logRoute.POST as never, { method: "POST", params: { episodeId: ep.id }, user: w.members.editor, body: { id: "not-a-uuid", text: "" } });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.json.error.fields).sort()).toEqual(["id", "text"]);
    const foreign = await call(logRoute.POST as never, { method: "POST", params: { episodeId: ep.id }, user: w.members.editor, body: { id: crypto.randomUUID(), text: "ok", stepId: foreignStep!.id } });
    expect(foreign.status).toBe(422);
    expect(foreign.json.error.fields.stepId).toEqual(["not in this episode"]);
    expect((await call(logRoute.POST as never, { method: "POST", params: { episodeId: ep.id }, user: w.members.sponsor_liaison, body: { id: crypto.randomUUID(), text: "ok" } })).status).toBe(403);
  });

  it("a note becomes a voice-over segment or a pickup shot, once each, keeping the link", async () => {
    const ep = await makeEpisode(w.channel.id, "shooting", 3, "Convert");
    const [step] = await db().insert(buildSteps).values({ episodeId: ep.id, position: 0, title: "Bend the bands" }).returning();
    const id = crypto.randomUUID();
    await call(logRoute.POST as never, { method: "POST", params: { episodeId: ep.id }, user: w.members.editor, body: { id, text: "The band cracked at the rivet; soak it longer.", stepId: step!.id } });
    expect((await call(toScript.POST as never, { method: "POST", params: { noteId: id }, user: w.members.editor, body: {} })).status).toBe(403);
    const seg = await call(toScript.POST as never, { method: "POST", params: { noteId: id }, user: w.members.presenter, body: {} });
    expect(seg.status).toBe(201);
    expect(seg.json.segment).toMatchObject({ kind: "voice_over", text: "The band cracked at the rivet; soak it longer.", stepId: step!.id });
    expect(seg.json.note.segmentId).toBe(seg.json.segment.id);
    expect((await db().select().from(scriptSegments).where(eq(scriptSegments.episodeId, ep.id))).length).toBe(1);
    expect((await call(toScript.POST as never, { method: "POST", params: { noteId: id }, user: w.members.presenter, body: {} })).status).toBe(409);
    const pickup = await call(toPickup.POST as never, { method: "POST", params: { noteId: id }, user: w.members.editor });
    expect(pickup.status).toBe(201);
    expect(pickup.json.shot).toMatchObject({ kind: "pickup", stepId: step!.id, status: "planned" });
    const [row] = await db().select().from(shots).where(eq(shots.id, pickup.json.shot.id));
    expect(row!.description).toBe("The band cracked at the rivet; soak it longer.");
    expect((await call(toPickup.POST as never, { method: "POST", params: { noteId: id }, user: w.members.editor })).status).toBe(409);
    // Another channel's owner cannot reach the note.
    expect((await call(toPickup.POST as never, { method: "POST", params: { noteId: id }, user: w.outsider })).status).toBe(404);
  });
});
