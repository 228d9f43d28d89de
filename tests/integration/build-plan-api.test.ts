import { beforeAll, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import * as stepsRoute from "@/app/api/episodes/[episodeId]/steps/route";
import * as orderRoute from "@/app/api/episodes/[episodeId]/steps/order/route";
import * as stepRoute from "@/app/api/steps/[stepId]/route";
import * as failureRoute from "@/app/api/steps/[stepId]/failure/route";
import * as remedyRoute from "@/app/api/steps/[stepId]/remedies/route";
import * as photosRoute from "@/app/api/episodes/[episodeId]/photos/route";
import * as toolsRoute from "@/app/api/channels/[channelId]/tools/route";
import * as toolRoute from "@/app/api/tools/[toolId]/route";
import { db } from "@/db/client";
import { buildSteps, sponsors, stepDependencies } from "@/db/schema";
import type { Role } from "@/lib/roles";
import { call, makeEpisode, makeWorld } from "../support/fixtures";

type World = Awaited<ReturnType<typeof makeWorld>>;
let w: World;
let episodeId: string;

const addStep = (user: { id: string }, body: Record<string, unknown>, ep = episodeId) =>
  call(stepsRoute.POST as never, { method: "POST", params: { episodeId: ep }, body, user });
const plan = async (ep = episodeId) => (await call(stepsRoute.GET as never, { params: { episodeId: ep }, user: w.members.owner })).json;

beforeAll(async () => {
  w = await makeWorld();
  episodeId = (await makeEpisode(w.channel.id, "planning", 0, "Plan test")).id;
});

describe("build steps: roles", () => {
  it.each<[Role, number]>([
    ["owner", 201],
    ["presenter", 201],
    ["producer", 403],
    ["editor", 403],
    ["sponsor_liaison", 403],
  ])("%s adding a step answers %i", async (role, status) => {
    const r = await addStep(w.members[role], { title: `By ${role}`, activeMinutes: 10 });
    expect(r.status).toBe(status);
  });

  it("a producer changes durations, waits and crew, but nothing else", async () => {
    const s = (await addStep(w.members.presenter, { title: "Glue-up", activeMinutes: 30 })).json.step;
    const timing = await call(stepRoute.PATCH as never, { method: "PATCH", params: { stepId: s.id }, body: { waitMinutes: 1440, waitReason: "glue cure", crewNeeded: 2 }, user: w.members.producer });
    expect(timing.status).toBe(200);
    const title = await call(stepRoute.PATCH as never, { method: "PATCH", params: { stepId: s.id }, body: { title: "Renamed", waitMinutes: 60 }, user: w.members.producer });
    expect(title.status).toBe(403);
    const editor = await call(stepRoute.PATCH as never, { method: "PATCH", params: { stepId: s.id }, body: { waitMinutes: 5 }, user: w.members.editor });
    expect(editor.status).toBe(403);
    const [row] = await db().select().from(buildSteps).where(eq(buildSteps.id, s.id));
    expect(row).toMatchObject({ title: "Glue-up", waitMinutes: 1440, waitReason: "glue cure", crewNeeded: 2 });
  });

  it("everyone in the channel reads the plan; another channel gets 404", async () => {
    for (const role of ["editor", "sponsor_liaison", "producer"] as Role[]) {
      const r = await call(stepsRoute.GET as never, { params: { episodeId }, user: w.members[role] });
      expect(r.status).toBe(200);
    }
    const o = await call(stepsRoute.GET as never, { params: { episodeId }, user: w.outsider });
    expect(o.status).toBe(404);
    const anyStep = (await plan()).steps[0].id;
    for (const [handler, method, body] of [
      [stepRoute.PATCH, "PATCH", { title: "x" }],
      [stepRoute.DELETE, "DELETE", undefined],
      [failureRoute.POST, "POST", { note: "x" }],
      [remedyRoute.POST, "POST", { title: "x" }],
    ] as const) {
      const r = await call(handler as never, { method, params: { stepId: anyStep }, body, user: w.outsider });
      expect(r.status, method).toBe(404);
    }
    const unauth = await call(stepsRoute.GET as never, { params: { episodeId } });
    expect(unauth.status).toBe(401);
  });
});

describe("dependencies and timing", () => {
  it("computes totals and the critical path with waits", async () => {
    const ep = (await makeEpisode(w.channel.id, "planning", 1, "Timing")).id;
    const a = (await addStep(w.members.presenter, { title: "Mill", activeMinutes: 90 }, ep)).json.step.id;
    const b = (await addStep(w.members.presenter, { title: "Glue", activeMinutes: 30, waitMinutes: 1440, waitReason: "glue cure", dependsOn: [a] }, ep)).json.step.id;
    const c = (await addStep(w.members.presenter, { title: "Legs", activeMinutes: 120, dependsOn: [a] }, ep)).json.step.id;
    const d = (await addStep(w.members.presenter, { title: "Assemble", activeMinutes: 60, dependsOn: [b, c] }, ep)).json.step.id;
    const p = await plan(ep);
    expect(p.timing).toMatchObject({ totalActiveMinutes: 300, totalWaitMinutes: 1440, criticalPathMinutes: 90 + 30 + 1440 + 60, criticalPath: [a, b, d] });
    expect(p.steps.find((s: { id: string }) => s.id === d).timing.start).toBe(1560);
    // The test channel has five people, so each step needing one never waits for hands.
    expect(p.crew).toMatchObject({ team: 5, finishMinutes: 1620, overCrew: [] });
    expect(p.steps.find((s: { id: string }) => s.id === c).crewTiming).toMatchObject({ start: 90, crewDelayMinutes: 0 });
  });

  it("refuses a loop with 409, names it, and writes nothing", async () => {
    const ep = (await makeEpisode(w.channel.id, "planning", 2, "Loop")).id;
    const a = (await addStep(w.members.presenter, { title: "Cut parts" }, ep)).json.step.id;
    const b = (await addStep(w.members.presenter, { title: "Dry fit", dependsOn: [a] }, ep)).json.step.id;
    const r = await call(stepRoute.PATCH as never, { method: "PATCH", params: { stepId: a }, body: { dependsOn: [b], title: "Cut parts again" }, user: w.members.presenter });
    expect(r.status).toBe(409);
    expect(r.json.error.message).toMatch(/loop: (Cut parts → Dry fit → Cut parts|Dry fit → Cut parts → Dry fit)/);
    expect(r.json.error.fields.dependsOn).toBeTruthy();
    const deps = await db().select().from(stepDependencies).where(eq(stepDependencies.stepId, a));
    expect(deps).toEqual([]);
    const [row] = await db().select().from(buildSteps).where(eq(buildSteps.id, a));
    expect(row!.title).toBe("Cut parts");
    const self = await call(stepRoute.PATCH as never, { method: "PATCH", params: { stepId: a }, body: { dependsOn: [a] }, user: w.members.presenter });
    expect(self.status).toBe(422);
  });

  it("refuses dependencies on another episode's steps and tools of another channel", async () => {
    const other = (await makeEpisode(w.channel.id, "idea", 5, "Elsewhere")).id;
    const foreignStep = (await addStep(w.members.presenter, { title: "Not here" }, other)).json.step.id;
    const r = await addStep(w.members.presenter, { title: "Bad link", dependsOn: [foreignStep] });
    expect(r.status).toBe(422);
    expect(r.json.error.fields.dependsOn).toBeTruthy();
    const outsiderTool = await call(toolsRoute.POST as never, { method: "POST", params: { channelId: w.other.id }, body: { name: "Their saw" }, user: w.outsider });
    const t = await addStep(w.members.presenter, { title: "Borrowed", toolIds: [outsiderTool.json.tool.id] });
    expect(t.status).toBe(422);
    expect(t.json.error.fields.toolIds).toBeTruthy();
  });

  it("bad values name their field", async () => {
    const r = await addStep(w.members.presenter, { title: "", activeMinutes: -5, crewNeeded: 0, coverageKinds: ["drone"] });
    expect(r.status).toBe(400);
    expect(Object.keys(r.json.error.fields)).toEqual(expect.arrayContaining(["title", "activeMinutes", "crewNeeded", "coverageKinds.0"]));
  });

  it("reorders all steps at once; a stale list is refused", async () => {
    const ep = (await makeEpisode(w.channel.id, "planning", 3, "Order")).id;
    const ids: string[] = [];
    for (const t of ["one", "two", "three"]) ids.push((await addStep(w.members.presenter, { title: t }, ep)).json.step.id);
    const stale = await call(orderRoute.PUT as never, { method: "PUT", params: { episodeId: ep }, body: { ids: ids.slice(0, 2) }, user: w.members.presenter });
    expect(stale.status).toBe(409);
    const ok = await call(orderRoute.PUT as never, { method: "PUT", params: { episodeId: ep }, body: { ids: [ids[2], ids[0], ids[1]] }, user: w.members.presenter });
    expect(ok.status).toBe(200);
    expect((await plan(ep)).steps.map((s: { title: string }) => s.title)).toEqual(["three", "one", "two"]);
  });
});

describe("failure and remedies", () => {
  it("marks a step failed with a note and a photo, and adds remedies right after it", async () => {
    const ep = (await makeEpisode(w.channel.id, "shooting", 0, "Warped panel")).id;
    const glue = (await addStep(w.members.presenter, { title: "Glue the panel", waitMinutes: 1440 }, ep)).json.step.id;
    const finish = (await addStep(w.members.presenter, { title: "Finish", dependsOn: [glue] }, ep)).json.step.id;

    const early = await call(remedyRoute.POST as never, { method: "POST", params: { stepId: glue }, body: { title: "Too early" }, user: w.members.presenter });
    expect(early.status).toBe(409);
    const noNote = await call(failureRoute.POST as never, { method: "POST", params: { stepId: glue }, body: { note: " " }, user: w.members.presenter });
    expect(noNote.status).toBe(400);
    const viaPatch = await call(stepRoute.PATCH as never, { method: "PATCH", params: { stepId: glue }, body: { status: "failed" }, user: w.members.presenter });
    expect(viaPatch.status).toBe(422);

    // A photo goes straight to the S3 fake through a presigned URL.
    const signed = await call(photosRoute.POST as never, { method: "POST", params: { episodeId: ep }, body: { contentType: "image/png", size: 8 }, user: w.members.presenter });
    expect(signed.status).toBe(201);
    expect(signed.json.key).toMatch(new RegExp(`^channel/${w.channel.id}/photo/[0-9a-f-]+\\.png$`));
    const put = await fetch(signed.json.uploadUrl, { method: "PUT", headers: signed.json.headers, body: new Uint8Array([137, 80, 78, 71, 13, 10, 26, 10]) });
    expect(put.status).toBe(200);

    const forged = await call(failureRoute.POST as never, { method: "POST", params: { stepId: glue }, body: { note: "cupped", photoKey: `channel/${w.other.id}/photo/x.png` }, user: w.members.presenter });
    expect(forged.status).toBe(422);
    const missing = await call(failureRoute.POST as never, { method: "POST", params: { stepId: glue }, body: { note: "cupped", photoKey: `channel/${w.channel.id}/photo/never-uploaded.png` }, user: w.members.presenter });
    expect(missing.status).toBe(422);

    const failed = await call(failureRoute.POST as never, { method: "POST", params: { stepId: glue }, body: { note: "Panel cupped overnight", photoKey: signed.json.key }, user: w.members.presenter });
    expect(failed.status).toBe(200);

    const r1 = await call(remedyRoute.POST as never, { method: "POST", params: { stepId: glue }, body: { title: "Rip and re-glue", activeMinutes: 60, waitMinutes: 1440 }, user: w.members.presenter });
    const r2 = await call(remedyRoute.POST as never, { method: "POST", params: { stepId: glue }, body: { title: "Add battens" }, user: w.members.presenter });
    expect(r1.status).toBe(201);
    expect(r2.status).toBe(201);
    const p = await plan(ep);
    expect(p.steps.map((s: { title: string }) => s.title)).toEqual(["Glue the panel", "Rip and re-glue", "Add battens", "Finish"]);
    const failedStep = p.steps[0];
    expect(failedStep).toMatchObject({ status: "failed", failureNote: "Panel cupped overnight" });
    expect(failedStep.failurePhotoUrl).toMatch(/^http:\/\/127\.0\.0\.1:\d+\//);
    expect(p.steps[1]).toMatchObject({ remedyOfStepId: glue, dependsOn: [glue] });
    // The step that waited for the failed one now waits for both remedies as well.
    expect(p.steps[3].id).toBe(finish);
    expect(new Set(p.steps[3].dependsOn)).toEqual(new Set([glue, r1.json.step.id, r2.json.step.id]));

    const roleCheck = await call(failureRoute.POST as never, { method: "POST", params: { stepId: glue }, body: { note: "x" }, user: w.members.producer });
    expect(roleCheck.status).toBe(403);
  });

  it("photo uploads check type and size before signing", async () => {
    const bad = await call(photosRoute.POST as never, { method: "POST", params: { episodeId }, body: { contentType: "application/x-sh", size: 0 }, user: w.members.presenter });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.json.error.fields)).toEqual(expect.arrayContaining(["contentType", "size"]));
    const big = await call(photosRoute.POST as never, { method: "POST", params: { episodeId }, body: { contentType: "image/jpeg", size: 50 * 1024 * 1024 }, user: w.members.presenter });
    expect(big.status).toBe(400);
  });
});

describe("tool shelf", () => {
  it("presenter adds tools; sponsored ones are flagged in the plan", async () => {
    const [sponsor] = await db().insert(sponsors).values({ channelId: w.channel.id, name: "Test Sponsor" }).returning();
    const saw = await call(toolsRoute.POST as never, { method: "POST", params: { channelId: w.channel.id }, body: { name: "Track saw", kind: "power_tool" }, user: w.members.presenter });
    const clamps = await call(toolsRoute.POST as never, { method: "POST", params: { channelId: w.channel.id }, body: { name: "Clamps", kind: "clamp", acquisition: "gifted", sponsorId: sponsor!.id }, user: w.members.presenter });
    expect(saw.status).toBe(201);
    expect(clamps.json.tool).toMatchObject({ sponsored: true, sponsorId: sponsor!.id });
    const producer = await call(toolsRoute.POST as never, { method: "POST", params: { channelId: w.channel.id }, body: { name: "Nope" }, user: w.members.producer });
    expect(producer.status).toBe(403);
    const [foreignSponsor] = await db().insert(sponsors).values({ channelId: w.other.id, name: "Not ours" }).returning();
    const wrong = await call(toolsRoute.POST as never, { method: "POST", params: { channelId: w.channel.id }, body: { name: "X", sponsorId: foreignSponsor!.id }, user: w.members.presenter });
    expect(wrong.status).toBe(422);

    const ep = (await makeEpisode(w.channel.id, "planning", 9, "Tools")).id;
    await addStep(w.members.presenter, { title: "Break down sheets", toolIds: [saw.json.tool.id, clamps.json.tool.id] }, ep);
    const p = await plan(ep);
    expect(p.steps[0].cautions).toEqual(["power_tool"]);
    expect(p.toolsUsed.find((t: { name: string }) => t.name === "Clamps")).toMatchObject({ sponsored: true, steps: ["Break down sheets"] });

    const foreignEdit = await call(toolRoute.PATCH as never, { method: "PATCH", params: { toolId: saw.json.tool.id }, body: { name: "Mine" }, user: w.outsider });
    expect(foreignEdit.status).toBe(404);
    const archive = await call(toolRoute.DELETE as never, { method: "DELETE", params: { toolId: saw.json.tool.id }, user: w.members.presenter });
    expect(archive.status).toBe(200);
    const list = await call(toolsRoute.GET as never, { params: { channelId: w.channel.id }, user: w.members.editor });
    expect(list.json.tools.map((t: { name: string }) => t.name)).not.toContain("Track saw");
  });
});
