import { PutObjectCommand, GetObjectCommand } from "@aws-sdk/client-s3";
import { getSignedUrl } from "@aws-sdk/s3-request-presigner";
import { bucket, s3 } from "./s3";

/** A short-lived URL the browser PUTs one object to; issued only after the permission check. */
export async function presignPut(key: string, contentType: string, size: number, expiresIn = 15 * 60): Promise<string> {
  return getSignedUrl(s3(), new PutObjectCommand({ Bucket: bucket(), Key: key, ContentType: contentType, ContentLength: size }), { expiresIn });
}

export async function presignGet(key: string, expiresIn = 5 * 60): Promise<string> {
  return getSignedUrl(s3(), new GetObjectCommand({ Bucket: bucket(), Key: key }), { expiresIn });
}
