/**
 * Generated bad-input sweep over every JSON write route: bodies made from
 * the route's own zod schema with fast-check (through its JSON Schema), then
 * mutated: wrong types, missing and extra fields, 1 MB strings, NUL and other
 * control characters, unicode, numeric limits, arrays for objects, invalid
 * JSON and the wrong content type. No answer may be a 5xx, and a refused
 * request must leave the channel's data exactly as it was.
 */
import crypto from "node:crypto";
import fc from "fast-check";
import { z } from "zod";
import { sql } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { cookieFor, makeWorld } from "../support/fixtures";
import { listRoutes, paramsFor, recordsOfEveryKind, type RouteEntry } from "../support/routes";

interface Target extends RouteEntry {
  label: string;
  schema: z.ZodType;
}

// These change who may sign in, and have their own tests; the sweep leaves them alone.
const SKIP = new Set(["POST password-reset/route.ts", "POST password-reset/confirm/route.ts", "POST invitations/accept/route.ts"]);
const targets: Target[] = [];
let w: Awaited<ReturnType<typeof makeWorld>>;
let cookie = "";

beforeAll(async () => {
  for (const e of await listRoutes((file) => file.startsWith("auth/"))) {
    const schema = e.handler.spec?.body;
    const label = `${e.method} ${e.file}`;
    if (e.method !== "GET" && schema && !SKIP.has(label)) targets.push({ ...e, label, schema });
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
      const { ids, invitationId } = await recordsOfEveryKind(w.channel.id, w.members.owner.id);
      const params = paramsFor(t, ids, { invitationId, userId: w.members.producer.id });
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
    const foreign: string[] = Object.values((await recordsOfEveryKind(w.other.id, w.outsider.id)).ids);
    foreign.push(w.outsider.id);
    const problems: string[] = [];
    let named = 0;
    let refusedForTheId = 0;
    for (const t of targets) {
      if (!JSON.stringify(z.toJSONSchema(t.schema, { io: "input", unrepresentable: "any" })).includes('"uuid"')) continue;
      const { ids, invitationId } = await recordsOfEveryKind(w.channel.id, w.members.owner.id);
      const params = paramsFor(t, ids, { invitationId, userId: w.members.producer.id });
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
