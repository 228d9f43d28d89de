import { channelRoute } from "@/lib/server/http/route-builder";
import { json } from "@/lib/server/http/api";
import { partsRequestSchema } from "@/lib/schemas/footage";
import { listParts, presignParts } from "@/storage/multipart";
import { AppError } from "@/lib/server/http/errors";

function uploading(clip: { state: string; uploadId: string | null; partSize: number | null }) {
  if (clip.state !== "uploading" || !clip.uploadId || !clip.partSize) throw new AppError("conflict:clip.stored", "This clip has finished uploading.");
  return { uploadId: clip.uploadId, partSize: clip.partSize };
}

/** The parts already in storage, so an interrupted upload resumes where it stopped. */
export const GET = channelRoute({ load: "clip", action: "footage.manage" }, async ({ clip }) => {
  const { uploadId, partSize } = uploading(clip);
  const parts = await listParts(clip.storageKey, uploadId);
  return json({ partSize, partCount: Math.ceil(clip.sizeBytes / partSize), parts: parts.map((p) => ({ partNumber: p.PartNumber, size: p.Size })) });
});

/** Signs PUT URLs for parts of this upload (15 minutes); part numbers outside the file are refused. */
export const POST = channelRoute({ load: "clip", action: "footage.manage", body: partsRequestSchema, what: "parts" }, async ({ clip, body }) => {
  const { partNumbers } = body;
  const { uploadId, partSize } = uploading(clip);
  const partCount = Math.ceil(clip.sizeBytes / partSize);
  const bad = partNumbers.filter((n) => n > partCount);
  if (bad.length) throw new AppError("validation:parts", `This file has ${partCount} parts; there is no part ${bad.join(", ")}.`, { fields: { partNumbers: [`must be between 1 and ${partCount}`] } });
  const expiresAt = new Date(Date.now() + 15 * 60 * 1000).toISOString();
  return json({ urls: await presignParts(clip.storageKey, uploadId, partNumbers), expiresAt });
});
