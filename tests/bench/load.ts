/**
 * Load: a generated channel of 500 episodes, one of them with a 2,000-segment
 * script and 1,000 shots, served by a production build on loopback. Each
 * route takes 50 connections for BENCH_LOAD_SECONDS (default 30) with
 * autocannon; p50 and p99 latency are reported as ratios against a bare route
 * (GET /api/me: session and one row) measured the same way in the same run.
 * Goal: 0 errors, board/script/shot-list p50 within 3x of the bare route.
 * The routes serve cached bodies checked against revisions; a last line loads
 * the script while one of its segments is saved every second, so the body is
 * rebuilt under load.
 */
import { sql } from "drizzle-orm";
import autocannon from "autocannon";
import * as schema from "../../db/schema";
import { startBenchApp } from "./app";

const SECONDS = Number(process.env.BENCH_LOAD_SECONDS ?? 30);
const CONNECTIONS = 50;

export async function loadBench() {
  const bench = await startBenchApp({ name: "bench-load", port: 3302, basePort: 54379 });
  const { db, user, cookie, base } = bench;
  try {
    const [channel] = await db.insert(schema.channels).values({ name: "Load" }).returning();
    const c = channel!.id;
    await db.insert(schema.memberships).values({ channelId: c, userId: user.id, roles: ["owner"] });
    await db.execute(sql`insert into episodes (channel_id, title, stage, position) select ${c}, 'Load episode ' || g, (array['idea','planning','shooting','editing','review','scheduled','published'])[1 + g % 7], g / 7 from generate_series(1, 500) g`);
    const [big] = await db.select().from(schema.episodes).where(sql`channel_id = ${c}`).limit(1);
    const e = big!.id;
    await db.execute(sql`insert into script_segments (episode_id, position, kind, text, chapter_start, chapter_title) select ${e}, g, (array['to_camera','voice_over','sponsor_read','on_screen_text'])[1 + g % 4], repeat('Glue both faces, clamp above and below so the panel stays flat. ', 1 + g % 4), g % 200 = 0, case when g % 200 = 0 then 'Part ' || g else null end from generate_series(0, 1999) g`);
    await db.execute(sql`insert into shots (episode_id, kind, description, position) select ${e}, 'broll', 'Shot ' || g, g from generate_series(0, 999) g`);

    const run = (path: string) =>
      new Promise<autocannon.Result>((resolve, reject) => {
        autocannon({ url: `${base}${path}`, connections: CONNECTIONS, duration: SECONDS, headers: { cookie } }, (err, res) => (err ? reject(err) : resolve(res)));
      });
    // Warm each route once (compilation, caches), then measure.
    for (const p of ["/api/me", `/api/channels/${c}/episodes`, `/api/episodes/${e}/script`, `/api/episodes/${e}/shots`]) await fetch(`${base}${p}`, { headers: { cookie } });
    const bare = await run("/api/me");
    const line = (name: string, r: autocannon.Result) =>
      console.log(
        JSON.stringify({
          bench: `load: ${name}, ${CONNECTIONS} connections for ${SECONDS} s`,
          requests: r.requests.total,
          errors: r.errors + r.non2xx + r.timeouts,
          p50Ms: r.latency.p50,
          p99Ms: r.latency.p99,
          p50Ratio: +(r.latency.p50 / Math.max(bare.latency.p50, 0.5)).toFixed(2),
          p99Ratio: +(r.latency.p99 / Math.max(bare.latency.p99, 0.5)).toFixed(2),
          goal: "0 errors; p50 within 3x of the bare route",
        }),
      );
    line("bare route GET /api/me", bare);
    line("board of 500 episodes", await run(`/api/channels/${c}/episodes`));
    line("script of 2,000 segments", await run(`/api/episodes/${e}/script`));
    line("shot list of 1,000 shots", await run(`/api/episodes/${e}/shots`));
    // The same script while a segment is saved every second (as an autosave would), so the cached body is rebuilt each time.
    let n = 0;
    const saving = setInterval(() => void db.execute(sql`update script_segments set text = ${`Edited ${++n}: clamp above and below.`}, version = version + 1 where episode_id = ${e} and position = 1000`), 1000);
    try {
      line("script of 2,000 segments, one segment saved every second", await run(`/api/episodes/${e}/script`));
    } finally {
      clearInterval(saving);
    }
  } finally {
    await bench.stop();
  }
}

if (process.argv[1]?.endsWith("load.ts")) void loadBench();
