import { json, parseBody, route, sessionUser } from "@/lib/server/api";
import { loadClip } from "@/lib/server/clip-loader";
import { assertCan } from "@/lib/server/access";
import { partsRequestSchema } from "@/lib/schemas/footage";
import { listParts, presignParts } from "@/storage/multipart";
import { AppError } from "@/lib/server/errors";

type P = { clipId: string };

function uploading(clip: { state: string; uploadId: string | null; partSize: number | null }) {
  if (clip.state !== "uploading" || !clip.uploadId || !clip.partSize) throw new AppError("conflict:clip.stored", "This clip has finished uploading.");
  return { uploadId: clip.uploadId, partSize: clip.partSize };
}

/** The parts already in storage, so an interrupted upload resumes where it stopped. */
export const GET = route<P>(async (req, params) => {
  const user = await sessionUser(req);
  const { clip, access } = await loadClip(user.id, params.clipId);
  assertCan(access, "footage.manage");
  const { uploadId, partSize } = uploading(clip);
  const parts = await listParts(clip.storageKey, uploadId);
  return json({ partSize, partCount: Math.ceil(clip.sizeBytes / partSize), parts: parts.map((p) => ({ partNumber: p.PartNumber, size: p.Size })) });
});

/** Signs PUT URLs for parts of this upload (15 minutes); part numbers outside the file are refused. */
export const POST = route<P>(async (req, params) => {
  const { partNumbers } = await parseBody(req, partsRequestSchema, "parts");
  const user = await sessionUser(req);
  const { clip, access } = await loadClip(user.id, params.clipId);
  assertCan(access, "footage.manage");
  const { uploadId, partSize } = uploading(clip);
  const partCount = Math.ceil(clip.sizeBytes / partSize);
  const bad = partNumbers.filter((n) => n > partCount);
  if (bad.length) throw new AppError("validation:parts", `This file has ${partCount} parts; there is no part ${bad.join(", ")}.`, { fields: { partNumbers: [`must be between 1 and ${partCount}`] } });
  const expiresAt = new Date(Date.now() + 15 * 60 * 1000).toISOString();
  return json({ urls: await presignParts(clip.storageKey, uploadId, partNumbers), expiresAt });
});
