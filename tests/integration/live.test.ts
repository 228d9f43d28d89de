/**
 * Live updates through the event stream: a committed change arrives with the
 * records it touched, a rolled-back one never does, a reconnect with
 * Last-Event-ID gets what it missed, an episode stream sees only its episode,
 * and a member removed from the channel is told so and the stream ends.
 * (Across two app instances: tests/e2e/live.spec.ts.)
 */
import { beforeAll, describe, expect, it } from "vitest";
import { and, eq } from "drizzle-orm";
import * as liveRoute from "@/app/api/channels/[channelId]/live/route";
import { db } from "@/db/client";
import { episodes, memberships, scriptSegments } from "@/db/schema";
import { cookieFor, makeEpisode, makeUser, makeWorld } from "../support/fixtures";

type World = Awaited<ReturnType<typeof makeWorld>>;
let w: World;
beforeAll(async () => {
  w = await makeWorld();
});

interface Frame {
  event: string;
  id?: string;
  data: any;
}

/** Opens the stream as `user` and returns a reader of its events. */
async function open(user: { id: string }, opts: { episodeId?: string; lastEventId?: number } = {}) {
  const q = opts.episodeId ? `?episodeId=${opts.episodeId}` : "";
  const headers: Record<string, string> = { cookie: await cookieFor(user.id) };
  if (opts.lastEventId !== undefined) headers["last-event-id"] = String(opts.lastEventId);
  const res = await liveRoute.GET(new Request(`http://127.0.0.1/api/channels/${w.channel.id}/live${q}`, { headers }), { params: Promise.resolve({ channelId: w.channel.id }) });
  expect(res.status).toBe(200);
  expect(res.headers.get("content-type")).toMatch(/^text\/event-stream/);
  const reader = res.body!.getReader();
  const dec = new TextDecoder();
  let buf = "";
  let ended = false;
  const next = async (timeoutMs = 5000): Promise<Frame | null> => {
    const deadline = Date.now() + timeoutMs;
    for (;;) {
      const cut = buf.indexOf("\n\n");
      if (cut >= 0) {
        const raw = buf.slice(0, cut);
        buf = buf.slice(cut + 2);
        if (!raw || raw.startsWith(":") || raw.startsWith("retry:")) continue;
        const f: Frame = { event: "message", data: null };
        for (const line of raw.split("\n")) {
          const [k, ...v] = line.split(": ");
          if (k === "event") f.event = v.join(": ");
          else if (k === "id") f.id = v.join(": ");
          else if (k === "data") f.data = JSON.parse(v.join(": "));
        }
        return f;
      }
      if (ended) return null;
      const left = deadline - Date.now();
      if (left <= 0) return null;
      const r = await Promise.race([reader.read(), new Promise<"timeout">((res) => setTimeout(() => res("timeout"), left))]);
      if (r === "timeout") return null;
      if (r.done) ended = true;
      else buf += dec.decode(r.value);
    }
  };
  /** The next event with this name, skipping others. */
  const until = async (event: string, match: (f: Frame) => boolean = () => true, timeoutMs = 5000) => {
    const deadline = Date.now() + timeoutMs;
    for (;;) {
      const f = await next(Math.max(1, deadline - Date.now()));
      if (!f) return null;
      if (f.event === event && match(f)) return f;
    }
  };
  return { next, until, close: () => reader.cancel(), ended: () => ended };
}

describe("live updates", () => {
  it("a committed change arrives with its records; a rolled-back one never does", async () => {
    const s = await open(w.members.editor);
    expect(await s.until("ready")).not.toBeNull();
    await db()
      .transaction(async (tx) => {
        await tx.insert(episodes).values({ channelId: w.channel.id, title: "Never happened", stage: "idea", position: 90 });
        throw new Error("roll back");
      })
      .catch(() => undefined);
    const ep = await makeEpisode(w.channel.id, "idea", 91, "Hall tree");
    const f = await s.until("change", (x) => x.data.kind === "episodes");
    expect(f!.data).toMatchObject({ channelId: w.channel.id, kind: "episodes", op: "insert", recordIds: [ep.id] });
    expect(Number(f!.id)).toBeGreaterThan(0);
    await s.close();
  });

  it("a reconnect with Last-Event-ID gets what it missed, in order", async () => {
    const s = await open(w.members.editor);
    await s.until("ready");
    const a = await makeEpisode(w.channel.id, "idea", 92, "Missed one");
    const first = await s.until("change", (x) => x.data.recordIds.includes(a.id));
    await s.close();
    const b = await makeEpisode(w.channel.id, "idea", 93, "Missed two");
    const c = await makeEpisode(w.channel.id, "idea", 94, "Missed three");
    const again = await open(w.members.editor, { lastEventId: Number(first!.id) });
    const got: string[] = [];
    for (;;) {
      const f = await again.next();
      if (!f || f.event === "ready") break;
      if (f.event === "change" && f.data.kind === "episodes") got.push(...f.data.recordIds);
    }
    expect(got).toEqual([b.id, c.id]);
    await again.close();
  });

  it("an episode stream carries that episode's changes, not another's", async () => {
    const mine = await makeEpisode(w.channel.id, "planning", 95, "Mine");
    const other = await makeEpisode(w.channel.id, "planning", 96, "Other");
    const s = await open(w.members.editor, { episodeId: mine.id });
    await s.until("ready");
    await db().insert(scriptSegments).values({ episodeId: other.id, position: 0, kind: "voice_over", text: "not for you" });
    const [seg] = await db().insert(scriptSegments).values({ episodeId: mine.id, position: 0, kind: "voice_over", text: "for you" }).returning();
    const f = await s.until("change", (x) => x.data.kind === "script_segments");
    expect(f!.data).toMatchObject({ episodeId: mine.id, recordIds: [seg!.id] });
    await s.close();
  });

  it("a member removed from the channel is told and the stream ends", async () => {
    const temp = await makeUser("temp");
    await db().insert(memberships).values({ channelId: w.channel.id, userId: temp.id, roles: ["editor"] });
    const s = await open(temp);
    await s.until("ready");
    await db().delete(memberships).where(and(eq(memberships.channelId, w.channel.id), eq(memberships.userId, temp.id)));
    const f = await s.until("revoked");
    expect(f).not.toBeNull();
    expect(await s.next(2000)).toBeNull();
    expect(s.ended()).toBe(true);
  });

  it("another channel's member gets 404, and no session 401", async () => {
    const res = await liveRoute.GET(new Request(`http://127.0.0.1/api/channels/${w.channel.id}/live`, { headers: { cookie: await cookieFor(w.outsider.id) } }), { params: Promise.resolve({ channelId: w.channel.id }) });
    expect(res.status).toBe(404);
    const anon = await liveRoute.GET(new Request(`http://127.0.0.1/api/channels/${w.channel.id}/live`), { params: Promise.resolve({ channelId: w.channel.id }) });
    expect(anon.status).toBe(401);
  });
});
