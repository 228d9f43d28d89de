/**
 * Whole-channel export and import: a channel with a record in every table
 * and stored objects is exported, imported as a new channel, and exported
 * again; the two exports must say the same thing row for row (ids re-made,
 * storage keys moved to the new channel, the copied objects present). A
 * tampered, truncated, foreign or out-of-order file is refused with nothing
 * written.
 */
import { beforeAll, describe, expect, it } from "vitest";
import crypto from "node:crypto";
import { Readable } from "node:stream";
import { count, eq, sql } from "drizzle-orm";
import unzipper from "unzipper";
import { ZipArchive } from "archiver";
import * as exportRoute from "@/app/api/channels/[channelId]/export/route";
import * as importRoute from "@/app/api/channels/import/route";
import { db } from "@/db/client";
import * as s from "@/db/schema";
import { ARCHIVE_TABLES } from "@/db/queries/archive";
import { importChannel, remapRow, type RemapContext } from "@/lib/server/services/channel-archive";
import { headObject } from "@/storage/s3";
import { presignPut } from "@/storage/presign";
import { cookieFor, makeEpisode, makeWorld } from "../support/fixtures";
import { recordsOfEveryKind } from "../support/routes";

type World = Awaited<ReturnType<typeof makeWorld>>;
let w: World;
const png = new Uint8Array([137, 80, 78, 71, 13, 10, 26, 10, 1, 2, 3]);

async function putObject(key: string, type: string, bytes: Uint8Array) {
  const r = await fetch(await presignPut(key, type, bytes.length), { method: "PUT", headers: { "content-type": type }, body: new Blob([bytes as Uint8Array<ArrayBuffer>]) });
  expect(r.ok).toBe(true);
}

/** A record in every exported table, two stored objects, a gifted tool and a paid deal. */
async function fillChannel(channelId: string, owner: { id: string }, editor: { id: string }) {
  const { ids } = await recordsOfEveryKind(channelId, owner.id);
  const episodeId = ids.episode;
  const photoKey = `channel/${channelId}/photo/${crypto.randomUUID()}.png`;
  await putObject(photoKey, "image/png", png);
  await db().update(s.tools).set({ photoKey, acquisition: "gifted", sponsorId: ids.sponsor }).where(eq(s.tools.id, ids.tool));
  const [clip] = await db().select().from(s.clips).where(eq(s.clips.id, ids.clip));
  await putObject(clip!.storageKey, "video/mp4", new Uint8Array(2048).fill(7));
  const [step2] = await db().insert(s.buildSteps).values({ episodeId, title: "Glue up", position: 1, waitMinutes: 1440, hazards: ["finish"], coverageKinds: ["broll"] }).returning();
  await db().insert(s.stepDependencies).values({ stepId: step2!.id, dependsOnStepId: ids.step });
  await db().insert(s.stepTools).values({ stepId: ids.step, toolId: ids.tool });
  await db().insert(s.sponsorContacts).values({ sponsorId: ids.sponsor, name: "Ines Varga", email: "ines@sponsor.example" });
  await db().insert(s.daysAway).values({ channelId, userId: editor.id, day: "2026-12-24", note: "family" });
  await db().insert(s.shootDayCrew).values({ shootDayId: ids.shootDay, userId: editor.id, duty: "camera" });
  await db().insert(s.shootDayHelpers).values({ shootDayId: ids.shootDay, name: "A neighbour", duty: "holds the board" });
  await db().insert(s.scheduledSteps).values({ stepId: ids.step, episodeId, shootDayId: ids.shootDay, startsAt: new Date("2026-12-12T09:00:00.123456Z"), endsAt: new Date("2026-12-12T10:00:00Z") });
  await db().insert(s.callSheetSends).values({ shootDayId: ids.shootDay, sentBy: owner.id, recipients: ["a@test.example"] });
  await db().update(s.shots).set({ gapId: ids.gap, stepId: ids.step }).where(eq(s.shots.id, ids.shot));
  await db().update(s.coverageRanges).set({ clipId: ids.clip }).where(eq(s.coverageRanges.id, ids.range));
  await db().insert(s.shootLogNotes).values({ episodeId, stepId: ids.step, authorId: editor.id, text: "In hindsight, the string stretched; use a batten." });
  await db().insert(s.dealEpisodes).values({ dealId: ids.deal, episodeId });
  await db().insert(s.dealTools).values({ dealId: ids.deal, toolId: ids.tool });
  await db().insert(s.reviewComments).values({ dealId: ids.deal, guestLinkId: ids.reviewLink, body: "Looks right", decision: "approved", scriptFingerprint: "abc" });
  await db().insert(s.invoices).values({ dealId: ids.deal, amountMinor: 125050, currency: "EUR", providerId: `in_${crypto.randomUUID()}`, status: "open" });
  const thumbKey = `channel/${channelId}/photo/${crypto.randomUUID()}.png`;
  await putObject(thumbKey, "image/png", png);
  await db().insert(s.publishPackages).values({ episodeId, title: "Ad | Slats", summary: "Ünïcode ✓ and a € sign", thumbnailKey: thumbKey, sections: { chapters: true, credits: false, materials: true, safety: true } });
  await db().insert(s.publishOverrides).values({ episodeId, userId: owner.id, reason: "Published by hand already", failing: ["shots_done"] });
  await db().insert(s.auditEntries).values({ channelId, userId: owner.id, action: "move", entity: "episode", entityId: episodeId, before: { stage: "idea" }, after: { stage: "planning" } });
  await db().update(s.materials).set({ thickness: "0.7500", wastePercent: "12.5" }).where(eq(s.materials.id, ids.material));
  await makeEpisode(channelId, "idea", 1, "A second episode");
}

async function exportZip(channelId: string, user: { id: string }) {
  const res = await exportRoute.GET(new Request(`http://127.0.0.1/api/channels/${channelId}/export`, { headers: { cookie: await cookieFor(user.id) } }), { params: Promise.resolve({ channelId }) });
  return { status: res.status, type: res.headers.get("content-type"), bytes: Buffer.from(await res.arrayBuffer()) };
}

async function importZip(bytes: Buffer, user: { id: string }, name?: string) {
  const req = new Request(`http://127.0.0.1/api/channels/import${name ? `?name=${encodeURIComponent(name)}` : ""}`, { method: "POST", headers: { cookie: await cookieFor(user.id), "content-type": "application/zip", origin: "http://127.0.0.1" }, body: new Blob([bytes as Uint8Array<ArrayBuffer>]) });
  const res = await importRoute.POST(req, { params: Promise.resolve({}) });
  return { status: res.status, json: await res.json() };
}

async function entries(bytes: Buffer): Promise<Map<string, string>> {
  const dir = await unzipper.Open.buffer(bytes);
  const out = new Map<string, string>();
  for (const f of dir.files) out.set(f.path, (await f.buffer()).toString("utf8"));
  return out;
}

const rowsOf = (text: string) => text.split("\n").filter(Boolean).map((l) => JSON.parse(l) as Record<string, unknown>);

/** Rebuilds a zip from entries, changing what `edit` says. */
async function rezip(files: Map<string, string>, edit: (name: string, text: string) => string | null): Promise<Buffer> {
  const zip = new ZipArchive({});
  for (const [name, text] of files) {
    const t = edit(name, text);
    if (t !== null) zip.append(Buffer.from(t), { name });
  }
  const chunks: Buffer[] = [];
  zip.on("data", (c: Buffer) => chunks.push(c));
  const done = new Promise((r) => zip.on("end", r));
  await zip.finalize();
  await done;
  return Buffer.concat(chunks);
}

async function channelCount() {
  const [r] = await db().select({ n: count() }).from(s.channels);
  return r!.n;
}

let first: Buffer;
beforeAll(async () => {
  w = await makeWorld();
  await fillChannel(w.channel.id, w.members.owner, w.members.editor);
  const r = await exportZip(w.channel.id, w.members.owner);
  expect(r.status).toBe(200);
  expect(r.type).toBe("application/zip");
  first = r.bytes;
});

describe("export", () => {
  it("is the owner's alone", async () => {
    for (const role of ["presenter", "editor", "producer", "sponsor_liaison"] as const) expect((await exportZip(w.channel.id, w.members[role])).status, role).toBe(403);
    expect((await exportZip(w.channel.id, w.outsider)).status).toBe(404);
  });

  it("holds every table, the objects' manifest and no secret", async () => {
    const files = await entries(first);
    expect([...files.keys()][0]).toBe("header.json");
    expect([...files.keys()].at(-1)).toBe("manifest.json");
    for (const t of ARCHIVE_TABLES) expect([...files.keys()].some((k) => k.endsWith(`-${t.table}.ndjson`)), t.table).toBe(true);
    for (const [name, text] of files) if (name.startsWith("records/")) expect(rowsOf(text).length, name).toBeGreaterThan(0);
    const objects = rowsOf(files.get("objects.ndjson")!);
    expect(objects.filter((o) => !o.missing)).toHaveLength(3);
    const all = [...files.values()].join("\n");
    expect(all).not.toContain("token_hash");
    expect(all).not.toContain("password_hash");
    // Exact values survive: microseconds and numeric scale as PostgreSQL keeps them.
    expect(all).toMatch(/"created_at": "\d{4}-\d\d-\d\dT\d\d:\d\d:\d\d\.\d{6}\+00:00"/);
    expect(files.get("manifest.json")).toMatch(/"signature":"[0-9a-f]{64}"/);
  });
});

describe("round trip", () => {
  it("export, import, export again: nothing lost", async () => {
    const before = await channelCount();
    const result = await importChannel({ userId: w.members.owner.id, body: Readable.from(first) });
    expect(await channelCount()).toBe(before + 1);
    const again = await exportZip(result.channelId, w.members.owner);
    expect(again.status).toBe(200);
    const a = await entries(first);
    const b = await entries(again.bytes);
    expect([...b.keys()]).toEqual([...a.keys()]);
    const { rows: cols } = await db().execute<{ table_name: string; column_name: string; data_type: string; is_identity: string }>(sql`select table_name, column_name, data_type, is_identity from information_schema.columns where table_schema = 'public'`);
    const users = new Map(rowsOf(a.get("users.ndjson")!).map((u) => [String(u.id), String(u.id)]));
    const ctx: RemapContext = { oldChannelId: w.channel.id, newChannelId: result.channelId, namespace: result.namespace, users, name: "" };
    for (const [i, t] of ARCHIVE_TABLES.entries()) {
      const file = `records/${String(i).padStart(2, "0")}-${t.table}.ndjson`;
      const columns = cols.filter((c) => c.table_name === t.table).map((c) => ({ name: c.column_name, type: c.data_type, identity: c.is_identity === "YES" }));
      const drop = (r: Record<string, unknown>) => {
        const o = { ...r };
        for (const c of columns) if (c.identity) delete o[c.name];
        return o;
      };
      const key = (r: Record<string, unknown>) => JSON.stringify(Object.entries(r).sort());
      const expected = rowsOf(a.get(file)!)
        .map((r) => remapRow(t.table, r, columns, { ...ctx, name: `${String(r.name)} (copy)` }))
        .map((r) => drop(r!))
        .map(key)
        .sort();
      const actual = rowsOf(b.get(file)!).map(drop).map(key).sort();
      expect(actual, t.table).toEqual(expected);
    }
    // The stored objects were copied under the new channel's keys.
    for (const o of rowsOf(b.get("objects.ndjson")!)) {
      expect(String(o.key).startsWith(`channel/${result.channelId}/`)).toBe(true);
      expect(o.missing).toBeUndefined();
      expect((await headObject(String(o.key)))?.size).toBe(Number(o.size));
    }
    // The owner owns the copy; the other members came along; the copy's review links do not open (fresh secrets).
    const members = await db().select().from(s.memberships).where(eq(s.memberships.channelId, result.channelId));
    expect(members).toHaveLength(5);
    const [orig] = await db().select().from(s.guestLinks).innerJoin(s.deals, eq(s.deals.id, s.guestLinks.dealId)).where(eq(s.deals.channelId, w.channel.id));
    const [copy] = await db().select().from(s.guestLinks).innerJoin(s.deals, eq(s.deals.id, s.guestLinks.dealId)).where(eq(s.deals.channelId, result.channelId));
    expect(copy!.guest_links.tokenHash).not.toBe(orig!.guest_links.tokenHash);
  });

  it("through the route: the copy gets its name; only an owner of the exported channel may import it", async () => {
    const ok = await importZip(first, w.members.owner, "Workshop archive");
    expect(ok.status).toBe(201);
    const [ch] = await db().select().from(s.channels).where(eq(s.channels.id, ok.json.channelId));
    expect(ch!.name).toBe("Workshop archive");
    const before = await channelCount();
    expect((await importZip(first, w.members.presenter)).status).toBe(403);
    expect((await importZip(first, w.outsider)).status).toBe(404);
    const wrongType = await call415(first);
    expect(wrongType).toBe(400);
    expect(await channelCount()).toBe(before);
  });
});

async function call415(bytes: Buffer) {
  const req = new Request("http://127.0.0.1/api/channels/import", { method: "POST", headers: { cookie: await cookieFor(w.members.owner.id), "content-type": "application/json", origin: "http://127.0.0.1" }, body: new Blob([bytes as Uint8Array<ArrayBuffer>]) });
  return (await importRoute.POST(req, { params: Promise.resolve({}) })).status;
}

describe("refused files write nothing", () => {
  const refusedWith = async (bytes: Buffer, why: RegExp) => {
    const before = await channelCount();
    const r = await importZip(bytes, w.members.owner);
    expect(r.status).toBe(422);
    expect(r.json.error.message).toMatch(why);
    expect(await channelCount()).toBe(before);
  };

  it("a truncated file, cut at any of several points", async () => {
    for (const at of [0.2, 0.5, 0.9, 0.999]) await refusedWith(first.subarray(0, Math.floor(first.length * at)), /cut off|damaged/);
  });

  it("a changed record, with its checksum left as it was", async () => {
    const files = await entries(first);
    await refusedWith(
      await rezip(files, (name, text) => (name.endsWith("-episodes.ndjson") ? text.replace("A second episode", "A forged episode") : text)),
      /was changed after export/,
    );
  });

  it("a changed record with a recomputed checksum (the signature no longer matches)", async () => {
    const files = await entries(first);
    const name = [...files.keys()].find((k) => k.endsWith("-episodes.ndjson"))!;
    const forged = files.get(name)!.replace("A second episode", "A forged episode");
    const manifest = JSON.parse(files.get("manifest.json")!);
    manifest.body.files[name].sha256 = crypto.createHash("sha256").update(forged).digest("hex");
    await refusedWith(await rezip(files, (n, t) => (n === name ? forged : n === "manifest.json" ? JSON.stringify(manifest) : t)), /manifest was changed|signed by another/);
  });

  it("a missing table, an extra entry, or no manifest", async () => {
    const files = await entries(first);
    await refusedWith(await rezip(files, (n, t) => (n.endsWith("-shots.ndjson") ? null : t)), /not the table expected next/);
    await refusedWith(await rezip(files, (n, t) => (n === "manifest.json" ? null : t)), /ends before the manifest/);
    const extra = new Map([...files.entries()].flatMap(([n, t]) => (n === "objects.ndjson" ? [[n, t] as const, ["notes.txt", "hello"] as const] : [[n, t] as const])));
    await refusedWith(await rezip(extra, (_n, t) => t), /entry this format does not have/);
  });

  it("a stored object the exported channel does not reference", async () => {
    const files = await entries(first);
    const foreign = `channel/${w.other.id}/photo/${crypto.randomUUID()}.png`;
    await refusedWith(await rezip(files, (n, t) => (n === "objects.ndjson" ? `${t}${JSON.stringify({ key: foreign, size: 11, contentType: "image/png" })}\n` : t)), /not the exported channel's/);
  });

  it("not a zip at all", async () => {
    await refusedWith(Buffer.from("just some text, not a zip"), /cut off|damaged|header is missing|ends before/);
  });
});
