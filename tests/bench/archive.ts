/**
 * Channel export and import benchmark: a small channel and one ten times its
 * size (records), each with the same large stored footage file, exported and
 * imported through the app server in the same run. Reports time and the app
 * server's peak RSS growth for both, and the large-to-small ratios: constant
 * memory means the RSS ratio stays near 1 while the time ratio grows with the
 * records. BENCH_ARCHIVE_FOOTAGE_BYTES overrides the 512 MiB footage default;
 * BENCH_ARCHIVE_SCALE the record count (default 3,500 small, 35,000 large).
 */
import crypto from "node:crypto";
import { sql } from "drizzle-orm";
import { S3Client, CreateMultipartUploadCommand, UploadPartCommand, CompleteMultipartUploadCommand, CopyObjectCommand } from "@aws-sdk/client-s3";
import * as schema from "../../db/schema";
import { rssKiB, startBenchApp } from "./app";

const FOOTAGE = Number(process.env.BENCH_ARCHIVE_FOOTAGE_BYTES ?? 512 * 1024 ** 2);
const SCALE = Number(process.env.BENCH_ARCHIVE_SCALE ?? 1000);
const PART = 64 * 1024 ** 2;

export async function archiveBench() {
  const bench = await startBenchApp({ name: "bench-archive", port: 3301, basePort: 54359 });
  const { services, db, app, cookie, user, base } = bench;
  try {
    const s3 = new S3Client({ endpoint: services.env.S3_ENDPOINT, region: "us-east-1", forcePathStyle: true, credentials: { accessKeyId: "S3RVER", secretAccessKey: "S3RVER" }, requestChecksumCalculation: "WHEN_REQUIRED", responseChecksumValidation: "WHEN_REQUIRED" });
    const Bucket = services.env.S3_BUCKET!;
    // One large footage object, uploaded once; each channel gets its own copy made inside storage.
    const masterKey = `bench/master-${crypto.randomUUID()}.mp4`;
    const { UploadId } = await s3.send(new CreateMultipartUploadCommand({ Bucket, Key: masterKey, ContentType: "video/mp4" }));
    const chunk = crypto.randomBytes(Math.min(PART, FOOTAGE));
    const parts: { PartNumber: number; ETag: string }[] = [];
    for (let n = 1, left = FOOTAGE; left > 0; n++, left -= chunk.length) {
      const r = await s3.send(new UploadPartCommand({ Bucket, Key: masterKey, UploadId, PartNumber: n, Body: left >= chunk.length ? chunk : chunk.subarray(0, left) }));
      parts.push({ PartNumber: n, ETag: r.ETag! });
    }
    await s3.send(new CompleteMultipartUploadCommand({ Bucket, Key: masterKey, UploadId, MultipartUpload: { Parts: parts } }));

    /** A channel with `k` thousand-record units: episodes, script segments, shots and cut-list rows, and one footage clip. */
    const makeChannel = async (name: string, k: number) => {
      const [channel] = await db.insert(schema.channels).values({ name }).returning();
      const c = channel!.id;
      await db.insert(schema.memberships).values({ channelId: c, userId: user.id, roles: ["owner"] });
      const episodes = Math.max(5, Math.round(k / 2));
      await db.execute(sql`insert into episodes (channel_id, title, stage, position) select ${c}, 'Bench episode ' || g, 'planning', g from generate_series(1, ${episodes}) g`);
      const each = (n: number) => sql`(select id, row_number() over () as r from episodes where channel_id = ${c}) e, generate_series(1, ${Math.ceil(n / episodes)}) g`;
      await db.execute(sql`insert into script_segments (episode_id, position, kind, text) select e.id, g, 'voice_over', repeat('Plane the edge square, then check it with the try square. ', 3) from ${each(k * 2)}`);
      await db.execute(sql`insert into shots (episode_id, kind, description, position) select e.id, 'broll', 'Shavings off the edge, close', g from ${each(k)}`);
      await db.execute(sql`insert into materials (episode_id, part_name, material, thickness, width, length, position) select e.id, 'Rail ' || g, 'White oak', 0.75, 3.5, 36, g from ${each(k / 2)}`);
      const [ep] = await db.select().from(schema.episodes).where(sql`channel_id = ${c}`).limit(1);
      const key = `channel/${c}/footage/${crypto.randomUUID()}.mp4`;
      await s3.send(new CopyObjectCommand({ Bucket, Key: key, CopySource: `${Bucket}/${masterKey}` }));
      await db.insert(schema.clips).values({ channelId: c, episodeId: ep!.id, storageKey: key, originalName: "A001_C001.mp4", sizeBytes: FOOTAGE, contentType: "video/mp4", createdBy: user.id });
      const [{ n }] = (await db.execute<{ n: number }>(sql`select (select count(*) from episodes where channel_id = ${c}) + (select count(*) from script_segments s join episodes e on e.id = s.episode_id where e.channel_id = ${c}) + (select count(*) from shots s join episodes e on e.id = s.episode_id where e.channel_id = ${c}) + (select count(*) from materials s join episodes e on e.id = s.episode_id where e.channel_id = ${c}) as n`)).rows as [{ n: number }];
      return { id: c, records: Number(n) };
    };

    const measure = async <T>(fn: () => Promise<T>) => {
      await new Promise((r) => setTimeout(r, 300));
      const baseRss = rssKiB(app.pid!);
      let peak = baseRss;
      const sampler = setInterval(() => (peak = Math.max(peak, rssKiB(app.pid!))), 50);
      const t0 = performance.now();
      const out = await fn();
      const ms = performance.now() - t0;
      clearInterval(sampler);
      return { out, ms, rssGrowthMiB: (peak - baseRss) / 1024 };
    };

    const exportOf = async (channelId: string) => {
      const r = await fetch(`${base}/api/channels/${channelId}/export`, { headers: { cookie } });
      if (!r.ok) throw new Error(`export ${r.status}`);
      const chunks: Buffer[] = [];
      for await (const c of r.body as unknown as AsyncIterable<Uint8Array>) chunks.push(Buffer.from(c));
      return Buffer.concat(chunks);
    };
    const importOf = async (zip: Buffer) => {
      const r = await fetch(`${base}/api/channels/import`, { method: "POST", headers: { cookie, "content-type": "application/zip", origin: base }, body: new Blob([zip as Uint8Array<ArrayBuffer>]) });
      if (r.status !== 201) throw new Error(`import ${r.status} ${await r.text()}`);
      return r.json() as Promise<{ rows: number; objects: number }>;
    };

    const small = await makeChannel("Bench small", SCALE);
    const large = await makeChannel("Bench large", SCALE * 10);
    // Warm both paths once (route compilation, storage client), then measure.
    const warmZip = await exportOf(small.id);
    await importOf(warmZip);
    const es = await measure(() => exportOf(small.id));
    const el = await measure(() => exportOf(large.id));
    const is = await measure(() => importOf(es.out));
    const il = await measure(() => importOf(el.out));
    const footageMiB = FOOTAGE / 1024 ** 2;
    const line = (what: string, s: typeof es | typeof is, l: typeof el | typeof il, extra: object) =>
      console.log(
        JSON.stringify({
          bench: `channel ${what}: ${small.records.toLocaleString("en")} vs ${large.records.toLocaleString("en")} records, ${footageMiB.toFixed(0)} MiB footage each`,
          smallMs: Math.round(s.ms),
          largeMs: Math.round(l.ms),
          timeRatio: +(l.ms / s.ms).toFixed(2),
          smallRssGrowthMiB: +s.rssGrowthMiB.toFixed(1),
          largeRssGrowthMiB: +l.rssGrowthMiB.toFixed(1),
          rssGrowthRatio: +(Math.max(l.rssGrowthMiB, 1) / Math.max(s.rssGrowthMiB, 1)).toFixed(2),
          goal: "RSS growth ratio near 1 (memory does not grow with the channel); footage never passes through the app",
          ...extra,
        }),
      );
    line("export", es, el, { smallZipKiB: Math.round(es.out.length / 1024), largeZipKiB: Math.round(el.out.length / 1024) });
    line("import", is, il, { objectsCopied: il.out.objects });
  } finally {
    await bench.stop();
  }
}

if (process.argv[1]?.endsWith("archive.ts")) void archiveBench();
