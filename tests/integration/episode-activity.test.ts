import { beforeAll, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import * as stepsRoute from "@/app/api/episodes/[episodeId]/steps/route";
import * as materialsRoute from "@/app/api/episodes/[episodeId]/materials/route";
import * as materialRoute from "@/app/api/materials/[materialId]/route";
import * as scriptRoute from "@/app/api/episodes/[episodeId]/script/route";
import * as segmentRoute from "@/app/api/segments/[segmentId]/route";
import * as shotsRoute from "@/app/api/episodes/[episodeId]/shots/route";
import { db } from "@/db/client";
import { episodes, materials, shots } from "@/db/schema";
import { call, makeEpisode, makeWorld } from "../support/fixtures";

type World = Awaited<ReturnType<typeof makeWorld>>;
let w: World;
let episodeId: string;

const stamp = async () => (await db().select({ at: episodes.updatedAt }).from(episodes).where(eq(episodes.id, episodeId)))[0]!.at.getTime();
/** Sets the stamp into the past, runs the write, and says whether the stamp moved. */
async function moves(write: () => Promise<{ status: number }>, expected: number) {
  await db().update(episodes).set({ updatedAt: new Date("2020-01-01T00:00:00Z") }).where(eq(episodes.id, episodeId));
  const before = await stamp();
  const r = await write();
  expect(r.status).toBe(expected);
  return (await stamp()) > before;
}

beforeAll(async () => {
  w = await makeWorld();
  episodeId = (await makeEpisode(w.channel.id, "planning", 0, "Stamped")).id;
});

describe("the episode's updated stamp follows its content", () => {
  it("moves when a step, a cut-list row, a script segment or a shot is written", async () => {
    const user = w.members.presenter;
    const params = { episodeId };
    expect(await moves(() => call(stepsRoute.POST as never, { method: "POST", params, user, body: { title: "Glue the legs", activeMinutes: 30 } }), 201)).toBe(true);
    let materialId = "";
    expect(
      await moves(async () => {
        const r = await call(materialsRoute.POST as never, { method: "POST", params, user, body: { partName: "Leg", thickness: "1-1/2", width: "1-1/2", length: "18" } });
        materialId = r.json.material.id;
        return r;
      }, 201),
    ).toBe(true);
    expect(await moves(() => call(materialRoute.PATCH as never, { method: "PATCH", params: { materialId }, user, body: { quantity: 4 } }), 200)).toBe(true);
    let segment = { id: "", version: 0 };
    expect(
      await moves(async () => {
        const r = await call(scriptRoute.POST as never, { method: "POST", params, user, body: { kind: "voice_over", text: "Four legs, one glue-up." } });
        segment = r.json.segment;
        return r;
      }, 201),
    ).toBe(true);
    expect(await moves(() => call(segmentRoute.PATCH as never, { method: "PATCH", params: { segmentId: segment.id }, user, body: { version: segment.version, text: "Four legs, two glue-ups." } }), 200)).toBe(true);
    expect(await moves(() => call(shotsRoute.POST as never, { method: "POST", params, user, body: { kind: "broll", description: "Clamps going on" } }), 201)).toBe(true);
    // A refused write leaves the stamp alone.
    expect(await moves(() => call(shotsRoute.POST as never, { method: "POST", params, user, body: { kind: "broll" } }), 400)).toBe(false);
  });

  it("gives 20 shots added at once 20 different positions", async () => {
    const user = w.members.editor;
    const rs = await Promise.all(Array.from({ length: 20 }, (_, i) => call(shotsRoute.POST as never, { method: "POST", params: { episodeId }, user, body: { kind: "broll", description: `Burst ${i}` } })));
    expect(rs.map((r) => r.status)).toEqual(Array(20).fill(201));
    const rows = await db().select({ position: shots.position }).from(shots).where(eq(shots.episodeId, episodeId));
    expect(new Set(rows.map((r) => r.position)).size).toBe(rows.length);
  });

  it("gives 20 cut-list rows added at once 20 different positions", async () => {
    const user = w.members.presenter;
    const rs = await Promise.all(Array.from({ length: 20 }, (_, i) => call(materialsRoute.POST as never, { method: "POST", params: { episodeId }, user, body: { partName: `Slat ${i}`, thickness: "3/4", width: "2", length: "30" } })));
    expect(rs.map((r) => r.status)).toEqual(Array(20).fill(201));
    const rows = await db().select({ position: materials.position }).from(materials).where(eq(materials.episodeId, episodeId));
    expect(new Set(rows.map((r) => r.position)).size).toBe(rows.length);
  });
});
