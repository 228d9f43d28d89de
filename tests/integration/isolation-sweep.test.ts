/**
 * Every route handler that takes an id, read and delete alike: another
 * channel's owner gets 404 and no session gets 401. The POST/PATCH cases are
 * covered per domain with valid bodies in the other files.
 */
import { beforeAll, describe, expect, it } from "vitest";
import fs from "node:fs";
import path from "node:path";
import { db } from "@/db/client";
import { buildSteps, clips, coverageRanges, deals, deliverables, gaps, invitations, materials, scriptRevisions, scriptSegments, shootDays, shootLogNotes, shots, sponsors, tools } from "@/db/schema";
import { call, makeEpisode, makeWorld } from "../support/fixtures";

type World = Awaited<ReturnType<typeof makeWorld>>;
let w: World;
const ids: Record<string, string> = {};

function routeFiles(dir: string): string[] {
  return fs.readdirSync(dir, { withFileTypes: true }).flatMap((e) => {
    const p = path.join(dir, e.name);
    return e.isDirectory() ? routeFiles(p) : e.name === "route.ts" ? [p] : [];
  });
}

beforeAll(async () => {
  w = await makeWorld();
  const ep = await makeEpisode(w.channel.id, "planning", 0, "Private");
  const [step] = await db().insert(buildSteps).values({ episodeId: ep.id, position: 0, title: "Private step" }).returning();
  const [material] = await db().insert(materials).values({ episodeId: ep.id, partName: "Leg", thickness: "1", width: "2", length: "3" }).returning();
  const [tool] = await db().insert(tools).values({ channelId: w.channel.id, name: "Private saw" }).returning();
  const [segment] = await db().insert(scriptSegments).values({ episodeId: ep.id, position: 0, kind: "voice_over", text: "private" }).returning();
  const [revision] = await db().insert(scriptRevisions).values({ episodeId: ep.id, segmentId: segment!.id, after: { text: "private" } }).returning();
  const [shot] = await db().insert(shots).values({ episodeId: ep.id, kind: "broll", description: "private" }).returning();
  const [clip] = await db()
    .insert(clips)
    .values({ channelId: w.channel.id, episodeId: ep.id, storageKey: `channel/${w.channel.id}/footage/${crypto.randomUUID()}.mp4`, originalName: "p.mp4", sizeBytes: 10, contentType: "video/mp4", state: "stored" })
    .returning();
  const [gap] = await db().insert(gaps).values({ episodeId: ep.id, startFrame: 0, endFrame: 10, source: "marked" }).returning();
  const [range] = await db().insert(coverageRanges).values({ episodeId: ep.id, startFrame: 0, endFrame: 10 }).returning();
  const [inv] = await db().insert(invitations).values({ channelId: w.channel.id, email: "x@test.example", roles: ["editor"], tokenHash: crypto.randomUUID(), expiresAt: new Date(Date.now() + 86400_000) }).returning();
  const [shootDay] = await db().insert(shootDays).values({ channelId: w.channel.id, day: "2027-01-09", callAt: new Date("2027-01-09T09:00:00Z"), wrapAt: new Date("2027-01-09T17:00:00Z") }).returning();
  const [sponsor] = await db().insert(sponsors).values({ channelId: w.channel.id, name: "Private sponsor" }).returning();
  const [deal] = await db().insert(deals).values({ channelId: w.channel.id, sponsorId: sponsor!.id, title: "Private deal" }).returning();
  const [deliverable] = await db().insert(deliverables).values({ dealId: deal!.id, kind: "spoken_disclosure" }).returning();
  const [note] = await db().insert(shootLogNotes).values({ episodeId: ep.id, text: "private note" }).returning();
  Object.assign(ids, {
    noteId: note!.id,
    sponsorId: sponsor!.id,
    dealId: deal!.id,
    deliverableId: deliverable!.id,
    shootDayId: shootDay!.id,
    channelId: w.channel.id,
    episodeId: ep.id,
    stepId: step!.id,
    materialId: material!.id,
    toolId: tool!.id,
    segmentId: segment!.id,
    revisionId: revision!.id,
    shotId: shot!.id,
    clipId: clip!.id,
    gapId: gap!.id,
    rangeId: range!.id,
    invitationId: inv!.id,
    userId: w.members.editor.id,
  });
});

const root = path.resolve("app");
const cases = routeFiles(path.join(root, "api"))
  // The calendar feed and the sponsor review are keyed by a secret token in the path, not a session:
  // shoot-days-api.test.ts and sponsors-review.test.ts try wrong, expired and withdrawn tokens.
  .filter((f) => f.includes("[") && !f.includes("[...nextauth]") && !f.includes("calendar/[token]") && !f.includes("review/[token]"))
  .flatMap((f) => {
    const src = fs.readFileSync(f, "utf8");
    const methods = [...src.matchAll(/export const (GET|DELETE)\b/g)].map((m) => m[1]!);
    const rel = path.relative(root, path.dirname(f)).split(path.sep).join("/");
    return methods.map((m) => [`${m} /${rel}`, f, m] as const);
  });

describe("isolation sweep over every id-taking GET and DELETE", () => {
  it("found the routes", () => {
    expect(cases.length).toBeGreaterThan(15);
  });

  it.each(cases)("%s", async (_name, file, method) => {
    const mod = (await import(/* @vite-ignore */ file)) as Record<string, unknown>;
    const params = Object.fromEntries([...file.matchAll(/\[(\w+)\]/g)].map((m) => [m[1]!, ids[m[1]!]!]));
    const outsider = await call(mod[method] as never, { method, params, user: w.outsider });
    expect(outsider.status, "another channel's owner").toBe(404);
    const anonymous = await call(mod[method] as never, { method, params, user: null });
    expect(anonymous.status, "no session").toBe(401);
  });
});
