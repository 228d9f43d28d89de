import "server-only";
import { PutObjectCommand, GetObjectCommand } from "@aws-sdk/client-s3";
import { getSignedUrl } from "@aws-sdk/s3-request-presigner";
import { bucket, s3 } from "./s3";
import { servedAs } from "./keys";

/**
 * A short-lived URL the browser PUTs one object to; issued only after the
 * permission check. The content type and exact length are signed, so the
 * store refuses a body of another type or size.
 */
export async function presignPut(key: string, contentType: string, size: number, expiresIn = 15 * 60): Promise<string> {
  return getSignedUrl(s3(), new PutObjectCommand({ Bucket: bucket(), Key: key, ContentType: contentType, ContentLength: size }), {
    expiresIn,
    signableHeaders: new Set(["content-type", "content-length"]),
  });
}

/** A short-lived read URL whose response carries a safe type and disposition, whatever the stored metadata says. */
export async function presignGet(key: string, expiresIn = 5 * 60): Promise<string> {
  const { contentType, disposition } = servedAs(key);
  return getSignedUrl(s3(), new GetObjectCommand({ Bucket: bucket(), Key: key, ResponseContentType: contentType, ResponseContentDisposition: disposition }), { expiresIn });
}
