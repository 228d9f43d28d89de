import "server-only";
import { CopyObjectCommand, DeleteObjectCommand, S3Client, HeadBucketCommand, HeadObjectCommand } from "@aws-sdk/client-s3";
import { env } from "../lib/env";

const g = globalThis as unknown as { __jigboardS3?: S3Client };

/**
 * The one S3 client. Checksums only when required: with the SDK's default
 * flexible checksums, streamed bodies reach S3-compatible fakes with
 * aws-chunked framing stored inside the object.
 */
export function s3(): S3Client {
  if (!g.__jigboardS3) {
    const e = env();
    g.__jigboardS3 = new S3Client({
      endpoint: e.S3_ENDPOINT,
      region: e.S3_REGION,
      forcePathStyle: e.S3_FORCE_PATH_STYLE,
      credentials: { accessKeyId: e.S3_ACCESS_KEY_ID, secretAccessKey: e.S3_SECRET_ACCESS_KEY },
      requestChecksumCalculation: "WHEN_REQUIRED",
      responseChecksumValidation: "WHEN_REQUIRED",
    });
  }
  return g.__jigboardS3;
}

export function bucket(): string {
  return env().S3_BUCKET;
}

export async function storageHealthy(): Promise<{ ok: boolean; detail?: string }> {
  try {
    await s3().send(new HeadBucketCommand({ Bucket: bucket() }));
    return { ok: true };
  } catch (e) {
    return { ok: false, detail: e instanceof Error ? e.name : "unreachable" };
  }
}

/** The stored object's size and type, or null when there is none. */
export async function headObject(key: string): Promise<{ size: number | undefined; contentType: string | undefined } | null> {
  const head = await s3()
    .send(new HeadObjectCommand({ Bucket: bucket(), Key: key }))
    .catch(() => null);
  return head ? { size: head.ContentLength, contentType: head.ContentType } : null;
}

/** Copies an object inside the bucket, store to store: the bytes never pass through the app (one request up to 5 GB). */
export async function copyObject(from: string, to: string): Promise<void> {
  await s3().send(new CopyObjectCommand({ Bucket: bucket(), Key: to, CopySource: `${bucket()}/${encodeURIComponent(from).replace(/%2F/g, "/")}` }));
}

export async function deleteObject(key: string): Promise<void> {
  await s3().send(new DeleteObjectCommand({ Bucket: bucket(), Key: key }));
}
