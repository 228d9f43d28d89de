/**
 * Upload benchmark: the same file sent through Jigboard's flow (the app signs,
 * the client PUTs parts straight to storage) and through the AWS SDK's plain
 * multipart calls, to the same local store in the same run. Reports the
 * throughput ratio and the app server's peak RSS growth while the file moves.
 * BENCH_UPLOAD_BYTES overrides the 2 GiB default.
 */
import http from "node:http";
import crypto from "node:crypto";
import { S3Client, CreateMultipartUploadCommand, UploadPartCommand, CompleteMultipartUploadCommand, DeleteObjectCommand } from "@aws-sdk/client-s3";
import * as schema from "../../db/schema";
import { rssKiB, startBenchApp } from "./app";

const SIZE = Number(process.env.BENCH_UPLOAD_BYTES ?? 2 * 1024 ** 3);
const PART = 16 * 1024 * 1024;
const CONCURRENCY = 4;
const PORT = 3300;

/** PUTs one part with node:http, the same client stack the SDK uses, so the two flows differ only in who signs. */
const agent = new http.Agent({ keepAlive: true, maxSockets: 16 });
function putPart(url: string, body: Buffer): Promise<number> {
  return new Promise((resolve, reject) => {
    const req = http.request(url, { method: "PUT", agent, headers: { "content-length": body.length } }, (res) => {
      res.resume();
      res.on("end", () => resolve(res.statusCode ?? 0));
    });
    req.on("error", reject);
    req.end(body);
  });
}

async function pool<T>(items: T[], n: number, fn: (t: T) => Promise<void>) {
  const queue = [...items];
  await Promise.all(Array.from({ length: n }, async () => {
    while (queue.length) await fn(queue.shift()!);
  }));
}

export async function uploadBench() {
  const bench = await startBenchApp({ name: "bench", port: PORT, basePort: 54349, env: { UPLOAD_PART_BYTES: String(PART) } });
  const { services, db, app, cookie, user } = bench;
  try {
    const [channel] = await db.insert(schema.channels).values({ name: "Bench" }).returning();
    await db.insert(schema.memberships).values({ channelId: channel!.id, userId: user.id, roles: ["editor"] });
    const [episode] = await db.insert(schema.episodes).values({ channelId: channel!.id, title: "Bench", stage: "editing", position: 0 }).returning();
    const chunk = crypto.randomBytes(PART);
    const partBody = (n: number, count: number) => (n < count ? chunk : chunk.subarray(0, SIZE - PART * (count - 1)));
    const call = async (url: string, method: string, body?: unknown) => {
      const r = await fetch(`http://127.0.0.1:${PORT}${url}`, { method, headers: { cookie, "content-type": "application/json" }, body: body ? JSON.stringify(body) : undefined });
      if (!r.ok) throw new Error(`${method} ${url}: ${r.status} ${await r.text()}`);
      return r.json() as Promise<any>;
    };

    // Warm the app with one small upload (loads the storage client and MediaInfo), then measure its resting memory.
    const warm = await call(`/api/episodes/${episode!.id}/uploads`, "POST", { fileName: "warm.mp4", size: 1024, contentType: "video/mp4" });
    const warmUrl = (await call(`/api/clips/${warm.clip.id}/parts`, "POST", { partNumbers: [1] })).urls[0].url;
    await fetch(warmUrl, { method: "PUT", body: chunk.subarray(0, 1024) as unknown as BodyInit });
    await call(`/api/clips/${warm.clip.id}/complete`, "POST");
    await new Promise((r) => setTimeout(r, 500));
    const baseRss = rssKiB(app.pid!);
    let peakRss = baseRss;
    const sampler = setInterval(() => (peakRss = Math.max(peakRss, rssKiB(app!.pid!))), 100);

    const s3 = new S3Client({ endpoint: services.env.S3_ENDPOINT, region: "us-east-1", forcePathStyle: true, credentials: { accessKeyId: "S3RVER", secretAccessKey: "S3RVER" }, requestChecksumCalculation: "WHEN_REQUIRED", responseChecksumValidation: "WHEN_REQUIRED" });
    const Bucket = services.env.S3_BUCKET!;
    let count = 0;
    let completeMs = 0;

    const appRun = async () => {
      const t0 = performance.now();
      const started = await call(`/api/episodes/${episode!.id}/uploads`, "POST", { fileName: "bench.mp4", size: SIZE, contentType: "video/mp4" });
      count = started.partCount;
      const numbers = Array.from({ length: count }, (_, i) => i + 1);
      const urls = new Map<number, string>();
      for (let i = 0; i < numbers.length; i += 100) {
        const r = await call(`/api/clips/${started.clip.id}/parts`, "POST", { partNumbers: numbers.slice(i, i + 100) });
        for (const u of r.urls) urls.set(u.partNumber, u.url);
      }
      await pool(numbers, CONCURRENCY, async (n) => {
        const status = await putPart(urls.get(n)!, partBody(n, count));
        if (status !== 200) throw new Error(`part ${n}: ${status}`);
      });
      const tComplete = performance.now();
      await call(`/api/clips/${started.clip.id}/complete`, "POST");
      completeMs = Math.max(completeMs, performance.now() - tComplete);
      const ms = performance.now() - t0;
      await call(`/api/clips/${started.clip.id}`, "DELETE");
      return ms;
    };

    // The same bytes with the SDK's own multipart calls, same part size and concurrency.
    const sdkRun = async () => {
      const Key = `bench/sdk-${crypto.randomUUID()}.bin`;
      const numbers = Array.from({ length: count || Math.ceil(SIZE / PART) }, (_, i) => i + 1);
      const t1 = performance.now();
      const { UploadId } = await s3.send(new CreateMultipartUploadCommand({ Bucket, Key }));
      const etags = new Map<number, string>();
      await pool(numbers, CONCURRENCY, async (n) => {
        const r = await s3.send(new UploadPartCommand({ Bucket, Key, UploadId, PartNumber: n, Body: partBody(n, numbers.length) }));
        etags.set(n, r.ETag!);
      });
      await s3.send(new CompleteMultipartUploadCommand({ Bucket, Key, UploadId, MultipartUpload: { Parts: numbers.map((n) => ({ PartNumber: n, ETag: etags.get(n) })) } }));
      const ms = performance.now() - t1;
      await s3.send(new DeleteObjectCommand({ Bucket, Key }));
      return ms;
    };

    // Interleaved (app, SDK, SDK, app) so disk-cache warmth favours neither side.
    const app1 = await appRun();
    const sdk1 = await sdkRun();
    const sdk2 = await sdkRun();
    const app2 = await appRun();
    clearInterval(sampler);
    const appMs = (app1 + app2) / 2;
    const sdkMs = (sdk1 + sdk2) / 2;

    const mib = SIZE / 1024 / 1024;
    console.log(
      JSON.stringify({
        bench: `upload ${mib.toFixed(0)} MiB in ${count} parts (mean of two runs each)`,
        appMiBps: +(mib / (appMs / 1000)).toFixed(1),
        sdkMiBps: +(mib / (sdkMs / 1000)).toFixed(1),
        throughputRatio: +(sdkMs / appMs).toFixed(3),
        goalRatio: 0.8,
        appCompleteMs: Math.round(completeMs),
        appServerRssGrowthMiB: +((peakRss - baseRss) / 1024).toFixed(1),
        goalRssGrowthMiB: 50,
      }),
    );
  } finally {
    await bench.stop();
  }
}

if (process.argv[1]?.endsWith("upload.ts")) void uploadBench();
