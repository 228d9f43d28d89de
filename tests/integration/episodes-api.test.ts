import { beforeAll, describe, expect, it } from "vitest";
import { and, asc, eq, isNull } from "drizzle-orm";
import * as listRoute from "@/app/api/channels/[channelId]/episodes/route";
import * as oneRoute from "@/app/api/episodes/[episodeId]/route";
import * as channelsRoute from "@/app/api/channels/route";
import { db } from "@/db/client";
import { episodes } from "@/db/schema";
import type { Role } from "@/lib/roles";
import type { Stage } from "@/lib/stages";
import { call, makeEpisode, makeWorld } from "../support/fixtures";

type World = Awaited<ReturnType<typeof makeWorld>>;
let w: World;

beforeAll(async () => {
  w = await makeWorld();
});

const ROLES: Role[] = ["owner", "presenter", "editor", "producer", "sponsor_liaison"];

describe("unauthenticated requests get 401", () => {
  it.each([
    ["GET /api/channels", () => call(channelsRoute.GET as never, {})],
    ["GET episodes", () => call(listRoute.GET as never, { params: { channelId: w.channel.id } })],
    ["POST episodes", () => call(listRoute.POST as never, { method: "POST", params: { channelId: w.channel.id }, body: { title: "x" } })],
    ["GET episode", () => call(oneRoute.GET as never, { params: { episodeId: crypto.randomUUID() } })],
    ["PATCH episode", () => call(oneRoute.PATCH as never, { method: "PATCH", params: { episodeId: crypto.randomUUID() }, body: { title: "x" } })],
    ["DELETE episode", () => call(oneRoute.DELETE as never, { method: "DELETE", params: { episodeId: crypto.randomUUID() } })],
  ])("%s", async (_name, f) => {
    const r = await f();
    expect(r.status).toBe(401);
    expect(r.json.error.code).toBe("unauthenticated");
  });

  it("a forged session cookie is refused", async () => {
    const req = new Request("http://127.0.0.1/api/channels", { headers: { cookie: "next-auth.session-token=not-a-jwt" } });
    const res = await channelsRoute.GET(req, { params: Promise.resolve({}) });
    expect(res.status).toBe(401);
  });
});

describe("role matrix", () => {
  it("everyone in the channel reads the board; channels list shows roles", async () => {
    for (const role of ROLES) {
      const r = await call(listRoute.GET as never, { params: { channelId: w.channel.id }, user: w.members[role] });
      expect(r.status, role).toBe(200);
      const c = await call(channelsRoute.GET as never, { user: w.members[role] });
      expect(c.json.channels).toEqual([expect.objectContaining({ id: w.channel.id, roles: [role] })]);
    }
  });

  it.each(ROLES)("%s creating an episode", async (role) => {
    const r = await call(listRoute.POST as never, { method: "POST", params: { channelId: w.channel.id }, body: { title: `By ${role}` }, user: w.members[role] });
    const allowed = ["owner", "presenter", "producer"].includes(role);
    expect(r.status).toBe(allowed ? 201 : 403);
    if (!allowed) expect(r.json.error.code).toBe("forbidden:episode.create");
  });

  it.each(ROLES)("%s editing fields", async (role) => {
    const ep = await makeEpisode(w.channel.id, "planning", 90);
    const r = await call(oneRoute.PATCH as never, { method: "PATCH", params: { episodeId: ep.id }, body: { title: "Renamed" }, user: w.members[role] });
    expect(r.status).toBe(["owner", "presenter", "producer"].includes(role) ? 200 : 403);
  });

  it.each(ROLES)("%s archiving", async (role) => {
    const ep = await makeEpisode(w.channel.id, "idea", 90);
    const r = await call(oneRoute.DELETE as never, { method: "DELETE", params: { episodeId: ep.id }, user: w.members[role] });
    expect(r.status).toBe(["owner", "presenter", "producer"].includes(role) ? 200 : 403);
  });

  const moves: [Role, Stage, Stage, number][] = [
    ["owner", "idea", "scheduled", 200],
    // A blank episode fails the publish checklist (tests/integration/publish.test.ts covers the gate).
    ["owner", "idea", "published", 409],
    ["presenter", "planning", "shooting", 200],
    ["producer", "shooting", "editing", 200],
    ["editor", "editing", "review", 200],
    ["editor", "review", "editing", 200],
    ["editor", "shooting", "editing", 403],
    ["editor", "review", "scheduled", 403],
    ["sponsor_liaison", "review", "scheduled", 403],
    ["sponsor_liaison", "review", "review", 403],
  ];
  it.each(moves)("%s moving %s → %s answers %i", async (role, from, to, status) => {
    const ep = await makeEpisode(w.channel.id, from, 95);
    const r = await call(oneRoute.PATCH as never, { method: "PATCH", params: { episodeId: ep.id }, body: { stage: to, position: 0 }, user: w.members[role] });
    expect(r.status).toBe(status);
    const [after] = await db().select().from(episodes).where(eq(episodes.id, ep.id));
    expect(after!.stage).toBe(status === 200 ? to : from);
  });

  it("an editor may not rename while moving", async () => {
    const ep = await makeEpisode(w.channel.id, "editing", 96);
    const r = await call(oneRoute.PATCH as never, { method: "PATCH", params: { episodeId: ep.id }, body: { stage: "review", title: "sneaky" }, user: w.members.editor });
    expect(r.status).toBe(403);
    const [after] = await db().select().from(episodes).where(eq(episodes.id, ep.id));
    expect(after!.stage).toBe("editing");
  });

  it("a role removed in the database takes effect on the next request", async () => {
    const { memberships } = await import("@/db/schema");
    const w2 = await makeWorld();
    const ok = await call(listRoute.POST as never, { method: "POST", params: { channelId: w2.channel.id }, body: { title: "Before" }, user: w2.members.presenter });
    expect(ok.status).toBe(201);
    await db().update(memberships).set({ roles: ["sponsor_liaison"] }).where(and(eq(memberships.userId, w2.members.presenter.id), eq(memberships.channelId, w2.channel.id)));
    const refused = await call(listRoute.POST as never, { method: "POST", params: { channelId: w2.channel.id }, body: { title: "After" }, user: w2.members.presenter });
    expect(refused.status).toBe(403);
  });
});

describe("channel isolation: another channel's data is 404", () => {
  it("list and create in a channel I am not in", async () => {
    const list = await call(listRoute.GET as never, { params: { channelId: w.other.id }, user: w.members.owner });
    expect(list.status).toBe(404);
    const create = await call(listRoute.POST as never, { method: "POST", params: { channelId: w.other.id }, body: { title: "Intruder" }, user: w.members.owner });
    expect(create.status).toBe(404);
  });

  it("read, edit, move and archive an episode of another channel", async () => {
    const foreign = await makeEpisode(w.other.id, "planning", 0, "Not yours");
    for (const [handler, method, body] of [
      [oneRoute.GET, "GET", undefined],
      [oneRoute.PATCH, "PATCH", { title: "Mine now" }],
      [oneRoute.PATCH, "PATCH", { stage: "published" }],
      [oneRoute.DELETE, "DELETE", undefined],
    ] as const) {
      const r = await call(handler as never, { method, params: { episodeId: foreign.id }, body, user: w.members.owner });
      expect(r.status, method).toBe(404);
      expect(r.json.error.message).toBe("No such episode.");
    }
    const [still] = await db().select().from(episodes).where(eq(episodes.id, foreign.id));
    expect(still).toMatchObject({ title: "Not yours", stage: "planning", archivedAt: null });
  });

  it("the list never contains another channel's episodes", async () => {
    await makeEpisode(w.other.id, "idea", 1, "Outsider idea");
    const r = await call(listRoute.GET as never, { params: { channelId: w.channel.id }, user: w.members.owner });
    expect(r.json.episodes.every((e: { channelId: string }) => e.channelId === w.channel.id)).toBe(true);
  });

  it("malformed ids are 404, not 500", async () => {
    const r = await call(oneRoute.GET as never, { params: { episodeId: "../../etc" }, user: w.members.owner });
    expect(r.status).toBe(404);
    const l = await call(listRoute.GET as never, { params: { channelId: "1 or 1=1" }, user: w.members.owner });
    expect(l.status).toBe(404);
  });
});

describe("bad input answers 4xx with the field named", () => {
  it("missing title and wrong types", async () => {
    const r = await call(listRoute.POST as never, { method: "POST", params: { channelId: w.channel.id }, body: { title: "", targetRuntimeSeconds: "long", frameRate: "48" }, user: w.members.presenter });
    expect(r.status).toBe(400);
    expect(Object.keys(r.json.error.fields)).toEqual(expect.arrayContaining(["title", "targetRuntimeSeconds", "frameRate"]));
    expect(r.json.error.message).toMatch(/title/);
  });

  it("broken JSON", async () => {
    const r = await call(listRoute.POST as never, { method: "POST", params: { channelId: w.channel.id }, rawBody: "{title:", user: w.members.presenter });
    expect(r.status).toBe(400);
    expect(r.json.error.code).toBe("validation:json");
  });

  it("unknown fields are refused, not ignored", async () => {
    const r = await call(listRoute.POST as never, { method: "POST", params: { channelId: w.channel.id }, body: { title: "ok", channelId: w.other.id }, user: w.members.presenter });
    expect(r.status).toBe(400);
  });

  it("drop-frame at a rate that has none: 400 on create, 422 when the stored rate conflicts", async () => {
    const c = await call(listRoute.POST as never, { method: "POST", params: { channelId: w.channel.id }, body: { title: "t", frameRate: "25", dropFrame: true }, user: w.members.presenter });
    expect(c.status).toBe(400);
    expect(c.json.error.fields.dropFrame).toBeTruthy();
    const ep = await makeEpisode(w.channel.id, "idea", 97);
    await db().update(episodes).set({ frameRate: "29.97", dropFrame: true }).where(eq(episodes.id, ep.id));
    const p = await call(oneRoute.PATCH as never, { method: "PATCH", params: { episodeId: ep.id }, body: { frameRate: "25" }, user: w.members.presenter });
    expect(p.status).toBe(422);
    expect(p.json.error.fields.dropFrame).toBeTruthy();
  });

  it("bad filters", async () => {
    const r = await call(listRoute.GET as never, { path: "/x?month=2026-13", params: { channelId: w.channel.id }, user: w.members.owner });
    expect(r.status).toBe(400);
    expect(r.json.error.fields.month).toBeTruthy();
  });
});

describe("board order", () => {
  it("filters by stage and publish month", async () => {
    const w3 = await makeWorld();
    const mk = (title: string, stage: Stage, publishDate: string | null) =>
      call(listRoute.POST as never, { method: "POST", params: { channelId: w3.channel.id }, body: { title, stage, publishDate }, user: w3.members.owner });
    await mk("A", "editing", "2027-01-15");
    await mk("B", "editing", "2027-02-01");
    await mk("C", "idea", "2027-01-31");
    const byStage = await call(listRoute.GET as never, { path: "/x?stage=editing", params: { channelId: w3.channel.id }, user: w3.members.owner });
    expect(byStage.json.episodes.map((e: { title: string }) => e.title).sort()).toEqual(["A", "B"]);
    const byMonth = await call(listRoute.GET as never, { path: "/x?month=2027-01", params: { channelId: w3.channel.id }, user: w3.members.owner });
    expect(byMonth.json.episodes.map((e: { title: string }) => e.title).sort()).toEqual(["A", "C"]);
  });

  it("a move renumbers both columns densely", async () => {
    const w4 = await makeWorld();
    await makeEpisode(w4.channel.id, "planning", 0, "a");
    const b = await makeEpisode(w4.channel.id, "planning", 1, "b");
    await makeEpisode(w4.channel.id, "planning", 2, "c");
    await makeEpisode(w4.channel.id, "shooting", 0, "d");
    const r = await call(oneRoute.PATCH as never, { method: "PATCH", params: { episodeId: b.id }, body: { stage: "shooting", position: 0 }, user: w4.members.producer });
    expect(r.status).toBe(200);
    const rows = await db().select().from(episodes).where(eq(episodes.channelId, w4.channel.id)).orderBy(asc(episodes.stage), asc(episodes.position));
    const col = (s: string) => rows.filter((x) => x.stage === s).map((x) => [x.title, x.position]);
    expect(col("planning")).toEqual([["a", 0], ["c", 1]]);
    expect(col("shooting")).toEqual([["b", 0], ["d", 1]]);
  });

  it("concurrent moves keep every column dense and unique", async () => {
    const w5 = await makeWorld();
    const eps: Awaited<ReturnType<typeof makeEpisode>>[] = [];
    for (let i = 0; i < 12; i++) eps.push(await makeEpisode(w5.channel.id, "planning", i, `p${i}`));
    const stages: Stage[] = ["planning", "shooting", "editing"];
    const users = [w5.members.owner, w5.members.presenter, w5.members.producer];
    const results = await Promise.all(
      Array.from({ length: 36 }, (_, i) =>
        call(oneRoute.PATCH as never, {
          method: "PATCH",
          params: { episodeId: eps[i % eps.length]!.id },
          body: { stage: stages[(i * 7) % 3], position: (i * 5) % 6 },
          user: users[i % 3],
        }),
      ),
    );
    expect(results.every((r) => r.status === 200)).toBe(true);
    const rows = await db().select().from(episodes).where(and(eq(episodes.channelId, w5.channel.id), isNull(episodes.archivedAt)));
    expect(rows.length).toBe(12);
    for (const s of stages) {
      const positions = rows.filter((r) => r.stage === s).map((r) => r.position).sort((x, y) => x - y);
      expect(positions).toEqual(positions.map((_, i) => i));
    }
  });

  it("archived episodes leave the board and refuse moves", async () => {
    const w6 = await makeWorld();
    const e1 = await makeEpisode(w6.channel.id, "idea", 0, "gone");
    await makeEpisode(w6.channel.id, "idea", 1, "stays");
    const del = await call(oneRoute.DELETE as never, { method: "DELETE", params: { episodeId: e1.id }, user: w6.members.owner });
    expect(del.status).toBe(200);
    const again = await call(oneRoute.DELETE as never, { method: "DELETE", params: { episodeId: e1.id }, user: w6.members.owner });
    expect(again.status).toBe(409);
    const move = await call(oneRoute.PATCH as never, { method: "PATCH", params: { episodeId: e1.id }, body: { stage: "planning" }, user: w6.members.owner });
    expect(move.status).toBe(409);
    const list = await call(listRoute.GET as never, { params: { channelId: w6.channel.id }, user: w6.members.owner });
    expect(list.json.episodes).toEqual([expect.objectContaining({ title: "stays", position: 0 })]);
    const archived = await call(listRoute.GET as never, { path: "/x?archived=true", params: { channelId: w6.channel.id }, user: w6.members.owner });
    expect(archived.json.episodes).toEqual([expect.objectContaining({ title: "gone" })]);
    const restoreRoute = await import("@/app/api/episodes/[episodeId]/restore/route");
    expect((await call(restoreRoute.POST as never, { method: "POST", params: { episodeId: e1.id }, user: w6.members.editor })).status).toBe(403);
    expect((await call(restoreRoute.POST as never, { method: "POST", params: { episodeId: e1.id }, user: w6.outsider })).status).toBe(404);
    const back = await call(restoreRoute.POST as never, { method: "POST", params: { episodeId: e1.id }, user: w6.members.producer });
    expect(back.json.episode).toMatchObject({ archivedAt: null, stage: "idea", position: 1 });
    expect((await call(restoreRoute.POST as never, { method: "POST", params: { episodeId: e1.id }, user: w6.members.producer })).status).toBe(409);
  });
});
