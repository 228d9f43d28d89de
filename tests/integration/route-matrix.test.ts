/**
 * Generated from the routes themselves: every handler under app/api must be
 * built with the route builder, and every channel route is called by every
 * role of the channel, by another channel's owner and without a session,
 * with the status the permission table implies. A new route is covered
 * without writing anything here.
 */
import fs from "node:fs";
import path from "node:path";
import crypto from "node:crypto";
import { beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { buildSteps, clips, coverageRanges, gaps, invitations, materials, scriptRevisions, scriptSegments, shots, tools } from "@/db/schema";
import { can, type Action } from "@/lib/permissions";
import { ROLES } from "@/lib/roles";
import type { BuiltSpec, LoadKind } from "@/lib/server/route-builder";
import { call, makeEpisode, makeWorld } from "../support/fixtures";

const API = path.join(process.cwd(), "app", "api");
const METHODS = ["GET", "POST", "PUT", "PATCH", "DELETE"] as const;
// next-auth's own handler; it throttles and refuses odd input itself (see http.test.ts).
const EXEMPT = new Set(["auth/[...nextauth]/route.ts"]);
const PUBLIC = new Set(["health/route.ts", "openapi.json/route.ts", "invitations/accept/route.ts", "password-reset/route.ts", "password-reset/confirm/route.ts"]);

type Built = ((req: Request, ctx: { params: Promise<Record<string, string>> }) => Promise<Response>) & { spec?: BuiltSpec };
interface RouteEntry {
  file: string;
  method: (typeof METHODS)[number];
  handler: Built;
  params: string[];
}

function routeFiles(dir = API): string[] {
  return fs.readdirSync(dir, { withFileTypes: true }).flatMap((d) => (d.isDirectory() ? routeFiles(path.join(dir, d.name)) : d.name === "route.ts" ? [path.join(dir, d.name)] : []));
}

const entries: RouteEntry[] = [];
let w: Awaited<ReturnType<typeof makeWorld>>;

beforeAll(async () => {
  for (const abs of routeFiles()) {
    const file = path.relative(API, abs);
    if (EXEMPT.has(file)) continue;
    const mod = (await import(/* @vite-ignore */ abs)) as Record<string, Built>;
    const params = [...file.matchAll(/\[(\w+)\]/g)].map((m) => m[1]!);
    for (const method of METHODS) if (mod[method]) entries.push({ file, method, handler: mod[method]!, params });
  }
  w = await makeWorld();
}, 60_000);

/** One fresh record of every kind in the channel, so destructive calls never starve the next caller. */
async function records(channelId: string, userId: string) {
  const episode = await makeEpisode(channelId, "planning", 0, `Matrix ${crypto.randomUUID().slice(0, 6)}`);
  const [step] = await db().insert(buildSteps).values({ episodeId: episode.id, title: "Plane the slats", position: 0 }).returning();
  const [material] = await db().insert(materials).values({ episodeId: episode.id, partName: "Slat", thickness: "1", width: "3", length: "36", position: 0 }).returning();
  const [tool] = await db().insert(tools).values({ channelId, name: "Block plane" }).returning();
  const [segment] = await db().insert(scriptSegments).values({ episodeId: episode.id, position: 0, kind: "voice_over", text: "Slats first.", updatedBy: userId }).returning();
  const [shot] = await db().insert(shots).values({ episodeId: episode.id, kind: "broll", description: "Shavings", position: 0 }).returning();
  const [clip] = await db().insert(clips).values({ channelId, episodeId: episode.id, storageKey: `channel/${channelId}/footage/${crypto.randomUUID()}.mp4`, originalName: "A001.mp4", sizeBytes: 10, contentType: "video/mp4", createdBy: userId }).returning();
  const [gap] = await db().insert(gaps).values({ episodeId: episode.id, startFrame: 0, endFrame: 50, source: "marked", status: "open" }).returning();
  const [range] = await db().insert(coverageRanges).values({ episodeId: episode.id, startFrame: 0, endFrame: 25 }).returning();
  const [revision] = await db().insert(scriptRevisions).values({ episodeId: episode.id, segmentId: segment!.id, userId, before: null, after: { kind: "voice_over", text: "Slats first." } }).returning();
  const [invitation] = await db().insert(invitations).values({ channelId, email: `m-${crypto.randomUUID().slice(0, 6)}@test.example`, roles: ["editor"], tokenHash: crypto.randomUUID(), expiresAt: new Date(Date.now() + 86400000) }).returning();
  const ids: Record<LoadKind, string> = { channel: channelId, episode: episode.id, step: step!.id, material: material!.id, tool: tool!.id, segment: segment!.id, clip: clip!.id, shot: shot!.id, gap: gap!.id, range: range!.id, revision: revision!.id };
  return { ids, extra: { invitationId: invitation!.id, userId: w.members.producer.id } as Record<string, string> };
}

async function callAs(e: RouteEntry, user: { id: string } | null, channelId: string, ownerId: string) {
  const { ids, extra } = await records(channelId, ownerId);
  const spec = e.handler.spec!;
  const params: Record<string, string> = {};
  for (const p of e.params) params[p] = spec.kind === "channel" && p === spec.param ? ids[spec.load] : (extra[p] ?? ids[p.replace(/Id$/, "") as LoadKind] ?? crypto.randomUUID());
  const write = e.method !== "GET";
  return call(e.handler as never, { method: e.method, params, user, path: "/x", ...(write ? { body: {} } : {}) });
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
      }
    }
    expect(problems).toEqual([]);
  }, 240_000);
});
