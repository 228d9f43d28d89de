import "server-only";
import {
  AbortMultipartUploadCommand,
  CompleteMultipartUploadCommand,
  CreateMultipartUploadCommand,
  DeleteObjectCommand,
  GetObjectCommand,
  HeadObjectCommand,
  ListMultipartUploadsCommand,
  ListPartsCommand,
  UploadPartCommand,
  type Part,
} from "@aws-sdk/client-s3";
import { getSignedUrl } from "@aws-sdk/s3-request-presigner";
import { bucket, s3 } from "./s3";

export const MIN_PART_BYTES = 5 * 1024 * 1024;
export const MAX_PARTS = 10_000;

/** Part size for a file: the configured size, grown so that no file needs more than 10,000 parts. */
export function planParts(size: number, preferred: number): { partSize: number; partCount: number } {
  const mib = 1024 * 1024;
  const partSize = Math.max(MIN_PART_BYTES, preferred, Math.ceil(size / MAX_PARTS / mib) * mib);
  return { partSize, partCount: Math.max(1, Math.ceil(size / partSize)) };
}

export async function createUpload(key: string, contentType: string): Promise<string> {
  const r = await s3().send(new CreateMultipartUploadCommand({ Bucket: bucket(), Key: key, ContentType: contentType }));
  if (!r.UploadId) throw new Error("storage returned no upload id");
  return r.UploadId;
}

/** Short-lived URLs the browser PUTs parts to; the app server never carries the bytes. */
export async function presignParts(key: string, uploadId: string, partNumbers: number[], expiresIn = 15 * 60) {
  return Promise.all(
    partNumbers.map(async (partNumber) => ({
      partNumber,
      url: await getSignedUrl(s3(), new UploadPartCommand({ Bucket: bucket(), Key: key, UploadId: uploadId, PartNumber: partNumber }), { expiresIn }),
    })),
  );
}

export async function listParts(key: string, uploadId: string): Promise<Part[]> {
  const parts: Part[] = [];
  let marker: string | undefined;
  for (;;) {
    const r = await s3().send(new ListPartsCommand({ Bucket: bucket(), Key: key, UploadId: uploadId, PartNumberMarker: marker }));
    parts.push(...(r.Parts ?? []));
    if (!r.IsTruncated) return parts;
    marker = r.NextPartNumberMarker;
  }
}

export async function completeUpload(key: string, uploadId: string, parts: Part[]) {
  const r = await s3().send(
    new CompleteMultipartUploadCommand({
      Bucket: bucket(),
      Key: key,
      UploadId: uploadId,
      MultipartUpload: { Parts: parts.map((p) => ({ PartNumber: p.PartNumber, ETag: p.ETag })) },
    }),
  );
  return { etag: r.ETag?.replace(/"/g, "") ?? null };
}

export async function abortUpload(key: string, uploadId: string) {
  await s3()
    .send(new AbortMultipartUploadCommand({ Bucket: bucket(), Key: key, UploadId: uploadId }))
    .catch((e: Error) => {
      if (e.name !== "NoSuchUpload") throw e;
    });
}

export async function objectSize(key: string): Promise<number | null> {
  try {
    const r = await s3().send(new HeadObjectCommand({ Bucket: bucket(), Key: key }));
    return r.ContentLength ?? null;
  } catch {
    return null;
  }
}

export async function deleteObject(key: string) {
  await s3().send(new DeleteObjectCommand({ Bucket: bucket(), Key: key }));
}

export async function readRange(key: string, offset: number, size: number): Promise<Uint8Array> {
  if (size <= 0) return new Uint8Array();
  const r = await s3().send(new GetObjectCommand({ Bucket: bucket(), Key: key, Range: `bytes=${offset}-${offset + size - 1}` }));
  return r.Body ? await r.Body.transformToByteArray() : new Uint8Array();
}

/** Multipart uploads under a prefix that were started before `olderThan`. */
export async function listStaleUploads(prefix: string, olderThan: Date) {
  const out: { key: string; uploadId: string; initiated: Date }[] = [];
  let keyMarker: string | undefined;
  let idMarker: string | undefined;
  for (;;) {
    const r = await s3().send(new ListMultipartUploadsCommand({ Bucket: bucket(), Prefix: prefix, KeyMarker: keyMarker, UploadIdMarker: idMarker }));
    for (const u of r.Uploads ?? []) {
      if (u.Key && u.UploadId && u.Initiated && u.Initiated < olderThan) out.push({ key: u.Key, uploadId: u.UploadId, initiated: u.Initiated });
    }
    if (!r.IsTruncated) return out;
    keyMarker = r.NextKeyMarker;
    idMarker = r.NextUploadIdMarker;
  }
}
