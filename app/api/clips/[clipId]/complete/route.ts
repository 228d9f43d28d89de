import { channelRoute } from "@/lib/server/http/route-builder";
import { json } from "@/lib/server/http/api";
import { completeUpload, listParts, objectSize } from "@/storage/multipart";
import { readMediaMeta } from "@/storage/media-info";
import { finishClip } from "@/lib/server/services/footage";
import { toClipDto } from "@/lib/server/views/shots";
import { AppError } from "@/lib/server/http/errors";

/**
 * Finishes an upload. The server lists the stored parts itself and checks
 * that every part is there with the right size before asking storage to join
 * them; then it reads the clip's metadata with ranged reads.
 */
export const POST = channelRoute({ load: "clip", action: "footage.manage" }, async ({ clip }) => {
  if (clip.state !== "uploading" || !clip.uploadId || !clip.partSize) throw new AppError("conflict:clip.stored", "This clip has already finished uploading.");
  const partCount = Math.ceil(clip.sizeBytes / clip.partSize);
  const parts = (await listParts(clip.storageKey, clip.uploadId)).sort((a, b) => (a.PartNumber ?? 0) - (b.PartNumber ?? 0));
  const expectedSize = (n: number) => (n < partCount ? clip.partSize! : clip.sizeBytes - clip.partSize! * (partCount - 1));
  const missing: number[] = [];
  for (let n = 1; n <= partCount; n++) {
    const p = parts.find((x) => x.PartNumber === n);
    if (!p || p.Size !== expectedSize(n)) missing.push(n);
  }
  if (missing.length) {
    throw new AppError("conflict:clip.parts", `Parts ${missing.slice(0, 10).join(", ")}${missing.length > 10 ? "…" : ""} are missing or incomplete; upload them, then finish again.`, {
      fields: { parts: [`${missing.length} of ${partCount} parts missing or the wrong size`] },
    });
  }
  const { etag } = await completeUpload(clip.storageKey, clip.uploadId, parts.filter((p) => (p.PartNumber ?? 0) <= partCount));
  const stored = await objectSize(clip.storageKey);
  if (stored !== clip.sizeBytes) throw new AppError("conflict:clip.size", `Storage holds ${stored ?? 0} bytes but the file has ${clip.sizeBytes}.`);
  let meta = {};
  if (/^(video|audio)\//.test(clip.contentType) || clip.contentType === "application/mxf") {
    meta = await readMediaMeta(clip.storageKey, clip.sizeBytes).catch((e: Error) => {
      console.error("[clips] metadata not read", e.message);
      return {};
    });
  }
  const row = await finishClip({ clip, meta: { ...meta, checksum: etag ? `s3-etag:${etag}` : null } });
  if (!row) throw new AppError("conflict:clip.stored", "This clip was finished a moment ago.");
  return json({ clip: toClipDto(row) });
});
