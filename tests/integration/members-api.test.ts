import { beforeAll, describe, expect, it } from "vitest";
import bcrypt from "bcryptjs";
import { and, eq } from "drizzle-orm";
import * as invitesRoute from "@/app/api/channels/[channelId]/invitations/route";
import * as inviteRoute from "@/app/api/channels/[channelId]/invitations/[invitationId]/route";
import * as acceptRoute from "@/app/api/invitations/accept/route";
import * as membersRoute from "@/app/api/channels/[channelId]/members/route";
import * as memberRoute from "@/app/api/channels/[channelId]/members/[userId]/route";
import * as resetRoute from "@/app/api/password-reset/route";
import * as resetConfirmRoute from "@/app/api/password-reset/confirm/route";
import * as mailboxRoute from "@/app/api/mailbox/route";
import * as listRoute from "@/app/api/channels/[channelId]/episodes/route";
import { db } from "@/db/client";
import { memberships, passwordResets, users } from "@/db/schema";
import { call, makeUser, makeWorld, PASSWORD } from "../support/fixtures";
import { linkToken, waitForMail } from "../support/mail";

type World = Awaited<ReturnType<typeof makeWorld>>;
let w: World;
beforeAll(async () => {
  w = await makeWorld();
});

describe("invitations", () => {
  it("only the owner invites; other roles 403; other channel 404", async () => {
    for (const role of ["presenter", "editor", "producer", "sponsor_liaison"] as const) {
      const r = await call(invitesRoute.POST as never, { method: "POST", params: { channelId: w.channel.id }, body: { email: "x@test.example", roles: ["editor"] }, user: w.members[role] });
      expect(r.status, role).toBe(403);
    }
    const foreign = await call(invitesRoute.POST as never, { method: "POST", params: { channelId: w.other.id }, body: { email: "x@test.example", roles: ["editor"] }, user: w.members.owner });
    expect(foreign.status).toBe(404);
    const unauth = await call(invitesRoute.GET as never, { params: { channelId: w.channel.id } });
    expect(unauth.status).toBe(401);
  });

  it("e-mails a single-use link; accepting creates the account and membership", async () => {
    const email = `newbie-${Date.now()}@test.example`;
    const r = await call(invitesRoute.POST as never, { method: "POST", params: { channelId: w.channel.id }, body: { email, roles: ["editor", "producer"] }, user: w.members.owner });
    expect(r.status).toBe(201);
    const listed = await call(invitesRoute.GET as never, { params: { channelId: w.channel.id }, user: w.members.owner });
    expect(listed.json.invitations.map((i: { email: string }) => i.email)).toContain(email);

    const mail = await waitForMail(email, "invited you");
    const token = linkToken(mail.text, "/invite");

    const bad = await call(acceptRoute.POST as never, { method: "POST", body: { token, name: "", password: "short" } });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.json.error.fields)).toEqual(expect.arrayContaining(["name", "password"]));

    const ok = await call(acceptRoute.POST as never, { method: "POST", body: { token, name: "Newbie", password: "a-long-password" } });
    expect(ok.status).toBe(201);
    const [u] = await db().select().from(users).where(eq(users.email, email));
    expect(await bcrypt.compare("a-long-password", u!.passwordHash)).toBe(true);
    const [m] = await db().select().from(memberships).where(and(eq(memberships.userId, u!.id), eq(memberships.channelId, w.channel.id)));
    expect(m!.roles.sort()).toEqual(["editor", "producer"]);

    const reuse = await call(acceptRoute.POST as never, { method: "POST", body: { token, name: "Again", password: "a-long-password" } });
    expect(reuse.status).toBe(404);
  });

  it("an existing account joins with its own password", async () => {
    const existing = await makeUser("existing");
    await call(invitesRoute.POST as never, { method: "POST", params: { channelId: w.channel.id }, body: { email: existing.email, roles: ["presenter"] }, user: w.members.owner });
    const token = linkToken((await waitForMail(existing.email, "invited you")).text, "/invite");
    const wrong = await call(acceptRoute.POST as never, { method: "POST", body: { token, name: "x", password: "not-the-password" } });
    expect(wrong.status).toBe(422);
    expect(wrong.json.error.fields.password).toBeTruthy();
    const right = await call(acceptRoute.POST as never, { method: "POST", body: { token, name: "x", password: PASSWORD } });
    expect(right.status).toBe(201);
  });

  it("revoked invitations stop working", async () => {
    const email = `revoked-${Date.now()}@test.example`;
    const r = await call(invitesRoute.POST as never, { method: "POST", params: { channelId: w.channel.id }, body: { email, roles: ["editor"] }, user: w.members.owner });
    const token = linkToken((await waitForMail(email, "invited you")).text, "/invite");
    const del = await call(inviteRoute.DELETE as never, { method: "DELETE", params: { channelId: w.channel.id, invitationId: r.json.invitation.id }, user: w.members.owner });
    expect(del.status).toBe(200);
    const accept = await call(acceptRoute.POST as never, { method: "POST", body: { token, name: "Late", password: "a-long-password" } });
    expect(accept.status).toBe(404);
    const foreignRevoke = await call(inviteRoute.DELETE as never, { method: "DELETE", params: { channelId: w.other.id, invitationId: r.json.invitation.id }, user: w.outsider });
    expect(foreignRevoke.status).toBe(404);
  });
});

describe("members and roles", () => {
  it("everyone reads the member list; outsiders get 404", async () => {
    const r = await call(membersRoute.GET as never, { params: { channelId: w.channel.id }, user: w.members.sponsor_liaison });
    expect(r.status).toBe(200);
    expect(r.json.members.length).toBeGreaterThanOrEqual(5);
    const o = await call(membersRoute.GET as never, { params: { channelId: w.channel.id }, user: w.outsider });
    expect(o.status).toBe(404);
  });

  it("owner changes roles, effective at once; the last owner cannot be demoted", async () => {
    const w2 = await makeWorld();
    const r = await call(memberRoute.PATCH as never, { method: "PATCH", params: { channelId: w2.channel.id, userId: w2.members.editor.id }, body: { roles: ["editor", "presenter"] }, user: w2.members.owner });
    expect(r.status).toBe(200);
    const create = await call(listRoute.POST as never, { method: "POST", params: { channelId: w2.channel.id }, body: { title: "Editor now presents" }, user: w2.members.editor });
    expect(create.status).toBe(201);

    const lastOwner = await call(memberRoute.PATCH as never, { method: "PATCH", params: { channelId: w2.channel.id, userId: w2.members.owner.id }, body: { roles: ["presenter"] }, user: w2.members.owner });
    expect(lastOwner.status).toBe(409);

    const notOwner = await call(memberRoute.PATCH as never, { method: "PATCH", params: { channelId: w2.channel.id, userId: w2.members.editor.id }, body: { roles: ["owner"] }, user: w2.members.presenter });
    expect(notOwner.status).toBe(403);
    const badRoles = await call(memberRoute.PATCH as never, { method: "PATCH", params: { channelId: w2.channel.id, userId: w2.members.editor.id }, body: { roles: ["boss"] }, user: w2.members.owner });
    expect(badRoles.status).toBe(400);
    expect(badRoles.json.error.fields["roles.0"]).toBeTruthy();
    const stranger = await call(memberRoute.PATCH as never, { method: "PATCH", params: { channelId: w2.channel.id, userId: w.outsider.id }, body: { roles: ["editor"] }, user: w2.members.owner });
    expect(stranger.status).toBe(404);
  });
});

describe("password reset", () => {
  it("mails a single-use, expiring link and changes the password", async () => {
    const u = await makeUser("forgetful");
    const unknown = await call(resetRoute.POST as never, { method: "POST", body: { email: "nobody@test.example" } });
    expect(unknown.status).toBe(202);
    const r = await call(resetRoute.POST as never, { method: "POST", body: { email: u.email.toUpperCase() } });
    expect(r.status).toBe(202);
    const token = linkToken((await waitForMail(u.email, "Reset")).text, "/reset-password");

    const weak = await call(resetConfirmRoute.POST as never, { method: "POST", body: { token, password: "short" } });
    expect(weak.status).toBe(400);
    expect(weak.json.error.fields.password).toBeTruthy();

    const ok = await call(resetConfirmRoute.POST as never, { method: "POST", body: { token, password: "brand-new-password" } });
    expect(ok.status).toBe(200);
    const [after] = await db().select().from(users).where(eq(users.id, u.id));
    expect(await bcrypt.compare("brand-new-password", after!.passwordHash)).toBe(true);

    const again = await call(resetConfirmRoute.POST as never, { method: "POST", body: { token, password: "another-password" } });
    expect(again.status).toBe(404);
  });

  it("an expired link is refused", async () => {
    const u = await makeUser("slow");
    await call(resetRoute.POST as never, { method: "POST", body: { email: u.email } });
    const token = linkToken((await waitForMail(u.email, "Reset")).text, "/reset-password");
    await db().update(passwordResets).set({ expiresAt: new Date(Date.now() - 1000) }).where(eq(passwordResets.userId, u.id));
    const r = await call(resetConfirmRoute.POST as never, { method: "POST", body: { token, password: "brand-new-password" } });
    expect(r.status).toBe(404);
  });
});

describe("dev mailbox", () => {
  it("owner reads it; other roles 403; outsiders 404", async () => {
    // A pending invitation of this channel, so there is mail to show.
    const pending = `pending-${Date.now()}@test.example`;
    await call(invitesRoute.POST as never, { method: "POST", params: { channelId: w.channel.id }, body: { email: pending, roles: ["editor"] }, user: w.members.owner });
    await waitForMail(pending, "invited you");
    const ok = await call(mailboxRoute.GET as never, { path: `/x?channelId=${w.channel.id}`, user: w.members.owner });
    expect(ok.status).toBe(200);
    expect(ok.json.messages.length).toBeGreaterThan(0);
    const editor = await call(mailboxRoute.GET as never, { path: `/x?channelId=${w.channel.id}`, user: w.members.editor });
    expect(editor.status).toBe(403);
    const outsider = await call(mailboxRoute.GET as never, { path: `/x?channelId=${w.channel.id}`, user: w.outsider });
    expect(outsider.status).toBe(404);
    const missing = await call(mailboxRoute.GET as never, { path: `/x`, user: w.members.owner });
    expect(missing.status).toBe(400);
  });

  it("an owner sees only mail sent to the channel's own people and invitees", async () => {
    const email = `only-ours-${Date.now()}@test.example`;
    await call(invitesRoute.POST as never, { method: "POST", params: { channelId: w.channel.id }, body: { email, roles: ["editor"] }, user: w.members.owner });
    await waitForMail(email, "invited you");
    const ours = await call(mailboxRoute.GET as never, { path: `/x?channelId=${w.channel.id}`, user: w.members.owner });
    expect(ours.json.messages.some((m: { toAddresses: string[] }) => m.toAddresses.includes(email))).toBe(true);
    const theirs = await call(mailboxRoute.GET as never, { path: `/x?channelId=${w.other.id}`, user: w.outsider });
    expect(theirs.status).toBe(200);
    expect(theirs.json.messages.some((m: { toAddresses: string[] }) => m.toAddresses.includes(email))).toBe(false);
  });
});
