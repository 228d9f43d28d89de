/**
 * For the generated route tests: every route module under app/api with its
 * built handlers, and one fresh record of every kind a route can load.
 */
import fs from "node:fs";
import path from "node:path";
import crypto from "node:crypto";
import { db } from "../../db/client";
import { buildSteps, clips, coverageRanges, deals, deliverables, gaps, guestLinks, invitations, materials, scriptRevisions, scriptSegments, shootDays, shootLogNotes, shots, sponsors, tools } from "../../db/schema";
import type { BuiltSpec, LoadKind } from "../../lib/server/http/route-builder";
import { makeEpisode } from "./fixtures";

export const API = path.join(process.cwd(), "app", "api");
export const METHODS = ["GET", "POST", "PUT", "PATCH", "DELETE"] as const;
export type Built = ((req: Request, ctx: { params: Promise<Record<string, string>> }) => Promise<Response>) & { spec?: BuiltSpec };

export interface RouteEntry {
  /** The route file under app/api, e.g. "episodes/[episodeId]/shots/route.ts". */
  file: string;
  method: (typeof METHODS)[number];
  handler: Built;
  /** The path's parameters, in order. */
  params: string[];
}

function routeFiles(dir = API): string[] {
  return fs.readdirSync(dir, { withFileTypes: true }).flatMap((d) => (d.isDirectory() ? routeFiles(path.join(dir, d.name)) : d.name === "route.ts" ? [path.join(dir, d.name)] : []));
}

/** Imports every route module (except the given files) and lists its handlers. */
export async function listRoutes(skip: (file: string) => boolean = () => false): Promise<RouteEntry[]> {
  const out: RouteEntry[] = [];
  for (const abs of routeFiles()) {
    const file = path.relative(API, abs);
    if (skip(file)) continue;
    const mod = (await import(/* @vite-ignore */ abs)) as Record<string, Built>;
    const params = [...file.matchAll(/\[(\w+)\]/g)].map((m) => m[1]!);
    for (const method of METHODS) if (mod[method]) out.push({ file, method, handler: mod[method]!, params });
  }
  return out;
}

/** One fresh record of every kind in the channel, so destructive calls never starve the next caller. */
export async function recordsOfEveryKind(channelId: string, userId: string): Promise<{ ids: Record<LoadKind, string>; invitationId: string }> {
  const episode = await makeEpisode(channelId, "planning", 0, `Route test ${crypto.randomUUID().slice(0, 6)}`);
  const [step] = await db().insert(buildSteps).values({ episodeId: episode.id, title: "Plane the slats", position: 0 }).returning();
  const [material] = await db().insert(materials).values({ episodeId: episode.id, partName: "Slat", thickness: "1", width: "3", length: "36", position: 0 }).returning();
  const [tool] = await db().insert(tools).values({ channelId, name: "Block plane" }).returning();
  const [segment] = await db().insert(scriptSegments).values({ episodeId: episode.id, position: 0, kind: "voice_over", text: "Slats first.", updatedBy: userId }).returning();
  const [shot] = await db().insert(shots).values({ episodeId: episode.id, kind: "broll", description: "Shavings", position: 0 }).returning();
  const [clip] = await db().insert(clips).values({ channelId, episodeId: episode.id, storageKey: `channel/${channelId}/footage/${crypto.randomUUID()}.mp4`, originalName: "A001.mp4", sizeBytes: 10, contentType: "video/mp4", createdBy: userId }).returning();
  const [gap] = await db().insert(gaps).values({ episodeId: episode.id, startFrame: 0, endFrame: 50, source: "marked", status: "open" }).returning();
  const [range] = await db().insert(coverageRanges).values({ episodeId: episode.id, startFrame: 0, endFrame: 25 }).returning();
  const [revision] = await db().insert(scriptRevisions).values({ episodeId: episode.id, segmentId: segment!.id, userId, before: null, after: { kind: "voice_over", text: "Slats first." } }).returning();
  const [shootDay] = await db().insert(shootDays).values({ channelId, day: "2026-12-12", callAt: new Date("2026-12-12T09:00:00Z"), wrapAt: new Date("2026-12-12T17:00:00Z") }).returning();
  const [sponsor] = await db().insert(sponsors).values({ channelId, name: "Route test sponsor" }).returning();
  const [deal] = await db().insert(deals).values({ channelId, sponsorId: sponsor!.id, title: "Route test deal" }).returning();
  const [deliverable] = await db().insert(deliverables).values({ dealId: deal!.id, kind: "spoken_disclosure" }).returning();
  const [reviewLink] = await db().insert(guestLinks).values({ dealId: deal!.id, tokenHash: crypto.randomUUID(), expiresAt: new Date(Date.now() + 86400000) }).returning();
  const [note] = await db().insert(shootLogNotes).values({ episodeId: episode.id, stepId: step!.id, authorId: userId, text: "The string stretched; use a batten." }).returning();
  const [invitation] = await db().insert(invitations).values({ channelId, email: `m-${crypto.randomUUID().slice(0, 6)}@test.example`, roles: ["editor"], tokenHash: crypto.randomUUID(), expiresAt: new Date(Date.now() + 86400000) }).returning();
  return {
    ids: { channel: channelId, episode: episode.id, step: step!.id, material: material!.id, tool: tool!.id, segment: segment!.id, clip: clip!.id, shot: shot!.id, gap: gap!.id, range: range!.id, revision: revision!.id, shootDay: shootDay!.id, sponsor: sponsor!.id, deal: deal!.id, deliverable: deliverable!.id, reviewLink: reviewLink!.id, note: note!.id },
    invitationId: invitation!.id,
  };
}

/** Path parameters for a route: the loaded record's id, then other known ids, then a fresh uuid. */
export function paramsFor(entry: RouteEntry, ids: Record<LoadKind, string>, extra: Record<string, string>): Record<string, string> {
  const spec = entry.handler.spec;
  const out: Record<string, string> = {};
  for (const p of entry.params) out[p] = spec?.kind === "channel" && p === spec.param ? ids[spec.load] : (extra[p] ?? ids[p.replace(/Id$/, "") as LoadKind] ?? crypto.randomUUID());
  return out;
}
