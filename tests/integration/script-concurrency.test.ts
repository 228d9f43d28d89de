/**
 * Script writes racing each other: every answer is a success or a clean
 * refusal (404 gone, 409 changed), never a 500, and the positions stay a
 * dense 0..n-1 afterwards. Each write locks the episode first, then its rows.
 */
import { beforeAll, describe, expect, it } from "vitest";
import { asc, eq } from "drizzle-orm";
import * as scriptRoute from "@/app/api/episodes/[episodeId]/script/route";
import * as orderRoute from "@/app/api/episodes/[episodeId]/script/order/route";
import * as segmentRoute from "@/app/api/segments/[segmentId]/route";
import * as splitRoute from "@/app/api/segments/[segmentId]/split/route";
import { db } from "@/db/client";
import { scriptSegments } from "@/db/schema";
import { call, makeEpisode, makeWorld } from "../support/fixtures";

type World = Awaited<ReturnType<typeof makeWorld>>;
let w: World;
let episodeId: string;
const OK = new Set([200, 201, 404, 409]);

beforeAll(async () => {
  w = await makeWorld();
  episodeId = (await makeEpisode(w.channel.id, "planning", 0, "Race")).id;
});

const segments = async () => db().select().from(scriptSegments).where(eq(scriptSegments.episodeId, episodeId)).orderBy(asc(scriptSegments.position));
const add = (text: string) => call(scriptRoute.POST as never, { method: "POST", params: { episodeId }, body: { kind: "voice_over", text }, user: w.members.presenter });

describe("concurrent script writes", () => {
  it("split‖delete, save‖create and delete‖reorder: 240 requests, only successes and clean refusals", async () => {
    for (let i = 0; i < 12; i++) await add(`Start ${i} and then the rest of it`);
    const statuses: number[] = [];
    for (let round = 0; round < 10; round++) {
      const rows = await segments();
      const [a, b, c, d] = [rows[0]!, rows[1]!, rows[2]!, rows[rows.length - 1]!];
      const ids = rows.map((r) => r.id).reverse();
      const batch = await Promise.all([
        // split ‖ delete on the same segment
        call(splitRoute.POST as never, { method: "POST", params: { segmentId: a.id }, body: { version: a.version, before: "Start", after: "and then the rest" }, user: w.members.presenter }),
        call(segmentRoute.DELETE as never, { method: "DELETE", params: { segmentId: a.id }, user: w.members.presenter }),
        // save ‖ create
        call(segmentRoute.PATCH as never, { method: "PATCH", params: { segmentId: b.id }, body: { version: b.version, text: `Saved in round ${round}` }, user: w.members.presenter }),
        add(`Created in round ${round}`),
        // delete ‖ reorder
        call(segmentRoute.DELETE as never, { method: "DELETE", params: { segmentId: c.id }, user: w.members.presenter }),
        call(orderRoute.PUT as never, { method: "PUT", params: { episodeId }, body: { ids }, user: w.members.presenter }),
        // and the same pairs once more, crossed
        call(segmentRoute.PATCH as never, { method: "PATCH", params: { segmentId: d.id }, body: { version: d.version, text: `Last, round ${round}` }, user: w.members.presenter }),
        call(splitRoute.POST as never, { method: "POST", params: { segmentId: d.id }, body: { version: d.version, before: "Last", after: "part" }, user: w.members.presenter }),
        call(orderRoute.PUT as never, { method: "PUT", params: { episodeId }, body: { ids: rows.map((r) => r.id) }, user: w.members.presenter }),
        add(`Another in round ${round}`),
        call(segmentRoute.DELETE as never, { method: "DELETE", params: { segmentId: b.id }, user: w.members.presenter }),
        add(`Third in round ${round}`),
        call(segmentRoute.PATCH as never, { method: "PATCH", params: { segmentId: c.id }, body: { version: c.version, text: "too late" }, user: w.members.presenter }),
        call(splitRoute.POST as never, { method: "POST", params: { segmentId: b.id }, body: { version: b.version, before: "x", after: "y" }, user: w.members.presenter }),
        call(orderRoute.PUT as never, { method: "PUT", params: { episodeId }, body: { ids }, user: w.members.presenter }),
        add(`Fourth in round ${round}`),
        call(segmentRoute.DELETE as never, { method: "DELETE", params: { segmentId: d.id }, user: w.members.presenter }),
        add(`Fifth in round ${round}`),
        call(segmentRoute.PATCH as never, { method: "PATCH", params: { segmentId: a.id }, body: { version: a.version, text: "raced" }, user: w.members.presenter }),
        call(orderRoute.PUT as never, { method: "PUT", params: { episodeId }, body: { ids: rows.map((r) => r.id) }, user: w.members.presenter }),
        add(`Sixth in round ${round}`),
        call(segmentRoute.DELETE as never, { method: "DELETE", params: { segmentId: a.id }, user: w.members.presenter }),
        add(`Seventh in round ${round}`),
        call(segmentRoute.PATCH as never, { method: "PATCH", params: { segmentId: d.id }, body: { version: d.version, text: "again" }, user: w.members.presenter }),
      ]);
      statuses.push(...batch.map((r) => r.status));
    }
    expect(statuses).toHaveLength(240);
    const unexpected = statuses.filter((s) => !OK.has(s));
    expect(unexpected).toEqual([]);
    // Positions stay dense and unique.
    const rows = await segments();
    expect(rows.map((r) => r.position)).toEqual(rows.map((_, i) => i));
  });
});
