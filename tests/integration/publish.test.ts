/**
 * The publish package through the API: the description composed from the
 * data, the script marked final (and unmarked by a later edit), the
 * thumbnail claimed only from this channel's own upload, and the move to
 * published refused while the checklist fails unless an owner gives a reason.
 * The pure rules are in tests/unit/publish.test.ts.
 */
import { beforeAll, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import * as publishRoute from "@/app/api/episodes/[episodeId]/publish/route";
import * as finalRoute from "@/app/api/episodes/[episodeId]/publish/script-final/route";
import * as uploadRoute from "@/app/api/episodes/[episodeId]/publish/thumbnail-upload/route";
import * as thumbRoute from "@/app/api/episodes/[episodeId]/publish/thumbnail/route";
import * as episodeRoute from "@/app/api/episodes/[episodeId]/route";
import * as segmentRoute from "@/app/api/segments/[segmentId]/route";
import * as toolPhotoRoute from "@/app/api/channels/[channelId]/photos/route";
import { db } from "@/db/client";
import { buildSteps, channels, episodes, publishOverrides, scriptSegments, shots, stepTools, tools } from "@/db/schema";
import { call, makeEpisode, makeWorld } from "../support/fixtures";

type World = Awaited<ReturnType<typeof makeWorld>>;
let w: World;
beforeAll(async () => {
  w = await makeWorld();
  // Three to-camera chapters back to back run 36 s: allow that without a cutaway, so only what a test sets fails.
  await db().update(channels).set({ toCameraMaxMs: 120_000 }).where(eq(channels.id, w.channel.id));
});

// About 30 words: at the default reading rate each segment runs over 10 s, so three chapters are valid.
const words = (topic: string) => `${topic} `.repeat(30).trim();

async function scriptedEpisode(title: string) {
  const ep = await makeEpisode(w.channel.id, "review", 0, title);
  await db().insert(scriptSegments).values(
    ["Welcome", "Milling", "Glue up"].map((t, i) => ({ episodeId: ep.id, position: i, kind: "to_camera" as const, text: words(t.toLowerCase()), chapterStart: true, chapterTitle: t })),
  );
  return ep;
}

const get = async (episodeId: string) => (await call(publishRoute.GET as never, { params: { episodeId }, user: w.members.owner })).json;
const item = (view: { checklist: { items: { key: string; pass: boolean; detail: string }[] } }, key: string) => view.checklist.items.find((i) => i.key === key)!;

async function uploadThumbnail(episodeId: string) {
  const signed = await call(uploadRoute.POST as never, { method: "POST", params: { episodeId }, user: w.members.editor, body: { contentType: "image/png", size: 8 } });
  expect(signed.status).toBe(201);
  const put = await fetch(signed.json.uploadUrl, { method: "PUT", headers: signed.json.headers, body: new Uint8Array([137, 80, 78, 71, 13, 10, 26, 10]) });
  expect(put.ok).toBe(true);
  return signed.json.key as string;
}

describe("publish package", () => {
  it("composes the description from the data: chapters from the script, tools, materials and the caution", async () => {
    const ep = await scriptedEpisode("Hall table");
    const [saw] = await db().insert(tools).values({ channelId: w.channel.id, name: "track saw", kind: "power_tool" }).returning();
    const [step] = await db().insert(buildSteps).values({ episodeId: ep.id, position: 0, title: "Break down the board", activeMinutes: 30 }).returning();
    await db().insert(stepTools).values({ stepId: step!.id, toolId: saw!.id });
    const patched = await call(publishRoute.PATCH as never, { method: "PATCH", params: { episodeId: ep.id }, user: w.members.presenter, body: { title: "A hall table from one board", summary: "One walnut board, one table." } });
    expect(patched.status).toBe(200);
    const v = patched.json;
    expect(v.description.startsWith("One walnut board, one table.\n\nChapters\n0:00 Welcome\n")).toBe(true);
    expect(v.description).toContain("Tools in this build\ntrack saw");
    // The caution defers to the manufacturer's instructions (lib/safety.ts DEFER).
    expect(v.description).toContain("This build uses power tools");
    expect(v.description).toContain("manufacturer's instructions");
    expect(v.chapters.valid).toBe(true);
    expect(v.texts.titleChars).toBe("A hall table from one board".length);
    // Switching a section off removes it.
    const off = await call(publishRoute.PATCH as never, { method: "PATCH", params: { episodeId: ep.id }, user: w.members.presenter, body: { sections: { chapters: false } } });
    expect(off.json.description).not.toContain("Chapters");
    expect(off.json.package.sections).toEqual({ chapters: false, credits: true, materials: true, safety: true });
    // Bad input names the field; a sponsor liaison may not edit.
    const bad = await call(publishRoute.PATCH as never, { method: "PATCH", params: { episodeId: ep.id }, user: w.members.presenter, body: { title: 5 } });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.json.error.fields)).toEqual(["title"]);
    expect((await call(publishRoute.PATCH as never, { method: "PATCH", params: { episodeId: ep.id }, user: w.members.sponsor_liaison, body: { title: "x" } })).status).toBe(403);
  });

  it("the thumbnail must be this channel's thumbnail upload; another purpose or channel is refused", async () => {
    const ep = await scriptedEpisode("Thumb test");
    const key = await uploadThumbnail(ep.id);
    // A tool photo upload of the same channel is not a thumbnail.
    const photo = await call(toolPhotoRoute.POST as never, { method: "POST", params: { channelId: w.channel.id }, user: w.members.owner, body: { contentType: "image/png", size: 8 } });
    await fetch(photo.json.uploadUrl, { method: "PUT", headers: photo.json.headers, body: new Uint8Array([137, 80, 78, 71, 13, 10, 26, 10]) });
    const wrong = await call(thumbRoute.PUT as never, { method: "PUT", params: { episodeId: ep.id }, user: w.members.editor, body: { key: photo.json.key } });
    expect(wrong.status).toBe(422);
    expect(wrong.json.error.fields.key).toBeDefined();
    const forged = await call(thumbRoute.PUT as never, { method: "PUT", params: { episodeId: ep.id }, user: w.members.editor, body: { key: key.replace(w.channel.id, w.other.id) } });
    expect(forged.status).toBe(422);
    const ok = await call(thumbRoute.PUT as never, { method: "PUT", params: { episodeId: ep.id }, user: w.members.editor, body: { key } });
    expect(ok.status).toBe(200);
    expect(ok.json.package.thumbnailUrl).toMatch(/^http/);
    // Over 2 MB is refused before anything is signed.
    const big = await call(uploadRoute.POST as never, { method: "POST", params: { episodeId: ep.id }, user: w.members.editor, body: { contentType: "image/png", size: 3 * 1024 * 1024 } });
    expect(big.status).toBe(400);
    expect(big.json.error.fields.size[0]).toBe("a thumbnail can be at most 2 MB");
  });

  it("the script marked final stops counting as final after an edit", async () => {
    const ep = await scriptedEpisode("Final test");
    expect((await call(finalRoute.PUT as never, { method: "PUT", params: { episodeId: ep.id }, user: w.members.editor, body: { final: true } })).status).toBe(403);
    const marked = await call(finalRoute.PUT as never, { method: "PUT", params: { episodeId: ep.id }, user: w.members.presenter, body: { final: true } });
    expect(marked.status).toBe(200);
    expect(item(marked.json, "script_final").pass).toBe(true);
    const [seg] = await db().select().from(scriptSegments).where(eq(scriptSegments.episodeId, ep.id)).limit(1);
    const saved = await call(segmentRoute.PATCH as never, { method: "PATCH", params: { segmentId: seg!.id }, user: w.members.presenter, body: { text: `${seg!.text} again`, version: seg!.version } });
    expect(saved.status).toBe(200);
    const after = await get(ep.id);
    expect(item(after, "script_final")).toMatchObject({ pass: false, detail: "edited after it was marked final; mark it final again" });
    const empty = await makeEpisode(w.channel.id, "idea", 9, "No script");
    expect((await call(finalRoute.PUT as never, { method: "PUT", params: { episodeId: empty.id }, user: w.members.presenter, body: { final: true } })).status).toBe(422);
  });

  it("refuses the move to published while the checklist fails; an owner may override with a reason, recorded", async () => {
    const ep = await scriptedEpisode("Gate test");
    await db().insert(shots).values({ episodeId: ep.id, kind: "broll", description: "glue squeeze-out", position: 0 });
    const move = (user: (typeof w.members)[keyof typeof w.members], extra: object = {}) => call(episodeRoute.PATCH as never, { method: "PATCH", params: { episodeId: ep.id }, user, body: { stage: "published", ...extra } });
    const refused = await move(w.members.owner);
    expect(refused.status).toBe(409);
    expect(refused.json.error.code).toBe("conflict:publish.checklist");
    expect(refused.json.error.message).toMatch(/script marked final/);
    expect(refused.json.error.current.checklist.failing).toEqual(["script_final", "shots_done", "title_thumbnail"]);
    expect((await move(w.members.presenter, { publishOverride: "the sponsor moved the date" })).status).toBe(403);
    const short = await move(w.members.owner, { publishOverride: "late" });
    expect(short.status).toBe(400);
    expect(short.json.error.fields.publishOverride[0]).toBe("say why, in at least 10 characters");
    let [row] = await db().select().from(episodes).where(eq(episodes.id, ep.id));
    expect(row!.stage).toBe("review");
    expect(await db().select().from(publishOverrides).where(eq(publishOverrides.episodeId, ep.id))).toEqual([]);

    const ok = await move(w.members.owner, { publishOverride: "Published by hand on the platform already; tidying up." });
    expect(ok.status).toBe(200);
    [row] = await db().select().from(episodes).where(eq(episodes.id, ep.id));
    expect(row!.stage).toBe("published");
    const view = await get(ep.id);
    expect(view.overrides).toHaveLength(1);
    expect(view.overrides[0]).toMatchObject({ reason: "Published by hand on the platform already; tidying up.", failing: ["script_final", "shots_done", "title_thumbnail"] });
  });

  it("publishes without an override once every item passes (a shot marked not needed counts as done)", async () => {
    const ep = await scriptedEpisode("Clean publish");
    const [shot] = await db().insert(shots).values({ episodeId: ep.id, kind: "broll", description: "detail of the joint", position: 0 }).returning();
    await db().update(shots).set({ status: "waived" }).where(eq(shots.id, shot!.id));
    await call(publishRoute.PATCH as never, { method: "PATCH", params: { episodeId: ep.id }, user: w.members.presenter, body: { title: "A clean publish" } });
    const key = await uploadThumbnail(ep.id);
    await call(thumbRoute.PUT as never, { method: "PUT", params: { episodeId: ep.id }, user: w.members.editor, body: { key } });
    const v = (await call(finalRoute.PUT as never, { method: "PUT", params: { episodeId: ep.id }, user: w.members.presenter, body: { final: true } })).json;
    expect(v.checklist.failing).toEqual([]);
    const r = await call(episodeRoute.PATCH as never, { method: "PATCH", params: { episodeId: ep.id }, user: w.members.presenter, body: { stage: "published" } });
    expect(r.status).toBe(200);
    expect(r.json.episode.stage).toBe("published");
    expect(await db().select().from(publishOverrides).where(eq(publishOverrides.episodeId, ep.id))).toEqual([]);
  });
});
