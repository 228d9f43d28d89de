import { beforeAll, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
// Reference implementation (devDependency, tests only).
// @ts-expect-error untyped package
import Timecode from "smpte-timecode";
import * as scriptRoute from "@/app/api/episodes/[episodeId]/script/route";
import * as timingRoute from "@/app/api/episodes/[episodeId]/script/timing/route";
import * as episodeRoute from "@/app/api/episodes/[episodeId]/route";
import * as rangesRoute from "@/app/api/episodes/[episodeId]/coverage-ranges/route";
import { db } from "@/db/client";
import { coverageRanges, episodes, scriptSegments } from "@/db/schema";
import { call, makeEpisode, makeWorld } from "../support/fixtures";

type World = Awaited<ReturnType<typeof makeWorld>>;
let w: World;

beforeAll(async () => {
  w = await makeWorld();
});

async function setup() {
  const ep = await makeEpisode(w.channel.id, "planning", 0, "Rates");
  await db().update(episodes).set({ frameRate: "25", dropFrame: false }).where(eq(episodes.id, ep.id));
  const user = w.members.presenter;
  // 10 s of words at 150 wpm, then a segment pinned at 00:00:30:00 with a fixed 4 s length.
  await call(scriptRoute.POST as never, { method: "POST", params: { episodeId: ep.id }, body: { kind: "voice_over", text: Array.from({ length: 25 }, () => "oak").join(" ") }, user });
  const pinned = (await call(scriptRoute.POST as never, { method: "POST", params: { episodeId: ep.id }, body: { kind: "on_screen_text", text: "Cure 24 h", pinnedStartFrame: 750, explicitDurationFrames: 100 }, user })).json.segment;
  await call(rangesRoute.POST as never, { method: "POST", params: { episodeId: ep.id }, body: { startFrame: 25, endFrame: 125, note: "hands" }, user: w.members.editor });
  return { id: ep.id, pinned };
}

describe("frame counts keep their time when the rate changes", () => {
  it("the timing view at another rate gives the same runtime", async () => {
    const { id } = await setup();
    const at = async (q: string) => (await call(timingRoute.GET as never, { path: `/x${q}`, params: { episodeId: id }, user: w.members.editor })).json;
    const native = await at("");
    const fifty = await at("?rate=50");
    const ntsc = await at("?rate=29.97&dropFrame=true");
    expect(native.totals.seconds).toBeCloseTo(34, 5);
    expect(fifty.totals.seconds).toBeCloseTo(native.totals.seconds, 5);
    // 34 s at 30000/1001 is 1018.98 frames: 1019, within half a frame.
    expect(Math.abs(ntsc.totals.seconds - native.totals.seconds)).toBeLessThanOrEqual(0.5 * (1001 / 30000));
    // The pin reads 00:00:30 at every rate; at 29.97 DF the label is the reference package's for frame 899 (nearest to 30 s).
    expect(fifty.segments[1].startTimecode).toBe("00:00:30:00");
    expect(ntsc.segments[1].startTimecode).toBe(new Timecode(899, 29.97, true).toString());
  });

  it("changing the episode's rate converts stored pins, fixed lengths and B-roll ranges", async () => {
    const { id, pinned } = await setup();
    const r = await call(episodeRoute.PATCH as never, { method: "PATCH", params: { episodeId: id }, body: { frameRate: "50" }, user: w.members.presenter });
    expect(r.status).toBe(200);
    const [seg] = await db().select().from(scriptSegments).where(eq(scriptSegments.id, pinned.id));
    expect(seg).toMatchObject({ pinnedStartFrame: 1500, explicitDurationFrames: 200 });
    const [range] = await db().select().from(coverageRanges).where(eq(coverageRanges.episodeId, id));
    expect(range).toMatchObject({ startFrame: 50, endFrame: 250 });
    // 25 → 23.976: 750 frames (30 s) become 719.28 → 719, stated as the nearest frame.
    await call(episodeRoute.PATCH as never, { method: "PATCH", params: { episodeId: id }, body: { frameRate: "23.976" }, user: w.members.presenter });
    const [again] = await db().select().from(scriptSegments).where(eq(scriptSegments.id, pinned.id));
    expect(again!.pinnedStartFrame).toBe(719);
  });
});
