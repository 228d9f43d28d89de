/**
 * Regression tests for the holes an outside probe found: each fails on the
 * code before the fix.
 */
import { beforeAll, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import * as invitesRoute from "@/app/api/channels/[channelId]/invitations/route";
import * as inviteRoute from "@/app/api/channels/[channelId]/invitations/[invitationId]/route";
import * as mailboxRoute from "@/app/api/mailbox/route";
import * as resetRoute from "@/app/api/password-reset/route";
import * as resetConfirmRoute from "@/app/api/password-reset/confirm/route";
import * as channelPhotosRoute from "@/app/api/channels/[channelId]/photos/route";
import * as episodePhotosRoute from "@/app/api/episodes/[episodeId]/photos/route";
import * as toolsRoute from "@/app/api/channels/[channelId]/tools/route";
import * as toolRoute from "@/app/api/tools/[toolId]/route";
import * as episodesRoute from "@/app/api/channels/[channelId]/episodes/route";
import * as episodeRoute from "@/app/api/episodes/[episodeId]/route";
import * as csvRoute from "@/app/api/episodes/[episodeId]/materials/csv/route";
import * as shotsCsvRoute from "@/app/api/episodes/[episodeId]/shots/csv/route";
import * as shotsRoute from "@/app/api/episodes/[episodeId]/shots/route";
import * as materialsRoute from "@/app/api/episodes/[episodeId]/materials/route";
import * as uploadsRoute from "@/app/api/episodes/[episodeId]/uploads/route";
import * as channelsRoute from "@/app/api/channels/route";
import { db } from "@/db/client";
import { clips } from "@/db/schema";
import { call, makeEpisode, makeUser, makeWorld } from "../support/fixtures";
import { linkToken, waitForMail } from "../support/mail";

type World = Awaited<ReturnType<typeof makeWorld>>;
let w: World;
let episodeId: string;
beforeAll(async () => {
  w = await makeWorld();
  episodeId = (await makeEpisode(w.channel.id, "planning", 0, "Trust")).id;
});

const mailbox = async (channelId: string, user: { id: string }) => (await call(mailboxRoute.GET as never, { path: `/x?channelId=${channelId}`, user })).json.messages as { toAddresses: string[]; subject: string }[];
const addressed = (msgs: { toAddresses: string[] }[], email: string) => msgs.some((m) => m.toAddresses.includes(email));

describe("dev mailbox shows only this channel's own pending invitations", () => {
  it("never another channel's mail, a revoked invitation, or a password reset", async () => {
    const invitee = `shared-${Date.now()}@test.example`;
    // Both channels invite the same address; each owner sees only its own invitation.
    const mine = await call(invitesRoute.POST as never, { method: "POST", params: { channelId: w.channel.id }, body: { email: invitee, roles: ["editor"] }, user: w.members.owner });
    await call(invitesRoute.POST as never, { method: "POST", params: { channelId: w.other.id }, body: { email: invitee, roles: ["editor"] }, user: w.outsider });
    await waitForMail(invitee, "invited you");
    await new Promise((r) => setTimeout(r, 300));
    const ours = (await mailbox(w.channel.id, w.members.owner)).filter((m) => m.toAddresses.includes(invitee));
    expect(ours).toHaveLength(1);
    expect(ours[0]!.subject).toContain(w.channel.name);

    // A member of this channel asks for a password reset: the owner must not see the link.
    await call(resetRoute.POST as never, { method: "POST", body: { email: w.members.editor.email }, headers: { "x-forwarded-for": "203.0.113.41" } });
    await waitForMail(w.members.editor.email, "Reset");
    expect(addressed(await mailbox(w.channel.id, w.members.owner), w.members.editor.email)).toBe(false);

    // Revoked: gone from the mailbox.
    await call(inviteRoute.DELETE as never, { method: "DELETE", params: { channelId: w.channel.id, invitationId: mine.json.invitation.id }, user: w.members.owner });
    expect(addressed(await mailbox(w.channel.id, w.members.owner), invitee)).toBe(false);
  });
});

describe("storage keys a client sends must be ones issued to this channel for that purpose", () => {
  async function issuedPhoto(channelId: string, user: { id: string }, route: "tool" | "failure" = "tool", epId = episodeId) {
    const signed =
      route === "tool"
        ? await call(channelPhotosRoute.POST as never, { method: "POST", params: { channelId }, body: { contentType: "image/png", size: 8 }, user })
        : await call(episodePhotosRoute.POST as never, { method: "POST", params: { episodeId: epId }, body: { contentType: "image/png", size: 8 }, user });
    expect(signed.status).toBe(201);
    const put = await fetch(signed.json.uploadUrl, { method: "PUT", headers: signed.json.headers, body: new Uint8Array([137, 80, 78, 71, 13, 10, 26, 10]) });
    expect(put.status).toBe(200);
    return signed.json as { key: string; uploadUrl: string; headers: Record<string, string> };
  }

  it("refuses another channel's key, a ../ key, a key issued for another purpose, and one never issued: 422", async () => {
    const tool = (await call(toolsRoute.POST as never, { method: "POST", params: { channelId: w.channel.id }, body: { name: "Marking gauge" }, user: w.members.presenter })).json.tool;
    const theirs = await issuedPhoto(w.other.id, w.outsider);
    const failurePhoto = await issuedPhoto(w.channel.id, w.members.presenter, "failure");
    const ours = await issuedPhoto(w.channel.id, w.members.presenter);
    const attempts = [
      theirs.key,
      `channel/${w.channel.id}/photo/../../${w.other.id}/photo/${theirs.key.split("/").pop()}`,
      `channel/${w.channel.id}/photo/${theirs.key.split("/").pop()}`,
      failurePhoto.key,
      ` ${ours.key}`,
    ];
    for (const photoKey of attempts) {
      const r = await call(toolRoute.PATCH as never, { method: "PATCH", params: { toolId: tool.id }, body: { photoKey }, user: w.members.presenter });
      expect(r.status, photoKey).toBe(422);
      expect(r.json.error.fields.photoKey).toBeTruthy();
    }
    const created = await call(toolsRoute.POST as never, { method: "POST", params: { channelId: w.channel.id }, body: { name: "Stolen photo", photoKey: theirs.key }, user: w.members.presenter });
    expect(created.status).toBe(422);
    const ok = await call(toolRoute.PATCH as never, { method: "PATCH", params: { toolId: tool.id }, body: { photoKey: ours.key }, user: w.members.presenter });
    expect(ok.status).toBe(200);
  });

  it("signs the content type and length: a text/html body is refused by the store; reads are served as the allowed type", async () => {
    const signed = await call(channelPhotosRoute.POST as never, { method: "POST", params: { channelId: w.channel.id }, body: { contentType: "image/png", size: 8 }, user: w.members.presenter });
    expect(signed.json.key).toMatch(/\.png$/);
    const html = await fetch(signed.json.uploadUrl, { method: "PUT", headers: { "content-type": "text/html" }, body: "<script>1</script>" });
    expect(html.status).toBeGreaterThanOrEqual(400);
    const longer = await fetch(signed.json.uploadUrl, { method: "PUT", headers: signed.json.headers, body: new Uint8Array(9) });
    expect(longer.status).toBeGreaterThanOrEqual(400);
  });

  it("refuses footage file names with direction controls, and keys take the extension of the allowed type", async () => {
    const bidi = await call(uploadsRoute.POST as never, { method: "POST", params: { episodeId }, body: { fileName: "clip\u202Egpj.mp4", contentType: "video/mp4", size: 1000 }, user: w.members.editor });
    expect(bidi.status).toBe(400);
    expect(bidi.json.error.fields.fileName.join()).toMatch(/direction controls/);
    const named = await call(uploadsRoute.POST as never, { method: "POST", params: { episodeId }, body: { fileName: "B001.html", contentType: "video/mp4", size: 1000 }, user: w.members.editor });
    expect(named.status).toBe(201);
    const [clip] = await db().select().from(clips).where(eq(clips.id, named.json.clip.id));
    expect(clip!.storageKey).toMatch(new RegExp(`^channel/${w.channel.id}/footage/[0-9a-f-]+\\.mp4$`));
  });
});

describe("writes from other sites are refused in the route wrapper", () => {
  const body = { title: "Planted by another site" };
  it.each([
    ["an Origin of another site", { origin: "https://evil.example" }, 403],
    ["Sec-Fetch-Site: cross-site", { "sec-fetch-site": "cross-site" }, 403],
    ["Sec-Fetch-Site: same-site (a sibling subdomain)", { "sec-fetch-site": "same-site" }, 403],
    ["Origin: null", { origin: "null" }, 403],
    ["a text/plain body", { "content-type": "text/plain" }, 400],
    ["a form body", { "content-type": "application/x-www-form-urlencoded" }, 400],
  ])("%s", async (_label, headers, status) => {
    const r = await call(episodesRoute.POST as never, { method: "POST", params: { channelId: w.channel.id }, body, user: w.members.presenter, headers: headers as Record<string, string> });
    expect(r.status).toBe(status);
  });

  it("accepts the app's own origin", async () => {
    const r = await call(episodesRoute.POST as never, { method: "POST", params: { channelId: w.channel.id }, body: { title: "From our own page" }, user: w.members.presenter, headers: { origin: "http://127.0.0.1", "sec-fetch-site": "same-origin" } });
    expect(r.status).toBe(201);
  });
});

describe("a NUL character is the caller's mistake: 400 naming the field", () => {
  it("in JSON bodies", async () => {
    const a = await call(episodesRoute.POST as never, { method: "POST", params: { channelId: w.channel.id }, body: { title: "Bench\u0000top" }, user: w.members.presenter });
    expect(a.status).toBe(400);
    expect(a.json.error.fields.title).toBeTruthy();
    const b = await call(episodeRoute.PATCH as never, { method: "PATCH", params: { episodeId }, body: { summary: "x\u0000" }, user: w.members.presenter });
    expect(b.status).toBe(400);
    const c = await call(shotsRoute.POST as never, { method: "POST", params: { episodeId }, body: { kind: "broll", description: "ok", framing: "\u0000" }, user: w.members.editor });
    expect(c.status).toBe(400);
    expect(c.json.error.fields.framing).toBeTruthy();
  });

  it("in a CSV import, naming the line; nothing imported", async () => {
    const header = "part,material,unit,thickness,width,length,quantity,sizing,pricing_unit,unit_price,currency,waste_percent,step,supplier_note";
    const r = await call(csvRoute.POST as never, { method: "POST", params: { episodeId }, rawBody: `${header}\nLeg,Ash,in,1,2,20,4,actual,board_foot,9,USD,10,,\nRail,As\u0000h,in,1,2,20,4,actual,board_foot,9,USD,10,,\n`, user: w.members.presenter, headers: { "content-type": "text/csv" } });
    expect(r.status).toBe(400);
    expect(r.json.error.message).toMatch(/Line 3/);
    const rows = await call(materialsRoute.GET as never, { params: { episodeId }, user: w.members.presenter });
    expect(rows.json.rows.filter((x: { partName: string }) => x.partName === "Leg")).toHaveLength(0);
  });
});

describe("CSV exports neutralise formulas (OWASP, CSV Injection)", () => {
  it("prefixes cells starting with = + - @ with a quote; import keeps text as written", async () => {
    await call(materialsRoute.POST as never, { method: "POST", params: { episodeId }, body: { partName: '=HYPERLINK("http://evil.example","x")', thickness: 1, width: 2, length: 3, supplierNote: "@SUM(A1)" }, user: w.members.presenter });
    await call(shotsRoute.POST as never, { method: "POST", params: { episodeId }, body: { kind: "broll", description: "+cmd|' /C calc'!A0" }, user: w.members.editor });
    const text = String((await call(csvRoute.GET as never, { params: { episodeId }, user: w.members.presenter })).json);
    expect(text).toContain(`"'=HYPERLINK(""http://evil.example"",""x"")"`);
    expect(text).toContain("'@SUM(A1)");
    const shots = await call(shotsCsvRoute.GET as never, { params: { episodeId }, user: w.members.editor });
    expect(String(shots.json)).toContain("'+cmd");
  });
});

describe("password reset", () => {
  it("does the same work for unknown and known addresses: one message each", async () => {
    const u = await makeUser("known");
    const ghost = `ghost-${Date.now()}@test.example`;
    expect((await call(resetRoute.POST as never, { method: "POST", body: { email: ghost }, headers: { "x-forwarded-for": "203.0.113.50" } })).status).toBe(202);
    expect((await call(resetRoute.POST as never, { method: "POST", body: { email: u.email }, headers: { "x-forwarded-for": "203.0.113.50" } })).status).toBe(202);
    expect((await waitForMail(ghost, "Reset")).text).toMatch(/no Jigboard account uses this address/);
    expect((await waitForMail(u.email, "Reset")).text).toMatch(/reset-password\//);
  });

  it("is throttled per address asked about: the fourth request in 15 minutes is 429 with Retry-After", async () => {
    const u = await makeUser("hammered");
    for (let i = 0; i < 3; i++) expect((await call(resetRoute.POST as never, { method: "POST", body: { email: u.email }, headers: { "x-forwarded-for": `203.0.113.${60 + i}` } })).status).toBe(202);
    const fourth = await call(resetRoute.POST as never, { method: "POST", body: { email: u.email }, headers: { "x-forwarded-for": "203.0.113.70" } });
    expect(fourth.status).toBe(429);
    expect(fourth.headers.get("retry-after")).toMatch(/^\d+$/);
  });

  it("using one link kills every other outstanding link, and ends the account's existing sessions", async () => {
    const u = await makeUser("two-links");
    await call(resetRoute.POST as never, { method: "POST", body: { email: u.email }, headers: { "x-forwarded-for": "203.0.113.80" } });
    const first = linkToken((await waitForMail(u.email, "Reset")).text, "/reset-password");
    await new Promise((r) => setTimeout(r, 50));
    await call(resetRoute.POST as never, { method: "POST", body: { email: u.email }, headers: { "x-forwarded-for": "203.0.113.81" } });
    let second = first;
    for (let i = 0; i < 50 && second === first; i++) {
      second = linkToken((await waitForMail(u.email, "Reset")).text, "/reset-password");
      if (second === first) await new Promise((r) => setTimeout(r, 100));
    }
    expect(second).not.toBe(first);
    // A session from before the change works until the change.
    expect((await call(channelsRoute.GET as never, { user: u })).status).toBe(200);
    expect((await call(resetConfirmRoute.POST as never, { method: "POST", body: { token: second, password: "the-newer-password" } })).status).toBe(200);
    expect((await call(resetConfirmRoute.POST as never, { method: "POST", body: { token: first, password: "the-older-password" } })).status).toBe(404);
    const after = await call(channelsRoute.GET as never, { user: u });
    expect(after.status).toBe(401);
  });
});

describe("sign out everywhere", () => {
  it("ends every existing session of the account; other people stay signed in", async () => {
    const meRoute = await import("@/app/api/me/sessions/route");
    const u = await makeUser("many-devices");
    expect((await call(channelsRoute.GET as never, { user: u })).status).toBe(200);
    expect((await call(meRoute.DELETE as never, { method: "DELETE", user: u })).status).toBe(200);
    expect((await call(channelsRoute.GET as never, { user: u })).status).toBe(401);
    expect((await call(channelsRoute.GET as never, { user: w.members.editor })).status).toBe(200);
    expect((await call(meRoute.DELETE as never, { method: "DELETE" })).status).toBe(401);
  });
});
