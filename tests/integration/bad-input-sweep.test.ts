/**
 * Generated bad-input sweep over every JSON write route: bodies made from
 * the route's own zod schema with fast-check (through its JSON Schema), then
 * mutated: wrong types, missing and extra fields, 1 MB strings, NUL and other
 * control characters, unicode, numeric limits, arrays for objects, invalid
 * JSON and the wrong content type. No answer may be a 5xx, and a refused
 * request must leave the channel's data exactly as it was.
 */
import fs from "node:fs";
import path from "node:path";
import crypto from "node:crypto";
import fc from "fast-check";
import { z } from "zod";
import { sql } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { buildSteps, clips, coverageRanges, gaps, materials, scriptRevisions, scriptSegments, shots, tools } from "@/db/schema";
import type { BuiltSpec, LoadKind } from "@/lib/server/route-builder";
import { cookieFor, makeEpisode, makeWorld } from "../support/fixtures";

const API = path.join(process.cwd(), "app", "api");
type Built = ((req: Request, ctx: { params: Promise<Record<string, string>> }) => Promise<Response>) & { spec?: BuiltSpec };
interface Target {
  label: string;
  method: string;
  handler: Built;
  params: string[];
  schema: z.ZodType;
}

function routeFiles(dir = API): string[] {
  return fs.readdirSync(dir, { withFileTypes: true }).flatMap((d) => (d.isDirectory() ? routeFiles(path.join(dir, d.name)) : d.name === "route.ts" ? [path.join(dir, d.name)] : []));
}

// Routes that mail or talk to storage on success are still swept; these only change who may sign in, so they are left to their own tests.
const SKIP = new Set(["POST password-reset/route.ts", "POST password-reset/confirm/route.ts", "POST invitations/accept/route.ts"]);
const targets: Target[] = [];
let w: Awaited<ReturnType<typeof makeWorld>>;
let cookie = "";

beforeAll(async () => {
  for (const abs of routeFiles()) {
    const file = path.relative(API, abs);
    if (file.startsWith("auth/")) continue;
    const mod = (await import(/* @vite-ignore */ abs)) as Record<string, Built>;
    for (const method of ["POST", "PUT", "PATCH", "DELETE"]) {
      const h = mod[method];
      const schema = h?.spec?.body;
      if (!h || !schema || SKIP.has(`${method} ${file}`)) continue;
      targets.push({ label: `${method} ${file}`, method, handler: h, params: [...file.matchAll(/\[(\w+)\]/g)].map((m) => m[1]!), schema });
    }
  }
  w = await makeWorld();
  cookie = await cookieFor(w.members.owner.id);
}, 60_000);

/**
 * A fast-check arbitrary for values of a JSON Schema, as zod writes them
 * (enough of the vocabulary for our schemas). `uuids`, when given, is where
 * every id in the body comes from.
 */
function arb(s: any, defs: Record<string, any>, depth = 0, uuids?: string[]): fc.Arbitrary<unknown> {
  if (!s || depth > 6) return fc.constant(null);
  if (s.$ref) return arb(defs[s.$ref.replace("#/$defs/", "")], defs, depth + 1, uuids);
  if (s.anyOf || s.oneOf) {
    const options = (s.anyOf ?? s.oneOf) as any[];
    // Naming a record is the point: prefer the id branch of "id or null".
    const ids = options.filter((x) => x.format === "uuid");
    return uuids && ids.length ? arb(ids[0], defs, depth + 1, uuids) : fc.oneof(...options.map((x: any) => arb(x, defs, depth + 1, uuids)));
  }
  if (s.enum) return fc.constantFrom(...s.enum);
  if (s.const !== undefined) return fc.constant(s.const);
  switch (s.type) {
    case "string":
      if (s.format === "uuid") return uuids ? fc.constantFrom(...uuids) : fc.uuid();
      if (s.format === "email") return fc.emailAddress();
      return fc.string({ minLength: s.minLength ?? 0, maxLength: Math.min(s.maxLength ?? 40, 40) });
    case "integer":
      return fc.integer({ min: Math.max(s.minimum ?? -1000, -1e6), max: Math.min(s.maximum ?? 1e6, 1e9) });
    case "number":
      return fc.double({ min: s.minimum ?? -1e6, max: s.maximum ?? 1e6, noNaN: true, noDefaultInfinity: true });
    case "boolean":
      return fc.boolean();
    case "null":
      return fc.constant(null);
    case "array":
      return fc.array(arb(s.items ?? {}, defs, depth + 1, uuids), { minLength: Math.max(s.minItems ?? 0, uuids && s.items?.format === "uuid" ? 1 : 0), maxLength: Math.min(s.maxItems ?? 3, 3) });
    case "object": {
      const props = Object.entries(s.properties ?? {});
      if (!props.length) return fc.constant({});
      const required = new Set(s.required ?? []);
      // With foreign ids, every id field is sent, so each one is tried.
      const idField = (v: any) => v?.format === "uuid" || v?.items?.format === "uuid" || (v?.anyOf ?? []).some((x: any) => x.format === "uuid");
      const keys = [...required, ...(uuids ? props.filter(([, v]) => idField(v)).map(([k]) => k) : [])].filter((k) => props.some(([p]) => p === k));
      return fc.record(Object.fromEntries(props.map(([k, v]) => [k, arb(v, defs, depth + 1, uuids)])), { requiredKeys: [...new Set(keys)] as never[] });
    }
    default:
      return fc.oneof(fc.string(), fc.integer(), fc.constant(null));
  }
}

const nasty = fc.oneof(
  fc.constant("\u0000"),
  fc.constant("a\u0000b"),
  fc.constant("\u0007\u001b[2J\u007f"),
  fc.constant("\u202Eevil\u2066"),
  fc.constant("x".repeat(1024 * 1024)),
  fc.string({ unit: "grapheme", maxLength: 30 }),
  fc.string({ unit: "binary", maxLength: 30 }),
  fc.constantFrom(Number.MAX_SAFE_INTEGER + 2, -Number.MAX_VALUE, Number.MAX_VALUE, -0, 1e308, -1, 2 ** 31, 0.1),
  fc.constant([]),
  fc.constant({}),
  fc.constant(true),
  fc.constant([{ a: 1 }]),
  fc.constant("00000000-0000-0000-0000-000000000000"),
  fc.constant(crypto.randomUUID()),
);

type Probe = { raw: string; contentType: string };
function probes(schema: z.ZodType): fc.Arbitrary<Probe> {
  const js = z.toJSONSchema(schema, { io: "input", unrepresentable: "any" }) as any;
  const root = js.$ref ? js.$defs[js.$ref.replace("#/$defs/", "")] : js;
  const valid = arb(root, js.$defs ?? {});
  const keys = Object.keys(root?.properties ?? { x: 1 });
  const mutated = fc.oneof(
    valid,
    fc.tuple(valid, fc.constantFrom(...keys), nasty).map(([v, k, bad]) => (v && typeof v === "object" && !Array.isArray(v) ? { ...v, [k]: bad } : { [k]: bad })),
    fc.tuple(valid, fc.constantFrom(...keys)).map(([v, k]) => {
      if (!v || typeof v !== "object" || Array.isArray(v)) return v;
      const { [k]: _drop, ...rest } = v as Record<string, unknown>;
      return rest;
    }),
    fc.tuple(valid, fc.string({ minLength: 1, maxLength: 12 }), nasty).map(([v, k, bad]) => ({ ...(v as object), [`extra_${k}`]: bad })),
    valid.map((v) => [v]),
    nasty,
  );
  return fc.oneof(
    { weight: 8, arbitrary: mutated.map((v) => ({ raw: JSON.stringify(v) ?? "null", contentType: "application/json" })) },
    { weight: 1, arbitrary: fc.constantFrom("{", '{"a":', "[1,", "\u0000", "nul", '{"x":"\\ud800"}').map((raw) => ({ raw, contentType: "application/json" })) },
    { weight: 1, arbitrary: valid.map((v) => ({ raw: JSON.stringify(v) ?? "{}", contentType: "text/plain" })) },
  );
}

async function records(channelId: string, userId: string) {
  const episode = await makeEpisode(channelId, "planning", 0, `Sweep ${crypto.randomUUID().slice(0, 6)}`);
  const [step] = await db().insert(buildSteps).values({ episodeId: episode.id, title: "Rip", position: 0 }).returning();
  const [material] = await db().insert(materials).values({ episodeId: episode.id, partName: "Rail", thickness: "1", width: "2", length: "30", position: 0 }).returning();
  const [tool] = await db().insert(tools).values({ channelId, name: "Rasp" }).returning();
  const [segment] = await db().insert(scriptSegments).values({ episodeId: episode.id, position: 0, kind: "voice_over", text: "One.", updatedBy: userId }).returning();
  const [shot] = await db().insert(shots).values({ episodeId: episode.id, kind: "broll", description: "Dust", position: 0 }).returning();
  const [clip] = await db().insert(clips).values({ channelId, episodeId: episode.id, storageKey: `channel/${channelId}/footage/${crypto.randomUUID()}.mp4`, originalName: "A.mp4", sizeBytes: 10, contentType: "video/mp4", createdBy: userId }).returning();
  const [gap] = await db().insert(gaps).values({ episodeId: episode.id, startFrame: 0, endFrame: 50, source: "marked", status: "open" }).returning();
  const [range] = await db().insert(coverageRanges).values({ episodeId: episode.id, startFrame: 0, endFrame: 25 }).returning();
  const [revision] = await db().insert(scriptRevisions).values({ episodeId: episode.id, segmentId: segment!.id, userId, before: null, after: { text: "One." } }).returning();
  const ids: Record<LoadKind, string> = { channel: channelId, episode: episode.id, step: step!.id, material: material!.id, tool: tool!.id, segment: segment!.id, clip: clip!.id, shot: shot!.id, gap: gap!.id, range: range!.id, revision: revision!.id };
  return ids;
}

/** Everything the sweep's channel owns, hashed table by table (other test files write to other channels meanwhile). */
async function snapshot(channelId: string) {
  const r = await db().execute(sql`
    with eps as (select id from episodes where channel_id = ${channelId})
    select
      (select md5(coalesce(string_agg(t::text, '|' order by t.id), '')) from episodes t where t.channel_id = ${channelId}) as episodes,
      (select md5(coalesce(string_agg(t::text, '|' order by t.id), '')) from build_steps t where t.episode_id in (select id from eps)) as steps,
      (select md5(coalesce(string_agg(t::text, '|' order by t.id), '')) from materials t where t.episode_id in (select id from eps)) as materials,
      (select md5(coalesce(string_agg(t::text, '|' order by t.id), '')) from script_segments t where t.episode_id in (select id from eps)) as segments,
      (select count(*) from script_revisions t where t.episode_id in (select id from eps)) as revisions,
      (select md5(coalesce(string_agg(t::text, '|' order by t.id), '')) from shots t where t.episode_id in (select id from eps)) as shots,
      (select md5(coalesce(string_agg(t::text, '|' order by t.id), '')) from clips t where t.channel_id = ${channelId}) as clips,
      (select md5(coalesce(string_agg(t::text, '|' order by t.id), '')) from gaps t where t.episode_id in (select id from eps)) as gaps,
      (select md5(coalesce(string_agg(t::text, '|' order by t.id), '')) from coverage_ranges t where t.episode_id in (select id from eps)) as ranges,
      (select md5(coalesce(string_agg(t::text, '|' order by t.id), '')) from tools t where t.channel_id = ${channelId}) as tools,
      (select md5(coalesce(string_agg(t::text, '|' order by t.user_id), '')) from memberships t where t.channel_id = ${channelId}) as members,
      (select md5(coalesce(string_agg(t::text, '|' order by t.id), '')) from invitations t where t.channel_id = ${channelId}) as invitations,
      (select md5(coalesce(string_agg(t::text, '|' order by t.id), '')) from channels t where t.id = ${channelId}) as channel,
      (select count(*) from pending_uploads t where t.channel_id = ${channelId}) as uploads`);
  return JSON.stringify(r.rows[0]);
}

describe("generated bad-input sweep", () => {
  it("finds JSON write routes to sweep", () => {
    expect(targets.length).toBeGreaterThan(25);
  });

  it("never answers 5xx, and a refused request changes nothing", async () => {
    const problems: string[] = [];
    for (const t of targets) {
      const ids = await records(w.channel.id, w.members.owner.id);
      const params: Record<string, string> = {};
      for (const p of t.params) params[p] = ids[p.replace(/Id$/, "") as LoadKind] ?? (p === "userId" ? w.members.producer.id : crypto.randomUUID());
      const samples = fc.sample(probes(t.schema), { numRuns: 12, seed: 20261202 });
      for (const probe of samples) {
        const before = await snapshot(w.channel.id);
        const req = new Request("http://127.0.0.1/x", { method: t.method, headers: { cookie, "content-type": probe.contentType }, body: probe.raw });
        const res = await t.handler(req, { params: Promise.resolve(params) });
        const text = await res.text();
        if (res.status >= 500) problems.push(`${t.label}: ${res.status} for ${probe.contentType} ${probe.raw.slice(0, 120)} → ${text.slice(0, 160)}`);
        else if (res.status >= 400 && (await snapshot(w.channel.id)) !== before) problems.push(`${t.label}: refused with ${res.status} but data changed, for ${probe.raw.slice(0, 120)}`);
      }
    }
    expect(problems).toEqual([]);
  }, 300_000);

  it("bodies naming another channel's records are refused and change nothing there", async () => {
    const foreign = Object.values(await records(w.other.id, w.outsider.id));
    foreign.push(w.outsider.id);
    const problems: string[] = [];
    let named = 0;
    let refusedForTheId = 0;
    for (const t of targets) {
      if (!JSON.stringify(z.toJSONSchema(t.schema, { io: "input", unrepresentable: "any" })).includes('"uuid"')) continue;
      const ids = await records(w.channel.id, w.members.owner.id);
      const params: Record<string, string> = {};
      for (const p of t.params) params[p] = ids[p.replace(/Id$/, "") as LoadKind] ?? (p === "userId" ? w.members.producer.id : crypto.randomUUID());
      const js = z.toJSONSchema(t.schema, { io: "input", unrepresentable: "any" }) as any;
      const root = js.$ref ? js.$defs[js.$ref.replace("#/$defs/", "")] : js;
      for (const body of fc.sample(arb(root, js.$defs ?? {}, 0, foreign), { numRuns: 15, seed: 20261203 })) {
        const theirs = await snapshot(w.other.id);
        const req = new Request("http://127.0.0.1/x", { method: t.method, headers: { cookie, "content-type": "application/json" }, body: JSON.stringify(body) });
        const res = await t.handler(req, { params: Promise.resolve(params) });
        const theirIds = JSON.stringify(body).match(/[0-9a-f]{8}-[0-9a-f-]{27}/g)?.filter((x) => foreign.includes(x)) ?? [];
        if (theirIds.length) named += 1;
        if (theirIds.length && [404, 409, 422].includes(res.status)) refusedForTheId += 1;
        if (theirIds.length && res.status < 400) problems.push(`${t.label}: accepted another channel's id (${res.status}) in ${JSON.stringify(body).slice(0, 160)}`);
        if ((await snapshot(w.other.id)) !== theirs) problems.push(`${t.label}: changed another channel's data`);
      }
    }
    expect(problems).toEqual([]);
    // The sweep really tried: many bodies named foreign records, and many got past validation to be refused for it.
    expect(named).toBeGreaterThan(100);
    expect(refusedForTheId).toBeGreaterThan(20);
  }, 300_000);
});
