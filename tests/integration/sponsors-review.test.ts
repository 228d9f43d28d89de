/**
 * The sponsor review link, a new actor: it reaches one deal's segments,
 * checks and clips and nothing else. Every route is tried with it.
 */
import { beforeAll, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import * as linksRoute from "@/app/api/deals/[dealId]/review-links/route";
import * as linkRoute from "@/app/api/review-links/[reviewLinkId]/route";
import * as teamRoute from "@/app/api/deals/[dealId]/review/route";
import * as guestRoute from "@/app/api/review/[token]/route";
import * as decisionRoute from "@/app/api/review/[token]/decision/route";
import * as dealsRoute from "@/app/api/channels/[channelId]/deals/route";
import * as sponsorsRoute from "@/app/api/channels/[channelId]/sponsors/route";
import * as scriptRoute from "@/app/api/episodes/[episodeId]/script/route";
import * as segmentRoute from "@/app/api/segments/[segmentId]/route";
import { db } from "@/db/client";
import { deals, guestLinks } from "@/db/schema";
import { guestReviewSchema } from "@/lib/schemas/sponsors";
import { call, makeEpisode, makeWorld } from "../support/fixtures";
import { linkToken, waitForMail } from "../support/mail";
import { listRoutes, paramsFor, recordsOfEveryKind } from "../support/routes";

type World = Awaited<ReturnType<typeof makeWorld>>;
let w: World;
let dealA: { id: string };
let dealB: { id: string };
let episodeId: string;
let read: { id: string; version: number };
let token = "";

beforeAll(async () => {
  w = await makeWorld();
  const episode = await makeEpisode(w.channel.id, "planning", 0, "Tool tote");
  episodeId = episode.id;
  const sponsor = async (name: string) => (await call(sponsorsRoute.POST as never, { method: "POST", params: { channelId: w.channel.id }, user: w.members.owner, body: { name } })).json.sponsor.id as string;
  const a = await sponsor("Alder Glue Works");
  const b = await sponsor("Birch Blade Supply");
  dealA = (await call(dealsRoute.POST as never, { method: "POST", params: { channelId: w.channel.id }, user: w.members.owner, body: { sponsorId: a, title: "Glue read", feeMinor: 99000, episodeIds: [episodeId] } })).json.deal;
  dealB = (await call(dealsRoute.POST as never, { method: "POST", params: { channelId: w.channel.id }, user: w.members.owner, body: { sponsorId: b, title: "Secret blade deal", feeMinor: 55000, episodeIds: [episodeId] } })).json.deal;
  const add = async (text: string) => (await call(scriptRoute.POST as never, { method: "POST", params: { episodeId }, user: w.members.presenter, body: { kind: "sponsor_read", text } })).json.segment;
  read = await add("This video is sponsored by Alder Glue Works: thirty minutes of open time.");
  await add("Birch Blade Supply sent us this blade for free.");
});

describe("sponsor review link", () => {
  it("is mailed to the contact; it shows this deal's read, checks and timing, nothing of the other deal or the fee", async () => {
    expect((await call(linksRoute.POST as never, { method: "POST", params: { dealId: dealA.id }, user: w.members.presenter, body: { contactEmail: "x@alder.example" } })).status).toBe(403);
    const r = await call(linksRoute.POST as never, { method: "POST", params: { dealId: dealA.id }, user: w.members.sponsor_liaison, body: { contactEmail: "reviewer@alder.example", days: 7 } });
    expect(r.status).toBe(201);
    const mail = await waitForMail("reviewer@alder.example", "Please review: Glue read");
    token = linkToken(mail.text, "/review");
    const g = await call(guestRoute.GET as never, { params: { token }, user: null });
    expect(g.status).toBe(200);
    expect(guestReviewSchema.parse(g.json)).toEqual(g.json);
    expect(g.json.sponsorName).toBe("Alder Glue Works");
    expect(g.json.episodes[0].segments.map((s: { text: string }) => s.text)).toEqual(["This video is sponsored by Alder Glue Works: thirty minutes of open time."]);
    const text = JSON.stringify(g.json);
    for (const secret of ["Birch", "Secret blade deal", "99000", "55000", "990"]) expect(text, secret).not.toContain(secret);
    expect((await db().select().from(deals).where(eq(deals.id, dealA.id)))[0]!.status).toBe("in_review");
  });

  it("approves, and a new script version reopens the review; changes need a comment", async () => {
    const bad = await call(decisionRoute.POST as never, { method: "POST", params: { token }, user: null, body: { decision: "changes_requested" } });
    expect(bad.status).toBe(400);
    expect(bad.json.error.fields.comment[0]).toBe("say what should change");
    const ok = await call(decisionRoute.POST as never, { method: "POST", params: { token }, user: null, body: { decision: "approved", comment: "Looks right." } });
    expect(ok.status).toBe(201);
    expect(ok.json.state).toBe("approved");
    const team = await call(teamRoute.GET as never, { params: { dealId: dealA.id }, user: w.members.presenter });
    expect(team.json.state).toBe("approved");
    expect(team.json.thread[0]).toMatchObject({ decision: "approved", body: "Looks right.", current: true });
    // The other deal on the same episode is untouched.
    expect((await db().select().from(deals).where(eq(deals.id, dealB.id)))[0]!.status).toBe("proposed");
    expect((await call(teamRoute.GET as never, { params: { dealId: dealB.id }, user: w.members.owner })).json.thread).toEqual([]);
    await call(segmentRoute.PATCH as never, { method: "PATCH", params: { segmentId: read.id }, user: w.members.presenter, body: { version: read.version, text: "This video is sponsored by Alder Glue Works: thirty minutes of open time, then clamp." } });
    const again = await call(guestRoute.GET as never, { params: { token }, user: null });
    expect(again.json.state).toBe("reopened");
    expect(again.json.thread[0].current).toBe(false);
    const reply = await call(teamRoute.POST as never, { method: "POST", params: { dealId: dealA.id }, user: w.members.presenter, body: { body: "Added the clamping line." } });
    expect(reply.status).toBe(201);
  });

  it("reaches no other route: every route tried with the link as a session, a bearer token and a path token", async () => {
    const entries = await listRoutes((f) => f.startsWith("auth/"));
    const { ids, invitationId } = await recordsOfEveryKind(w.channel.id, w.members.owner.id);
    const problems: string[] = [];
    for (const e of entries) {
      const params = { ...paramsFor(e, ids, { invitationId, userId: w.members.producer.id }), token };
      const r = await call(e.handler as never, {
        method: e.method,
        params,
        user: null,
        path: "/x",
        headers: { cookie: `next-auth.session-token=${token}`, authorization: `Bearer ${token}` },
        ...(e.method === "GET" ? {} : { body: {} }),
      });
      const kind = e.handler.spec?.kind;
      const label = `${e.method} ${e.file}`;
      if (r.status >= 500) problems.push(`${label}: ${r.status}`);
      if (kind === "channel" || kind === "user") {
        if (r.status !== 401) problems.push(`${label}: ${r.status} with the review link`);
      } else if (kind === "guest") {
        const body = JSON.stringify(r.json);
        if (body.includes("Birch") || body.includes("55000")) problems.push(`${label}: leaked the other deal`);
      }
    }
    expect(problems).toEqual([]);
  }, 60_000);

  it("a withdrawn or expired link is not found", async () => {
    const team = await call(teamRoute.GET as never, { params: { dealId: dealA.id }, user: w.members.owner });
    const linkId = team.json.links[0].id;
    await db().update(guestLinks).set({ expiresAt: new Date(Date.now() - 1000) }).where(eq(guestLinks.id, linkId));
    expect((await call(guestRoute.GET as never, { params: { token }, user: null })).status).toBe(404);
    await db().update(guestLinks).set({ expiresAt: new Date(Date.now() + 86_400_000) }).where(eq(guestLinks.id, linkId));
    expect((await call(guestRoute.GET as never, { params: { token }, user: null })).status).toBe(200);
    expect((await call(linkRoute.DELETE as never, { method: "DELETE", params: { reviewLinkId: linkId }, user: w.members.sponsor_liaison })).status).toBe(200);
    const gone = await call(guestRoute.GET as never, { params: { token }, user: null });
    expect(gone.status).toBe(404);
    expect(gone.json.error.message).toMatch(/expired or was withdrawn/);
  });
});
