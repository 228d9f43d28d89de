import "server-only";
/**
 * Reads a stored clip's technical metadata with MediaInfo (mediainfo.js,
 * WebAssembly) through ranged reads of the object: the file is never
 * downloaded whole.
 */
import mediaInfoFactory, { type MediaInfo } from "mediainfo.js";
import { readRange } from "./multipart";

export interface MediaMeta {
  durationMs: number | null;
  frameRate: string | null;
  width: number | null;
  height: number | null;
  startTimecode: string | null;
}

type Track = Record<string, unknown> & { "@type": string };

/** MediaInfo finds container headers near the start or the end; it never needs the whole file. */
const READ_BUDGET_BYTES = 4 * 1024 * 1024;
/** MediaInfo asks for small chunks; fetch whole blocks so one ranged GET serves many of them. */
const BLOCK = 256 * 1024;

const num = (v: unknown) => (v == null || v === "" || Number.isNaN(Number(v)) ? null : Number(v));

// One WebAssembly instance per process, compiled once; analyses take turns on it.
let instance: Promise<MediaInfo<"object">> | null = null;
let queue: Promise<unknown> = Promise.resolve();

export function readMediaMeta(key: string, size: number): Promise<MediaMeta> {
  const run = queue.then(() => analyse(key, size));
  queue = run.catch(() => {});
  return run;
}

async function analyse(key: string, size: number): Promise<MediaMeta> {
  instance ??= mediaInfoFactory({ format: "object" });
  const mi: MediaInfo<"object"> = await instance;
  let budget = READ_BUDGET_BYTES;
  const blocks = new Map<number, Uint8Array>();
  const block = async (i: number) => {
    let b = blocks.get(i);
    if (!b) {
      b = await readRange(key, i * BLOCK, Math.min(BLOCK, size - i * BLOCK));
      budget -= b.length;
      if (blocks.size > 8) blocks.delete(blocks.keys().next().value!);
      blocks.set(i, b);
    }
    return b;
  };
  try {
    const result = (await mi.analyzeData(size, async (chunkSize: number, offset: number) => {
      // An unknown format would make MediaInfo scan everything; an empty chunk ends the analysis.
      const n = Math.min(chunkSize, size - offset);
      if (n <= 0 || budget <= 0) return new Uint8Array();
      const out = new Uint8Array(n);
      let filled = 0;
      while (filled < n) {
        const at = offset + filled;
        const b = await block(Math.floor(at / BLOCK));
        const from = at % BLOCK;
        const take = Math.min(n - filled, b.length - from);
        if (take <= 0) break;
        out.set(b.subarray(from, from + take), filled);
        filled += take;
      }
      return out.subarray(0, filled);
    })) as unknown as {
      media?: { track?: Track[] };
    };
    const tracks = result.media?.track ?? [];
    const general = tracks.find((t) => t["@type"] === "General");
    const video = tracks.find((t) => t["@type"] === "Video");
    const tc = tracks.find((t) => t["@type"] === "Other" && typeof t.TimeCode_FirstFrame === "string") ?? video;
    const seconds = num(general?.Duration ?? video?.Duration);
    return {
      durationMs: seconds != null ? Math.round(seconds * 1000) : null,
      frameRate: video?.FrameRate != null ? String(video.FrameRate) : null,
      width: num(video?.Width),
      height: num(video?.Height),
      startTimecode: typeof tc?.TimeCode_FirstFrame === "string" ? tc.TimeCode_FirstFrame : null,
    };
  } catch (e) {
    // A broken instance is not reused.
    instance = null;
    throw e;
  }
}
