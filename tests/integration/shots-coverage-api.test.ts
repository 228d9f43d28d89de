import { beforeAll, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import * as shotsRoute from "@/app/api/episodes/[episodeId]/shots/route";
import * as shotRoute from "@/app/api/shots/[shotId]/route";
import * as bulkRoute from "@/app/api/episodes/[episodeId]/shots/bulk/route";
import * as csvRoute from "@/app/api/episodes/[episodeId]/shots/csv/route";
import * as plannedRoute from "@/app/api/steps/[stepId]/planned-shots/route";
import * as stepsRoute from "@/app/api/episodes/[episodeId]/steps/route";
import * as scriptRoute from "@/app/api/episodes/[episodeId]/script/route";
import * as coverageRoute from "@/app/api/episodes/[episodeId]/coverage/route";
import * as rangesRoute from "@/app/api/episodes/[episodeId]/coverage-ranges/route";
import * as rangeRoute from "@/app/api/coverage-ranges/[rangeId]/route";
import * as gapsRoute from "@/app/api/episodes/[episodeId]/gaps/route";
import * as gapRoute from "@/app/api/gaps/[gapId]/route";
import * as pickupsRoute from "@/app/api/episodes/[episodeId]/pickups/route";
import * as listRoute from "@/app/api/channels/[channelId]/episodes/route";
import { db } from "@/db/client";
import { episodes, gaps } from "@/db/schema";
import type { Role } from "@/lib/roles";
import { call, makeEpisode, makeWorld } from "../support/fixtures";

type World = Awaited<ReturnType<typeof makeWorld>>;
let w: World;
let episodeId: string;
const words = (n: number) => Array.from({ length: n }, () => "oak").join(" ");

beforeAll(async () => {
  w = await makeWorld();
  episodeId = (await makeEpisode(w.channel.id, "editing", 0, "Coverage")).id;
  await db().update(episodes).set({ frameRate: "25", dropFrame: false }).where(eq(episodes.id, episodeId));
});

describe("shot list", () => {
  it.each<[Role, number]>([
    ["owner", 201],
    ["presenter", 201],
    ["producer", 201],
    ["editor", 201],
    ["sponsor_liaison", 403],
  ])("%s adding a shot: %i", async (role, status) => {
    const r = await call(shotsRoute.POST as never, { method: "POST", params: { episodeId }, body: { description: `by ${role}`, kind: "close_up" }, user: w.members[role] });
    expect(r.status).toBe(status);
  });

  it("creates a step's planned coverage in one action, once", async () => {
    const step = (await call(stepsRoute.POST as never, { method: "POST", params: { episodeId }, body: { title: "Cut the legs", coverageKinds: ["broll", "overhead", "slow_motion"] }, user: w.members.presenter })).json.step;
    const r = await call(plannedRoute.POST as never, { method: "POST", params: { stepId: step.id }, user: w.members.producer });
    expect(r.status).toBe(201);
    expect(r.json.shots.map((s: { kind: string }) => s.kind).sort()).toEqual(["broll", "overhead", "slow_motion"]);
    const again = await call(plannedRoute.POST as never, { method: "POST", params: { stepId: step.id }, user: w.members.producer });
    expect(again.json).toMatchObject({ shots: [], skipped: 3 });
    expect((await call(plannedRoute.POST as never, { method: "POST", params: { stepId: step.id }, user: w.outsider })).status).toBe(404);
  });

  it("bulk status is all or none, and only within the episode", async () => {
    const list = (await call(shotsRoute.GET as never, { params: { episodeId }, user: w.members.editor })).json.shots;
    const ids = list.slice(0, 3).map((s: { id: string }) => s.id);
    const ok = await call(bulkRoute.POST as never, { method: "POST", params: { episodeId }, body: { ids, status: "selected" }, user: w.members.editor });
    expect(ok.json.updated).toBe(3);
    const other = (await makeEpisode(w.channel.id, "idea", 3, "Other")).id;
    const foreign = (await call(shotsRoute.POST as never, { method: "POST", params: { episodeId: other }, body: { description: "x" }, user: w.members.editor })).json.shot.id;
    const mixed = await call(bulkRoute.POST as never, { method: "POST", params: { episodeId }, body: { ids: [ids[0], foreign], status: "rejected" }, user: w.members.editor });
    expect(mixed.status).toBe(404);
    const after = (await call(shotsRoute.GET as never, { params: { episodeId }, user: w.members.editor })).json.shots;
    expect(after.find((s: { id: string }) => s.id === ids[0]).status).toBe("selected");
    const bad = await call(shotRoute.PATCH as never, { method: "PATCH", params: { shotId: ids[0] }, body: { priority: 9, status: "lost" }, user: w.members.editor });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.json.error.fields)).toEqual(expect.arrayContaining(["priority", "status"]));
    const csv = await call(csvRoute.GET as never, { params: { episodeId }, user: w.members.sponsor_liaison });
    expect(String(csv.json).split("\r\n")[0]).toBe("kind,description,step,framing,camera_notes,priority,status");
    expect((await call(shotRoute.DELETE as never, { method: "DELETE", params: { shotId: ids[0] }, user: w.outsider })).status).toBe(404);
  });
});

describe("coverage and gaps", () => {
  it("computes voice-over gaps, closes them with B-roll, and turns a gap into a pickup", async () => {
    const ep = (await makeEpisode(w.channel.id, "editing", 1, "Gaps")).id;
    await db().update(episodes).set({ frameRate: "25", dropFrame: false }).where(eq(episodes.id, ep));
    // 25 words at 150 wpm = 10 s of voice-over = 250 frames; then 50 words to camera = 20 s.
    const vo = (await call(scriptRoute.POST as never, { method: "POST", params: { episodeId: ep }, body: { kind: "voice_over", text: words(25) }, user: w.members.presenter })).json.segment;
    await call(scriptRoute.POST as never, { method: "POST", params: { episodeId: ep }, body: { kind: "to_camera", text: words(55) }, user: w.members.presenter });
    const cov = async () => (await call(coverageRoute.GET as never, { params: { episodeId: ep }, user: w.members.sponsor_liaison })).json;
    let c = await cov();
    // Channel defaults: voice-over gaps over 2 s, to camera over 20 s without a cutaway (22 s here).
    expect(c.gaps.map((g: { startFrame: number; endFrame: number; reason: string }) => [g.startFrame, g.endFrame, g.reason])).toEqual([
      [0, 250, "voice_over"],
      [250, 800, "to_camera"],
    ]);
    expect(c.coverage).toBe(0);

    const denied = await call(rangesRoute.POST as never, { method: "POST", params: { episodeId: ep }, body: { startFrame: 0, endFrame: 100 }, user: w.members.presenter });
    expect(denied.status).toBe(403);
    const r1 = await call(rangesRoute.POST as never, { method: "POST", params: { episodeId: ep }, body: { startFrame: 0, endFrame: 100, note: "screws" }, user: w.members.editor });
    expect(r1.status).toBe(201);
    c = await cov();
    expect(c.gaps[0]).toMatchObject({ startFrame: 100, endFrame: 250, startTimecode: "00:00:04:00", segmentId: vo.id });
    expect(c.coverage).toBeCloseTo(0.4, 9);

    // The gap becomes a pickup shot linked to it and to the segment.
    const pick = await call(pickupsRoute.POST as never, { method: "POST", params: { episodeId: ep }, body: { startFrame: 100, endFrame: 250, segmentId: vo.id, reason: "voice_over" }, user: w.members.editor });
    expect(pick.status).toBe(201);
    expect(pick.json.shot).toMatchObject({ kind: "pickup", segmentId: vo.id, gapId: pick.json.gapId, status: "planned" });
    c = await cov();
    expect(c.gaps[0].id).toBe(pick.json.gapId);
    expect(c.gaps[0]).toMatchObject({ status: "open", pickupShotId: pick.json.shot.id });
    // A second pickup for the same gap, by its id or by its frames (a stale page), is refused and makes nothing.
    const again = await Promise.all([
      call(pickupsRoute.POST as never, { method: "POST", params: { episodeId: ep }, body: { gapId: pick.json.gapId }, user: w.members.editor }),
      call(pickupsRoute.POST as never, { method: "POST", params: { episodeId: ep }, body: { startFrame: 100, endFrame: 250, segmentId: vo.id, reason: "voice_over" }, user: w.members.editor }),
    ]);
    expect(again.map((r) => r.status)).toEqual([409, 409]);
    expect(again[0]!.json.error.code).toBe("conflict:gap.pickup");
    expect((await db().select().from(gaps).where(eq(gaps.episodeId, ep))).length).toBe(1);

    // Covering the rest closes it: the kept gap is resolved.
    await call(rangesRoute.POST as never, { method: "POST", params: { episodeId: ep }, body: { startFrame: 90, endFrame: 260 }, user: w.members.editor });
    c = await cov();
    expect(c.gaps.filter((g: { reason: string }) => g.reason === "voice_over")).toEqual([]);
    expect(c.coverage).toBe(1);
    const [kept] = await db().select().from(gaps).where(eq(gaps.id, pick.json.gapId));
    expect(kept!.status).toBe("resolved");

    // Removing B-roll opens a gap again.
    await call(rangeRoute.DELETE as never, { method: "DELETE", params: { rangeId: r1.json.range.id }, user: w.members.editor });
    c = await cov();
    expect(c.gaps[0]).toMatchObject({ startFrame: 0, endFrame: 90, status: "open" });
  });

  it("marked gaps, dismissing computed ones, and the board count", async () => {
    const ep = (await makeEpisode(w.channel.id, "editing", 2, "Marked")).id;
    await db().update(episodes).set({ frameRate: "25", dropFrame: false }).where(eq(episodes.id, ep));
    await call(scriptRoute.POST as never, { method: "POST", params: { episodeId: ep }, body: { kind: "voice_over", text: words(25) }, user: w.members.presenter });
    const marked = await call(gapsRoute.POST as never, { method: "POST", params: { episodeId: ep }, body: { startFrame: 10, endFrame: 5 }, user: w.members.editor });
    expect(marked.status).toBe(400);
    const m = await call(gapsRoute.POST as never, { method: "POST", params: { episodeId: ep }, body: { startFrame: 300, endFrame: 400, note: "need a wide" }, user: w.members.editor });
    expect(m.status).toBe(201);
    const dismiss = await call(gapsRoute.POST as never, { method: "POST", params: { episodeId: ep }, body: { source: "computed", status: "dismissed", startFrame: 0, endFrame: 250, reason: "voice_over" }, user: w.members.editor });
    expect(dismiss.status).toBe(201);
    const c = (await call(coverageRoute.GET as never, { params: { episodeId: ep }, user: w.members.owner })).json;
    expect(c.gaps.map((g: { status: string; source: string }) => `${g.source}:${g.status}`)).toEqual(["computed:dismissed", "marked:open"]);
    expect(c.openGaps).toBe(1);
    const board = await call(listRoute.GET as never, { params: { channelId: w.channel.id }, user: w.members.owner });
    expect(board.json.episodes.find((e: { id: string }) => e.id === ep).openGaps).toBe(1);
    expect((await call(gapRoute.PATCH as never, { method: "PATCH", params: { gapId: m.json.gap.id }, body: { status: "resolved" }, user: w.members.producer })).status).toBe(403);
    expect((await call(gapRoute.PATCH as never, { method: "PATCH", params: { gapId: m.json.gap.id }, body: { status: "resolved" }, user: w.outsider })).status).toBe(404);
    expect((await call(gapRoute.PATCH as never, { method: "PATCH", params: { gapId: m.json.gap.id }, body: { status: "resolved" }, user: w.members.editor })).status).toBe(200);
    expect((await call(coverageRoute.GET as never, { params: { episodeId: ep }, user: w.outsider })).status).toBe(404);
  });
});

describe("channel settings", () => {
  it("the owner sets the gap thresholds, and gaps follow", async () => {
    const channelRoute = await import("@/app/api/channels/[channelId]/route");
    const w2 = await makeWorld();
    const ep = (await makeEpisode(w2.channel.id, "editing", 0, "Thresholds")).id;
    await db().update(episodes).set({ frameRate: "25", dropFrame: false }).where(eq(episodes.id, ep));
    await call(scriptRoute.POST as never, { method: "POST", params: { episodeId: ep }, body: { kind: "voice_over", text: words(25) }, user: w2.members.presenter });
    await call(rangesRoute.POST as never, { method: "POST", params: { episodeId: ep }, body: { startFrame: 0, endFrame: 100 }, user: w2.members.editor });
    const gapsNow = async () => (await call(coverageRoute.GET as never, { params: { episodeId: ep }, user: w2.members.editor })).json.openGaps;
    expect(await gapsNow()).toBe(1); // 6 s bare, over the 2 s default
    for (const [role, status] of [["presenter", 403], ["editor", 403]] as const) {
      expect((await call(channelRoute.PATCH as never, { method: "PATCH", params: { channelId: w2.channel.id }, body: { brollGapMs: 10_000 }, user: w2.members[role] })).status).toBe(status);
    }
    expect((await call(channelRoute.PATCH as never, { method: "PATCH", params: { channelId: w2.channel.id }, body: { brollGapMs: 10_000 }, user: w2.outsider })).status).toBe(404);
    const bad = await call(channelRoute.PATCH as never, { method: "PATCH", params: { channelId: w2.channel.id }, body: { brollGapMs: -1, currency: "euro" }, user: w2.members.owner });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.json.error.fields)).toEqual(expect.arrayContaining(["brollGapMs", "currency"]));
    const ok = await call(channelRoute.PATCH as never, { method: "PATCH", params: { channelId: w2.channel.id }, body: { brollGapMs: 10_000, units: "metric" }, user: w2.members.owner });
    expect(ok.json.channel).toMatchObject({ brollGapMs: 10_000, units: "metric" });
    expect(await gapsNow()).toBe(0);
  });
});
