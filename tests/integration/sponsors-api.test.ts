/**
 * Sponsors and deals through the API: who writes, who sees fees, links that
 * must stay in the channel, and the episode's checks turning from failing to
 * passing when the script is fixed (rules as in tests/unit/sponsor-checks.test.ts).
 */
import { beforeAll, describe, expect, it } from "vitest";
import * as sponsorsRoute from "@/app/api/channels/[channelId]/sponsors/route";
import * as dealsRoute from "@/app/api/channels/[channelId]/deals/route";
import * as dealRoute from "@/app/api/deals/[dealId]/route";
import * as deliverablesRoute from "@/app/api/deals/[dealId]/deliverables/route";
import * as checksRoute from "@/app/api/episodes/[episodeId]/sponsor-checks/route";
import * as scriptRoute from "@/app/api/episodes/[episodeId]/script/route";
import * as segmentRoute from "@/app/api/segments/[segmentId]/route";
import { eq } from "drizzle-orm";
import { db } from "@/db/client";
import { tools } from "@/db/schema";
import { call, makeEpisode, makeWorld } from "../support/fixtures";

type World = Awaited<ReturnType<typeof makeWorld>>;
let w: World;
beforeAll(async () => {
  w = await makeWorld();
});

describe("sponsors and deals", () => {
  it("the liaison and owner write; everyone reads deals, but only they see fees; links stay in the channel", async () => {
    const sp = await call(sponsorsRoute.POST as never, { method: "POST", params: { channelId: w.channel.id }, user: w.members.sponsor_liaison, body: { name: "Kestrel Abrasives", contacts: [{ name: "Juno Pell", email: "juno@kestrel.example" }] } });
    expect(sp.status).toBe(201);
    expect((await call(sponsorsRoute.POST as never, { method: "POST", params: { channelId: w.channel.id }, user: w.members.presenter, body: { name: "X" } })).status).toBe(403);
    const episode = await makeEpisode(w.channel.id, "planning", 0, "Sanding jig");
    const created = await call(dealsRoute.POST as never, { method: "POST", params: { channelId: w.channel.id }, user: w.members.sponsor_liaison, body: { sponsorId: sp.json.sponsor.id, title: "Sanding jig read", feeMinor: 150000, currency: "USD", episodeIds: [episode.id], publishFrom: "2027-02-01", publishTo: "2027-02-28" } });
    expect(created.status).toBe(201);
    expect(created.json.deal.feeMinor).toBe(150000);
    for (const [role, sees] of [["owner", true], ["sponsor_liaison", true], ["presenter", false], ["editor", false], ["producer", false]] as const) {
      const r = await call(dealRoute.GET as never, { params: { dealId: created.json.deal.id }, user: w.members[role] });
      expect(r.status, role).toBe(200);
      expect(r.json.deal.feeMinor === 150000, role).toBe(sees);
    }
    const list = await call(dealsRoute.GET as never, { params: { channelId: w.channel.id }, user: w.members.editor });
    expect(list.json.deals.every((d: { feeMinor: number | null }) => d.feeMinor === null)).toBe(true);
    const foreign = await makeEpisode(w.other.id, "planning", 0, "Not ours");
    const bad = await call(dealsRoute.POST as never, { method: "POST", params: { channelId: w.channel.id }, user: w.members.owner, body: { sponsorId: sp.json.sponsor.id, title: "Sneaky", episodeIds: [foreign.id] } });
    expect(bad.status).toBe(422);
    expect(bad.json.error.fields.episodeIds[0]).toMatch(/not on this channel/);
    const window = await call(dealRoute.PATCH as never, { method: "PATCH", params: { dealId: created.json.deal.id }, user: w.members.owner, body: { publishTo: "2027-01-01" } });
    expect(window.status).toBe(400);
    expect(window.json.error.fields.publishTo).toBeDefined();
    const noSeconds = await call(deliverablesRoute.POST as never, { method: "POST", params: { dealId: created.json.deal.id }, user: w.members.owner, body: { kind: "mention_before" } });
    expect(noSeconds.status).toBe(400);
    expect(noSeconds.json.error.fields.seconds[0]).toBe("say how many seconds");
  });

  it("a failing check turns to passing when the script is fixed, with timecodes as evidence", async () => {
    const [tool] = await db().insert(tools).values({ channelId: w.channel.id, name: "orbital sander", acquisition: "gifted" }).returning();
    const sp = (await call(sponsorsRoute.POST as never, { method: "POST", params: { channelId: w.channel.id }, user: w.members.owner, body: { name: "Harrow Power Tools" } })).json.sponsor;
    const episode = await makeEpisode(w.channel.id, "planning", 1, "Box joints");
    await db().update(tools).set({ sponsorId: sp.id }).where(eq(tools.id, tool!.id));
    const deal = (await call(dealsRoute.POST as never, { method: "POST", params: { channelId: w.channel.id }, user: w.members.owner, body: { sponsorId: sp.id, title: "Sander", kind: "gifted_tool", episodeIds: [episode.id], toolIds: [tool!.id] } })).json.deal;
    for (const body of [{ kind: "mention_before", seconds: 30 }, { kind: "talking_points", phrases: ["dust port"] }, { kind: "spoken_disclosure" }]) {
      expect((await call(deliverablesRoute.POST as never, { method: "POST", params: { dealId: deal.id }, user: w.members.owner, body })).status).toBe(201);
    }
    const add = async (body: Record<string, unknown>) => (await call(scriptRoute.POST as never, { method: "POST", params: { episodeId: episode.id }, user: w.members.presenter, body })).json.segment;
    await add({ kind: "to_camera", text: "Box joints today, cut on a simple jig." });
    const read = await add({ kind: "sponsor_read", text: "Harrow Power Tools makes this sander." });
    const before = await call(checksRoute.GET as never, { params: { episodeId: episode.id }, user: w.members.editor });
    expect(before.status).toBe(200);
    const byKind = (r: typeof before, k: string) => r.json.results.find((x: { kind: string }) => x.kind === k);
    expect(byKind(before, "talking_points").pass).toBe(false);
    expect(byKind(before, "spoken_disclosure").pass).toBe(false);
    expect(byKind(before, "mention_before").evidence[0].start).toMatch(/^00:00:0\d;\d\d$|^00:00:0\d:\d\d$/);

    await call(segmentRoute.PATCH as never, { method: "PATCH", params: { segmentId: read.id }, user: w.members.presenter, body: { version: read.version, text: "This sander was given to the channel for free by Harrow Power Tools. The dust port takes a standard hose." } });
    const after = await call(checksRoute.GET as never, { params: { episodeId: episode.id }, user: w.members.editor });
    expect(byKind(after, "talking_points").pass).toBe(true);
    expect(byKind(after, "spoken_disclosure").pass).toBe(true);
    expect(after.json.results.filter((r: { pass: boolean }) => !r.pass)).toEqual([]);
    expect(after.json.state).toBe("met");
  });
});
