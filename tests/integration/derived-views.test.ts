/**
 * The board, script and shot-list responses are cached under revisions that
 * triggers raise with every change to what they read. After each kind of
 * change the cached answer must equal one computed from nothing (the caches
 * emptied and every stored figure marked stale); a figure computed before a
 * change can never be kept after it; the script and shot list answer 304 to
 * the ETag of the body the client holds, and 200 once it has changed.
 */
import { beforeAll, describe, expect, it } from "vitest";
import { and, eq, sql } from "drizzle-orm";
import * as listRoute from "@/app/api/channels/[channelId]/episodes/route";
import * as scriptRoute from "@/app/api/episodes/[episodeId]/script/route";
import * as shotsRoute from "@/app/api/episodes/[episodeId]/shots/route";
import { db } from "@/db/client";
import { channels, coverageRanges, episodeFigures, episodes, scriptSegments, shots, users } from "@/db/schema";
import { listEpisodeFiguresByChannel, storeEpisodeFigures } from "@/db/queries/figures";
import { clearViewCache } from "@/lib/server/infra/view-cache";
import { openApiDocument } from "@/lib/openapi";
import { call, makeEpisode, makeWorld } from "../support/fixtures";

type World = Awaited<ReturnType<typeof makeWorld>>;
let w: World;
let episodeId: string;
const words = (n: number) => Array.from({ length: n }, () => "walnut").join(" ");

beforeAll(async () => {
  w = await makeWorld();
  const e = await makeEpisode(w.channel.id, "editing", 0, "Bench hook");
  episodeId = e.id;
  await makeEpisode(w.channel.id, "idea", 0, "Sawhorse pair");
  await db().update(episodes).set({ presenterId: w.members.presenter.id, frameRate: "25", dropFrame: false }).where(eq(episodes.id, episodeId));
  await db().insert(scriptSegments).values([
    { episodeId, position: 0, kind: "to_camera", text: words(30) },
    { episodeId, position: 1, kind: "voice_over", text: words(60) },
  ]);
});

async function readAll() {
  const as = { user: w.members.editor };
  const board = await call(listRoute.GET as never, { path: `/api/channels/${w.channel.id}/episodes`, params: { channelId: w.channel.id }, ...as });
  const script = await call(scriptRoute.GET as never, { path: `/api/episodes/${episodeId}/script`, params: { episodeId }, ...as });
  const shotList = await call(shotsRoute.GET as never, { path: `/api/episodes/${episodeId}/shots`, params: { episodeId }, ...as });
  for (const r of [board, script, shotList]) expect(r.status).toBe(200);
  return { board: board.json, script: script.json, shots: shotList.json };
}

/** What the routes answer with every cache emptied and every stored figure stale. */
async function fromNothing() {
  clearViewCache();
  await db().execute(sql`update episode_figures set computed_rev = null where episode_id in (select id from episodes where channel_id = ${w.channel.id})`);
  return readAll();
}

/** Reads once (filling the caches), changes something, and expects the cached answer to equal one from nothing. */
async function expectFollows(change: () => Promise<unknown>) {
  await readAll();
  await readAll();
  await change();
  const cached = await readAll();
  expect(cached).toEqual(await fromNothing());
  return cached;
}

const card = (board: { episodes: { id: string }[] }, id = episodeId) => board.episodes.find((e) => e.id === id) as Record<string, unknown>;

describe("cached views follow every change to what they read", () => {
  it("a segment added, edited and removed", async () => {
    const before = card((await readAll()).board).scriptSeconds as number;
    let added = await expectFollows(() => db().insert(scriptSegments).values({ episodeId, position: 2, kind: "voice_over", text: words(150) }));
    expect(card(added.board).scriptSeconds).toBe(before + 60); // 150 words at 150 wpm (the default rate) is one minute
    const [seg] = await db().select().from(scriptSegments).where(and(eq(scriptSegments.episodeId, episodeId), eq(scriptSegments.position, 2)));
    added = await expectFollows(() => db().update(scriptSegments).set({ text: words(75) }).where(eq(scriptSegments.id, seg!.id)));
    expect(card(added.board).scriptSeconds).toBe(before + 30);
    const removed = await expectFollows(() => db().delete(scriptSegments).where(eq(scriptSegments.id, seg!.id)));
    expect(card(removed.board).scriptSeconds).toBe(before);
    expect(removed.script.segments).toHaveLength(2);
  });

  it("the presenter's reading rate", async () => {
    const r = await expectFollows(() => db().update(users).set({ readingRateWpm: 180 }).where(eq(users.id, w.members.presenter.id)));
    expect(r.script.wordsPerMinute).toBe(180);
    // 90 words at 180 wpm: 30 s.
    expect(card(r.board).scriptSeconds).toBe(30);
  });

  it("the episode's rate, target and title", async () => {
    const r = await expectFollows(() => db().update(episodes).set({ frameRate: "30", targetRuntimeSeconds: 600, title: "Bench hook, take two" }).where(eq(episodes.id, episodeId)));
    expect(r.script.rate.id).toBe("30");
    expect(card(r.board).title).toBe("Bench hook, take two");
  });

  it("coverage ranges and the channel's gap threshold", async () => {
    const start = card((await readAll()).board).openGaps as number;
    expect(start).toBeGreaterThan(0);
    const covered = await expectFollows(() => db().insert(coverageRanges).values({ episodeId, startFrame: 0, endFrame: 30 * 60 * 10 }));
    expect(card(covered.board).openGaps).toBe(0);
    await db().delete(coverageRanges).where(eq(coverageRanges.episodeId, episodeId));
    const wide = await expectFollows(() => db().update(channels).set({ brollGapMs: 120_000 }).where(eq(channels.id, w.channel.id)));
    expect(card(wide.board).openGaps).toBeLessThan(start);
  });

  it("shots added and captured", async () => {
    const added = await expectFollows(() => db().insert(shots).values([{ episodeId, kind: "broll", description: "Hook against the bench edge", position: 0 }, { episodeId, kind: "broll", description: "Paring cut", position: 1 }]));
    expect(added.shots.shots).toHaveLength(2);
    expect(card(added.board)).toMatchObject({ shotsDone: 0, shotsTotal: 2 });
    const done = await expectFollows(() => db().update(shots).set({ status: "captured" }).where(and(eq(shots.episodeId, episodeId), eq(shots.description, "Paring cut"))));
    expect(card(done.board)).toMatchObject({ shotsDone: 1, shotsTotal: 2 });
  });

  it("episodes added, archived and deleted (with their segments)", async () => {
    let id = "";
    const added = await expectFollows(async () => (id = (await makeEpisode(w.channel.id, "planning", 3, "Tool tote")).id));
    expect(card(added.board, id)).toMatchObject({ title: "Tool tote", scriptSeconds: null });
    await db().insert(scriptSegments).values({ episodeId: id, position: 0, kind: "to_camera", text: words(10) });
    const gone = await expectFollows(() => db().delete(episodes).where(eq(episodes.id, id)));
    expect(card(gone.board, id)).toBeUndefined();
    const archived = await expectFollows(() => db().update(episodes).set({ archivedAt: new Date() }).where(and(eq(episodes.channelId, w.channel.id), eq(episodes.title, "Sawhorse pair"))));
    expect(archived.board.episodes.map((e: { title: string }) => e.title)).not.toContain("Sawhorse pair");
  });

  it("a channel deleted with everything in it takes its figures along", async () => {
    const [ch] = await db().insert(channels).values({ name: "Short-lived" }).returning();
    const e = await makeEpisode(ch!.id, "idea", 0);
    await db().insert(scriptSegments).values({ episodeId: e.id, position: 0, kind: "to_camera", text: "Hello" });
    await db().delete(channels).where(eq(channels.id, ch!.id));
    expect(await db().select().from(episodeFigures).where(eq(episodeFigures.episodeId, e.id))).toEqual([]);
  });
});

describe("stored figures are never older than the data", () => {
  it("figures computed before a change are not kept after it", async () => {
    await readAll();
    const seen = (await listEpisodeFiguresByChannel({ channelId: w.channel.id })).get(episodeId)!;
    expect(seen.computedRev).toBe(seen.rev);
    // A reader saw revision `seen.rev`, then a write lands before it stores what it computed.
    await db().update(scriptSegments).set({ text: words(5) }).where(and(eq(scriptSegments.episodeId, episodeId), eq(scriptSegments.position, 0)));
    await storeEpisodeFigures([{ episodeId, rev: seen.rev, scriptSeconds: 1, openGaps: 99 }]);
    const after = (await listEpisodeFiguresByChannel({ channelId: w.channel.id })).get(episodeId)!;
    expect(after.rev).toBeGreaterThan(seen.rev);
    expect(after.computedRev).not.toBe(after.rev);
    expect(card((await readAll()).board).openGaps).not.toBe(99);
  });
});

describe("conditional requests", () => {
  it("the script and shot list answer 304 to the current ETag and 200 after a change", async () => {
    for (const [route, path] of [
      [scriptRoute.GET, `/api/episodes/${episodeId}/script`],
      [shotsRoute.GET, `/api/episodes/${episodeId}/shots`],
    ] as const) {
      const first = await call(route as never, { path, params: { episodeId }, user: w.members.editor });
      const etag = first.headers.get("etag")!;
      expect(etag).toMatch(/^W\/".+"$/);
      expect(first.headers.get("cache-control")).toBe("private, no-cache");
      const again = await call(route as never, { path, params: { episodeId }, user: w.members.editor, headers: { "if-none-match": etag } });
      expect(again.status).toBe(304);
      expect(again.json).toBeNull();
      // Another channel's member gets 404 whatever ETag they send.
      expect((await call(route as never, { path, params: { episodeId }, user: w.outsider, headers: { "if-none-match": etag } })).status).toBe(404);
      await db().insert(shots).values({ episodeId, kind: "broll", description: `Pickup ${etag}`, position: 9 });
      const changed = await call(route as never, { path, params: { episodeId }, user: w.members.editor, headers: { "if-none-match": etag } });
      expect(changed.status).toBe(200);
      expect(changed.headers.get("etag")).not.toBe(etag);
    }
    // The API document says so.
    const doc = openApiDocument() as unknown as { paths: Record<string, { get: { responses: Record<string, unknown> } }> };
    for (const p of ["/api/episodes/{episodeId}/script", "/api/episodes/{episodeId}/shots"]) expect(doc.paths[p]!.get.responses["304"]).toBeDefined();
  });
});
