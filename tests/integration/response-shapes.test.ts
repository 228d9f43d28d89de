/**
 * Generated: every documented GET route is called as the channel's owner on
 * fresh records, and its JSON answer must match the response schema the
 * OpenAPI document (and the browser's types) use, with no property the
 * schema does not name. One shape per resource, checked at the source.
 */
import { beforeAll, describe, expect, it } from "vitest";
import { z } from "zod";
import { ROUTES } from "@/lib/openapi";
import { call, makeWorld } from "../support/fixtures";
import { listRoutes, paramsFor, recordsOfEveryKind, type RouteEntry } from "../support/routes";

let entries: RouteEntry[] = [];
let w: Awaited<ReturnType<typeof makeWorld>>;

beforeAll(async () => {
  entries = (await listRoutes((f) => f.startsWith("auth/"))).filter((e) => e.method === "GET");
  w = await makeWorld();
}, 60_000);

// The fixture's clip is already stored, so asking for its parts is refused as it should be.
// A made-up review token is "not found"; sponsors-review.test.ts checks the guest view against its schema.
const REFUSED = new Map([["clips/[clipId]/parts/route.ts", 409], ["review/[token]/route.ts", 404]]);

const apiPath = (file: string) => "/api/" + file.replace(/\/?route\.ts$/, "").replace(/\[(\w+)\]/g, "{$1}");

/** Properties in `value` that the parsed (stripped) copy lost: keys the schema does not declare. */
function undeclared(value: unknown, parsed: unknown, at = "$"): string[] {
  if (Array.isArray(value) && Array.isArray(parsed)) return value.flatMap((v, i) => undeclared(v, parsed[i], `${at}[${i}]`));
  if (value && typeof value === "object" && parsed && typeof parsed === "object") {
    return Object.keys(value).flatMap((k) => (k in parsed ? undeclared((value as any)[k], (parsed as any)[k], `${at}.${k}`) : [`${at}.${k}`]));
  }
  return [];
}

describe("response shapes", () => {
  it("every JSON GET answers exactly its documented schema", async () => {
    const problems: string[] = [];
    let checked = 0;
    for (const e of entries) {
      const doc = ROUTES.find((r) => r.method === "get" && r.path === apiPath(e.file));
      if (!doc) {
        problems.push(`${e.file}: not in the OpenAPI document`);
        continue;
      }
      if (doc.response instanceof z.ZodString) continue; // CSV and text exports
      const { ids, invitationId } = await recordsOfEveryKind(w.channel.id, w.members.owner.id);
      const params = paramsFor(e, ids, { invitationId, userId: w.members.producer.id });
      const query = e.file === "mailbox/route.ts" ? `?channelId=${w.channel.id}` : "";
      const r = await call(e.handler as never, { method: "GET", params, user: w.members.owner, path: `/x${query}` });
      if (REFUSED.get(e.file) === r.status) continue;
      if (r.status !== 200) {
        problems.push(`${e.file}: ${r.status} ${JSON.stringify(r.json).slice(0, 160)}`);
        continue;
      }
      const parsed = doc.response.safeParse(r.json);
      if (!parsed.success) {
        problems.push(`${e.file}: ${parsed.error.issues.map((i) => `${i.path.join(".")} ${i.message}`).join("; ")}`);
        continue;
      }
      const extra = undeclared(r.json, parsed.data);
      if (extra.length && !(doc.response instanceof z.ZodObject && doc.response.def.catchall)) problems.push(`${e.file}: undeclared ${extra.slice(0, 5).join(", ")}`);
      checked++;
    }
    expect(problems).toEqual([]);
    expect(checked).toBeGreaterThan(12);
  }, 120_000);
});
