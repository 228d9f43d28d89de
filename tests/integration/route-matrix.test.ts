/**
 * Generated from the routes themselves: every handler under app/api must be
 * built with the route builder, and every channel route is called by every
 * role of the channel, by another channel's owner and without a session,
 * with the status the permission table implies. A new route is covered
 * without writing anything here.
 */
import { beforeAll, describe, expect, it } from "vitest";
import { can, type Action } from "@/lib/permissions";
import { ROLES } from "@/lib/roles";
import { call, makeUser, makeWorld } from "../support/fixtures";
import { db } from "@/db/client";
import { memberships } from "@/db/schema";
import { listRoutes, paramsFor, recordsOfEveryKind, type RouteEntry } from "../support/routes";

// next-auth's own handler; it throttles and refuses odd input itself (see http.test.ts).
const EXEMPT = new Set(["auth/[...nextauth]/route.ts"]);
const PUBLIC = new Set(["health/route.ts", "openapi.json/route.ts", "invitations/accept/route.ts", "password-reset/route.ts", "password-reset/confirm/route.ts", "calendar/[token]/route.ts", "payments/webhook/route.ts"]);

let entries: RouteEntry[] = [];
let w: Awaited<ReturnType<typeof makeWorld>>;

beforeAll(async () => {
  entries = await listRoutes((file) => EXEMPT.has(file));
  w = await makeWorld();
}, 60_000);

async function callAs(e: RouteEntry, user: { id: string } | null, channelId: string, ownerId: string) {
  const { ids, invitationId } = await recordsOfEveryKind(channelId, ownerId);
  // Removing a member is real: it gets a member of its own each time, so the roles of the world stay.
  let userId = w.members.producer.id;
  if (e.method === "DELETE" && e.file.includes("members/[userId]")) {
    const temp = await makeUser("removable");
    await db().insert(memberships).values({ channelId, userId: temp.id, roles: ["editor"] });
    userId = temp.id;
  }
  const params = paramsFor(e, ids, { invitationId, userId });
  const write = e.method !== "GET";
  return call(e.handler as never, { method: e.method, params, user, path: "/x", ...(write ? { body: {} } : {}) });
}

/** True when any feeMinor in the answer carries a number. */
function hasFee(v: unknown): boolean {
  if (Array.isArray(v)) return v.some(hasFee);
  if (v && typeof v === "object") return Object.entries(v).some(([k, x]) => (k === "feeMinor" && typeof x === "number") || hasFee(x));
  return false;
}

const allowed = (action: Action | readonly Action[], roles: readonly string[]) => (typeof action === "string" ? [action] : action).some((a) => can(roles as never, a));

describe("every route is built with the route builder", () => {
  it("lists its declaration on every handler, and only the known public routes skip the session", () => {
    expect(entries.length).toBeGreaterThan(60);
    const unbuilt = entries.filter((e) => !e.handler.spec).map((e) => `${e.method} ${e.file}`);
    expect(unbuilt).toEqual([]);
    const publicOnes = [...new Set(entries.filter((e) => e.handler.spec!.kind === "public").map((e) => e.file))].sort();
    expect(publicOnes).toEqual([...PUBLIC].sort());
  });
});

describe("generated authorization matrix: route × method × caller", () => {
  it("anonymous 401, another channel's owner 404, each role as the permission table says; never a 5xx", async () => {
    const problems: string[] = [];
    for (const e of entries) {
      const spec = e.handler.spec!;
      if (spec.kind === "public") continue;
      const label = `${e.method} ${e.file}`;
      const anon = await callAs(e, null, w.channel.id, w.members.owner.id);
      // A guest route has no session to miss: without a live review link in its path it is "not found".
      if (spec.kind === "guest") {
        if (anon.status !== 404) problems.push(`${label} without a live link: ${anon.status}`);
        continue;
      }
      if (anon.status !== 401) problems.push(`${label} anonymous: ${anon.status}`);
      if (spec.kind === "user") continue;
      const outsider = await callAs(e, w.outsider, w.channel.id, w.members.owner.id);
      if (outsider.status !== 404) problems.push(`${label} other channel: ${outsider.status}`);
      for (const role of ROLES) {
        const r = await callAs(e, w.members[role], w.channel.id, w.members.owner.id);
        const ok = allowed(spec.action, [role]);
        if (r.status >= 500) problems.push(`${label} ${role}: ${r.status} ${JSON.stringify(r.json).slice(0, 200)}`);
        else if (ok && [401, 403, 404].includes(r.status)) problems.push(`${label} ${role}: allowed but ${r.status} ${r.json?.error?.code ?? ""}`);
        else if (!ok && r.status !== 403) problems.push(`${label} ${role}: expected 403, got ${r.status}`);
        // Sponsor fees: only the roles the permission table lets see them ever get a number.
        if (r.status < 300 && !can([role], "deals.fees") && hasFee(r.json)) problems.push(`${label} ${role}: answered a sponsor fee`);
      }
    }
    expect(problems).toEqual([]);
  }, 240_000);
});
