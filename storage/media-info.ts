/**
 * Reads a stored clip's technical metadata with MediaInfo (mediainfo.js,
 * WebAssembly) through ranged reads of the object: the file is never
 * downloaded whole.
 */
import mediaInfoFactory from "mediainfo.js";
import { readRange } from "./multipart";

export interface MediaMeta {
  durationMs: number | null;
  frameRate: string | null;
  width: number | null;
  height: number | null;
  startTimecode: string | null;
}

type Track = Record<string, unknown> & { "@type": string };

const num = (v: unknown) => (v == null || v === "" || Number.isNaN(Number(v)) ? null : Number(v));

export async function readMediaMeta(key: string, size: number): Promise<MediaMeta> {
  const mi = await mediaInfoFactory({ format: "object" });
  try {
    const result = (await mi.analyzeData(size, (chunkSize: number, offset: number) => readRange(key, offset, Math.min(chunkSize, size - offset)))) as unknown as {
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
  } finally {
    mi.close();
  }
}
