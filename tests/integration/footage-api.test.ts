import { beforeAll, describe, expect, it } from "vitest";
import crypto from "node:crypto";
import fs from "node:fs";
import { eq } from "drizzle-orm";
import { GetObjectCommand, ListPartsCommand } from "@aws-sdk/client-s3";
import * as uploadsRoute from "@/app/api/episodes/[episodeId]/uploads/route";
import * as partsRoute from "@/app/api/clips/[clipId]/parts/route";
import * as completeRoute from "@/app/api/clips/[clipId]/complete/route";
import * as clipRoute from "@/app/api/clips/[clipId]/route";
import * as clipsRoute from "@/app/api/episodes/[episodeId]/clips/route";
import * as cleanupRoute from "@/app/api/channels/[channelId]/uploads/cleanup/route";
import * as shotsRoute from "@/app/api/episodes/[episodeId]/shots/route";
import { db } from "@/db/client";
import { clips, shots } from "@/db/schema";
import { resetEnvCache } from "@/lib/env";
import { bucket, s3 } from "@/storage/s3";
import type { Role } from "@/lib/roles";
import { call, makeEpisode, makeWorld } from "../support/fixtures";

type World = Awaited<ReturnType<typeof makeWorld>>;
let w: World;
let episodeId: string;
const MiB = 1024 * 1024;

beforeAll(async () => {
  process.env.UPLOAD_PART_BYTES = String(5 * MiB);
  process.env.UPLOAD_MAX_BYTES = String(100 * MiB);
  resetEnvCache();
  w = await makeWorld();
  episodeId = (await makeEpisode(w.channel.id, "shooting", 0, "Footage")).id;
});

const start = (user: { id: string }, body: Record<string, unknown>, ep = episodeId) => call(uploadsRoute.POST as never, { method: "POST", params: { episodeId: ep }, body, user });
const sign = (user: { id: string }, clipId: string, partNumbers: number[]) => call(partsRoute.POST as never, { method: "POST", params: { clipId }, body: { partNumbers }, user });
const complete = (user: { id: string }, clipId: string) => call(completeRoute.POST as never, { method: "POST", params: { clipId }, user });

async function put(url: string, bytes: Uint8Array) {
  const r = await fetch(url, { method: "PUT", body: Buffer.from(bytes) as unknown as BodyInit });
  expect(r.status).toBe(200);
}

describe("multipart upload against the local S3-compatible store", () => {
  it("uploads parts, survives an interruption, refuses to finish early, then stores exactly the bytes sent", async () => {
    const data = crypto.randomBytes(12 * MiB + 12345);
    const s = await start(w.members.editor, { fileName: "B001_wide.mp4", size: data.length, contentType: "video/mp4" });
    expect(s.status).toBe(201);
    expect(s.json).toMatchObject({ partSize: 5 * MiB, partCount: 3 });
    const clipId = s.json.clip.id;
    const [row] = await db().select().from(clips).where(eq(clips.id, clipId));
    expect(row!.storageKey).toMatch(new RegExp(`^channel/${w.channel.id}/footage/[0-9a-f-]{36}\\.mp4$`));
    expect(row!.storageKey).not.toContain("B001");

    const urls = (await sign(w.members.editor, clipId, [1, 2, 3])).json.urls as { partNumber: number; url: string }[];
    await put(urls[0]!.url, data.subarray(0, 5 * MiB));
    await put(urls[1]!.url, data.subarray(5 * MiB, 10 * MiB));
    // Interrupted here: the browser reloads and asks what is stored.
    const listed = await call(partsRoute.GET as never, { params: { clipId }, user: w.members.editor });
    expect(listed.json.parts).toEqual([
      { partNumber: 1, size: 5 * MiB },
      { partNumber: 2, size: 5 * MiB },
    ]);
    const early = await complete(w.members.editor, clipId);
    expect(early.status).toBe(409);
    expect(early.json.error.message).toMatch(/Parts 3 are missing/);

    const again = (await sign(w.members.editor, clipId, [3])).json.urls[0].url;
    await put(again, data.subarray(10 * MiB));
    const done = await complete(w.members.editor, clipId);
    expect(done.status).toBe(200);
    expect(done.json.clip).toMatchObject({ state: "stored", sizeBytes: data.length });
    expect(done.json.clip.checksum).toMatch(/^s3-etag:/);

    const obj = await s3().send(new GetObjectCommand({ Bucket: bucket(), Key: row!.storageKey }));
    const stored = Buffer.from(await obj.Body!.transformToByteArray());
    expect(crypto.createHash("sha256").update(stored).digest("hex")).toBe(crypto.createHash("sha256").update(data).digest("hex"));
    expect((await complete(w.members.editor, clipId)).status).toBe(409);
  });

  it("reads metadata (duration, rate, size, start timecode) from the stored object", async () => {
    // A 4 s, 320×180, 29.97 fps test pattern with a 01:00:00;00 timecode track, made with ffmpeg for the demo.
    const bytes = fs.readFileSync("db/demo-media/test-pattern.mp4");
    const s = await start(w.members.owner, { fileName: "pattern.mp4", size: bytes.length, contentType: "video/mp4" });
    await put((await sign(w.members.owner, s.json.clip.id, [1])).json.urls[0].url, bytes);
    const done = await complete(w.members.owner, s.json.clip.id);
    expect(done.json.clip).toMatchObject({ width: 320, height: 180, startTimecode: "01:00:00;00" });
    expect(done.json.clip.durationMs).toBeGreaterThanOrEqual(3900);
    expect(Number(done.json.clip.frameRate)).toBeCloseTo(29.97, 2);
    const got = await call(clipRoute.GET as never, { params: { clipId: s.json.clip.id }, user: w.members.sponsor_liaison });
    expect(got.json.playbackUrl).toMatch(/X-Amz-Expires=300/);
  });

  it("cancel aborts the multipart upload and leaves nothing behind", async () => {
    const s = await start(w.members.editor, { fileName: "C001.mov", size: 6 * MiB, contentType: "video/quicktime" });
    const clipId = s.json.clip.id;
    await put((await sign(w.members.editor, clipId, [1])).json.urls[0].url, crypto.randomBytes(5 * MiB));
    const [row] = await db().select().from(clips).where(eq(clips.id, clipId));
    const del = await call(clipRoute.DELETE as never, { method: "DELETE", params: { clipId }, user: w.members.editor });
    expect(del.status).toBe(200);
    await expect(s3().send(new ListPartsCommand({ Bucket: bucket(), Key: row!.storageKey, UploadId: row!.uploadId! }))).rejects.toMatchObject({ name: "NoSuchUpload" });
    expect(await db().select().from(clips).where(eq(clips.id, clipId))).toEqual([]);
  });

  it("abandoned uploads older than a day are cleaned up by the owner", async () => {
    const s = await start(w.members.editor, { fileName: "old.mp4", size: 1000, contentType: "video/mp4" });
    await db().update(clips).set({ createdAt: new Date(Date.now() - 2 * 86400_000) }).where(eq(clips.id, s.json.clip.id));
    expect((await call(cleanupRoute.POST as never, { method: "POST", params: { channelId: w.channel.id }, user: w.members.editor })).status).toBe(403);
    const r = await call(cleanupRoute.POST as never, { method: "POST", params: { channelId: w.channel.id }, user: w.members.owner });
    expect(r.status).toBe(200);
    expect(r.json.removedClips).toBeGreaterThanOrEqual(1);
    expect(await db().select().from(clips).where(eq(clips.id, s.json.clip.id))).toEqual([]);
  });
});

describe("bad input is refused before any bytes move", () => {
  it.each([
    ["wrong type", { fileName: "notes.txt", size: 10, contentType: "text/plain" }, "contentType"],
    ["zero bytes", { fileName: "empty.mp4", size: 0, contentType: "video/mp4" }, "size"],
    ["over the limit", { fileName: "huge.mp4", size: 101 * MiB, contentType: "video/mp4" }, "size"],
    ["path in the name", { fileName: "../../etc/passwd.mp4", size: 10, contentType: "video/mp4" }, "fileName"],
    ["control characters", { fileName: "a\u0000b.mp4", size: 10, contentType: "video/mp4" }, "fileName"],
  ])("%s", async (_n, body, field) => {
    const before = (await db().select().from(clips)).length;
    const r = await start(w.members.editor, body);
    expect(r.status).toBe(400);
    expect(r.json.error.fields[field]).toBeTruthy();
    expect((await db().select().from(clips)).length).toBe(before);
  });

  it("a shot of another episode and forged part numbers", async () => {
    const other = (await makeEpisode(w.channel.id, "idea", 9, "Other")).id;
    const foreignShot = (await call(shotsRoute.POST as never, { method: "POST", params: { episodeId: other }, body: { description: "elsewhere" }, user: w.members.editor })).json.shot.id;
    const r = await start(w.members.editor, { fileName: "a.mp4", size: 10, contentType: "video/mp4", shotId: foreignShot });
    expect(r.status).toBe(422);
    const s = await start(w.members.editor, { fileName: "b.mp4", size: 10, contentType: "video/mp4" });
    expect((await sign(w.members.editor, s.json.clip.id, [2])).status).toBe(400);
    expect((await sign(w.members.editor, s.json.clip.id, [0])).status).toBe(400);
    expect((await sign(w.members.editor, s.json.clip.id, [1.5])).status).toBe(400);
    await call(clipRoute.DELETE as never, { method: "DELETE", params: { clipId: s.json.clip.id }, user: w.members.editor });
  });
});

describe("roles and isolation", () => {
  it.each<[Role, number]>([
    ["owner", 201],
    ["editor", 201],
    ["presenter", 403],
    ["producer", 403],
    ["sponsor_liaison", 403],
  ])("%s starting an upload: %i", async (role, status) => {
    const r = await start(w.members[role], { fileName: "r.mp4", size: 10, contentType: "video/mp4" });
    expect(r.status).toBe(status);
    if (r.status === 201) await call(clipRoute.DELETE as never, { method: "DELETE", params: { clipId: r.json.clip.id }, user: w.members[role] });
  });

  it("another channel's clip is 404 on every route, by id or by key", async () => {
    const s = await start(w.members.editor, { fileName: "private.mp4", size: 10, contentType: "video/mp4" });
    const clipId = s.json.clip.id;
    for (const [handler, method, body] of [
      [clipRoute.GET, "GET", undefined],
      [clipRoute.PATCH, "PATCH", { inFrame: 1 }],
      [clipRoute.DELETE, "DELETE", undefined],
      [partsRoute.GET, "GET", undefined],
      [partsRoute.POST, "POST", { partNumbers: [1] }],
      [completeRoute.POST, "POST", undefined],
    ] as const) {
      const r = await call(handler as never, { method, params: { clipId }, body, user: w.outsider });
      expect(r.status, `${method}`).toBe(404);
    }
    expect((await call(clipsRoute.GET as never, { params: { episodeId }, user: w.outsider })).status).toBe(404);
    // A photo key of another channel cannot be passed off as evidence either (see the build-plan tests).
    expect((await call(clipRoute.GET as never, { params: { clipId }, user: null })).status).toBe(401);
  });

  it("linking a clip marks its shot captured", async () => {
    const shot = (await call(shotsRoute.POST as never, { method: "POST", params: { episodeId }, body: { description: "Wide of the bench", kind: "broll" }, user: w.members.producer })).json.shot;
    const bytes = fs.readFileSync("db/demo-media/test-pattern.mp4");
    const s = await start(w.members.editor, { fileName: "wide.mp4", size: bytes.length, contentType: "video/mp4" });
    await put((await sign(w.members.editor, s.json.clip.id, [1])).json.urls[0].url, bytes);
    await complete(w.members.editor, s.json.clip.id);
    const link = await call(clipRoute.PATCH as never, { method: "PATCH", params: { clipId: s.json.clip.id }, body: { shotId: shot.id }, user: w.members.editor });
    expect(link.status).toBe(200);
    const [row] = await db().select().from(shots).where(eq(shots.id, shot.id));
    expect(row!.status).toBe("captured");
    const badRange = await call(clipRoute.PATCH as never, { method: "PATCH", params: { clipId: s.json.clip.id }, body: { inFrame: 50, outFrame: 10 }, user: w.members.editor });
    expect(badRange.status).toBe(400);
  });
});
