import { beforeAll, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import * as scriptRoute from "@/app/api/episodes/[episodeId]/script/route";
import * as orderRoute from "@/app/api/episodes/[episodeId]/script/order/route";
import * as timingRoute from "@/app/api/episodes/[episodeId]/script/timing/route";
import * as exportRoute from "@/app/api/episodes/[episodeId]/script/export/route";
import * as revisionsRoute from "@/app/api/episodes/[episodeId]/script/revisions/route";
import * as restoreRoute from "@/app/api/script-revisions/[revisionId]/restore/route";
import * as segmentRoute from "@/app/api/segments/[segmentId]/route";
import * as splitRoute from "@/app/api/segments/[segmentId]/split/route";
import * as joinRoute from "@/app/api/segments/[segmentId]/join/route";
import * as meRoute from "@/app/api/me/route";
import * as episodeRoute from "@/app/api/episodes/[episodeId]/route";
import * as listRoute from "@/app/api/channels/[channelId]/episodes/route";
import { db } from "@/db/client";
import { episodes, scriptSegments } from "@/db/schema";
import type { Role } from "@/lib/roles";
import { call, makeEpisode, makeWorld } from "../support/fixtures";

type World = Awaited<ReturnType<typeof makeWorld>>;
let w: World;
let episodeId: string;
const words = (n: number, w = "plane") => Array.from({ length: n }, () => w).join(" ");

const add = (user: { id: string }, body: Record<string, unknown>, ep = episodeId) => call(scriptRoute.POST as never, { method: "POST", params: { episodeId: ep }, body, user });
const save = (user: { id: string }, id: string, body: Record<string, unknown>) => call(segmentRoute.PATCH as never, { method: "PATCH", params: { segmentId: id }, body, user });
const script = async (ep = episodeId) => (await call(scriptRoute.GET as never, { params: { episodeId: ep }, user: w.members.owner })).json;

beforeAll(async () => {
  w = await makeWorld();
  episodeId = (await makeEpisode(w.channel.id, "planning", 0, "Script test")).id;
  await db().update(episodes).set({ frameRate: "25", targetRuntimeSeconds: 60 }).where(eq(episodes.id, episodeId));
});

describe("roles and isolation", () => {
  it.each<[Role, number]>([
    ["owner", 201],
    ["presenter", 201],
    ["editor", 403],
    ["producer", 403],
    ["sponsor_liaison", 403],
  ])("%s adding a segment: %i", async (role, status) => {
    expect((await add(w.members[role], { text: `by ${role}` })).status).toBe(status);
  });

  it("an editor writes notes and chapter flags, not the words", async () => {
    const s = (await add(w.members.presenter, { text: "Intro" })).json.segment;
    const notes = await save(w.members.editor, s.id, { version: s.version, editorNotes: "cut to the wide", chapterStart: true, chapterTitle: "Intro" });
    expect(notes.status).toBe(200);
    const text = await save(w.members.editor, s.id, { version: notes.json.segment.version, text: "Editor's words" });
    expect(text.status).toBe(403);
    const producer = await save(w.members.producer, s.id, { version: notes.json.segment.version, editorNotes: "x" });
    expect(producer.status).toBe(403);
  });

  it("another channel gets 404 everywhere", async () => {
    const s = (await add(w.members.presenter, { text: "private" })).json.segment;
    expect((await call(scriptRoute.GET as never, { params: { episodeId }, user: w.outsider })).status).toBe(404);
    expect((await save(w.outsider, s.id, { version: s.version, text: "mine" })).status).toBe(404);
    expect((await call(splitRoute.POST as never, { method: "POST", params: { segmentId: s.id }, body: { version: 1, before: "a", after: "b" }, user: w.outsider })).status).toBe(404);
    expect((await call(timingRoute.GET as never, { params: { episodeId }, user: w.outsider })).status).toBe(404);
    expect((await call(exportRoute.GET as never, { params: { episodeId }, user: w.outsider })).status).toBe(404);
    expect((await call(segmentRoute.DELETE as never, { method: "DELETE", params: { segmentId: s.id }, user: w.outsider })).status).toBe(404);
    expect((await call(scriptRoute.GET as never, { params: { episodeId } })).status).toBe(401);
  });

  it("bad input names the field", async () => {
    const r = await add(w.members.presenter, { kind: "monologue", pinnedStartFrame: -1, explicitDurationFrames: 1.5 });
    expect(r.status).toBe(400);
    expect(Object.keys(r.json.error.fields)).toEqual(expect.arrayContaining(["kind", "pinnedStartFrame", "explicitDurationFrames"]));
    const s = (await add(w.members.presenter, { text: "x" })).json.segment;
    const noVersion = await save(w.members.presenter, s.id, { text: "y" });
    expect(noVersion.status).toBe(400);
    expect(noVersion.json.error.fields.version).toBeTruthy();
  });
});

describe("no lost edits", () => {
  it("a stale save answers 409 with the newer text and writes nothing", async () => {
    const s = (await add(w.members.presenter, { text: "The first draft." })).json.segment;
    const a = await save(w.members.presenter, s.id, { version: s.version, text: "The first draft, improved by A." });
    expect(a.status).toBe(200);
    const b = await save(w.members.owner, s.id, { version: s.version, text: "B's version, from the old text." });
    expect(b.status).toBe(409);
    expect(b.json.error.current).toMatchObject({ text: "The first draft, improved by A.", version: s.version + 1 });
    const [row] = await db().select().from(scriptSegments).where(eq(scriptSegments.id, s.id));
    expect(row!.text).toBe("The first draft, improved by A.");
  });

  it("two clients saving concurrently over many rounds lose no words", async () => {
    const s = (await add(w.members.presenter, { text: "" })).json.segment;
    // Each client appends its own words and, on 409, merges by re-applying its addition to the newer text.
    const client = (user: { id: string }, tag: string, rounds: number) => async () => {
      let known = { version: s.version, text: "" };
      for (let i = 0; i < rounds; i++) {
        const word = `${tag}${i}`;
        for (;;) {
          const r = await save(user, s.id, { version: known.version, text: `${known.text} ${word}`.trim() });
          if (r.status === 200) {
            known = r.json.segment;
            break;
          }
          expect(r.status).toBe(409);
          known = r.json.error.current;
        }
      }
    };
    await Promise.all([client(w.members.presenter, "a", 25)(), client(w.members.owner, "b", 25)()]);
    const [row] = await db().select().from(scriptSegments).where(eq(scriptSegments.id, s.id));
    const got = row!.text.split(" ");
    for (let i = 0; i < 25; i++) {
      expect(got).toContain(`a${i}`);
      expect(got).toContain(`b${i}`);
    }
    expect(got.length).toBe(50);
    expect(row!.version).toBe(s.version + 50);
  });
});

describe("split, join, order", () => {
  it("splits at the cursor and joins back, each checked against versions", async () => {
    const ep = (await makeEpisode(w.channel.id, "planning", 1, "Split")).id;
    const s = (await add(w.members.presenter, { text: "Mill the stock. Then glue it up." }, ep)).json.segment;
    const stale = await call(splitRoute.POST as never, { method: "POST", params: { segmentId: s.id }, body: { version: s.version + 3, before: "x", after: "y" }, user: w.members.presenter });
    expect(stale.status).toBe(409);
    const split = await call(splitRoute.POST as never, { method: "POST", params: { segmentId: s.id }, body: { version: s.version, before: "Mill the stock.", after: "Then glue it up." }, user: w.members.presenter });
    expect(split.status).toBe(201);
    expect((await script(ep)).segments.map((x: { text: string }) => x.text)).toEqual(["Mill the stock.", "Then glue it up."]);
    const join = await call(joinRoute.POST as never, { method: "POST", params: { segmentId: s.id }, body: { version: split.json.first.version, nextVersion: split.json.second.version }, user: w.members.presenter });
    expect(join.status).toBe(200);
    expect((await script(ep)).segments.map((x: { text: string }) => x.text)).toEqual(["Mill the stock. Then glue it up."]);
    const last = await call(joinRoute.POST as never, { method: "POST", params: { segmentId: s.id }, body: { version: join.json.segment.version, nextVersion: 1 }, user: w.members.presenter });
    expect(last.status).toBe(409);
  });

  it("inserts after a segment and reorders all at once", async () => {
    const ep = (await makeEpisode(w.channel.id, "planning", 2, "Order")).id;
    const a = (await add(w.members.presenter, { text: "A" }, ep)).json.segment;
    const c = (await add(w.members.presenter, { text: "C" }, ep)).json.segment;
    const b = (await add(w.members.presenter, { text: "B", afterId: a.id }, ep)).json.segment;
    expect((await script(ep)).segments.map((x: { text: string }) => x.text)).toEqual(["A", "B", "C"]);
    const partial = await call(orderRoute.PUT as never, { method: "PUT", params: { episodeId: ep }, body: { ids: [a.id, b.id] }, user: w.members.presenter });
    expect(partial.status).toBe(409);
    const ok = await call(orderRoute.PUT as never, { method: "PUT", params: { episodeId: ep }, body: { ids: [c.id, a.id, b.id] }, user: w.members.presenter });
    expect(ok.status).toBe(200);
    expect((await script(ep)).segments.map((x: { text: string }) => x.text)).toEqual(["C", "A", "B"]);
  });
});

describe("timing, chapters, exports", () => {
  it("times the script at the episode's rate and at a chosen one", async () => {
    const ep = (await makeEpisode(w.channel.id, "planning", 3, "Timing")).id;
    await db().update(episodes).set({ frameRate: "25", targetRuntimeSeconds: 120 }).where(eq(episodes.id, ep));
    await add(w.members.presenter, { kind: "to_camera", text: words(150), chapterStart: true, chapterTitle: "Start" }, ep);
    await add(w.members.presenter, { kind: "voice_over", text: words(75), chapterStart: true, chapterTitle: "Milling", pinnedStartFrame: 25 * 70 }, ep);
    await add(w.members.presenter, { kind: "on_screen_text", text: "x".repeat(170), chapterStart: true, chapterTitle: "Glue" }, ep);
    const s = await script(ep);
    // 150 words at 150 wpm = 60 s = 1500 frames at 25 fps; the pin at 70 s leaves the estimate 10 s short.
    expect(s.segments.map((x: { timing: { startTimecode: string } }) => x.timing.startTimecode)).toEqual(["00:00:00:00", "00:01:10:00", "00:01:40:00"]);
    expect(s.segments[1].timing.drift).toBe(-250);
    expect(s.totals).toMatchObject({ frames: 2750, timecode: "00:01:50:00", overFrames: -250 });
    expect(s.chapters).toMatchObject({ valid: true, text: "0:00 Start\n1:10 Milling\n1:40 Glue" });

    const at2997 = await call(timingRoute.GET as never, { path: "/x?rate=29.97&dropFrame=true", params: { episodeId: ep }, user: w.members.editor });
    expect(at2997.status).toBe(200);
    expect(at2997.json.rate).toMatchObject({ id: "29.97", dropFrame: true });
    expect(at2997.json.segments[0].endTimecode).toBe("00:00:59;28"); // 1798 frames
    const bad = await call(timingRoute.GET as never, { path: "/x?rate=25&dropFrame=true", params: { episodeId: ep }, user: w.members.editor });
    expect(bad.status).toBe(400);

    const text = await call(exportRoute.GET as never, { path: "/x?format=text", params: { episodeId: ep }, user: w.members.sponsor_liaison });
    expect(text.json).toContain("[00:01:10:00 – 00:01:40:00] Voice-over · chapter: Milling");
    const json = await call(exportRoute.GET as never, { path: "/x?format=json", params: { episodeId: ep }, user: w.members.sponsor_liaison });
    expect(json.json.segments).toHaveLength(3);
    expect(json.json.chapters).toBe("0:00 Start\n1:10 Milling\n1:40 Glue");
  });

  it("uses the presenter's reading rate", async () => {
    const ep = (await makeEpisode(w.channel.id, "planning", 4, "Fast talker")).id;
    await add(w.members.presenter, { text: words(180) }, ep);
    const bad = await call(meRoute.PATCH as never, { method: "PATCH", body: { readingRateWpm: 400 }, user: w.members.presenter });
    expect(bad.status).toBe(400);
    expect((await call(meRoute.PATCH as never, { method: "PATCH", body: { readingRateWpm: 180 }, user: w.members.presenter })).status).toBe(200);
    const notMember = await call(episodeRoute.PATCH as never, { method: "PATCH", params: { episodeId: ep }, body: { presenterId: w.outsider.id }, user: w.members.producer });
    expect(notMember.status).toBe(422);
    expect((await call(episodeRoute.PATCH as never, { method: "PATCH", params: { episodeId: ep }, body: { presenterId: w.members.presenter.id }, user: w.members.producer })).status).toBe(200);
    const s = await script(ep);
    expect(s.wordsPerMinute).toBe(180);
    expect(s.totals.seconds).toBeCloseTo(60, 1);
    const board = await call(listRoute.GET as never, { params: { channelId: w.channel.id }, user: w.members.owner });
    expect(board.json.episodes.find((e: { id: string }) => e.id === ep).scriptSeconds).toBe(60);
  });

  it("keeps a revision history and restores an earlier text", async () => {
    const ep = (await makeEpisode(w.channel.id, "planning", 5, "History")).id;
    const s = (await add(w.members.presenter, { text: "Version one" }, ep)).json.segment;
    const v2 = await save(w.members.presenter, s.id, { version: s.version, text: "Version two" });
    await save(w.members.presenter, s.id, { version: v2.json.segment.version, text: "Version three" });
    const revs = (await call(revisionsRoute.GET as never, { params: { episodeId: ep }, user: w.members.editor })).json.revisions;
    expect(revs.map((r: { after: { text: string } }) => r.after.text)).toEqual(["Version three", "Version two", "Version one"]);
    const target = revs.find((r: { after: { text: string } }) => r.after.text === "Version two");
    expect((await call(restoreRoute.POST as never, { method: "POST", params: { revisionId: target.id }, user: w.members.editor })).status).toBe(403);
    const restored = await call(restoreRoute.POST as never, { method: "POST", params: { revisionId: target.id }, user: w.members.presenter });
    expect(restored.json.segment.text).toBe("Version two");
    // A deleted segment comes back too.
    await call(segmentRoute.DELETE as never, { method: "DELETE", params: { segmentId: s.id }, user: w.members.presenter });
    const deletion = (await call(revisionsRoute.GET as never, { params: { episodeId: ep }, user: w.members.presenter })).json.revisions[0];
    expect(deletion.after).toBeNull();
    const back = await call(restoreRoute.POST as never, { method: "POST", params: { revisionId: deletion.id }, user: w.members.presenter });
    expect(back.json.segment).toMatchObject({ id: s.id, text: "Version two" });
    expect((await call(restoreRoute.POST as never, { method: "POST", params: { revisionId: deletion.id }, user: w.outsider })).status).toBe(404);
  });
});
